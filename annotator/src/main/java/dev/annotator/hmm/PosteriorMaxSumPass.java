package dev.annotator.hmm;

/**
 * The backward-in-time maximisation behind {@link PosteriorViterbi}, fed one block of posteriors at a time in
 * the order forward-backward produces them (last block first, positions ascending within a block).
 *
 * <p>score_t(i) = post_t(i) + max over successors j of i of score_{t+1}(j), minus infinity where state i cannot
 * be at t. Successors are scanned in ascending order and a later one replaces the one held only when its score is
 * above it by more than the tolerance. States are visited by {@link SuccessorGroups} (one successor, two, more)
 * rather than in index order: the scores do not depend on the order, and a state with one successor needs neither
 * a comparison nor a back-pointer. The chosen successor of each state with several is kept as one byte per (t,
 * slot). One pass per sequence; not thread-safe.
 *
 * <p>Whether a state is visitable (its emission, or its posterior, above zero) is turned into minus infinity by
 * bit masks rather than a branch: on a genome it follows the bases (a codon base that would complete a stop codon
 * cannot be emitted), and a branch on it is mispredicted often.
 */
final class PosteriorMaxSumPass implements PosteriorBlockSink {
    private static final long MINUS_INF_BITS = Double.doubleToRawLongBits(Double.NEGATIVE_INFINITY);

    private final int n;
    private final int k;
    private final double[] start;
    private final SuccessorGroups g;
    private final double tolerance;
    private final byte[] next;
    // score of each state at the position after the one being filled, shifted so the best is 0
    private double[] later;
    private double[] current;
    private double shift;
    private int expectedEnd;

    PosteriorMaxSumPass(int n, double[] start, SuccessorGroups groups, double tolerance) {
        this.n = n;
        this.k = groups.stateCount;
        this.start = start;
        this.g = groups;
        this.tolerance = tolerance;
        this.next = new byte[n * groups.slots];
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
        int t = end - 1;
        if (t == n - 1) {
            lastBase(posterior, visitable, (t - from) * k);
            t--;
        }
        for (; t >= from; t--) {
            int row = (t - from) * k;
            double[] lat = later;
            double[] cur = current;
            oneSuccessor(row, lat, cur, posterior, visitable);
            twoSuccessors(row, t * g.slots, lat, cur, posterior, visitable);
            manySuccessors(row, t * g.slots, lat, cur, posterior, visitable);
            for (int i : g.noneState) {
                cur[i] = Double.NEGATIVE_INFINITY;
            }
            finishBase(t);
        }
        expectedEnd = from;
    }

    private void oneSuccessor(int row, double[] lat, double[] cur, double[] posterior, double[] visitable) {
        final int[] oneState = g.oneState;
        final int[] oneSucc = g.oneSucc;
        for (int q = 0; q < oneState.length; q++) {
            int i = oneState[q];
            cur[i] = unlessBarred(visitable[row + i], posterior[row + i] + lat[oneSucc[q]]);
        }
    }

    private void twoSuccessors(int row, int backRow, double[] lat, double[] cur, double[] posterior,
                               double[] visitable) {
        final double tol = tolerance;
        final int[] twoState = g.twoState;
        final int[] twoLow = g.twoLow;
        final int[] twoHigh = g.twoHigh;
        final int[] twoSlot = g.twoSlot;
        final byte[] back = next;
        for (int q = 0; q < twoState.length; q++) {
            int i = twoState[q];
            int low = twoLow[q];
            int high = twoHigh[q];
            double bl = lat[low];
            double bh = lat[high];
            // minus infinity plus the tolerance stays minus infinity, so a finite higher score replaces an
            // impossible lower one, as in the scan over many successors
            boolean takeHigh = bh > bl + tol;
            double bj = takeHigh ? bh : bl;
            cur[i] = unlessBarred(visitable[row + i], posterior[row + i] + bj);
            back[backRow + twoSlot[q]] = (byte) (takeHigh ? high : low);
        }
    }

    private void manySuccessors(int row, int backRow, double[] lat, double[] cur, double[] posterior,
                                double[] visitable) {
        final double tol = tolerance;
        final int[] manyState = g.manyState;
        final int[] manyOffset = g.manyOffset;
        final int[] manySucc = g.manySucc;
        final int[] manySlot = g.manySlot;
        final byte[] back = next;
        for (int q = 0; q < manyState.length; q++) {
            int i = manyState[q];
            int e = manyOffset[q];
            int arg = manySucc[e];
            double bj = lat[arg];
            for (int r = e + 1; r < manyOffset[q + 1]; r++) {
                int j = manySucc[r];
                double cand = lat[j];
                if (cand > bj + tol) {
                    bj = cand;
                    arg = j;
                }
            }
            cur[i] = unlessBarred(visitable[row + i], posterior[row + i] + bj);
            back[backRow + manySlot[q]] = (byte) arg;
        }
    }

    /** The last base of the sequence: a state's score is its posterior where it is visitable. */
    private void lastBase(double[] posterior, double[] visitable, int row) {
        for (int i = 0; i < k; i++) {
            current[i] = visitable[row + i] > 0 ? posterior[row + i] : Double.NEGATIVE_INFINITY;
        }
        finishBase(n - 1);
    }

    /** Shifts the scores of base t so the best is 0, and makes them the scores the next (earlier) base reads. */
    private void finishBase(int t) {
        double best = max(current, k);
        if (best == Double.NEGATIVE_INFINITY) {
            throw new ImpossibleSequenceException(t);
        }
        double[] cur = current;
        for (int i = 0; i < k; i++) {
            cur[i] -= best;
        }
        shift += best;
        current = later;
        later = cur;
    }

    /**
     * The largest of {@code a[0..k)}, by four running maxima rather than one: the next base waits for this value,
     * so the length of the chain of comparisons is on the critical path. The maximum does not depend on the order.
     */
    private static double max(double[] a, int k) {
        double m0 = Double.NEGATIVE_INFINITY;
        double m1 = Double.NEGATIVE_INFINITY;
        double m2 = Double.NEGATIVE_INFINITY;
        double m3 = Double.NEGATIVE_INFINITY;
        int i = 0;
        for (; i + 3 < k; i += 4) {
            m0 = Math.max(m0, a[i]);
            m1 = Math.max(m1, a[i + 1]);
            m2 = Math.max(m2, a[i + 2]);
            m3 = Math.max(m3, a[i + 3]);
        }
        for (; i < k; i++) {
            m0 = Math.max(m0, a[i]);
        }
        return Math.max(Math.max(m0, m1), Math.max(m2, m3));
    }

    /**
     * {@code score}, or minus infinity where {@code visitable} is not above zero (0, -0 or negative; never NaN
     * here), without a branch.
     */
    private static double unlessBarred(double visitable, double score) {
        long v = Double.doubleToRawLongBits(visitable);
        // all ones when v is 0 (+0) or has its sign bit set (-0, negative)
        long barred = ((v - 1) | v) >> 63;
        return Double.longBitsToDouble((Double.doubleToRawLongBits(score) & ~barred) | (MINUS_INF_BITS & barred));
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
        final int[] only = g.onlySuccessor;
        final int[] slotOf = g.slotOf;
        final int slots = g.slots;
        byte[] path = new byte[n];
        int s = first;
        path[0] = (byte) s;
        for (int t = 0; t + 1 < n; t++) {
            // a state on the path before the last base has a finite score, so it has a successor
            int j = only[s];
            s = j >= 0 ? j : next[t * slots + slotOf[s]] & 0xFF;
            path[t + 1] = (byte) s;
        }
        return new PosteriorPath(path, shift + later[first]);
    }
}
