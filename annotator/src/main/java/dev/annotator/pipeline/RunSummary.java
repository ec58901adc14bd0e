package dev.annotator.pipeline;

/** What one annotation run did, for progress lines and benchmarks. */
public record RunSummary(int records, long bases, int segments, double seconds) {
    public double megabasesPerSecond() {
        return seconds > 0 ? bases / seconds / 1e6 : Double.NaN;
    }
}
