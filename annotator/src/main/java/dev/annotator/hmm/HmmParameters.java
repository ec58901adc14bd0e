package dev.annotator.hmm;

import java.util.Arrays;

/**
 * The numbers of a hidden Markov model laid out for the kernels: primitive arrays only, immutable.
 *
 * <p>Transitions are sparse and stored twice, by destination (for forward and Viterbi: who can reach j) and by
 * source (for backward: where can i go), so kernels cost O(allowed transitions) per base, not O(states^2).
 *
 * <p>Emissions: state s has order k_s; its table gives P(base | k preceding bases) in rows of 4, row index =
 * context as a base-4 number, oldest base most significant. For every order j below k_s a reduced table is
 * derived by averaging out the oldest context base with equal weights; kernels use it near the start of a
 * record and after a missing base (N or another ambiguity code), where fewer than k_s clean preceding bases
 * exist. This is the graceful fallback for contexts that contain a missing base.
 */
public final class HmmParameters {
    private final int stateCount;
    private final int maxOrder;
    private final double[] start;
    private final int[] order;
    // emission[s] holds the tables of orders 0..order[s] back to back; tableOffset[s][j] is where order j starts
    private final double[][] emission;
    private final int[][] tableOffset;
    private final int[] predOffset;
    private final int[] predState;
    private final double[] predProb;
    private final int[] succOffset;
    private final int[] succState;
    private final double[] succProb;

    /**
     * @param start     start probability per state
     * @param from      source state of each allowed transition
     * @param to        destination state of each allowed transition
     * @param prob      probability of each allowed transition
     * @param orders    emission order per state
     * @param emissions per state, the full order-k table (4^k * 4 values)
     */
    public HmmParameters(double[] start, int[] from, int[] to, double[] prob, int[] orders, double[][] emissions) {
        int k = start.length;
        if (k == 0 || orders.length != k || emissions.length != k) {
            throw new IllegalArgumentException("state count mismatch");
        }
        if (from.length != to.length || from.length != prob.length) {
            throw new IllegalArgumentException("transition arrays differ in length");
        }
        this.stateCount = k;
        this.start = start.clone();
        this.order = orders.clone();
        int max = 0;
        this.emission = new double[k][];
        this.tableOffset = new int[k][];
        for (int s = 0; s < k; s++) {
            int ks = orders[s];
            if (ks < 0 || emissions[s].length != (4 << (2 * ks))) {
                throw new IllegalArgumentException("state " + s + ": table size does not match order " + ks);
            }
            max = Math.max(max, ks);
            buildTables(s, ks, emissions[s]);
        }
        this.maxOrder = max;

        int n = from.length;
        predOffset = new int[k + 1];
        succOffset = new int[k + 1];
        for (int t = 0; t < n; t++) {
            predOffset[to[t] + 1]++;
            succOffset[from[t] + 1]++;
        }
        for (int s = 0; s < k; s++) {
            predOffset[s + 1] += predOffset[s];
            succOffset[s + 1] += succOffset[s];
        }
        predState = new int[n];
        predProb = new double[n];
        succState = new int[n];
        succProb = new double[n];
        int[] pFill = Arrays.copyOf(predOffset, k);
        int[] sFill = Arrays.copyOf(succOffset, k);
        // stable order: predecessors of j sorted by source index, so ties in Viterbi resolve to the lowest index
        Integer[] idx = new Integer[n];
        for (int t = 0; t < n; t++) {
            idx[t] = t;
        }
        Arrays.sort(idx, (a, b) -> from[a] != from[b] ? Integer.compare(from[a], from[b]) : Integer.compare(to[a], to[b]));
        for (int t : idx) {
            int p = pFill[to[t]]++;
            predState[p] = from[t];
            predProb[p] = prob[t];
            int q = sFill[from[t]]++;
            succState[q] = to[t];
            succProb[q] = prob[t];
        }
    }

    private void buildTables(int s, int ks, double[] full) {
        int total = 0;
        int[] offsets = new int[ks + 1];
        for (int j = 0; j <= ks; j++) {
            offsets[j] = total;
            total += 4 << (2 * j);
        }
        double[] all = new double[total];
        System.arraycopy(full, 0, all, offsets[ks], full.length);
        for (int j = ks - 1; j >= 0; j--) {
            int rows = 1 << (2 * j);
            int hi = offsets[j + 1];
            int lo = offsets[j];
            for (int ctx = 0; ctx < rows; ctx++) {
                for (int b = 0; b < 4; b++) {
                    double sum = 0;
                    for (int oldest = 0; oldest < 4; oldest++) {
                        sum += all[hi + (oldest * rows + ctx) * 4 + b];
                    }
                    all[lo + ctx * 4 + b] = sum / 4;
                }
            }
        }
        emission[s] = all;
        tableOffset[s] = offsets;
    }

    public int stateCount() {
        return stateCount;
    }

    public int maxOrder() {
        return maxOrder;
    }

    public int order(int state) {
        return order[state];
    }

    public double start(int state) {
        return start[state];
    }

    /** P(base | context of length j) for state s; {@code j <= order(s)}, context holds the j preceding bases. */
    public double emission(int s, int j, int context, int base) {
        return emission[s][tableOffset[s][j] + context * 4 + base];
    }

    // ---- raw views for kernels in this package (no copies: callers here never write to them) ----

    double[] startArray() {
        return start;
    }

    int[] orderArray() {
        return order;
    }

    double[][] emissionTables() {
        return emission;
    }

    int[][] tableOffsets() {
        return tableOffset;
    }

    int[] predOffset() {
        return predOffset;
    }

    int[] predState() {
        return predState;
    }

    double[] predProb() {
        return predProb;
    }

    int[] succOffset() {
        return succOffset;
    }

    int[] succState() {
        return succState;
    }

    double[] succProb() {
        return succProb;
    }

    /** Number of allowed transitions. */
    public int transitionCount() {
        return predState.length;
    }

    /** Allowed transition i -> j as probability, 0 when forbidden (linear scan: for tests and summaries). */
    public double transition(int i, int j) {
        for (int p = succOffset[i]; p < succOffset[i + 1]; p++) {
            if (succState[p] == j) {
                return succProb[p];
            }
        }
        return 0;
    }
}
