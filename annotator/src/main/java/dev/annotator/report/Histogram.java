package dev.annotator.report;

/** Counts in fixed bins, linear or logarithmic; values outside go to the first or last bin. */
final class Histogram {
    private final double low;
    private final double high;
    private final boolean logarithmic;
    private final long[] counts;

    private Histogram(double low, double high, int bins, boolean logarithmic) {
        this.low = logarithmic ? Math.log10(low) : low;
        this.high = logarithmic ? Math.log10(high) : high;
        this.logarithmic = logarithmic;
        this.counts = new long[bins];
    }

    static Histogram linear(double low, double high, int bins) {
        return new Histogram(low, high, bins, false);
    }

    static Histogram logarithmic(double low, double high, int bins) {
        return new Histogram(low, high, bins, true);
    }

    void add(double value) {
        double v = logarithmic ? Math.log10(Math.max(value, 1e-300)) : value;
        int b = (int) Math.floor((v - low) / (high - low) * counts.length);
        counts[Math.max(0, Math.min(counts.length - 1, b))]++;
    }

    int bins() {
        return counts.length;
    }

    long count(int bin) {
        return counts[bin];
    }

    /** Lower edge of a bin, in the value's units. */
    double edge(int bin) {
        double e = low + (high - low) * bin / counts.length;
        return logarithmic ? Math.pow(10, e) : e;
    }
}
