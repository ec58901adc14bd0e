package dev.annotator.decode;

import java.util.List;

/**
 * Everything decoded for one FASTA record.
 *
 * @param seqid         the record's name
 * @param length        its length in bases
 * @param logLikelihood natural log of P(sequence | model)
 * @param segments      called segments of all reported labels, ordered by start (then by label order)
 */
public record RecordAnnotation(String seqid, int length, double logLikelihood, List<Segment> segments) {
    public RecordAnnotation {
        segments = List.copyOf(segments);
    }
}
