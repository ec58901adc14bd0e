package dev.annotator.hmm;

/**
 * Posterior-Viterbi decoding: among the valid state paths, the one whose per-position state posteriors add up
 * to the most. A valid path starts in a state with start probability above zero, takes only transitions of
 * probability above zero, and visits at each position only a state whose posterior there is above zero. Unlike
 * picking the most probable state at each position on its own, the result can always be produced by the model;
 * unlike Viterbi, it weighs every path through a state, not only the single most probable one.
 *
 * <p>The objective is the plain sum of posteriors, not the sum of their logarithms.
 *
 * <p>One forward-backward pass hands posteriors over from the last block of bases to the first, so the
 * maximisation runs backwards in time ({@link PosteriorMaxSumPass}) and the path is read off forwards from the
 * best first state. Ties are settled as in {@link Viterbi}: scores within {@link #TIE_TOLERANCE} of each other
 * count as equal and the lower-numbered state wins, both for the successor chosen at each step and for the first
 * state; scores are shifted so the best is 0 after every base, which keeps that absolute tolerance meaningful on
 * sequences of any length.
 *
 * <p>Positivity test: in {@link #decode(byte[])} a state counts as visitable at a position when its emission
 * probability of the base there is above zero. Together with the start and transition checks this selects the
 * same paths as "posterior above zero" (a path of positive joint probability gives each of its states a positive
 * posterior, and a state of positive posterior can emit its base), but it does not lose a state whose posterior
 * is positive yet underflows to 0 in double precision. {@link #decode(double[])} has only posteriors and tests
 * those.
 *
 * <p>Memory: one back-pointer byte per position for each state with two or more allowed successors
 * ({@link #backPointerBytesPerBase()}; a state with one successor needs none), at most {@link #MAX_STATES} states,
 * plus the forward-backward checkpoints. Instances are immutable and thread-safe.
 */
public final class PosteriorViterbi {
    public static final double TIE_TOLERANCE = Viterbi.TIE_TOLERANCE;
    public static final int MAX_STATES = Viterbi.MAX_STATES;

    private final HmmParameters p;
    private final ForwardBackward forwardBackward;
    // successors through transitions of probability above zero only, ascending by state within each source
    private final SuccessorGroups successors;

    public PosteriorViterbi(HmmParameters parameters) {
        this(parameters, ForwardBackward.blockFor(parameters.stateCount()));
    }

    /** @param blockSize forward-backward checkpoint block; results do not depend on it */
    public PosteriorViterbi(HmmParameters parameters, int blockSize) {
        int k = parameters.stateCount();
        if (k > MAX_STATES) {
            throw new IllegalArgumentException("posterior-Viterbi supports at most " + MAX_STATES + " states");
        }
        this.p = parameters;
        this.forwardBackward = new ForwardBackward(parameters, blockSize);
        int[] off = parameters.succOffset();
        int[] to = parameters.succState();
        double[] prob = parameters.succProb();
        int[] succOffset = new int[k + 1];
        int kept = 0;
        for (int q = 0; q < prob.length; q++) {
            if (prob[q] > 0) {
                kept++;
            }
        }
        int[] succState = new int[kept];
        int fill = 0;
        for (int s = 0; s < k; s++) {
            for (int q = off[s]; q < off[s + 1]; q++) {
                if (prob[q] > 0) {
                    succState[fill++] = to[q];
                }
            }
            succOffset[s + 1] = fill;
        }
        this.successors = new SuccessorGroups(succOffset, succState);
    }

    /** Back-pointer bytes per base: one per state with two or more allowed successors. */
    public int backPointerBytesPerBase() {
        return successors.slots;
    }

    /**
     * @throws ImpossibleSequenceException if the model cannot emit the sequence
     * @throws IllegalArgumentException    if length x states back-pointers do not fit in one Java array
     */
    public PosteriorPath decode(byte[] seq) {
        int n = seq.length;
        if (n == 0) {
            return new PosteriorPath(new byte[0], 0.0);
        }
        PosteriorMaxSumPass pass = newPass(n);
        forwardBackward.run(seq, pass);
        return pass.finish();
    }

    /**
     * As {@link #decode(byte[])}, handing each block of posteriors (and emission rows) also to {@code observer}
     * once the path's own pass has read it, so that callers needing per-base values beside the path do not run
     * forward-backward again.
     *
     * @throws ImpossibleSequenceException if the model cannot emit the sequence
     * @throws IllegalArgumentException    if length x states back-pointers do not fit in one Java array
     */
    public PosteriorDecoding decode(byte[] seq, PosteriorBlockSink observer) {
        int n = seq.length;
        if (n == 0) {
            return new PosteriorDecoding(new PosteriorPath(new byte[0], 0.0), 0.0);
        }
        PosteriorMaxSumPass pass = newPass(n);
        double logLikelihood = forwardBackward.run(seq, (start, end, posterior, emission) -> {
            pass.block(start, end, posterior, emission);
            observer.block(start, end, posterior, emission);
        });
        return new PosteriorDecoding(pass.finish(), logLikelihood);
    }

    /**
     * Decoding from posteriors computed elsewhere: {@code posterior[t * stateCount + s]} = P(state s at t | data),
     * with exactly 0 where the state cannot be at t.
     *
     * @throws ImpossibleSequenceException if no valid path exists
     */
    public PosteriorPath decode(double[] posterior) {
        int k = p.stateCount();
        if (posterior.length % k != 0) {
            throw new IllegalArgumentException("posterior length " + posterior.length + " is not a multiple of "
                    + k + " states");
        }
        int n = posterior.length / k;
        if (n == 0) {
            return new PosteriorPath(new byte[0], 0.0);
        }
        PosteriorMaxSumPass pass = newPass(n);
        pass.block(0, n, posterior, null);
        return pass.finish();
    }

    private PosteriorMaxSumPass newPass(int n) {
        checkBackPointersFit(n, successors.slots);
        return new PosteriorMaxSumPass(n, p.startArray(), successors, TIE_TOLERANCE);
    }

    /**
     * The back-pointers are one byte array, so length x states (those with several successors) must stay within
     * Java's array limit.
     */
    static void checkBackPointersFit(long length, int states) {
        if (length * states > Integer.MAX_VALUE - 8) {
            throw new IllegalArgumentException("posterior-Viterbi back-pointers for " + length + " bases x " + states
                    + " states exceed one Java array; decode this record with per-position posterior decoding");
        }
    }
}
