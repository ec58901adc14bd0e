package dev.annotator.hmm;

/**
 * Scaled forward-backward over any topology with k-th order emissions, in memory that does not grow with
 * length x states.
 *
 * <p>Checkpointing: the first forward pass keeps only the normalised forward vector at the start of every block
 * of {@link #blockSize()} bases. The backward pass then walks the blocks from last to first; for each block it
 * recomputes the forward vectors and emissions of that block from its checkpoint, and runs the backward
 * recursion through it. The result is exact (the same arithmetic as keeping every forward vector) at the cost
 * of a second forward pass; memory is O(length / block x states + block x states).
 *
 * <p>Scaling: forward vectors are normalised to sum 1 at every base and the scale factors' logs are summed
 * (into the log-likelihood); backward vectors are normalised to sum 1 as well, since only their ratios matter
 * for posteriors. Everything stays in linear space, so there is no log or exp in the inner loop.
 *
 * <p>Instances are immutable and can be shared across threads; each call allocates its own work arrays.
 */
public final class ForwardBackward {
    /** Default block length: the block's work arrays stay within a few hundred kB for small topologies. */
    public static final int DEFAULT_BLOCK = 1 << 14;

    private final HmmParameters p;
    private final int blockSize;

    public ForwardBackward(HmmParameters parameters) {
        this(parameters, DEFAULT_BLOCK);
    }

    public ForwardBackward(HmmParameters parameters, int blockSize) {
        if (blockSize < 1) {
            throw new IllegalArgumentException("block size must be positive");
        }
        this.p = parameters;
        this.blockSize = blockSize;
    }

    public int blockSize() {
        return blockSize;
    }

    /** Natural log of P(seq | model) by the forward algorithm alone. */
    public double logLikelihood(byte[] seq) {
        return forward(seq, null);
    }

    /**
     * Runs forward-backward over the whole sequence and hands every position's state posteriors to the sink,
     * from the last position to the first.
     *
     * @return natural log of P(seq | model)
     * @throws ImpossibleSequenceException if the model cannot emit the sequence
     */
    public double run(byte[] seq, PosteriorSink sink) {
        int n = seq.length;
        int k = p.stateCount();
        if (n == 0) {
            return 0.0;
        }
        int blocks = (n + blockSize - 1) / blockSize;
        double[] checkpoints = new double[blocks * k];
        double logLik = forward(seq, checkpoints);

        int maxLen = Math.min(blockSize, n);
        double[] alpha = new double[maxLen * k];
        double[] emis = new double[maxLen * k];
        double[] beta = new double[k];
        double[] nextBeta = new double[k];
        double[] nextEmis = new double[k];
        double[] weighted = new double[k];
        double[] gamma = new double[k];
        double[] eAt = new double[k];
        double[] before = new double[k];
        int[] succOffset = p.succOffset();
        int[] succState = p.succState();
        double[] succProb = p.succProb();
        EmissionTrack track = new EmissionTrack(p);

        for (int b = blocks - 1; b >= 0; b--) {
            int start = b * blockSize;
            int end = Math.min(n, start + blockSize);
            System.arraycopy(checkpoints, b * k, before, 0, k);
            track.seek(seq, start);
            forwardBlock(seq, start, end, before, alpha, emis, track, null);
            for (int t = end - 1; t >= start; t--) {
                if (t == n - 1) {
                    java.util.Arrays.fill(beta, 1.0 / k);
                } else {
                    // beta_t(i) = sum_j a_ij e_j(t+1) beta_{t+1}(j)
                    double[] eNext;
                    int eNextOff;
                    if (t + 1 < end) {
                        eNext = emis;
                        eNextOff = (t + 1 - start) * k;
                    } else {
                        eNext = nextEmis;
                        eNextOff = 0;
                    }
                    for (int j = 0; j < k; j++) {
                        weighted[j] = eNext[eNextOff + j] * nextBeta[j];
                    }
                    double sum = 0;
                    for (int i = 0; i < k; i++) {
                        double s = 0;
                        for (int q = succOffset[i]; q < succOffset[i + 1]; q++) {
                            s += succProb[q] * weighted[succState[q]];
                        }
                        beta[i] = s;
                        sum += s;
                    }
                    double inv = 1.0 / sum;
                    for (int i = 0; i < k; i++) {
                        beta[i] *= inv;
                    }
                }
                int off = (t - start) * k;
                double z = 0;
                for (int i = 0; i < k; i++) {
                    double g = alpha[off + i] * beta[i];
                    gamma[i] = g;
                    z += g;
                }
                double invZ = 1.0 / z;
                for (int i = 0; i < k; i++) {
                    gamma[i] *= invZ;
                    eAt[i] = emis[off + i];
                }
                sink.accept(t, gamma, eAt);
                double[] swap = nextBeta;
                nextBeta = beta;
                beta = swap;
            }
            System.arraycopy(emis, 0, nextEmis, 0, k);
        }
        return logLik;
    }

    /**
     * Forward pass, block by block through the same code that the backward pass uses to recompute a block; keeps
     * the normalised forward vector that precedes each block (block 0 has none: it starts from the start
     * distribution) when {@code checkpoints} is not null.
     */
    private double forward(byte[] seq, double[] checkpoints) {
        int n = seq.length;
        int k = p.stateCount();
        if (n == 0) {
            return 0.0;
        }
        int maxLen = Math.min(blockSize, n);
        double[] alpha = new double[maxLen * k];
        double[] emis = new double[maxLen * k];
        double[] carried = new double[k];
        EmissionTrack track = new EmissionTrack(p);
        LogScaleAccumulator scale = new LogScaleAccumulator();
        track.seek(seq, 0);
        for (int start = 0, block = 0; start < n; start += blockSize, block++) {
            int end = Math.min(n, start + blockSize);
            forwardBlock(seq, start, end, carried, alpha, emis, track, scale);
            System.arraycopy(alpha, (end - 1 - start) * k, carried, 0, k);
            if (checkpoints != null && end < n) {
                System.arraycopy(carried, 0, checkpoints, (block + 1) * k, k);
            }
        }
        return scale.log();
    }

    /**
     * Forward vectors (normalised) and emissions of the bases {@code [start, end)}, continuing from the forward
     * vector {@code before} of base start-1 (unused for start 0). The track must be positioned at {@code start}.
     *
     * @param scale receives the scale factors (the first pass), or null when recomputing
     */
    private void forwardBlock(byte[] seq, int start, int end, double[] before, double[] alpha, double[] emis,
                              EmissionTrack track, LogScaleAccumulator scale) {
        int k = p.stateCount();
        double[] startProb = p.startArray();
        int[] predOffset = p.predOffset();
        int[] predState = p.predState();
        double[] predProb = p.predProb();
        for (int t = start; t < end; t++) {
            int off = (t - start) * k;
            track.emit(seq[t], emis, off);
            double c = 0;
            if (t == 0) {
                for (int j = 0; j < k; j++) {
                    double v = startProb[j] * emis[off + j];
                    alpha[off + j] = v;
                    c += v;
                }
            } else {
                double[] prev = t == start ? before : alpha;
                int prevOff = t == start ? 0 : off - k;
                for (int j = 0; j < k; j++) {
                    double s = 0;
                    for (int q = predOffset[j]; q < predOffset[j + 1]; q++) {
                        s += prev[prevOff + predState[q]] * predProb[q];
                    }
                    double v = s * emis[off + j];
                    alpha[off + j] = v;
                    c += v;
                }
            }
            if (!(c > 0)) {
                throw new ImpossibleSequenceException(t);
            }
            double inv = 1.0 / c;
            for (int j = 0; j < k; j++) {
                alpha[off + j] *= inv;
            }
            if (scale != null) {
                scale.multiply(c);
            }
        }
    }
}
