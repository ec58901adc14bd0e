package dev.annotator.decode;

import java.util.ArrayList;
import java.util.List;

/** Viterbi and posterior-Viterbi decoding: the runs of each reported label along a decoded state path. */
final class PathRuns {
    private PathRuns() {
    }

    /** The maximal runs of one reported label along a path, in order, with empty statistics. */
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
}
