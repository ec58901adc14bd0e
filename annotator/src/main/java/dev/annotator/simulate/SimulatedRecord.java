package dev.annotator.simulate;

import dev.annotator.seq.SequenceRecord;

import java.util.List;

/**
 * One sampled record and the segments planted in it.
 *
 * @param record  the bases, uppercase A, C, G, T
 * @param planted runs of reported labels, ordered by start
 */
public record SimulatedRecord(SequenceRecord record, List<PlantedSegment> planted) {
    public SimulatedRecord {
        planted = List.copyOf(planted);
    }
}
