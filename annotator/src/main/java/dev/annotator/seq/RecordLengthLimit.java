package dev.annotator.seq;

/**
 * The longest record a reader accepts, and why that is the limit (the second half of the error message).
 *
 * @param bases  records with more bases are refused as soon as the reader has seen one base too many
 * @param reason why, as it reads after "longer than N bases, ": names the limit and what the user can do
 */
public record RecordLengthLimit(long bases, String reason) {
    /** The longest record a Java array (and BioJava's StringBuilder) can hold, whatever the memory. */
    public static final long ARRAY_MAX = Integer.MAX_VALUE - 8;

    /** The limit of an array: no reader can do better. */
    public static final RecordLengthLimit ARRAY = new RecordLengthLimit(ARRAY_MAX, "the most one record can hold");

    public RecordLengthLimit {
        if (bases < 1 || bases > ARRAY_MAX) {
            throw new IllegalArgumentException("record length limit must be within 1.." + ARRAY_MAX + ", got " + bases);
        }
    }
}
