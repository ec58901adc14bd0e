package dev.annotator.pipeline;

/**
 * What one annotation run did, for progress lines, reports and benchmarks.
 *
 * @param inputChecksum size and CRC-32 of the input as read, when the run was asked for it (else null)
 */
public record RunSummary(int records, long bases, int segments, double seconds,
                         dev.annotator.io.InputChecksum inputChecksum) {
    public double megabasesPerSecond() {
        return seconds > 0 ? bases / seconds / 1e6 : Double.NaN;
    }
}
