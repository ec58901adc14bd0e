package dev.annotator.evaluate;

/**
 * The comparison of one record.
 *
 * @param seqid        the record
 * @param length       its length in bases (each base counts once per strand in the base-level counts)
 * @param lengthSource where {@code length} came from
 * @param accuracy     the counts and measures
 */
public record RecordAccuracy(String seqid, long length, LengthSource lengthSource, GeneAccuracy accuracy) {
}
