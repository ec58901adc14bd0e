package dev.annotator.hmm;

import dev.annotator.seq.BaseCode;

/**
 * Every emission vector a model can need, precomputed: a base together with its usable context (the clean
 * preceding bases, at most the model's largest order) is one symbol, and the table holds each state's emission
 * probability for each symbol. Kernels then pay one table row per base instead of one lookup per state.
 *
 * <p>Symbol 0 is a missing base (N or another ambiguity code): factor 1 in every state. A base with j usable
 * context bases (j below the largest order near the start of a record or after a missing base) is symbol
 * {@code offset(j) + context * 4 + base}; each state reads its table at order min(its order, j).
 */
final class EmissionSymbols {
    private static final byte[] CODE = BaseCode.table();

    final int stateCount;
    final int maxOrder;
    /** Emission probability of symbol y in state s at {@code table[y * stateCount + s]}. */
    final double[] table;
    private final int[] orderOffset;
    private final int contextMask;

    EmissionSymbols(HmmParameters p) {
        this(p, false);
    }

    /** @param logarithms table of natural logs (0 for a missing base) instead of probabilities */
    EmissionSymbols(HmmParameters p, boolean logarithms) {
        this.stateCount = p.stateCount();
        this.maxOrder = p.maxOrder();
        this.orderOffset = new int[maxOrder + 1];
        int symbols = 1;
        for (int j = 0; j <= maxOrder; j++) {
            orderOffset[j] = symbols;
            symbols += 4 << (2 * j);
        }
        this.contextMask = maxOrder == 0 ? 0 : (1 << (2 * maxOrder)) - 1;
        int k = stateCount;
        table = new double[symbols * k];
        for (int s = 0; s < k; s++) {
            table[s] = logarithms ? 0.0 : 1.0;
        }
        for (int j = 0; j <= maxOrder; j++) {
            for (int ctx = 0; ctx < (1 << (2 * j)); ctx++) {
                for (int b = 0; b < 4; b++) {
                    int y = orderOffset[j] + ctx * 4 + b;
                    for (int s = 0; s < k; s++) {
                        int js = Math.min(p.order(s), j);
                        int ctxS = ctx & ((1 << (2 * js)) - 1);
                        double e = p.emission(s, js, ctxS, b);
                        table[y * k + s] = logarithms ? Math.log(e) : e;
                    }
                }
            }
        }
    }

    /**
     * Fills {@code symbols[i]} with the symbol of base {@code from + i} for i in [0, to - from), reading the
     * context from the bases before {@code from} when there are any.
     */
    void encode(byte[] seq, int from, int to, int[] symbols) {
        int context = 0;
        int clean = 0;
        for (int i = Math.max(0, from - maxOrder); i < from; i++) {
            int code = CODE[seq[i] & 0xFF];
            if (code < 0 || code == BaseCode.MISSING) {
                context = 0;
                clean = 0;
            } else {
                context = ((context << 2) | code) & contextMask;
                clean = Math.min(clean + 1, maxOrder);
            }
        }
        for (int t = from; t < to; t++) {
            int code = CODE[seq[t] & 0xFF];
            if (code < 0 || code == BaseCode.MISSING) {
                symbols[t - from] = 0;
                context = 0;
                clean = 0;
            } else {
                symbols[t - from] = orderOffset[clean] + ((context & ((1 << (2 * clean)) - 1)) << 2) + code;
                context = ((context << 2) | code) & contextMask;
                if (clean < maxOrder) {
                    clean++;
                }
            }
        }
    }
}
