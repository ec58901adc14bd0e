package dev.annotator.decode;

import dev.annotator.hmm.PosteriorBlockSink;

/**
 * Collects the per-base products of one decoding window [start, end): the track piece, the plot bins the window
 * touches, and per reported label the log likelihood ratio of its bases. Each window works in its own memory;
 * {@link RecordProfiles} joins them in window order.
 */
final class WindowProfile implements PosteriorBlockSink {
    private static final double BIG = 0x1p900;
    private static final double SMALL = 0x1p-900;
    private final boolean[][] masks;
    private final int trackLabel;
    // the track label's only state when it has one (the posterior is then read, not summed), else -1
    private final int trackState;
    private final int stateCount;
    final int start;
    final int end;
    final TrackPiece track;
    final int plotBin;
    final int firstBin;
    final float[] max;
    final double[] sum;
    // per label, the product of the bases' ratios kept in range by moving powers of two into an exponent: one
    // log per record instead of one per base, which would cost more than the rest of this class
    private final double[] product;
    private final long[] exponent;

    WindowProfile(ReportedLabels labels, int trackLabel, ProfileOptions options, int start, int end, int length,
                  int stateCount) {
        this.masks = labels.stateMasks();
        this.trackLabel = trackLabel;
        this.stateCount = stateCount;
        int only = -1;
        int count = 0;
        for (int st = 0; st < masks[trackLabel].length; st++) {
            if (masks[trackLabel][st]) {
                only = st;
                count++;
            }
        }
        this.trackState = count == 1 ? only : -1;
        this.start = start;
        this.end = end;
        this.track = options.track() ? new TrackPiece(start, end, length, options.trackStep()) : null;
        if (options.plotPoints() > 0 && end > start) {
            plotBin = PosteriorPlot.binSize(length, options.plotPoints());
            firstBin = start / plotBin;
            int bins = (end - 1) / plotBin - firstBin + 1;
            max = new float[bins];
            sum = new double[bins];
        } else {
            plotBin = 0;
            firstBin = 0;
            max = null;
            sum = null;
        }
        if (options.logOdds()) {
            product = new double[masks.length];
            java.util.Arrays.fill(product, 1);
            exponent = new long[masks.length];
        } else {
            product = null;
            exponent = null;
        }
    }

    @Override
    public void block(int blockStart, int blockEnd, double[] posterior, double[] emission) {
        if (max != null && track == null && product == null && trackState >= 0) {
            plotOnly(blockStart, blockEnd, posterior);
            return;
        }
        boolean[] mask = masks[trackLabel];
        boolean wantsPosterior = track != null || max != null;
        // the plot bin of t and where that bin starts, stepped down as t descends (no division per base); the
        // bin's maximum and sum stay in locals while t is inside it
        int bin = max == null ? 0 : (blockEnd - 1) / plotBin;
        int binStart = bin * plotBin;
        double binMax = max == null ? 0 : max[bin - firstBin];
        double binSum = max == null ? 0 : sum[bin - firstBin];
        for (int t = blockEnd - 1; t >= blockStart; t--) {
            int off = (t - blockStart) * stateCount;
            double trackPosterior = 0;
            if (wantsPosterior) {
                double p = trackState >= 0 ? posterior[off + trackState]
                        : SegmentAccumulator.labelPosterior(mask, posterior, off);
                trackPosterior = p;
                if (track != null) {
                    track.add(t, p);
                }
                if (max != null) {
                    if (t < binStart) {
                        max[bin - firstBin] = (float) binMax;
                        sum[bin - firstBin] = binSum;
                        bin--;
                        binStart -= plotBin;
                        binMax = max[bin - firstBin];
                        binSum = sum[bin - firstBin];
                    }
                    if (p > binMax) {
                        binMax = p;
                    }
                    binSum += p;
                }
            }
            if (product != null) {
                for (int r = 0; r < masks.length; r++) {
                    double lp = wantsPosterior && r == trackLabel ? trackPosterior
                            : SegmentAccumulator.labelPosterior(masks[r], posterior, off);
                    double x = product[r] * SegmentAccumulator.emissionRatio(masks[r], lp, posterior, emission, off);
                    if (x > BIG || x < SMALL) {
                        int e = Math.getExponent(x);
                        exponent[r] += e;
                        x = Math.scalb(x, -e);
                    }
                    product[r] = x;
                }
            }
        }
        if (max != null) {
            max[bin - firstBin] = (float) binMax;
            sum[bin - firstBin] = binSum;
        }
    }

    /**
     * The report's common case (plot bins of a one-state label, nothing else): bin by bin, a tight loop with two
     * partial sums so consecutive additions do not wait for each other.
     */
    private void plotOnly(int blockStart, int blockEnd, double[] posterior) {
        int k = stateCount;
        int s = trackState;
        int end = blockEnd;
        while (end > blockStart) {
            int bin = (end - 1) / plotBin;
            int from = Math.max(blockStart, bin * plotBin);
            double m = max[bin - firstBin];
            double sumA = 0;
            double sumB = 0;
            int t = end - 1;
            for (; t - 1 >= from; t -= 2) {
                double p = posterior[(t - blockStart) * k + s];
                double q = posterior[(t - 1 - blockStart) * k + s];
                // Math.max compiles without a branch; comparing by hand branched on every base (measured 1.6x slower)
                m = Math.max(m, Math.max(p, q));
                sumA += p;
                sumB += q;
            }
            if (t >= from) {
                double p = posterior[(t - blockStart) * k + s];
                m = Math.max(m, p);
                sumA += p;
            }
            max[bin - firstBin] = (float) m;
            sum[bin - firstBin] += sumA + sumB;
            end = from;
        }
    }

    /** Whether the plot is all this window collects, so a posterior fed base by base is enough. */
    boolean plotOnly() {
        return max != null && track == null && product == null;
    }

    // the bin being fed by plotBase (positions descend), kept in fields between calls
    private int fedBin = -1;
    private int fedBinStart;
    private double fedMax;
    private double fedSum;

    /** One base's posterior of the plotted label; bases come in descending order, as the backward pass gives them. */
    void plotBase(int t, double p) {
        if (t < fedBinStart || fedBin < 0) {
            flushFed();
            fedBin = t / plotBin;
            fedBinStart = fedBin * plotBin;
            fedMax = max[fedBin - firstBin];
            fedSum = sum[fedBin - firstBin];
        }
        fedMax = Math.max(fedMax, p);
        fedSum += p;
    }

    private void flushFed() {
        if (fedBin >= 0) {
            max[fedBin - firstBin] = (float) fedMax;
            sum[fedBin - firstBin] = fedSum;
        }
    }

    /** Natural log of the product of this window's ratios for reported label {@code r}. */
    double logRatio(int r) {
        return Math.log(product[r]) + exponent[r] * Math.log(2);
    }

    void finish() {
        flushFed();
        if (track != null) {
            track.finish();
        }
    }
}
