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
        boolean[] mask = masks[trackLabel];
        boolean wantsPosterior = track != null || max != null;
        // the plot bin of t and where that bin starts, stepped down as t descends (no division per base)
        int bin = max == null ? 0 : (blockEnd - 1) / plotBin;
        int binStart = bin * plotBin;
        for (int t = blockEnd - 1; t >= blockStart; t--) {
            int off = (t - blockStart) * stateCount;
            double trackPosterior = 0;
            if (wantsPosterior) {
                double p = SegmentAccumulator.labelPosterior(mask, posterior, off);
                trackPosterior = p;
                if (track != null) {
                    track.add(t, p);
                }
                if (max != null) {
                    if (t < binStart) {
                        bin--;
                        binStart -= plotBin;
                    }
                    int b = bin - firstBin;
                    max[b] = Math.max(max[b], (float) p);
                    sum[b] += p;
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
    }

    /** Natural log of the product of this window's ratios for reported label {@code r}. */
    double logRatio(int r) {
        return Math.log(product[r]) + exponent[r] * Math.log(2);
    }

    void finish() {
        if (track != null) {
            track.finish();
        }
    }
}
