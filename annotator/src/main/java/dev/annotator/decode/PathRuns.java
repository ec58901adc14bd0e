package dev.annotator.decode;

import dev.annotator.hmm.PosteriorBlockSink;

import java.util.ArrayList;
import java.util.List;

/**
 * Viterbi decoding: the runs of each reported label along the most probable path. The runs are fixed by the path;
 * the backward pass then streams posteriors through them (last block first) to give each run its confidence.
 */
final class PathRuns implements PosteriorBlockSink {
    private final List<RawSegment> runs;
    private final int stateCount;
    // runs sorted by start; cursor walks them backwards as positions descend
    private int cursor;

    PathRuns(ReportedLabels labels, byte[] path, int[] stateToReported, int stateCount) {
        List<RawSegment> found = new ArrayList<>();
        int n = path.length;
        int t = 0;
        while (t < n) {
            int r = stateToReported[path[t] & 0xFF];
            int u = t + 1;
            while (u < n && stateToReported[path[u] & 0xFF] == r) {
                u++;
            }
            if (r >= 0) {
                found.add(new RawSegment(r, t, u, new SegmentAccumulator(labels.stateMasks()[r])));
            }
            t = u;
        }
        this.runs = found;
        this.cursor = found.size() - 1;
        this.stateCount = stateCount;
    }

    @Override
    public void block(int start, int end, double[] posterior, double[] emission) {
        for (int t = end - 1; t >= start; t--) {
            while (cursor >= 0 && runs.get(cursor).start0() > t) {
                cursor--;
            }
            if (cursor < 0) {
                return;
            }
            RawSegment run = runs.get(cursor);
            if (t < run.endExclusive()) {
                run.stats().add(posterior, emission, (t - start) * stateCount);
            }
        }
    }

    List<RawSegment> segments() {
        return runs;
    }
}
