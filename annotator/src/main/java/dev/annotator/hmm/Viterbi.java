package dev.annotator.hmm;

/**
 * Viterbi decoding in log space over sparse transitions.
 *
 * <p>Ties: two scores whose natural logs differ by at most {@link #TIE_TOLERANCE} are treated as equal, and the
 * lower-numbered state (earlier in the model file) wins, both for the predecessor chosen at each step and for
 * the final state. Scores are shifted so the best is 0 after every base, which keeps the tolerance meaningful
 * on sequences of any length.
 *
 * <p>Memory: one back-pointer byte per state and position (so at most {@link #MAX_STATES} states) and one path
 * byte per position.
 */
public final class Viterbi {
    public static final double TIE_TOLERANCE = 1e-12;
    public static final int MAX_STATES = 256;
    private static final int BLOCK = 1 << 14;

    private final HmmParameters p;
    private final double[] logStart;
    private final double[] logPredProb;
    private final EmissionSymbols logEmission;

    public Viterbi(HmmParameters parameters) {
        if (parameters.stateCount() > MAX_STATES) {
            throw new IllegalArgumentException("Viterbi supports at most " + MAX_STATES + " states");
        }
        this.p = parameters;
        int k = parameters.stateCount();
        logStart = new double[k];
        for (int s = 0; s < k; s++) {
            logStart[s] = Math.log(parameters.start(s));
        }
        double[] pp = parameters.predProb();
        logPredProb = new double[pp.length];
        for (int q = 0; q < pp.length; q++) {
            logPredProb[q] = Math.log(pp[q]);
        }
        logEmission = new EmissionSymbols(parameters, true);
    }

    /**
     * @throws ImpossibleSequenceException if no path can emit the sequence
     */
    public ViterbiPath decode(byte[] seq) {
        int n = seq.length;
        int k = p.stateCount();
        if (n == 0) {
            return new ViterbiPath(new byte[0], 0.0);
        }
        int[] predOffset = p.predOffset();
        int[] predState = p.predState();
        if ((long) n * k > Integer.MAX_VALUE - 8) {
            throw new IllegalArgumentException("Viterbi back-pointers for " + n + " bases x " + k
                    + " states exceed one Java array; decode this record with posterior decoding");
        }
        byte[] back = new byte[n * k];
        double[] prev = new double[k];
        double[] cur = new double[k];
        double[] e = logEmission.table;
        int[] sy = new int[Math.min(n, BLOCK)];
        double shift = 0;
        for (int t = 0; t < n; t++) {
            if (t % BLOCK == 0) {
                logEmission.encode(seq, t, Math.min(n, t + BLOCK), sy);
            }
            int y = sy[t % BLOCK] * k;
            double best = Double.NEGATIVE_INFINITY;
            if (t == 0) {
                for (int j = 0; j < k; j++) {
                    cur[j] = logStart[j] + e[y + j];
                    best = Math.max(best, cur[j]);
                }
            } else {
                int row = t * k;
                for (int j = 0; j < k; j++) {
                    double bj = Double.NEGATIVE_INFINITY;
                    int arg = -1;
                    for (int q = predOffset[j]; q < predOffset[j + 1]; q++) {
                        double cand = prev[predState[q]] + logPredProb[q];
                        if (cand > bj + TIE_TOLERANCE || (arg < 0 && cand > Double.NEGATIVE_INFINITY)) {
                            bj = cand;
                            arg = predState[q];
                        }
                    }
                    back[row + j] = (byte) (arg < 0 ? 0 : arg);
                    cur[j] = bj + e[y + j];
                    best = Math.max(best, cur[j]);
                }
            }
            if (best == Double.NEGATIVE_INFINITY) {
                throw new ImpossibleSequenceException(t);
            }
            for (int j = 0; j < k; j++) {
                cur[j] -= best;
            }
            shift += best;
            double[] swap = prev;
            prev = cur;
            cur = swap;
        }
        int last = 0;
        for (int j = 1; j < k; j++) {
            if (prev[j] > prev[last] + TIE_TOLERANCE) {
                last = j;
            }
        }
        double logProb = shift + prev[last];
        byte[] path = new byte[n];
        path[n - 1] = (byte) last;
        for (int t = n - 1; t > 0; t--) {
            path[t - 1] = back[t * k + (path[t] & 0xFF)];
        }
        return new ViterbiPath(path, logProb);
    }
}
