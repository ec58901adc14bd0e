package dev.annotator.labels;

/**
 * One feature of an annotation with a strand, such as a CDS: the unit that gene-structure training and
 * evaluation work with.
 *
 * @param seqid  the record it lies on
 * @param start  first base, 1-based
 * @param end    last base, 1-based, inclusive ({@code start <= end})
 * @param strand {@code '+'} or {@code '-'}
 */
public record StrandedFeature(String seqid, long start, long end, char strand) {
    public StrandedFeature {
        if (start < 1 || end < start) {
            throw new IllegalArgumentException("feature needs 1 <= start <= end, got " + start + ".." + end);
        }
        if (strand != '+' && strand != '-') {
            throw new IllegalArgumentException("strand must be + or -, got " + strand);
        }
    }

    public long length() {
        return end - start + 1;
    }
}
