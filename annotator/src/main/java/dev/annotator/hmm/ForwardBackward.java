package dev.annotator.hmm;

import java.util.Arrays;

/**
 * Scaled forward-backward over any topology with k-th order emissions, in memory that does not grow with
 * length x states.
 *
 * <p>Checkpointing: the forward pass keeps only the forward vector at the end of every block of
 * {@link #blockSize()} bases. The backward pass walks the blocks from last to first; for each block it recomputes
 * the block's forward vectors from the checkpoint before it, runs the backward recursion through the block, and
 * hands the block's posteriors to a sink. The recomputation repeats the same arithmetic, so results do not depend
 * on the block size; memory is O(length / block x states + block x states).
 *
 * <p>Scaling: vectors stay in linear space and are multiplied by 2^256 (exact) whenever their sum falls below
 * 2^-256; the log-likelihood is the log of the final sum corrected by the count of those steps. No log, exp or
 * division per base in the forward and backward recursions; posteriors take one division per base.
 *
 * <p>Ranges: {@link #runRange} decodes part of a sequence given the forward vector before it and the backward
 * vector at its last base, which is how a long record is split into windows decoded in parallel.
 *
 * <p>Two-state models take a dedicated path with the transitions in registers; larger models use the sparse
 * transition lists (cost proportional to allowed transitions) in the layout of {@link TransitionGroups}. The
 * forward pass that only keeps checkpoints writes its vectors to two alternating rows. Instances are immutable and
 * thread-safe; every call allocates its own work arrays.
 */
public final class ForwardBackward {
    /** Block length for small topologies (work arrays of a few hundred kB); see {@link #blockFor}. */
    public static final int DEFAULT_BLOCK = 1 << 14;
    /** Bytes one work array of a block may take before the block is shortened (see {@link #blockFor}). */
    public static final int BLOCK_ARRAY_BYTES = 1 << 18;
    private static final int MIN_BLOCK = 1 << 10;
    private static final double RESCALE_BELOW = 0x1p-256;
    private static final double RESCALE_BY = 0x1p256;
    private static final double LOG_RESCALE = 256 * Math.log(2);
    /** Row masks of {@link #forwardSpan}: every base's forward vector kept, or only the last two. */
    private static final int ALL_ROWS = -1;
    private static final int TWO_ROWS = 1;
    /** Emission rows at least this long are copied by a copy call rather than a loop. */
    private static final int COPY_CALL_FROM = 16;

    private final HmmParameters p;
    private final int k;
    private final int blockSize;
    private final EmissionSymbols symbols;
    private final double[] em;
    private final boolean twoStates;
    private final double a00;
    private final double a01;
    private final double a10;
    private final double a11;
    // the sparse transitions grouped by fan-in (forward) and fan-out (backward), see TransitionGroups
    private final TransitionGroups predGroups;
    private final TransitionGroups succGroups;

    public ForwardBackward(HmmParameters parameters) {
        this(parameters, blockFor(parameters.stateCount()));
    }

    /**
     * The block length for a topology: {@link #DEFAULT_BLOCK}, shortened for larger topologies so that a block's
     * work arrays (forward vectors, posteriors, emission rows: length x states doubles each) stay within
     * {@link #BLOCK_ARRAY_BYTES} and a block's posteriors are still in cache when the sink reads them.
     */
    public static int blockFor(int states) {
        int block = BLOCK_ARRAY_BYTES / (Double.BYTES * Math.max(1, states));
        return Math.max(MIN_BLOCK, Math.min(DEFAULT_BLOCK, Integer.highestOneBit(block)));
    }

    public ForwardBackward(HmmParameters parameters, int blockSize) {
        if (blockSize < 1) {
            throw new IllegalArgumentException("block size must be positive");
        }
        this.p = parameters;
        this.k = parameters.stateCount();
        this.blockSize = blockSize;
        this.symbols = new EmissionSymbols(parameters);
        this.em = symbols.table;
        this.twoStates = k == 2;
        this.a00 = twoStates ? parameters.transition(0, 0) : 0;
        this.a01 = twoStates ? parameters.transition(0, 1) : 0;
        this.a10 = twoStates ? parameters.transition(1, 0) : 0;
        this.a11 = twoStates ? parameters.transition(1, 1) : 0;
        this.predGroups = new TransitionGroups(parameters.predOffset(), parameters.predState(),
                parameters.predProb());
        this.succGroups = new TransitionGroups(parameters.succOffset(), parameters.succState(),
                parameters.succProb());
    }

    public int blockSize() {
        return blockSize;
    }

    public int stateCount() {
        return k;
    }

    /** Natural log of P(seq | model) by the forward algorithm alone. */
    public double logLikelihood(byte[] seq) {
        return runRange(seq, 0, seq.length, null, null, null);
    }

    /**
     * Whole-sequence forward-backward, one position at a time to the sink, from the last position to the first.
     *
     * @return natural log of P(seq | model)
     * @throws ImpossibleSequenceException if the model cannot emit the sequence
     */
    public double run(byte[] seq, PosteriorSink sink) {
        double[] gamma = new double[k];
        double[] e = new double[k];
        return run(seq, (start, end, posterior, emission) -> {
            for (int t = end - 1; t >= start; t--) {
                System.arraycopy(posterior, (t - start) * k, gamma, 0, k);
                System.arraycopy(emission, (t - start) * k, e, 0, k);
                sink.accept(t, gamma, e);
            }
        });
    }

    /** Whole-sequence forward-backward, a block at a time to the sink; returns ln P(seq | model). */
    public double run(byte[] seq, PosteriorBlockSink sink) {
        return runRange(seq, 0, seq.length, null, null, sink);
    }

    /**
     * Forward-backward over the bases {@code [from, to)} of {@code seq}.
     *
     * @param before forward vector of base from-1 (any positive scale), or null when {@code from} starts the
     *               record: the start distribution applies to the first base
     * @param last   backward vector of base to-1 (any positive scale), or null when {@code to} ends the record
     * @param sink   receives the posteriors of every base in the range, last block first; null for the
     *               forward pass alone
     * @return natural log of P(x[from, to) | forward vector before the range, normalised to sum 1)
     * @throws ImpossibleSequenceException if no state path can emit the range
     */
    public double runRange(byte[] seq, int from, int to, double[] before, double[] last, PosteriorBlockSink sink) {
        int n = to - from;
        if (n <= 0) {
            return 0.0;
        }
        int blocks = (n + blockSize - 1) / blockSize;
        int maxLen = Math.min(blockSize, n);
        int[] sy = new int[maxLen];
        // the forward pass alone keeps two rows; recomputing a block for the backward pass keeps all of them
        double[] alpha = new double[(sink == null ? Math.min(2, maxLen) : maxLen) * k];
        double[] vec = initialVector(before);
        double[] checkpoints = sink == null ? null : new double[blocks * k];

        // forward pass
        long rescales = 0;
        for (int b = 0; b < blocks; b++) {
            int start = from + b * blockSize;
            int end = Math.min(to, start + blockSize);
            if (checkpoints != null) {
                System.arraycopy(vec, 0, checkpoints, b * k, k);
            }
            symbols.encode(seq, start, end, sy);
            rescales += forwardSpan(sy, end - start, vec, before == null && b == 0, alpha, start, TWO_ROWS);
            System.arraycopy(alpha, ((end - start - 1) & TWO_ROWS) * k, vec, 0, k);
        }
        double sum = 0;
        for (int s = 0; s < k; s++) {
            sum += vec[s];
        }
        double logLik = Math.log(sum) - rescales * LOG_RESCALE;
        if (sink == null) {
            return logLik;
        }

        // backward pass, recomputing each block's forward vectors from its checkpoint
        double[] beta = new double[k];
        double[] post = new double[maxLen * k];
        double[] emis = new double[maxLen * k];
        double[] weighted = new double[k];
        int nextSymbol = -1;
        if (last == null) {
            Arrays.fill(beta, 1.0);
        } else {
            System.arraycopy(last, 0, beta, 0, k);
        }
        for (int b = blocks - 1; b >= 0; b--) {
            int start = from + b * blockSize;
            int end = Math.min(to, start + blockSize);
            int len = end - start;
            System.arraycopy(checkpoints, b * k, vec, 0, k);
            symbols.encode(seq, start, end, sy);
            forwardSpan(sy, len, vec, before == null && b == 0, alpha, start, ALL_ROWS);
            backwardSpan(sy, len, nextSymbol, beta, alpha, post, weighted);
            emissionRows(sy, len, emis);
            sink.block(start, end, post, emis);
            nextSymbol = sy[0];
        }
        return logLik;
    }

    /**
     * Each base's emission row into {@code emis}: a plain loop for short rows (a copy call per base of 2 values
     * costs more), a copy call for long ones (a loop of a few dozen turns runs through the compiler's pre- and
     * post-loops each time).
     */
    private void emissionRows(int[] sy, int len, double[] emis) {
        final double[] e = em;
        if (twoStates) {
            for (int i = 0; i < len; i++) {
                int y = sy[i] << 1;
                emis[2 * i] = e[y];
                emis[2 * i + 1] = e[y + 1];
            }
        } else if (k < COPY_CALL_FROM) {
            for (int i = 0, off = 0; i < len; i++, off += k) {
                int y = sy[i] * k;
                for (int s = 0; s < k; s++) {
                    emis[off + s] = e[y + s];
                }
            }
        } else {
            for (int i = 0, off = 0; i < len; i++, off += k) {
                System.arraycopy(e, sy[i] * k, emis, off, k);
            }
        }
    }

    /**
     * Normalised forward vector of base to-1 after the bases {@code [from, to)}, starting from {@code before}
     * (null: the start distribution at base {@code from}). No storage beyond one block.
     */
    public double[] forwardVector(byte[] seq, int from, int to, double[] before) {
        int n = to - from;
        double[] vec = initialVector(before);
        if (n <= 0) {
            return vec;
        }
        int maxLen = Math.min(blockSize, n);
        int[] sy = new int[maxLen];
        double[] alpha = new double[2 * k];
        for (int start = from, b = 0; start < to; start += blockSize, b++) {
            int end = Math.min(to, start + blockSize);
            symbols.encode(seq, start, end, sy);
            forwardSpan(sy, end - start, vec, before == null && b == 0, alpha, start, TWO_ROWS);
            System.arraycopy(alpha, ((end - start - 1) & TWO_ROWS) * k, vec, 0, k);
        }
        return normalised(vec);
    }

    /**
     * Normalised backward vector of base {@code from} given the backward vector of base to-1 ({@code last}; null
     * when to-1 is the record's last base).
     */
    public double[] backwardVector(byte[] seq, int from, int to, double[] last) {
        double[] beta = last == null ? filled(1.0) : last.clone();
        int n = to - from;
        if (n <= 1) {
            return normalised(beta);
        }
        double[] weighted = new double[k];
        int maxLen = Math.min(blockSize, n);
        int[] sy = new int[maxLen];
        int nextSymbol = -1;
        for (int end = to; end > from; end -= blockSize) {
            int start = Math.max(from, end - blockSize);
            int len = end - start;
            symbols.encode(seq, start, end, sy);
            backwardSpan(sy, len, nextSymbol, beta, null, null, weighted);
            nextSymbol = sy[0];
        }
        return normalised(beta);
    }

    private double[] initialVector(double[] before) {
        if (before == null) {
            return new double[k];
        }
        if (before.length != k) {
            throw new IllegalArgumentException("vector length " + before.length + " for " + k + " states");
        }
        return normalised(before);
    }

    private double[] filled(double v) {
        double[] out = new double[k];
        Arrays.fill(out, v);
        return out;
    }

    private static double[] normalised(double[] v) {
        double sum = 0;
        for (double x : v) {
            sum += x;
        }
        if (!(sum > 0)) {
            throw new IllegalArgumentException("vector has no positive entry");
        }
        double[] out = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            out[i] = v[i] / sum;
        }
        return out;
    }

    /**
     * Forward recursion over {@code len} bases with symbols {@code sy}: row i of {@code alpha} gets the forward
     * vector of base i, continuing from {@code prev} (the vector before the first base) unless {@code atStart},
     * where the start distribution applies. Returns how many times the vectors were rescaled by 2^256.
     *
     * @param position0 position of the first base, for error messages
     * @param rowMask   {@link #ALL_ROWS}, or {@link #TWO_ROWS} when only the last vector is wanted: base i then
     *                  goes to row {@code i & 1}, and the rows stay in the first level of cache
     */
    private int forwardSpan(int[] sy, int len, double[] prev, boolean atStart, double[] alpha, int position0,
                            int rowMask) {
        return twoStates ? forwardSpan2(sy, len, prev, atStart, alpha, position0, rowMask)
                : forwardSpanSparse(sy, len, prev, atStart, alpha, position0, rowMask);
    }

    private int forwardSpan2(int[] sy, int len, double[] prev, boolean atStart, double[] alpha, int position0,
                             int rowMask) {
        final double[] e = em;
        final double t00 = a00;
        final double t01 = a01;
        final double t10 = a10;
        final double t11 = a11;
        int rescales = 0;
        double p0;
        double p1;
        int i = 0;
        if (atStart) {
            int y = sy[0] << 1;
            p0 = p.start(0) * e[y];
            p1 = p.start(1) * e[y + 1];
            i = 1;
            alpha[0] = p0;
            alpha[1] = p1;
            if (!(p0 + p1 > 0)) {
                throw new ImpossibleSequenceException(position0);
            }
        } else {
            p0 = prev[0];
            p1 = prev[1];
        }
        for (; i < len; i++) {
            int y = sy[i] << 1;
            double n0 = (p0 * t00 + p1 * t10) * e[y];
            double n1 = (p0 * t01 + p1 * t11) * e[y + 1];
            double s = n0 + n1;
            if (s < RESCALE_BELOW) {
                if (!(s > 0)) {
                    throw new ImpossibleSequenceException(position0 + i);
                }
                n0 *= RESCALE_BY;
                n1 *= RESCALE_BY;
                rescales++;
            }
            int r = 2 * (i & rowMask);
            alpha[r] = n0;
            alpha[r + 1] = n1;
            p0 = n0;
            p1 = n1;
        }
        return rescales;
    }

    private int forwardSpanSparse(int[] sy, int len, double[] prev, boolean atStart, double[] alpha, int position0,
                                  int rowMask) {
        final double[] e = em;
        final double[] startProb = p.startArray();
        int rescales = 0;
        for (int i = 0; i < len; i++) {
            int off = (i & rowMask) * k;
            int y = sy[i] * k;
            double sum = 0;
            if (i == 0 && atStart) {
                for (int j = 0; j < k; j++) {
                    double v = startProb[j] * e[y + j];
                    alpha[off + j] = v;
                    sum += v;
                }
            } else {
                double[] src = i == 0 ? prev : alpha;
                int srcOff = i == 0 ? 0 : ((i - 1) & rowMask) * k;
                sum = predGroups.gather(src, srcOff, alpha, off, e, y);
            }
            if (sum < RESCALE_BELOW) {
                if (!(sum > 0)) {
                    throw new ImpossibleSequenceException(position0 + i);
                }
                for (int j = 0; j < k; j++) {
                    alpha[off + j] *= RESCALE_BY;
                }
                rescales++;
            }
        }
        return rescales;
    }

    /**
     * Backward recursion over a span, last base first. On entry {@code beta} is the backward vector of the base
     * after the span ({@code nextSymbol} its symbol), or, when {@code nextSymbol < 0}, already the backward
     * vector of the span's last base. On exit it is the backward vector of the span's first base. With
     * {@code alpha} given, {@code post} receives the normalised posteriors.
     */
    private void backwardSpan(int[] sy, int len, int nextSymbol, double[] beta, double[] alpha, double[] post,
                              double[] weighted) {
        if (twoStates) {
            backwardSpan2(sy, len, nextSymbol, beta, alpha, post);
        } else {
            backwardSpanSparse(sy, len, nextSymbol, beta, alpha, post, weighted);
        }
    }

    /**
     * Two states: the backward vectors alone (boundary vectors) or with the posteriors, in separate loops so that
     * neither carries the other's branch. The base after the span, when there is one, is stepped over first.
     */
    private void backwardSpan2(int[] sy, int len, int nextSymbol, double[] beta, double[] alpha, double[] post) {
        if (nextSymbol >= 0) {
            backStep2(nextSymbol, beta);
        }
        if (alpha == null) {
            for (int i = len - 1; i > 0; i--) {
                backStep2(sy[i], beta);
            }
        } else {
            backwardPosteriors2(sy, len, beta, alpha, post);
        }
    }

    /** The backward vector one base earlier: {@code beta} of a base whose successor emits symbol {@code next}. */
    private void backStep2(int next, double[] beta) {
        final double[] e = em;
        int y = next << 1;
        double w0 = e[y] * beta[0];
        double w1 = e[y + 1] * beta[1];
        double n0 = a00 * w0 + a01 * w1;
        double n1 = a10 * w0 + a11 * w1;
        if (n0 + n1 < RESCALE_BELOW) {
            n0 *= RESCALE_BY;
            n1 *= RESCALE_BY;
        }
        beta[0] = n0;
        beta[1] = n1;
    }

    /**
     * On entry {@code beta} is the backward vector of the span's last base; on exit that of its first. Each base's
     * normalised posteriors go to {@code post}. The step of {@link #backStep2} is written out here with the vector
     * in locals: this is the two-state model's hottest loop, while boundary vectors take few steps.
     */
    private void backwardPosteriors2(int[] sy, int len, double[] beta, double[] alpha, double[] post) {
        final double[] e = em;
        final double t00 = a00;
        final double t01 = a01;
        final double t10 = a10;
        final double t11 = a11;
        double b0 = beta[0];
        double b1 = beta[1];
        int i = len - 1;
        while (true) {
            double g0 = alpha[2 * i] * b0;
            double g1 = alpha[2 * i + 1] * b1;
            double inv = 1.0 / (g0 + g1);
            post[2 * i] = g0 * inv;
            post[2 * i + 1] = g1 * inv;
            if (i == 0) {
                break;
            }
            int y = sy[i] << 1;
            double w0 = e[y] * b0;
            double w1 = e[y + 1] * b1;
            double n0 = t00 * w0 + t01 * w1;
            double n1 = t10 * w0 + t11 * w1;
            if (n0 + n1 < RESCALE_BELOW) {
                n0 *= RESCALE_BY;
                n1 *= RESCALE_BY;
            }
            b0 = n0;
            b1 = n1;
            i--;
        }
        beta[0] = b0;
        beta[1] = b1;
    }

    /** Sparse topologies: as {@link #backwardSpan2}, the boundary-vector and posterior loops kept apart. */
    private void backwardSpanSparse(int[] sy, int len, int nextSymbol, double[] beta, double[] alpha,
                                    double[] post, double[] weighted) {
        if (nextSymbol >= 0) {
            backStepSparse(nextSymbol, beta, weighted);
        }
        if (alpha == null) {
            for (int i = len - 1; i > 0; i--) {
                backStepSparse(sy[i], beta, weighted);
            }
        } else {
            for (int i = len - 1; ; i--) {
                posteriorRow(alpha, beta, post, i * k);
                if (i == 0) {
                    break;
                }
                backStepSparse(sy[i], beta, weighted);
            }
        }
    }

    /** The backward vector one base earlier, in place: {@code beta} of a base whose successor emits {@code next}. */
    private void backStepSparse(int next, double[] beta, double[] weighted) {
        final double[] e = em;
        int y = next * k;
        for (int j = 0; j < k; j++) {
            weighted[j] = e[y + j] * beta[j];
        }
        double sum = succGroups.gather(weighted, 0, beta, 0, null, 0);
        if (sum < RESCALE_BELOW) {
            for (int s = 0; s < k; s++) {
                beta[s] *= RESCALE_BY;
            }
        }
    }

    /** The normalised posteriors of one base from its forward row and backward vector. */
    private void posteriorRow(double[] alpha, double[] beta, double[] post, int off) {
        double z = 0;
        for (int s = 0; s < k; s++) {
            double g = alpha[off + s] * beta[s];
            post[off + s] = g;
            z += g;
        }
        double inv = 1.0 / z;
        for (int s = 0; s < k; s++) {
            post[off + s] *= inv;
        }
    }
}
