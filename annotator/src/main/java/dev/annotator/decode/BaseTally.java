package dev.annotator.decode;

import dev.annotator.seq.BaseCode;

/**
 * Running counts over a record read left to right in pieces: bases by kind, CpG pairs (counted across piece
 * boundaries too), ambiguous bases and the longest run of them. One pass gives the record's composition and each
 * plot bin's GC from the differences between snapshots.
 */
final class BaseTally {
    private static final byte[] CODE = BaseCode.table();
    // slots 0-3: A, C, G, T; slot 4: any ambiguous or other byte
    private final long[] n = new long[5];
    private long cg;
    private int previous = 4;
    private long run;
    private long longestRun;

    /** Adds {@code bases[from, to)}, which must follow what was added before. */
    void add(byte[] bases, int from, int to) {
        // branch-free counting: bases are close to random, so branches on them would mispredict
        final byte[] code = CODE;
        final long[] counts = n;
        long pairs = cg;
        int prev = previous;
        long r = run;
        long longest = longestRun;
        for (int i = from; i < to; i++) {
            int x = code[bases[i] & 0xFF];
            x = x < 0 ? 4 : x;
            counts[x]++;
            pairs += (prev << 3 | x) == (1 << 3 | 2) ? 1 : 0;
            r = x == 4 ? r + 1 : 0;
            longest = Math.max(longest, r);
            prev = x;
        }
        cg = pairs;
        previous = prev;
        run = r;
        longestRun = longest;
    }

    long unambiguous() {
        return n[0] + n[1] + n[2] + n[3];
    }

    long gcCount() {
        return n[1] + n[2];
    }

    long ambiguous() {
        return n[4];
    }

    long longestAmbiguousRun() {
        return longestRun;
    }

    /** GC and observed/expected CpG of everything added, as {@link CompositionCounter} defines them. */
    Composition composition() {
        long length = unambiguous();
        double gc = length == 0 ? Double.NaN : (double) gcCount() / length;
        double oe = n[1] == 0 || n[2] == 0 ? Double.NaN : (double) cg * length / ((double) n[1] * n[2]);
        return new Composition(gc, oe);
    }
}
