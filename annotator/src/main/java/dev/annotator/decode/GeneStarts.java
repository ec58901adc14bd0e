package dev.annotator.decode;

/** Where a decoded gene starts. */
public enum GeneStarts {
    /** At the 5'-most start codon of its open reading frame (see {@link LongestOrfStarts}). */
    LONGEST_ORF,
    /** Where the decoded path puts it. */
    DECODED
}
