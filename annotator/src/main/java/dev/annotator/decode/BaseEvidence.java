package dev.annotator.decode;

import dev.annotator.hmm.PosteriorBlockSink;

/**
 * What segment statistics need at every base, kept from the forward-backward pass that also feeds the path
 * decoder: for each reported label, its posterior and the likelihood ratio of the base under its states against
 * the rest (as {@link SegmentAccumulator} defines them). Runs fixed only after the path is read off (and then
 * moved, possibly overlapping, by {@link LongestOrfStarts}) take their statistics from here, so the sequence is
 * not run through forward-backward a second time.
 *
 * <p>Memory: {@value #BYTES_PER_BASE_AND_LABEL} bytes per base and reported label (two doubles, so statistics are
 * exactly those of a second pass).
 */
final class BaseEvidence implements PosteriorBlockSink {
    static final int BYTES_PER_BASE_AND_LABEL = 16;

    private final boolean[][] masks;
    private final int stateCount;
    private final double[][] labelPosterior;
    private final double[][] ratio;

    BaseEvidence(ReportedLabels labels, int length, int stateCount) {
        this.masks = labels.stateMasks();
        this.stateCount = stateCount;
        this.labelPosterior = new double[labels.size()][length];
        this.ratio = new double[labels.size()][length];
    }

    @Override
    public void block(int start, int end, double[] posterior, double[] emission) {
        for (int r = 0; r < masks.length; r++) {
            boolean[] mask = masks[r];
            double[] lp = labelPosterior[r];
            double[] lr = ratio[r];
            for (int t = start, off = 0; t < end; t++, off += stateCount) {
                double p = SegmentAccumulator.labelPosterior(mask, posterior, off);
                lp[t] = p;
                lr[t] = SegmentAccumulator.emissionRatio(mask, p, posterior, emission, off);
            }
        }
    }

    /** Adds the bases of a run to its statistics, last base first (the order a backward pass delivers them). */
    void collect(RawSegment run) {
        double[] lp = labelPosterior[run.label()];
        double[] lr = ratio[run.label()];
        SegmentAccumulator stats = run.stats();
        for (int t = run.endExclusive() - 1; t >= run.start0(); t--) {
            stats.add(lp[t], lr[t]);
        }
    }
}
