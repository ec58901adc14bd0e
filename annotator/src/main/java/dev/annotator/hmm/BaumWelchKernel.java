package dev.annotator.hmm;

import dev.annotator.seq.BaseCode;

import java.util.Arrays;
import java.util.concurrent.ForkJoinTask;

/**
 * The E-step of Baum-Welch: expected start, transition and emission counts of one sequence by scaled
 * forward-backward over primitive arrays, in memory that does not grow with length x states.
 *
 * <h2>Two halves</h2>
 * A sequence of at least {@code splitLength} bases is cut at its middle m. Phase one runs the forward pass over
 * the first half and, at the same time, the backward pass over the second half (the backward pass needs no
 * forward values); each keeps a checkpoint vector per block of {@code blockSize} bases. Phase two counts: the
 * first half walks its blocks from the end, recomputing each block's forward vectors from its checkpoint and
 * continuing the backward recursion from the second half's first backward vector; the second half walks its
 * blocks from the start, recomputing each block's backward vectors from their checkpoint and continuing the
 * forward recursion from the first half's last forward vector. Both phases have two independent jobs, so two
 * threads finish a long record in about half the time. Whether a sequence is cut depends on its length only,
 * never on the number of threads, and recomputation repeats the first pass's arithmetic exactly, so the counts
 * are the same bit for bit with or without threads and for any block size. Shorter sequences are one "half".
 *
 * <h2>Scaling</h2>
 * Forward vectors are normalised to sum 1 at every base (c_t is the factor; the log-likelihood is the sum of
 * log c_t, kept by {@link LogScaleAccumulator}); backward vectors are normalised to sum 1. With normalised
 * vectors the posterior of a transition i -> j between bases t and t+1 is
 * alpha_t(i) a_ij e_j(t+1) beta_{t+1}(j) / (c_{t+1} Z_{t+1}), where Z_{t+1} = sum_j alpha_{t+1}(j) beta_{t+1}(j)
 * is also the normaliser of the state posteriors at t+1; so every count needs one pass over the allowed
 * transitions and no logarithm.
 *
 * <h2>Labels</h2>
 * With a class per state (for example its label) and a class per base, a base may only be emitted by states of
 * its class (class -1: any state): the E-step of semi-supervised training. Where every class has one state the
 * state path is known and the counts are plain counts.
 *
 * <h2>Reduced-order contexts</h2>
 * Near the start of a sequence and after a missing base, fewer than k clean bases precede a base, and the model
 * emits it from the reduced-order table, which is the full-order table averaged over the unseen older bases with
 * equal weights. Such a base is counted first under the reduced context; {@link #fold} then spreads that count
 * over the compatible full-order contexts in proportion to their current probability of the base, which is the
 * posterior of the unseen older bases. That is the exact EM update for the model as the kernels define it, so
 * Baum-Welch never lowers the likelihood because of these bases.
 *
 * <p>Instances are immutable and can be shared across threads; each call allocates its own work arrays.
 */
public final class BaumWelchKernel {
    /** Default block length, as in {@link ForwardBackward}. */
    public static final int DEFAULT_BLOCK = 1 << 14;
    /** Sequences at least this long are counted as two halves. */
    public static final int DEFAULT_SPLIT = 1 << 16;

    private static final byte[] CODE = BaseCode.table();

    private final HmmParameters p;
    private final int k;
    private final int[] stateClass;
    private final int blockSize;
    private final int splitLength;
    private final int maxOrder;
    private final int[] order;
    private final double[][] tables;
    private final int[][] offsets;
    private final int[] contextMasks;
    private final int[] fullOffset;
    private final int[] fullMask;
    private final double[] startProb;
    private final int[] predOffset;
    private final int[] predState;
    private final double[] predProb;
    private final int[] succOffset;
    private final int[] succState;
    private final double[] succProb;

    /** Unrestricted E-step with the default block and split lengths. */
    public BaumWelchKernel(HmmParameters parameters) {
        this(parameters, null, DEFAULT_BLOCK, DEFAULT_SPLIT);
    }

    /**
     * @param stateClass  class of each state (e.g. its label index, 0..126), or null when bases carry no class
     * @param blockSize   bases between checkpoints
     * @param splitLength sequences at least this long are counted as two halves (at least 2)
     */
    public BaumWelchKernel(HmmParameters parameters, int[] stateClass, int blockSize, int splitLength) {
        if (blockSize < 1) {
            throw new IllegalArgumentException("block size must be positive");
        }
        if (splitLength < 2) {
            throw new IllegalArgumentException("split length must be at least 2");
        }
        this.p = parameters;
        this.k = parameters.stateCount();
        if (stateClass != null && stateClass.length != k) {
            throw new IllegalArgumentException("one class per state expected");
        }
        this.stateClass = stateClass == null ? null : stateClass.clone();
        this.blockSize = blockSize;
        this.splitLength = splitLength;
        this.maxOrder = parameters.maxOrder();
        this.order = parameters.orderArray();
        this.tables = parameters.emissionTables();
        this.offsets = parameters.tableOffsets();
        this.contextMasks = new int[maxOrder + 1];
        for (int j = 0; j <= maxOrder; j++) {
            contextMasks[j] = (1 << (2 * j)) - 1;
        }
        this.fullOffset = new int[k];
        this.fullMask = new int[k];
        for (int s = 0; s < k; s++) {
            fullOffset[s] = offsets[s][order[s]];
            fullMask[s] = contextMasks[order[s]];
        }
        this.startProb = parameters.startArray();
        this.predOffset = parameters.predOffset();
        this.predState = parameters.predState();
        this.predProb = parameters.predProb();
        this.succOffset = parameters.succOffset();
        this.succState = parameters.succState();
        this.succProb = parameters.succProb();
    }

    /** Zero counts shaped for this kernel's parameters. */
    public ExpectedCounts newCounts() {
        return new ExpectedCounts(p);
    }

    /**
     * Adds the expected counts and log-likelihood of one sequence. The first half's counts go to {@code head}
     * (the whole sequence's when it is not cut), the second half's to {@code tail}; two accumulators let both
     * halves run at once without sharing memory. Add {@code tail} to {@code head} afterwards, in a fixed order.
     *
     * @param baseClass class of each base (-1: any state), or null for none
     * @param fork      run the two jobs of each phase as fork/join tasks (call from inside a ForkJoinPool)
     * @throws ImpossibleSequenceException when no state path (allowed by the classes) can emit the sequence; the
     *                                     position is the first base where every path's probability is zero
     */
    public void accumulate(byte[] seq, byte[] baseClass, ExpectedCounts head, ExpectedCounts tail, boolean fork) {
        int n = seq.length;
        checkClasses(seq, baseClass);
        if (n == 0) {
            return;
        }
        int m = n >= splitLength ? n / 2 : n;
        ForwardHalf forward = new ForwardHalf(seq, baseClass, m);
        BackwardHalf backward = m < n ? new BackwardHalf(seq, baseClass, m, n) : null;
        run(fork, forward::run, backward == null ? null : backward::run);
        FirstHalfCounts first = new FirstHalfCounts(seq, baseClass, m, forward, backward, head);
        SecondHalfCounts second = backward == null ? null
                : new SecondHalfCounts(seq, baseClass, m, forward, backward, tail);
        run(fork, first::run, second == null ? null : second::run);
        head.addLogLikelihood(forward.logScale);
        head.addBases(n);
        head.addRecord();
        if (second != null) {
            tail.addLogLikelihood(second.logScale);
        }
    }

    /**
     * Natural log of the probability of the sequence (with classes: of the sequence and its classes), by the
     * forward pass alone.
     *
     * @throws ImpossibleSequenceException when it is zero
     */
    public double logLikelihood(byte[] seq, byte[] baseClass) {
        checkClasses(seq, baseClass);
        if (seq.length == 0) {
            return 0.0;
        }
        ForwardHalf f = new ForwardHalf(seq, baseClass, seq.length);
        f.keepCheckpoints = false;
        f.run();
        return f.logScale;
    }

    /**
     * Moves the counts of bases emitted under reduced-order contexts into the full-order table of their state:
     * each count is spread over the compatible full contexts (the unseen older bases prepended) in proportion to
     * their probability of the base under this kernel's parameters, one order at a time (the proportions
     * telescope to the full-order ones). Call once, on counts accumulated with this kernel.
     */
    public void fold(ExpectedCounts counts) {
        double[][] cnt = counts.emissionArrays();
        for (int s = 0; s < k; s++) {
            double[] c = cnt[s];
            double[] table = tables[s];
            int[] off = offsets[s];
            for (int j = 0; j < order[s]; j++) {
                int rows = 1 << (2 * j);
                for (int ctx = 0; ctx < rows; ctx++) {
                    for (int b = 0; b < 4; b++) {
                        int at = off[j] + ctx * 4 + b;
                        double w = c[at];
                        if (w == 0) {
                            continue;
                        }
                        c[at] = 0;
                        double denom = 0;
                        for (int oldest = 0; oldest < 4; oldest++) {
                            denom += table[off[j + 1] + (oldest * rows + ctx) * 4 + b];
                        }
                        if (!(denom > 0)) {
                            continue; // cannot happen: a counted base had a positive probability
                        }
                        double scale = w / denom;
                        for (int oldest = 0; oldest < 4; oldest++) {
                            int to = off[j + 1] + (oldest * rows + ctx) * 4 + b;
                            c[to] += scale * table[to];
                        }
                    }
                }
            }
        }
    }

    private void checkClasses(byte[] seq, byte[] baseClass) {
        if (baseClass != null) {
            if (stateClass == null) {
                throw new IllegalArgumentException("base classes given to a kernel without state classes");
            }
            if (baseClass.length != seq.length) {
                throw new IllegalArgumentException("one class per base expected");
            }
        }
    }

    private static void run(boolean fork, Runnable a, Runnable b) {
        if (b == null) {
            a.run();
        } else if (fork) {
            ForkJoinTask.invokeAll(ForkJoinTask.adapt(a), ForkJoinTask.adapt(b));
        } else {
            a.run();
            b.run();
        }
    }

    // ---- the shared arithmetic: every pass and every recomputation goes through these ----

    /**
     * Normalised forward vector of base t into {@code out} from the previous one ({@code prev}, unused at t = 0).
     *
     * @return the scale factor c_t (the unnormalised sum)
     */
    private double forwardStep(int t, double[] prev, int prevOff, double[] e, int eOff, double[] out, int outOff) {
        double c = 0;
        if (t == 0) {
            for (int j = 0; j < k; j++) {
                double v = startProb[j] * e[eOff + j];
                out[outOff + j] = v;
                c += v;
            }
        } else {
            for (int j = 0; j < k; j++) {
                double s = 0;
                for (int q = predOffset[j]; q < predOffset[j + 1]; q++) {
                    s += prev[prevOff + predState[q]] * predProb[q];
                }
                double v = s * e[eOff + j];
                out[outOff + j] = v;
                c += v;
            }
        }
        if (!(c > 0)) {
            throw new ImpossibleSequenceException(t);
        }
        double inv = 1.0 / c;
        for (int j = 0; j < k; j++) {
            out[outOff + j] *= inv;
        }
        return c;
    }

    /** Normalised backward vector of base t from that of t+1 and the emissions of base t+1. */
    private void backwardStep(double[] eNext, int eOff, double[] betaNext, int nextOff, double[] beta, int off,
                              double[] w) {
        for (int j = 0; j < k; j++) {
            w[j] = eNext[eOff + j] * betaNext[nextOff + j];
        }
        double sum = 0;
        for (int i = 0; i < k; i++) {
            double s = 0;
            for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                s += succProb[q] * w[succState[q]];
            }
            beta[off + i] = s;
            sum += s;
        }
        double inv = 1.0 / sum;
        for (int i = 0; i < k; i++) {
            beta[off + i] *= inv;
        }
    }

    /** Adds the state posteriors of base t to the emission counts; returns nothing, reads Z-normalised values. */
    private void countEmissions(double[] alpha, int aOff, double[] beta, int bOff, double invZ, int[] idx, int iOff,
                                double[][] emis) {
        for (int s = 0; s < k; s++) {
            int ix = idx[iOff + s];
            if (ix >= 0) {
                emis[s][ix] += alpha[aOff + s] * beta[bOff + s] * invZ;
            }
        }
    }

    /** Walks a sequence left to right and gives each state's emission probability and table index per base. */
    private final class Cursor {
        private int context;
        private int clean;

        /** Positions the cursor so that the next {@link #emit} describes base t. */
        void seek(byte[] seq, int t) {
            context = 0;
            clean = 0;
            for (int i = Math.max(0, t - maxOrder); i < t; i++) {
                push(CODE[seq[i] & 0xFF]);
            }
        }

        /**
         * Emission probability of the base per state into {@code e[off + s]} (0 for states outside the base's
         * class, 1 for a missing base) and, when {@code idx} is not null, the index of the counted table entry
         * (-1 for a missing base); then steps past the base.
         */
        void emit(byte raw, int cls, double[] e, int[] idx, int off) {
            byte code = CODE[raw & 0xFF];
            if (code < 0 || code == BaseCode.MISSING) {
                for (int s = 0; s < k; s++) {
                    e[off + s] = cls < 0 || stateClass[s] == cls ? 1.0 : 0.0;
                    if (idx != null) {
                        idx[off + s] = -1;
                    }
                }
            } else if (clean == maxOrder && cls < 0) {
                // the common case: every state sees its full context and may emit the base
                for (int s = 0; s < k; s++) {
                    int ix = fullOffset[s] + ((context & fullMask[s]) << 2) + code;
                    e[off + s] = tables[s][ix];
                    if (idx != null) {
                        idx[off + s] = ix;
                    }
                }
            } else {
                for (int s = 0; s < k; s++) {
                    int j = Math.min(order[s], clean);
                    int ix = offsets[s][j] + ((context & contextMasks[j]) << 2) + code;
                    e[off + s] = cls < 0 || stateClass[s] == cls ? tables[s][ix] : 0.0;
                    if (idx != null) {
                        idx[off + s] = ix;
                    }
                }
            }
            push(code);
        }

        private void push(byte code) {
            if (code < 0 || code == BaseCode.MISSING) {
                context = 0;
                clean = 0;
            } else if (maxOrder > 0) {
                context = ((context << 2) | code) & contextMasks[maxOrder];
                if (clean < maxOrder) {
                    clean++;
                }
            }
        }
    }

    private static int classOf(byte[] baseClass, int t) {
        return baseClass == null ? -1 : baseClass[t];
    }

    // ---- phase one ----

    /** Forward pass over [0, m): checkpoints (the vector before each block), the last vector, the log scale. */
    private final class ForwardHalf {
        final byte[] seq;
        final byte[] baseClass;
        final int m;
        boolean keepCheckpoints = true;
        double[] checkpoints;
        double[] last;
        double logScale;

        ForwardHalf(byte[] seq, byte[] baseClass, int m) {
            this.seq = seq;
            this.baseClass = baseClass;
            this.m = m;
        }

        void run() {
            int blocks = (m + blockSize - 1) / blockSize;
            checkpoints = keepCheckpoints ? new double[blocks * k] : null;
            double[] alpha = new double[k];
            double[] next = new double[k];
            double[] e = new double[k];
            Cursor cursor = new Cursor();
            LogScaleAccumulator scale = new LogScaleAccumulator();
            for (int t = 0; t < m; t++) {
                if (checkpoints != null && t > 0 && t % blockSize == 0) {
                    System.arraycopy(alpha, 0, checkpoints, (t / blockSize) * k, k);
                }
                cursor.emit(seq[t], classOf(baseClass, t), e, null, 0);
                scale.multiply(forwardStep(t, alpha, 0, e, 0, next, 0));
                double[] swap = alpha;
                alpha = next;
                next = swap;
            }
            last = alpha;
            logScale = scale.log();
        }
    }

    /**
     * Backward pass over [m, n) from the end: the backward vector at the last base of each block, the vector at
     * m and the emissions of base m.
     */
    private final class BackwardHalf {
        final byte[] seq;
        final byte[] baseClass;
        final int m;
        final int n;
        double[] checkpoints;
        double[] firstBeta;
        double[] firstEmission;

        BackwardHalf(byte[] seq, byte[] baseClass, int m, int n) {
            this.seq = seq;
            this.baseClass = baseClass;
            this.m = m;
            this.n = n;
        }

        void run() {
            int len = n - m;
            int blocks = (len + blockSize - 1) / blockSize;
            checkpoints = new double[blocks * k];
            int maxLen = Math.min(blockSize, len);
            double[] emis = new double[maxLen * k];
            double[] nextEmis = new double[k];
            double[] beta = new double[k];
            double[] nextBeta = new double[k];
            double[] w = new double[k];
            Cursor cursor = new Cursor();
            for (int b = blocks - 1; b >= 0; b--) {
                int b0 = m + b * blockSize;
                int b1 = Math.min(n, b0 + blockSize);
                cursor.seek(seq, b0);
                for (int t = b0; t < b1; t++) {
                    cursor.emit(seq[t], classOf(baseClass, t), emis, null, (t - b0) * k);
                }
                for (int t = b1 - 1; t >= b0; t--) {
                    if (t == n - 1) {
                        Arrays.fill(beta, 1.0 / k);
                    } else if (t + 1 < b1) {
                        backwardStep(emis, (t + 1 - b0) * k, nextBeta, 0, beta, 0, w);
                    } else {
                        backwardStep(nextEmis, 0, nextBeta, 0, beta, 0, w);
                    }
                    if (t == b1 - 1) {
                        System.arraycopy(beta, 0, checkpoints, b * k, k);
                    }
                    double[] swap = nextBeta;
                    nextBeta = beta;
                    beta = swap;
                }
                System.arraycopy(emis, 0, nextEmis, 0, k);
            }
            firstBeta = nextBeta;
            firstEmission = nextEmis;
        }
    }

    // ---- phase two ----

    /**
     * Counts over [0, m), blocks from last to first: forward vectors recomputed from the checkpoints, the backward
     * recursion continued from the second half's first vector (or started at the last base). Transitions from
     * base m-1 into the second half are counted there, not here.
     */
    private final class FirstHalfCounts {
        final byte[] seq;
        final byte[] baseClass;
        final int m;
        final ForwardHalf forward;
        final BackwardHalf backward;
        final ExpectedCounts into;

        FirstHalfCounts(byte[] seq, byte[] baseClass, int m, ForwardHalf forward, BackwardHalf backward,
                        ExpectedCounts into) {
            this.seq = seq;
            this.baseClass = baseClass;
            this.m = m;
            this.forward = forward;
            this.backward = backward;
            this.into = into;
        }

        void run() {
            int n = seq.length;
            int blocks = (m + blockSize - 1) / blockSize;
            int maxLen = Math.min(blockSize, m);
            double[] alpha = new double[maxLen * k];
            double[] emis = new double[maxLen * k];
            int[] idx = new int[maxLen * k];
            double[] scaleAt = new double[maxLen];
            double[] beta = new double[k];
            double[] nextBeta = new double[k];
            double[] nextEmis = new double[k];
            double[] w = new double[k];
            double nextC = 0;
            double nextZ = 0;
            if (backward != null) {
                System.arraycopy(backward.firstBeta, 0, nextBeta, 0, k);
                System.arraycopy(backward.firstEmission, 0, nextEmis, 0, k);
            }
            double[] start = into.startArray();
            double[] xi = into.transitionArray();
            double[][] counts = into.emissionArrays();
            Cursor cursor = new Cursor();
            for (int b = blocks - 1; b >= 0; b--) {
                int b0 = b * blockSize;
                int b1 = Math.min(m, b0 + blockSize);
                cursor.seek(seq, b0);
                for (int t = b0; t < b1; t++) {
                    int off = (t - b0) * k;
                    cursor.emit(seq[t], classOf(baseClass, t), emis, idx, off);
                    if (t == 0) {
                        scaleAt[0] = forwardStep(0, null, 0, emis, off, alpha, off);
                    } else if (t == b0) {
                        scaleAt[0] = forwardStep(t, forward.checkpoints, b * k, emis, off, alpha, off);
                    } else {
                        scaleAt[t - b0] = forwardStep(t, alpha, off - k, emis, off, alpha, off);
                    }
                }
                for (int t = b1 - 1; t >= b0; t--) {
                    int off = (t - b0) * k;
                    if (t == n - 1) {
                        Arrays.fill(beta, 1.0 / k);
                    } else {
                        double[] eNext = t + 1 < b1 ? emis : nextEmis;
                        int eOff = t + 1 < b1 ? off + k : 0;
                        for (int j = 0; j < k; j++) {
                            w[j] = eNext[eOff + j] * nextBeta[j];
                        }
                        double sum = 0;
                        if (t + 1 < m) {
                            double c = t + 1 < b1 ? scaleAt[t + 1 - b0] : nextC;
                            double invNorm = 1.0 / (c * nextZ);
                            for (int i = 0; i < k; i++) {
                                double ai = alpha[off + i] * invNorm;
                                double s = 0;
                                for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                                    double v = succProb[q] * w[succState[q]];
                                    s += v;
                                    xi[q] += ai * v;
                                }
                                beta[i] = s;
                                sum += s;
                            }
                        } else {
                            for (int i = 0; i < k; i++) {
                                double s = 0;
                                for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                                    s += succProb[q] * w[succState[q]];
                                }
                                beta[i] = s;
                                sum += s;
                            }
                        }
                        double inv = 1.0 / sum;
                        for (int i = 0; i < k; i++) {
                            beta[i] *= inv;
                        }
                    }
                    double z = 0;
                    for (int j = 0; j < k; j++) {
                        z += alpha[off + j] * beta[j];
                    }
                    double invZ = 1.0 / z;
                    countEmissions(alpha, off, beta, 0, invZ, idx, off, counts);
                    if (t == 0) {
                        for (int s = 0; s < k; s++) {
                            start[s] += alpha[s] * beta[s] * invZ;
                        }
                    }
                    nextZ = z;
                    double[] swap = nextBeta;
                    nextBeta = beta;
                    beta = swap;
                }
                System.arraycopy(emis, 0, nextEmis, 0, k);
                nextC = scaleAt[0];
            }
        }
    }

    /**
     * Counts over [m, n), blocks from first to last: backward vectors recomputed from the checkpoints, the forward
     * recursion continued from the first half's last vector. Also counts the transitions from base m-1 to m.
     */
    private final class SecondHalfCounts {
        final byte[] seq;
        final byte[] baseClass;
        final int m;
        final ForwardHalf forward;
        final BackwardHalf backward;
        final ExpectedCounts into;
        double logScale;

        SecondHalfCounts(byte[] seq, byte[] baseClass, int m, ForwardHalf forward, BackwardHalf backward,
                         ExpectedCounts into) {
            this.seq = seq;
            this.baseClass = baseClass;
            this.m = m;
            this.forward = forward;
            this.backward = backward;
            this.into = into;
        }

        void run() {
            int n = seq.length;
            int len = n - m;
            int blocks = (len + blockSize - 1) / blockSize;
            int maxLen = Math.min(blockSize, len);
            double[] emis = new double[maxLen * k];
            int[] idx = new int[maxLen * k];
            double[] beta = new double[maxLen * k];
            double[] prev = forward.last.clone();
            double[] alpha = new double[k];
            double[] w = new double[k];
            double[] xi = into.transitionArray();
            double[][] counts = into.emissionArrays();
            LogScaleAccumulator scale = new LogScaleAccumulator();
            Cursor cursor = new Cursor();
            cursor.seek(seq, m);
            for (int b = 0; b < blocks; b++) {
                int b0 = m + b * blockSize;
                int b1 = Math.min(n, b0 + blockSize);
                for (int t = b0; t < b1; t++) {
                    cursor.emit(seq[t], classOf(baseClass, t), emis, idx, (t - b0) * k);
                }
                System.arraycopy(backward.checkpoints, b * k, beta, (b1 - 1 - b0) * k, k);
                for (int t = b1 - 2; t >= b0; t--) {
                    int off = (t - b0) * k;
                    backwardStep(emis, off + k, beta, off + k, beta, off, w);
                }
                for (int t = b0; t < b1; t++) {
                    int off = (t - b0) * k;
                    double c = forwardStep(t, prev, 0, emis, off, alpha, 0);
                    scale.multiply(c);
                    double z = 0;
                    for (int j = 0; j < k; j++) {
                        z += alpha[j] * beta[off + j];
                    }
                    double invZ = 1.0 / z;
                    countEmissions(alpha, 0, beta, off, invZ, idx, off, counts);
                    for (int j = 0; j < k; j++) {
                        w[j] = emis[off + j] * beta[off + j];
                    }
                    double invNorm = invZ / c;
                    for (int i = 0; i < k; i++) {
                        double ai = prev[i] * invNorm;
                        if (ai == 0) {
                            continue;
                        }
                        for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                            xi[q] += ai * succProb[q] * w[succState[q]];
                        }
                    }
                    double[] swap = prev;
                    prev = alpha;
                    alpha = swap;
                }
            }
            logScale = scale.log();
        }
    }
}
