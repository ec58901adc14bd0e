package dev.annotator.hmm;

/**
 * Receives forward-backward results a block of bases at a time. Blocks arrive from the last to the first; the
 * arrays are reused after the call returns.
 */
@FunctionalInterface
public interface PosteriorBlockSink {
    /**
     * @param start     first position of the block (0-based, in the whole sequence)
     * @param end       one past the last position
     * @param posterior P(state s at position t | sequence) at {@code [(t - start) * stateCount + s]}; rows sum to 1
     * @param emission  each state's emission probability of the base at t, same layout (1 for a missing base)
     */
    void block(int start, int end, double[] posterior, double[] emission);
}
