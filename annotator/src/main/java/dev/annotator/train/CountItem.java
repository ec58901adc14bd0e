package dev.annotator.train;

/**
 * One sequence to count.
 *
 * @param where  how to name it in messages, e.g. {@code "in.fa: record chr1"}
 * @param bases  the sequence, one byte per base as read from FASTA
 * @param labels label index per base (the E-step keeps each base in its label's states), or null for none
 */
public record CountItem(String where, byte[] bases, byte[] labels) {
    public CountItem {
        if (labels != null && labels.length != bases.length) {
            throw new IllegalArgumentException("one label per base expected");
        }
    }
}
