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
    private int plotLabel = -1;
    private WindowProfile plot;
    /** A label of several states: its posterior of the current block's bases, handed to the plot after the block. */
    private double[] plotScratch;

    PosteriorRuns(ReportedLabels labels, int rangeStart, int stateCount) {
        this.labels = labels;
        this.rangeStart = rangeStart;
        this.stateCount = stateCount;
        this.open = new SegmentAccumulator[labels.size()];
        this.openEnd = new int[labels.size()];
    }

    /** Also hands every base's posterior of one label to a plot, block by block as the runs see them. */
    void feedPlot(int label, WindowProfile plot) {
        this.plotLabel = label;
        this.plot = plot;
    }

    @Override
    public void block(int start, int end, double[] posterior, double[] emission) {
        boolean[][] masks = labels.stateMasks();
        for (int r = 0; r < open.length; r++) {
            boolean[] mask = masks[r];
            // a one-state label's posterior is read from the posterior rows; a label of several states is summed
            // per base below and kept for the plot
            boolean plotted = r == plotLabel;
            double[] values = plotted && plot.plottedState() < 0 ? plotValues(end - start) : null;
            for (int t = end - 1; t >= start; t--) {
                int off = (t - start) * stateCount;
                double p = SegmentAccumulator.labelPosterior(mask, posterior, off);
                if (values != null) {
                    values[t - start] = p;
                }
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
            if (values != null) {
                plot.plotValues(start, end, values, 1, 0);
            } else if (plotted) {
                plot.plotValues(start, end, posterior, stateCount, plot.plottedState());
            }
        }
    }

    private double[] plotValues(int length) {
        if (plotScratch == null || plotScratch.length < length) {
            plotScratch = new double[length];
        }
        return plotScratch;
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
