package dev.annotator.topology;

import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * The codons a gene topology needs from a genetic code: those that may start a gene and those that end it.
 *
 * @param name   how the code is referred to in a model's provenance
 * @param starts start codons, as read on the gene's own strand
 * @param stops  stop codons, as read on the gene's own strand
 */
public record GeneticCode(String name, List<String> starts, List<String> stops) {
    private static final Pattern CODON = Pattern.compile("[ACGT]{3}");

    /**
     * NCBI translation table 11 (bacterial, archaeal and plant plastid code): starts ATG, GTG, TTG as the
     * commonly used initiators (the table lists a few more rare ones), stops TAA, TAG, TGA (shared with table 1).
     */
    public static final GeneticCode TABLE_11 = new GeneticCode("NCBI translation table 11",
            List.of("ATG", "GTG", "TTG"), List.of("TAA", "TAG", "TGA"));

    public GeneticCode {
        starts = normalise(starts, "start");
        stops = normalise(stops, "stop");
        for (String s : starts) {
            if (stops.contains(s)) {
                throw new IllegalArgumentException(s + " cannot be both a start and a stop codon");
            }
        }
    }

    private static List<String> normalise(List<String> codons, String what) {
        if (codons.isEmpty()) {
            throw new IllegalArgumentException("at least one " + what + " codon is needed");
        }
        List<String> out = codons.stream().map(c -> c.trim().toUpperCase(Locale.ROOT)).distinct().toList();
        for (String c : out) {
            if (!CODON.matcher(c).matches()) {
                throw new IllegalArgumentException(what + " codon '" + c + "' is not three of A, C, G, T");
            }
        }
        return out;
    }

    /** Whether a codon (upper case, on its own strand) is a stop. */
    public boolean isStop(String codon) {
        return stops.contains(codon);
    }

    /** The 64 codons minus the stops: what may occur inside a gene. */
    public List<String> senseCodons() {
        String bases = "ACGT";
        List<String> out = new java.util.ArrayList<>();
        for (int i = 0; i < 64; i++) {
            String c = "" + bases.charAt(i >> 4) + bases.charAt((i >> 2) & 3) + bases.charAt(i & 3);
            if (!isStop(c)) {
                out.add(c);
            }
        }
        return out;
    }

    /** The reverse complement of a codon (how a reverse-strand codon reads on the forward strand). */
    public static String reverseComplement(String codon) {
        StringBuilder b = new StringBuilder(codon.length());
        for (int i = codon.length() - 1; i >= 0; i--) {
            b.append(switch (codon.charAt(i)) {
                case 'A' -> 'T';
                case 'C' -> 'G';
                case 'G' -> 'C';
                case 'T' -> 'A';
                default -> throw new IllegalArgumentException("not a base: " + codon.charAt(i));
            });
        }
        return b.toString();
    }
}
