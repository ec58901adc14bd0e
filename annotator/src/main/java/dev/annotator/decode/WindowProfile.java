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
    /**
     * When every reported label is one state against one other (a two-state model), each label's only state and
     * the other one; else null. The posterior-weighted ratio of {@link SegmentAccumulator#emissionRatio} is then
     * just the ratio of the two states' emissions, which needs no posterior and no pass over the states.
     */
    private final int[] ratioIn;
    private final int[] ratioOut;
    /** A plotted label of several states: its posterior of the current block's bases. */
    private double[] labelScratch;

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
        // with two states, a label of one of them has the other against it
        int[] in = new int[masks.length];
        boolean twoStates = product != null && stateCount == 2;
        for (int r = 0; r < masks.length && twoStates; r++) {
            twoStates = masks[r][0] != masks[r][1];
            in[r] = masks[r][0] ? 0 : 1;
        }
        this.ratioIn = twoStates ? in : null;
        this.ratioOut = twoStates ? java.util.Arrays.stream(in).map(s -> 1 - s).toArray() : null;
    }

    @Override
    public void block(int blockStart, int blockEnd, double[] posterior, double[] emission) {
        boolean productPerBase = product != null && ratioIn == null;
        if (product != null && ratioIn != null) {
            emissionRatios(blockStart, blockEnd, emission);
        }
        // a one-state label's per-base track is read straight from the posterior rows
        boolean trackViaAdd = track != null && !(track.perBase() && trackState >= 0);
        if (track != null && !trackViaAdd) {
            track.addBases(blockStart, blockEnd, posterior, stateCount, trackState);
        }
        if (max != null && !trackViaAdd && !productPerBase) {
            plotOnly(blockStart, blockEnd, posterior);
            return;
        }
        if (max == null && !trackViaAdd && !productPerBase) {
            return;
        }
        boolean[] mask = masks[trackLabel];
        boolean wantsPosterior = trackViaAdd || max != null;
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
                if (trackViaAdd) {
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
            if (productPerBase) {
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
     * The log-odds' product for a two-state model: each base's ratio is the label's state's emission over the other
     * state's (1 where either is 0, as {@link SegmentAccumulator#emissionRatio} has it), multiplied in the same order
     * and kept in range the same way as the per-base path does.
     */
    private void emissionRatios(int blockStart, int blockEnd, double[] emission) {
        for (int r = 0; r < ratioIn.length; r++) {
            final int in = ratioIn[r];
            final int out = ratioOut[r];
            double x = product[r];
            long exp = exponent[r];
            for (int t = blockEnd - 1; t >= blockStart; t--) {
                int off = (t - blockStart) * stateCount;
                double eIn = emission[off + in];
                double eOut = emission[off + out];
                x *= eIn > 0 && eOut > 0 ? eIn / eOut : 1;
                if (x > BIG || x < SMALL) {
                    int e = Math.getExponent(x);
                    exp += e;
                    x = Math.scalb(x, -e);
                }
            }
            product[r] = x;
            exponent[r] = exp;
        }
    }

    /**
     * The report's common case (plot bins, nothing else per base): a one-state label's values are in the posterior
     * rows; a label of several states is summed per base first.
     */
    private void plotOnly(int blockStart, int blockEnd, double[] posterior) {
        if (trackState >= 0) {
            plotValues(blockStart, blockEnd, posterior, stateCount, trackState);
            return;
        }
        int n = blockEnd - blockStart;
        if (labelScratch == null || labelScratch.length < n) {
            labelScratch = new double[n];
        }
        boolean[] mask = masks[trackLabel];
        for (int i = 0; i < n; i++) {
            labelScratch[i] = SegmentAccumulator.labelPosterior(mask, posterior, i * stateCount);
        }
        plotValues(blockStart, blockEnd, labelScratch, 1, 0);
    }

    /**
     * Adds the plotted label's posterior of the bases [blockStart, blockEnd) to the plot bins, base t's value at
     * {@code values[(t - blockStart) * stride + offset]}. Bin by bin, a tight loop with four partial sums and two
     * running maxima, so consecutive bases do not wait for each other (one running sum cost as much as the runs'
     * own work: each addition waits for the one before).
     */
    void plotValues(int blockStart, int blockEnd, double[] values, int stride, int offset) {
        int end = blockEnd;
        while (end > blockStart) {
            int bin = (end - 1) / plotBin;
            int from = Math.max(blockStart, bin * plotBin);
            addToBin(bin - firstBin, values, (end - 1 - blockStart) * stride + offset, end - from, stride);
            end = from;
        }
    }

    /**
     * One bin's share of a block: {@code count} values, the last at {@code values[last]} and each {@code stride}
     * before the next, taken last first. A method of its own, called once per bin: in a cold process it is
     * compiled after a few hundred bins, where the loop inside a call per block ran interpreted for a dozen blocks
     * (the compilers count a method's calls sooner than its loops' turns).
     */
    private void addToBin(int b, double[] values, int last, int count, int stride) {
        double maxA = max[b];
        double maxB = maxA;
        double sumA = 0;
        double sumB = 0;
        double sumC = 0;
        double sumD = 0;
        int i = last;
        int k = count;
        for (; k >= 4; k -= 4, i -= 4 * stride) {
            double p = values[i];
            double q = values[i - stride];
            double u = values[i - 2 * stride];
            double v = values[i - 3 * stride];
            // Math.max compiles without a branch; comparing by hand branched on every base (measured 1.6x slower)
            maxA = Math.max(maxA, Math.max(p, q));
            maxB = Math.max(maxB, Math.max(u, v));
            sumA += p;
            sumB += q;
            sumC += u;
            sumD += v;
        }
        for (; k > 0; k--, i -= stride) {
            double p = values[i];
            maxA = Math.max(maxA, p);
            sumA += p;
        }
        max[b] = (float) Math.max(maxA, maxB);
        sum[b] += (sumA + sumB) + (sumC + sumD);
    }

    /** Whether anything is collected per base: else (composition alone, say) the window needs no blocks at all. */
    boolean perBase() {
        return max != null || track != null || product != null;
    }

    /** The plotted label's only state, whose posterior is the label's; -1 when the label has several. */
    int plottedState() {
        return trackState;
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
