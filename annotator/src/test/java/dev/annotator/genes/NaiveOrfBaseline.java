package dev.annotator.genes;

import dev.annotator.labels.StrandedFeature;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The floor a gene model must beat, as the gene-structure issue defines it: open reading frames of at least
 * {@code minLength} nt on both strands, each from the first ATG, GTG or TTG after the previous in-frame stop to the
 * next stop (TAA, TAG, TGA; NCBI translation table 11), all of them kept. The length counts the stop codon; a frame
 * that runs off the end of the sequence gives no ORF. Deliberately simple and independent of the model code.
 */
final class NaiveOrfBaseline {
    private NaiveOrfBaseline() {
    }

    static List<StrandedFeature> predict(String seqid, String sequence, int minLength) {
        String fwd = sequence.toUpperCase(Locale.ROOT);
        String rev = reverseComplement(fwd);
        int n = fwd.length();
        List<StrandedFeature> out = new ArrayList<>();
        for (int frame = 0; frame < 3; frame++) {
            for (int[] orf : orfs(fwd, frame, minLength)) {
                out.add(new StrandedFeature(seqid, orf[0] + 1, orf[1], '+'));
            }
            for (int[] orf : orfs(rev, frame, minLength)) {
                // [a, b) on the reverse complement is [n - b, n - a) on the forward strand
                out.add(new StrandedFeature(seqid, n - orf[1] + 1, n - orf[0], '-'));
            }
        }
        out.sort((x, y) -> x.start() != y.start() ? Long.compare(x.start(), y.start()) : Long.compare(x.end(), y.end()));
        return out;
    }

    /** ORFs of one frame as [first base, one past the stop codon), 0-based. */
    private static List<int[]> orfs(String s, int frame, int minLength) {
        List<int[]> out = new ArrayList<>();
        int start = -1;
        for (int i = frame; i + 3 <= s.length(); i += 3) {
            String codon = s.substring(i, i + 3);
            if (codon.equals("TAA") || codon.equals("TAG") || codon.equals("TGA")) {
                if (start >= 0 && i + 3 - start >= minLength) {
                    out.add(new int[]{start, i + 3});
                }
                start = -1;
            } else if (start < 0 && (codon.equals("ATG") || codon.equals("GTG") || codon.equals("TTG"))) {
                start = i;
            }
        }
        return out;
    }

    static String reverseComplement(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = s.length() - 1; i >= 0; i--) {
            char c = s.charAt(i);
            b.append(switch (c) {
                case 'A' -> 'T';
                case 'C' -> 'G';
                case 'G' -> 'C';
                case 'T' -> 'A';
                default -> 'N';
            });
        }
        return b.toString();
    }
}
