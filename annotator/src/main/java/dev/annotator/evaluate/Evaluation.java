package dev.annotator.evaluate;

import java.util.List;

/**
 * A whole comparison: per-record results in reference order (then records only the predictions name), and the
 * total, whose counts are the sums over records and whose measures are computed from those sums.
 */
public record Evaluation(String truthName, String predictedName, List<RecordAccuracy> records, GeneAccuracy total) {
    public Evaluation {
        records = List.copyOf(records);
    }

    /** Sum of the record lengths. */
    public long totalLength() {
        return records.stream().mapToLong(RecordAccuracy::length).sum();
    }

    /** Whether some record's length had to be taken from its features. */
    public boolean anyLengthEstimated() {
        return records.stream().anyMatch(r -> r.lengthSource() == LengthSource.FURTHEST_FEATURE);
    }
}
