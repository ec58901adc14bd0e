package dev.annotator.decode;

import dev.annotator.hmm.PosteriorBlockSink;

import java.util.ArrayList;
import java.util.List;

/**
 * Posterior decoding: for each reported label, the maximal runs of bases where the label's posterior exceeds
 * 0.5. Fed by the backward pass (blocks arrive last to first), so runs are opened at their end and closed at
 * their start; nothing per base is kept beyond the current block. A run still open at the start of the decoded
 * range is closed there; {@link WindowStitcher} joins runs cut by window boundaries.
 */
final class PosteriorRuns implements PosteriorBlockSink {
    private final ReportedLabels labels;
    private final int rangeStart;
    private final int stateCount;
    private final SegmentAccumulator[] open;
    private final int[] openEnd;
    private final List<RawSegment> closed = new ArrayList<>();

    PosteriorRuns(ReportedLabels labels, int rangeStart, int stateCount) {
        this.labels = labels;
        this.rangeStart = rangeStart;
        this.stateCount = stateCount;
        this.open = new SegmentAccumulator[labels.size()];
        this.openEnd = new int[labels.size()];
    }

    /**
     * Nothing here serves a plot: the same compiled code runs for records with and without one (a report plots only
     * the first records, and a branch on it here was compiled one way and thrown away at the first record past them).
     */
    @Override
    public void block(int start, int end, double[] posterior, double[] emission) {
        boolean[][] masks = labels.stateMasks();
        for (int r = 0; r < open.length; r++) {
            boolean[] mask = masks[r];
            for (int t = end - 1; t >= start; t--) {
                int off = (t - start) * stateCount;
                double p = SegmentAccumulator.labelPosterior(mask, posterior, off);
                if (p > 0.5) {
                    if (open[r] == null) {
                        open[r] = new SegmentAccumulator(mask);
                        openEnd[r] = t + 1;
                    }
                    open[r].add(p, posterior, emission, off);
                } else if (open[r] != null) {
                    close(r, t + 1);
                }
            }
        }
    }

    private void close(int label, int start0) {
        closed.add(new RawSegment(label, start0, openEnd[label], open[label]));
        open[label] = null;
    }

    /**
     * Closes the runs still open at the start of the range, once its first block has been fed. Kept out of
     * {@link #block}: true once per range, a branch there is compiled as never taken and costs a recompilation of
     * that hot method when it is.
     */
    PosteriorRuns finish() {
        for (int r = 0; r < open.length; r++) {
            if (open[r] != null) {
                close(r, rangeStart);
            }
        }
        return this;
    }

    /** Runs found, in discovery order (any order of labels and positions). */
    List<RawSegment> segments() {
        return closed;
    }
}
