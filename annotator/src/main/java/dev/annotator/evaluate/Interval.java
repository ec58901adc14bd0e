package dev.annotator.evaluate;

/** A closed interval of one sequence in 1-based coordinates (both ends included), as in GFF3. */
public record Interval(long start, long end) {
    public Interval {
        if (start < 1 || end < start) {
            throw new IllegalArgumentException("interval needs 1 <= start <= end, got " + start + ".." + end);
        }
    }

    /** Number of positions shared with {@code other}; 0 when they are disjoint. */
    public long overlap(Interval other) {
        return Math.max(0, Math.min(end, other.end) - Math.max(start, other.start) + 1);
    }
}
