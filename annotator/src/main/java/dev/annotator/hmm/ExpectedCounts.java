package dev.annotator.hmm;

/**
 * Expected numbers of starts, transitions and emissions of a hidden Markov model given sequences: the E-step of
 * Baum-Welch (or plain counts, when every base's state is known). A mutable accumulator owned by one task at a
 * time; {@link #add} combines accumulators in an order the caller fixes, so totals do not depend on threads.
 *
 * <p>Layout follows {@link HmmParameters}: transitions in by-source order (index q runs over the allowed
 * transitions sorted by source, then destination), and per state the emission counts of every order 0..k back to
 * back, as in {@link HmmParameters#emissionTables()}. The kernel counts a base under the table it was emitted
 * from; {@link BaumWelchKernel#fold} then moves the counts of reduced-order tables (bases near a record start or
 * after a missing base) into the full-order table, after which only the full-order part is non-zero.
 */
public final class ExpectedCounts {
    private final int stateCount;
    private final int[] order;
    private final int[][] tableOffset;
    private final int[] transitionFrom;
    private final int[] transitionTo;
    private final double[] start;
    private final double[] transition;
    private final double[][] emission;
    private double logLikelihood;
    private long bases;
    private long records;

    /** Zero counts shaped for {@code p}. */
    public ExpectedCounts(HmmParameters p) {
        this.stateCount = p.stateCount();
        this.order = p.orderArray().clone();
        this.tableOffset = p.tableOffsets();
        int[] succOffset = p.succOffset();
        int[] succState = p.succState();
        int n = succState.length;
        this.transitionFrom = new int[n];
        this.transitionTo = succState.clone();
        for (int i = 0; i < stateCount; i++) {
            for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                transitionFrom[q] = i;
            }
        }
        this.start = new double[stateCount];
        this.transition = new double[n];
        this.emission = new double[stateCount][];
        double[][] tables = p.emissionTables();
        for (int s = 0; s < stateCount; s++) {
            emission[s] = new double[tables[s].length];
        }
    }

    /** Adds every count of {@code other} (shaped for the same parameters) to this one. */
    public void add(ExpectedCounts other) {
        if (other.stateCount != stateCount || other.transition.length != transition.length) {
            throw new IllegalArgumentException("counts of differently shaped models");
        }
        for (int s = 0; s < stateCount; s++) {
            start[s] += other.start[s];
            double[] mine = emission[s];
            double[] theirs = other.emission[s];
            for (int i = 0; i < mine.length; i++) {
                mine[i] += theirs[i];
            }
        }
        for (int q = 0; q < transition.length; q++) {
            transition[q] += other.transition[q];
        }
        logLikelihood += other.logLikelihood;
        bases += other.bases;
        records += other.records;
    }

    public int stateCount() {
        return stateCount;
    }

    /** Expected number of sequences that start in state s. */
    public double start(int s) {
        return start[s];
    }

    /** Number of allowed transitions. */
    public int transitionCount() {
        return transition.length;
    }

    public int transitionFrom(int q) {
        return transitionFrom[q];
    }

    public int transitionTo(int q) {
        return transitionTo[q];
    }

    /** Expected number of uses of allowed transition q. */
    public double transition(int q) {
        return transition[q];
    }

    /** Expected number of uses of transition i -> j; 0 when it is not allowed. */
    public double transition(int i, int j) {
        for (int q = 0; q < transition.length; q++) {
            if (transitionFrom[q] == i && transitionTo[q] == j) {
                return transition[q];
            }
        }
        return 0;
    }

    /** Emission order of state s. */
    public int order(int s) {
        return order[s];
    }

    /**
     * Expected number of times state s emitted {@code base} after the full-order {@code context}. Complete only
     * after {@link BaumWelchKernel#fold}.
     */
    public double emission(int s, int context, int base) {
        return emission[s][tableOffset[s][order[s]] + context * 4 + base];
    }

    /** A copy of state s's full-order emission counts, 4^k rows of 4 in model-file row order. */
    public double[] fullOrderEmissions(int s) {
        int from = tableOffset[s][order[s]];
        return java.util.Arrays.copyOfRange(emission[s], from, emission[s].length);
    }

    /** Natural log-likelihood of the sequences counted (with labels: of the sequences and their labels). */
    public double logLikelihood() {
        return logLikelihood;
    }

    public long bases() {
        return bases;
    }

    public long records() {
        return records;
    }

    // ---- for the kernels in this package ----

    double[] startArray() {
        return start;
    }

    double[] transitionArray() {
        return transition;
    }

    double[][] emissionArrays() {
        return emission;
    }

    void addLogLikelihood(double value) {
        logLikelihood += value;
    }

    void addBases(long n) {
        bases += n;
    }

    void addRecord() {
        records++;
    }
}
