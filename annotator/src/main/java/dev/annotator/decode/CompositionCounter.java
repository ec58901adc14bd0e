package dev.annotator.decode;

import dev.annotator.seq.BaseCode;

/**
 * GC fraction and observed/expected CpG of a stretch of sequence, following Gardiner-Garden &amp; Frommer
 * (1987, J Mol Biol 196:261): o/e = n(CG) x L / (n(C) x n(G)). Ambiguous bases (N and other IUPAC codes) are
 * left out: L counts unambiguous bases only, and a CG pair counts only when both bases are unambiguous.
 */
public final class CompositionCounter {
    private CompositionCounter() {
    }

    private static final byte[] CODE = BaseCode.table();

    /** Composition of {@code bases[from, to)} (0-based, end excluded). */
    public static Composition of(byte[] bases, int from, int to) {
        // branch-free counting (bases are close to random, so branches would mispredict): counts indexed by
        // code, with every ambiguous or invalid byte counted in slot 4; a CpG is previous code 1 then code 2
        final byte[] code = CODE;
        long[] n = new long[5];
        long cg = 0;
        int previous = 4;
        for (int i = from; i < to; i++) {
            int x = code[bases[i] & 0xFF];
            x = x < 0 ? 4 : x;
            n[x]++;
            cg += (previous << 3 | x) == (1 << 3 | 2) ? 1 : 0;
            previous = x;
        }
        long length = n[0] + n[1] + n[2] + n[3];
        double gc = length == 0 ? Double.NaN : (double) (n[1] + n[2]) / length;
        double oe = n[1] == 0 || n[2] == 0 ? Double.NaN : (double) cg * length / ((double) n[1] * n[2]);
        return new Composition(gc, oe);
    }
}
