package dev.annotator.decode;

/**
 * What a segment of a stranded label (a gene on one strand) needs beside its coordinates to be written as a
 * gene with its CDS.
 *
 * @param strand     {@code '+'} or {@code '-'}
 * @param partial5   the gene touches the record's end on its 5' side, so it may begin beyond the record
 * @param partial3   the gene touches the record's end on its 3' side, so it may end beyond the record
 * @param phase      GFF3 phase of the CDS: bases to skip from its 5' end to the first whole codon (0 for a
 *                   gene that is not 5'-partial)
 * @param startCodon the first codon on the gene's strand, upper case; null for a 5'-partial gene
 */
public record GeneDetails(char strand, boolean partial5, boolean partial3, int phase, String startCodon) {

    /**
     * @param start0             first base of the segment, 0-based
     * @param endExclusive       one past its last base
     * @param fivePrimePosition  codon position (1..3) of the state at the gene's 5'-most base on the decoded path,
     *                           or 0 when unknown (posterior decoding)
     */
    static GeneDetails of(char strand, byte[] bases, int start0, int endExclusive, int fivePrimePosition) {
        boolean touchesLeft = start0 == 0;
        boolean touchesRight = endExclusive == bases.length;
        boolean partial5 = strand == '+' ? touchesLeft : touchesRight;
        boolean partial3 = strand == '+' ? touchesRight : touchesLeft;
        int length = endExclusive - start0;
        int phase;
        if (!partial5) {
            phase = 0;
        } else if (fivePrimePosition != 0) {
            phase = (4 - fivePrimePosition) % 3;
        } else if (!partial3) {
            phase = length % 3; // the 3' end closes a whole codon, so the odd bases sit at the 5' end
        } else {
            phase = 0;
        }
        String startCodon = partial5 || length < 3 ? null : firstCodon(strand, bases, start0, endExclusive);
        return new GeneDetails(strand, partial5, partial3, phase, startCodon);
    }

    private static String firstCodon(char strand, byte[] bases, int start0, int endExclusive) {
        StringBuilder b = new StringBuilder(3);
        for (int i = 0; i < 3; i++) {
            if (strand == '+') {
                b.append(upper(bases[start0 + i]));
            } else {
                b.append(complement(upper(bases[endExclusive - 1 - i])));
            }
        }
        return b.toString();
    }

    private static char upper(byte base) {
        return Character.toUpperCase((char) (base & 0xFF));
    }

    private static char complement(char base) {
        return switch (base) {
            case 'A' -> 'T';
            case 'C' -> 'G';
            case 'G' -> 'C';
            case 'T', 'U' -> 'A';
            default -> 'N';
        };
    }
}
