package dev.annotator.decode;

import dev.annotator.hmm.PosteriorSink;

import java.util.ArrayList;
import java.util.List;

/**
 * Posterior decoding: for each reported label, the maximal runs of bases where the label's posterior exceeds
 * 0.5. Fed by the backward pass (positions arrive last to first), so runs are opened at their end and closed at
 * their start; nothing per base is stored.
 */
final class PosteriorRuns implements PosteriorSink {
    private final ReportedLabels labels;
    private final SegmentAccumulator[] open;
    private final int[] openEnd;
    private final List<int[]> closed = new ArrayList<>();
    private final List<SegmentAccumulator> closedStats = new ArrayList<>();

    PosteriorRuns(ReportedLabels labels) {
        this.labels = labels;
        this.open = new SegmentAccumulator[labels.size()];
        this.openEnd = new int[labels.size()];
    }

    @Override
    public void accept(int position, double[] posterior, double[] emission) {
        for (int r = 0; r < open.length; r++) {
            boolean[] mask = labels.stateMasks()[r];
            double p = SegmentAccumulator.labelPosterior(mask, posterior);
            if (p > 0.5) {
                if (open[r] == null) {
                    open[r] = new SegmentAccumulator(mask);
                    openEnd[r] = position + 1;
                }
                open[r].add(p, posterior, emission);
                if (position == 0) {
                    close(r, 0);
                }
            } else if (open[r] != null) {
                close(r, position + 1);
            }
        }
    }

    private void close(int label, int start0) {
        closed.add(new int[]{label, start0, openEnd[label]});
        closedStats.add(open[label]);
        open[label] = null;
    }

    /** Runs found, as (label index, 0-based start, end exclusive) with their statistics, in discovery order. */
    List<RawSegment> segments() {
        List<RawSegment> out = new ArrayList<>(closed.size());
        for (int i = 0; i < closed.size(); i++) {
            int[] c = closed.get(i);
            out.add(new RawSegment(c[0], c[1], c[2], closedStats.get(i)));
        }
        return out;
    }
}
