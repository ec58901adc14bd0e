package dev.annotator.decode;

/** Where a decoded gene starts. */
public enum GeneStarts {
    /**
     * At the 5'-most of the likeliest start codons (by the model's start-codon frequencies) between the first start
     * codon of its open reading frame and the decoded start (see {@link LongestOrfStarts}).
     */
    LIKELIEST_START,
    /** At the 5'-most start codon of its open reading frame (see {@link LongestOrfStarts}). */
    LONGEST_ORF,
    /** Where the decoded path puts it. */
    DECODED
}
