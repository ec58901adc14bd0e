package dev.annotator.decode;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** Joins runs of the same label that were cut where two decoding windows meet. */
final class WindowStitcher {
    private WindowStitcher() {
    }

    /**
     * Two runs of one label that touch (one ends where the next starts) can only come from a window cut: a run
     * ends where the posterior drops to 0.5 or below, so the next base cannot open a run of that label.
     */
    static List<RawSegment> stitch(List<RawSegment> pieces) {
        List<RawSegment> sorted = new ArrayList<>(pieces);
        sorted.sort(Comparator.comparingInt(RawSegment::label).thenComparingInt(RawSegment::start0));
        List<RawSegment> out = new ArrayList<>(sorted.size());
        RawSegment current = null;
        for (RawSegment piece : sorted) {
            if (current != null && current.label() == piece.label() && current.endExclusive() == piece.start0()) {
                current.stats().merge(piece.stats());
                current = new RawSegment(current.label(), current.start0(), piece.endExclusive(), current.stats());
            } else {
                if (current != null) {
                    out.add(current);
                }
                current = piece;
            }
        }
        if (current != null) {
            out.add(current);
        }
        return out;
    }
}
