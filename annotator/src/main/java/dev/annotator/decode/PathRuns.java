package dev.annotator.decode;

import dev.annotator.hmm.PosteriorSink;

import java.util.ArrayList;
import java.util.List;

/**
 * Viterbi decoding: the runs of each reported label along the most probable path. The runs are fixed by the path;
 * the backward pass then streams posteriors through them (last position first) to give each run its confidence.
 */
final class PathRuns implements PosteriorSink {
    private final List<RawSegment> runs;
    // runs sorted by start; cursor walks them backwards as positions descend
    private int cursor;

    PathRuns(ReportedLabels labels, int[] path, int[] stateToReported) {
        List<RawSegment> found = new ArrayList<>();
        int n = path.length;
        int t = 0;
        while (t < n) {
            int r = stateToReported[path[t]];
            int u = t + 1;
            while (u < n && stateToReported[path[u]] == r) {
                u++;
            }
            if (r >= 0) {
                found.add(new RawSegment(r, t, u, new SegmentAccumulator(labels.stateMasks()[r])));
            }
            t = u;
        }
        this.runs = found;
        this.cursor = found.size() - 1;
    }

    @Override
    public void accept(int position, double[] posterior, double[] emission) {
        while (cursor >= 0 && runs.get(cursor).start0() > position) {
            cursor--;
        }
        if (cursor >= 0) {
            RawSegment run = runs.get(cursor);
            if (position < run.endExclusive()) {
                run.stats().add(posterior, emission);
            }
        }
    }

    List<RawSegment> segments() {
        return runs;
    }
}
