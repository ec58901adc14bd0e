package dev.annotator.hmm;

import dev.annotator.seq.BaseCode;

/**
 * Walks a sequence left to right and gives each state's emission probability at the current base, keeping the
 * preceding bases as a rolling 2-bit-per-base context. A missing base (N or another ambiguity code) emits with
 * factor 1 in every state and clears the context, so the next bases use the reduced-order tables until enough
 * clean bases precede them again.
 *
 * <p>Mutable and owned by one kernel call; never shared between threads.
 */
final class EmissionTrack {
    private static final byte[] CODE = BaseCode.table();

    private final int stateCount;
    private final int maxOrder;
    private final int[] order;
    private final double[][] tables;
    private final int[][] offsets;
    private final int contextMask;
    private final double missingValue;
    private int context;
    private int clean;

    EmissionTrack(HmmParameters p) {
        this(p, p.emissionTables(), 1.0);
    }

    /**
     * @param tables       per state, tables laid out like {@link HmmParameters#emissionTables()} (for example
     *                     their logarithms)
     * @param missingValue what a missing base emits in every state (1, or 0 for log tables)
     */
    EmissionTrack(HmmParameters p, double[][] tables, double missingValue) {
        this.stateCount = p.stateCount();
        this.maxOrder = p.maxOrder();
        this.order = p.orderArray();
        this.tables = tables;
        this.offsets = p.tableOffsets();
        this.contextMask = maxOrder == 0 ? 0 : (1 << (2 * maxOrder)) - 1;
        this.missingValue = missingValue;
    }

    /** Positions the track so that the next call to {@link #emit} describes base {@code t} of {@code seq}. */
    void seek(byte[] seq, int t) {
        context = 0;
        clean = 0;
        int from = Math.max(0, t - maxOrder);
        for (int i = from; i < t; i++) {
            push(CODE[seq[i] & 0xFF]);
        }
    }

    /** Writes the emission probability of base {@code b} into {@code e[eOff + s]} for every state, then steps past it. */
    void emit(byte b, double[] e, int eOff) {
        byte code = CODE[b & 0xFF];
        if (code < 0 || code == BaseCode.MISSING) {
            for (int s = 0; s < stateCount; s++) {
                e[eOff + s] = missingValue;
            }
        } else {
            for (int s = 0; s < stateCount; s++) {
                int j = Math.min(order[s], clean);
                int ctx = context & ((1 << (2 * j)) - 1);
                e[eOff + s] = tables[s][offsets[s][j] + (ctx << 2) + code];
            }
        }
        push(code);
    }

    private void push(byte code) {
        if (code < 0 || code == BaseCode.MISSING) {
            context = 0;
            clean = 0;
        } else {
            context = ((context << 2) | code) & contextMask;
            if (clean < maxOrder) {
                clean++;
            }
        }
    }
}
