package dev.annotator.decode;

/**
 * GC fraction and observed/expected CpG of a stretch of sequence, following Gardiner-Garden &amp; Frommer
 * (1987, J Mol Biol 196:261): o/e = n(CG) x L / (n(C) x n(G)). Ambiguous bases (N and other IUPAC codes) are
 * left out: L counts unambiguous bases only, and a CG pair counts only when both bases are unambiguous.
 */
public final class CompositionCounter {
    private CompositionCounter() {
    }

    /** Composition of {@code bases[from, to)} (0-based, end excluded). */
    public static Composition of(byte[] bases, int from, int to) {
        BaseTally tally = new BaseTally();
        tally.add(bases, from, to);
        return tally.composition();
    }
}
