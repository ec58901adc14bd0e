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

    /** Composition of {@code bases[from, to)} (0-based, end excluded). */
    public static Composition of(byte[] bases, int from, int to) {
        long[] n = new long[4];
        long cg = 0;
        int previous = -1;
        for (int i = from; i < to; i++) {
            int code = BaseCode.of(bases[i]);
            if (code >= 0 && code < 4) {
                n[code]++;
                if (previous == 1 && code == 2) {
                    cg++;
                }
                previous = code;
            } else {
                previous = -1;
            }
        }
        long length = n[0] + n[1] + n[2] + n[3];
        double gc = length == 0 ? Double.NaN : (double) (n[1] + n[2]) / length;
        double oe = n[1] == 0 || n[2] == 0 ? Double.NaN : (double) cg * length / ((double) n[1] * n[2]);
        return new Composition(gc, oe);
    }
}
