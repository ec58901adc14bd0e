package dev.annotator.topology;

import org.biojava.nbio.core.sequence.compound.AminoAcidCompoundSet;
import org.biojava.nbio.core.sequence.compound.DNACompoundSet;
import org.biojava.nbio.core.sequence.io.IUPACParser;

import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * The NCBI genetic codes as BioJava (biojava-core 7.2.2) ships them in its {@code iupac.txt}, a copy of NCBI's
 * "The Genetic Codes" tables: an outside reference for which codons stop translation, independent of the
 * project's own {@link GeneticCode}.
 */
public final class NcbiTables {
    private NcbiTables() {
    }

    /** Every codon (DNA, upper case) of NCBI table {@code id} with its one-letter amino acid, '*' for a stop. */
    public static Map<String, Character> translation(int id) {
        // a fresh parser: BioJava's tables cache the codons of the first compound set they are asked with
        var table = new IUPACParser().getTable(id);
        Map<String, Character> out = new TreeMap<>();
        for (var c : table.getCodons(DNACompoundSet.getDNACompoundSet(),
                AminoAcidCompoundSet.getAminoAcidCompoundSet())) {
            out.put(c.toString().toUpperCase(Locale.ROOT), c.getAminoAcid().toString().charAt(0));
        }
        return out;
    }

    /** The stop codons of NCBI table {@code id}. */
    public static Set<String> stops(int id) {
        Set<String> out = new TreeSet<>();
        translation(id).forEach((codon, aa) -> {
            if (aa == '*') {
                out.add(codon);
            }
        });
        return out;
    }

    /** The codons NCBI table {@code id} marks as possible initiators ("Starts" row, M). */
    public static Set<String> starts(int id) {
        var table = new IUPACParser().getTable(id);
        Set<String> out = new TreeSet<>();
        for (var c : table.getCodons(DNACompoundSet.getDNACompoundSet(),
                AminoAcidCompoundSet.getAminoAcidCompoundSet())) {
            if (c.isStart()) {
                out.add(c.toString().toUpperCase(Locale.ROOT));
            }
        }
        return out;
    }

    /** All 64 codons over A, C, G, T. */
    public static Set<String> allCodons() {
        Set<String> out = new TreeSet<>();
        String b = "ACGT";
        for (int i = 0; i < 64; i++) {
            out.add("" + b.charAt(i >> 4) + b.charAt((i >> 2) & 3) + b.charAt(i & 3));
        }
        return out;
    }

    /** Reverse complement, written here rather than taken from {@link GeneticCode} so the tests check it. */
    public static String reverseComplement(String dna) {
        StringBuilder out = new StringBuilder(dna.length());
        for (int i = dna.length() - 1; i >= 0; i--) {
            out.append("TGCA".charAt("ACGT".indexOf(dna.charAt(i))));
        }
        return out.toString();
    }
}
