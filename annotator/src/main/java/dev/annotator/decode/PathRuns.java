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
    // reach[i]: the furthest end of runs 0..i, so a position's runs are found walking back from the cursor
    private final int[] reach;

    PathRuns(ReportedLabels labels, byte[] path, int[] stateToReported, int stateCount) {
        this(runsOf(labels, path, stateToReported), stateCount);
    }

    /** Statistics over given runs: sorted by start, possibly overlapping. */
    PathRuns(List<RawSegment> runs, int stateCount) {
        this.runs = runs;
        this.stateCount = stateCount;
        this.cursor = runs.size() - 1;
        this.reach = new int[runs.size()];
        int max = 0;
        for (int i = 0; i < runs.size(); i++) {
            max = Math.max(max, runs.get(i).endExclusive());
            reach[i] = max;
        }
    }

    /** The maximal runs of one reported label along a path, in order. */
    static List<RawSegment> runsOf(ReportedLabels labels, byte[] path, int[] stateToReported) {
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
        return found;
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
            for (int i = cursor; i >= 0 && reach[i] > t; i--) {
                RawSegment run = runs.get(i);
                if (t < run.endExclusive()) {
                    run.stats().add(posterior, emission, (t - start) * stateCount);
                }
            }
        }
    }

    List<RawSegment> segments() {
        return runs;
    }
}
