package dev.annotator.simulate;

/**
 * A maximal run of one reported label in a simulated record: the truth a caller's segments are compared with.
 *
 * @param label the label's name in the model
 * @param start first base, 1-based
 * @param end   last base, 1-based, inclusive
 */
public record PlantedSegment(String label, int start, int end) {
    public PlantedSegment {
        if (start < 1 || end < start) {
            throw new IllegalArgumentException("planted segment needs 1 <= start <= end, got " + start + ".." + end);
        }
    }

    public int length() {
        return end - start + 1;
    }
}
