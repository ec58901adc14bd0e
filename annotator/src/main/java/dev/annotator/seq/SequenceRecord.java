package dev.annotator.seq;

/**
 * One FASTA record held as one byte per base, exactly as read (soft-masked lowercase kept, line breaks
 * removed). Every byte is a valid IUPAC nucleotide code; {@link BaseCode} maps it to the kernels' alphabet.
 *
 * @param name        the header's first word (the GFF3 seqid)
 * @param description the rest of the header line, may be empty
 * @param bases       the sequence; owned by this record, never modified after construction
 */
public record SequenceRecord(String name, String description, byte[] bases) {

    public int length() {
        return bases.length;
    }
}
