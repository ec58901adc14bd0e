package dev.annotator.decode;

import dev.annotator.seq.BaseCode;

/**
 * Running counts over a record read left to right in pieces: bases by kind, CpG pairs (counted across piece
 * boundaries too), ambiguous bases and the longest run of them. One pass gives the record's composition and each
 * plot bin's GC from the differences between snapshots. Tallies of consecutive stretches, each started where the
 * one before ends ({@link #startingAt}), join into the tally of the whole ({@link #append}), so the stretches can
 * be counted at once on different threads.
 *
 * <p>The counts of A, C, G and T are packed into one long (16 bits each) and added with one table lookup per
 * base, flushed before a field can overflow; CpG pairs come from a table indexed by the previous and the current
 * byte. Ambiguous bases are rare, so the run lengths are measured only in pieces that hold any.
 */
final class BaseTally {
    private static final long[] PACKED = packedIncrements();
    private static final byte[] CPG = cpgPairs();
    private static final byte[] CODE = BaseCode.table();
    /** Bases added between flushes of the packed counts: below 2^16, so no 16-bit field overflows. */
    private static final int FLUSH = 65_535;

    // slots 0-3: A, C, G, T; slot 4: any ambiguous or other byte
    private final long[] n = new long[5];
    private long cg;
    private int previousByte = -1;
    private long added;
    // ambiguous bases before the first unambiguous one, and whether every base so far was ambiguous
    private long leading;
    private boolean leadingOpen = true;
    // ambiguous bases after the last unambiguous one (the run still open)
    private long run;
    private long longestRun;

    BaseTally() {
    }

    /**
     * An empty tally of a stretch starting at {@code from}: the base before it counts as the first half of a CpG
     * pair, as in a tally that had added everything before.
     */
    static BaseTally startingAt(byte[] bases, int from) {
        BaseTally tally = new BaseTally();
        tally.previousByte = from > 0 ? bases[from - 1] & 0xFF : -1;
        return tally;
    }

    /** Adds {@code bases[from, to)}, which must follow what was added before. */
    void add(byte[] bases, int from, int to) {
        final long[] packed = PACKED;
        final byte[] cpg = CPG;
        long pairs = 0;
        int prev = previousByte < 0 ? 0 : previousByte;
        for (int chunk = from; chunk < to; chunk += FLUSH) {
            int end = Math.min(to, chunk + FLUSH);
            long acc = 0;
            for (int i = chunk; i < end; i++) {
                int b = bases[i] & 0xFF;
                acc += packed[b];
                pairs += cpg[prev << 8 | b];
                prev = b;
            }
            long a = a(acc);
            long c = c(acc);
            long g = g(acc);
            long t = t(acc);
            n[0] += a;
            n[1] += c;
            n[2] += g;
            n[3] += t;
            long other = (end - chunk) - (a + c + g + t);
            if (other > 0) {
                n[4] += other;
                measureRuns(bases, chunk, end);
            } else if (end > chunk) {
                run = 0;
                leadingOpen = false;
            }
            added += end - chunk;
        }
        cg += pairs;
        if (to > from) {
            previousByte = bases[to - 1] & 0xFF;
        }
    }

    /**
     * The counts of A, C, G and T in {@code bases[from, to)}, fewer than 65,536 bases, packed 16 bits each (read
     * them with {@link #a} to {@link #t}).
     */
    static long packedCounts(byte[] bases, int from, int to) {
        if (to - from > FLUSH) {
            throw new IllegalArgumentException("at most " + FLUSH + " bases, got " + (to - from));
        }
        final long[] packed = PACKED;
        long acc = 0;
        for (int i = from; i < to; i++) {
            acc += packed[bases[i] & 0xFF];
        }
        return acc;
    }

    static long a(long packed) {
        return packed & 0xFFFF;
    }

    static long c(long packed) {
        return (packed >>> 16) & 0xFFFF;
    }

    static long g(long packed) {
        return (packed >>> 32) & 0xFFFF;
    }

    static long t(long packed) {
        return (packed >>> 48) & 0xFFFF;
    }

    private void measureRuns(byte[] bases, int from, int to) {
        long r = run;
        long longest = longestRun;
        for (int i = from; i < to; i++) {
            int x = CODE[bases[i] & 0xFF];
            r = x >= 0 && x < 4 ? 0 : r + 1;
            longest = Math.max(longest, r);
        }
        if (leadingOpen) {
            int i = from;
            for (; i < to; i++) {
                int x = CODE[bases[i] & 0xFF];
                if (x >= 0 && x < 4) {
                    break;
                }
            }
            leading += i - from;
            leadingOpen = i == to;
        }
        run = r;
        longestRun = longest;
    }

    /**
     * Adds the tally of the stretch that follows this one's, made by {@link #startingAt} its first base (so the
     * CpG pair across the boundary is counted there, once); ambiguous runs that cross the boundary are joined.
     */
    void append(BaseTally next) {
        for (int i = 0; i < n.length; i++) {
            n[i] += next.n[i];
        }
        cg += next.cg;
        longestRun = Math.max(Math.max(longestRun, next.longestRun), run + next.leading);
        run = next.leadingOpen ? run + next.added : next.run;
        if (leadingOpen) {
            leading += next.leading;
            leadingOpen = next.leadingOpen;
        }
        if (next.added > 0) {
            previousByte = next.previousByte;
        }
        added += next.added;
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

    private static long[] packedIncrements() {
        long[] t = new long[256];
        byte[] code = BaseCode.table();
        for (int b = 0; b < 256; b++) {
            int x = code[b];
            t[b] = x >= 0 && x < 4 ? 1L << (16 * x) : 0;
        }
        return t;
    }

    private static byte[] cpgPairs() {
        byte[] t = new byte[1 << 16];
        byte[] code = BaseCode.table();
        for (int p = 0; p < 256; p++) {
            for (int b = 0; b < 256; b++) {
                t[p << 8 | b] = (byte) (code[p] == 1 && code[b] == 2 ? 1 : 0);
            }
        }
        return t;
    }
}
