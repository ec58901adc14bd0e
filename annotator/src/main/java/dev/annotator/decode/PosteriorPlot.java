package dev.annotator.decode;

/**
 * A record's label posterior and GC fraction in bins of {@code binSize} bases (the last bin may be shorter), small
 * enough to draw: the maximum keeps short confident stretches visible when many bases share a bin. The arrays are
 * the record's own; do not change them.
 *
 * @param binSize bases per bin
 * @param max     highest label posterior in each bin
 * @param mean    mean label posterior in each bin
 * @param gc      GC fraction of the bin's unambiguous bases (NaN when it has none)
 */
public record PosteriorPlot(int binSize, float[] max, float[] mean, float[] gc) {
    public int bins() {
        return max.length;
    }

    /** Bin size giving at most {@code points} bins over {@code length} bases. */
    static int binSize(int length, int points) {
        return Math.max(1, (int) ((length + (long) points - 1) / points));
    }
}
