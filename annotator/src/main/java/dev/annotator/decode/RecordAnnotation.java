package dev.annotator.decode;

import java.util.List;

/**
 * Everything decoded for one FASTA record.
 *
 * @param seqid         the record's name
 * @param length        its length in bases
 * @param logLikelihood natural log of P(sequence | model); NaN for a gene model decoded strand by strand without a
 *                      profile ({@link Annotator#logLikelihood(byte[])} computes it)
 * @param segments      called segments of all reported labels, ordered by start (then by label order)
 * @param profile       the per-record products asked for with {@link ProfileOptions}; null when none were
 */
public record RecordAnnotation(String seqid, int length, double logLikelihood, List<Segment> segments,
                               RecordProfile profile) {
    public RecordAnnotation {
        segments = List.copyOf(segments);
    }

    public RecordAnnotation(String seqid, int length, double logLikelihood, List<Segment> segments) {
        this(seqid, length, logLikelihood, segments, null);
    }
}
