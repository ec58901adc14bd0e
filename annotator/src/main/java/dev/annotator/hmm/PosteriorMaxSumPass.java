package dev.annotator.hmm;

/**
 * The backward-in-time maximisation behind {@link PosteriorViterbi}, fed one block of posteriors at a time in
 * the order forward-backward produces them (last block first, positions ascending within a block).
 *
 * <p>score_t(i) = post_t(i) + max over successors j of i of score_{t+1}(j), minus infinity where state i cannot
 * be at t; the chosen successor is kept as one byte per (t, i). One pass per sequence; not thread-safe.
 */
final class PosteriorMaxSumPass implements PosteriorBlockSink {
    private final int n;
    private final int k;
    private final double[] start;
    private final int[] succOffset;
    private final int[] succState;
    private final double tolerance;
    private final byte[] next;
    // score of each state at the position after the one being filled, shifted so the best is 0
    private double[] later;
    private double[] current;
    private double shift;
    private int expectedEnd;

    PosteriorMaxSumPass(int n, int k, double[] start, int[] succOffset, int[] succState, double tolerance) {
        this.n = n;
        this.k = k;
        this.start = start;
        this.succOffset = succOffset;
        this.succState = succState;
        this.tolerance = tolerance;
        this.next = new byte[n * k];
        this.later = new double[k];
        this.current = new double[k];
        this.expectedEnd = n;
    }

    /** @param emission null: a state is visitable where its posterior is above zero; else where this is */
    @Override
    public void block(int from, int end, double[] posterior, double[] emission) {
        if (end != expectedEnd || from < 0 || from >= end) {
            throw new IllegalStateException("posterior block [" + from + ", " + end + ") out of order; expected one"
                    + " ending at " + expectedEnd);
        }
        double[] visitable = emission == null ? posterior : emission;
        final double minusInf = Double.NEGATIVE_INFINITY;
        for (int t = end - 1; t >= from; t--) {
            int row = (t - from) * k;
            int backRow = t * k;
            boolean last = t == n - 1;
            double best = minusInf;
            for (int i = 0; i < k; i++) {
                double score = minusInf;
                int arg = 0;
                if (visitable[row + i] > 0) {
                    if (last) {
                        score = posterior[row + i];
                    } else {
                        double bj = minusInf;
                        int found = -1;
                        for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                            double cand = later[succState[q]];
                            if (cand > bj + tolerance || (found < 0 && cand > minusInf)) {
                                bj = cand;
                                found = succState[q];
                            }
                        }
                        if (found >= 0) {
                            score = posterior[row + i] + bj;
                            arg = found;
                        }
                    }
                }
                current[i] = score;
                next[backRow + i] = (byte) arg;
                best = Math.max(best, score);
            }
            if (best == minusInf) {
                throw new ImpossibleSequenceException(t);
            }
            for (int i = 0; i < k; i++) {
                current[i] -= best;
            }
            shift += best;
            double[] swap = later;
            later = current;
            current = swap;
        }
        expectedEnd = from;
    }

    /** The path from the best first state with start probability above zero. */
    PosteriorPath finish() {
        if (expectedEnd != 0) {
            throw new IllegalStateException("posteriors missing before position " + expectedEnd);
        }
        int first = -1;
        for (int i = 0; i < k; i++) {
            if (start[i] > 0 && later[i] > Double.NEGATIVE_INFINITY
                    && (first < 0 || later[i] > later[first] + tolerance)) {
                first = i;
            }
        }
        if (first < 0) {
            throw new ImpossibleSequenceException(0);
        }
        byte[] path = new byte[n];
        path[0] = (byte) first;
        for (int t = 0; t + 1 < n; t++) {
            path[t + 1] = next[t * k + (path[t] & 0xFF)];
        }
        return new PosteriorPath(path, shift + later[first]);
    }
}
