package dev.annotator.labels;

/**
 * One feature of a labels file that maps to a model label.
 *
 * @param seqid the record it lies on (percent-decoded)
 * @param start first base, 1-based
 * @param end   last base, 1-based, inclusive
 * @param label index of the label in the model's label list
 * @param line  line of the labels file it came from (for messages)
 */
public record LabelledInterval(String seqid, long start, long end, int label, long line) {
}
