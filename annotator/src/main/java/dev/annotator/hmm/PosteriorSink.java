package dev.annotator.hmm;

/**
 * Receives per-base results of forward-backward, one base at a time, in DESCENDING position order (the backward
 * pass runs right to left). The arrays are reused: read them during the call, never keep them.
 */
@FunctionalInterface
public interface PosteriorSink {
    /**
     * @param position  0-based position in the sequence
     * @param posterior P(state s at position | whole sequence) per state; sums to 1
     * @param emission  each state's emission probability of the base at this position (1 for a missing base)
     */
    void accept(int position, double[] posterior, double[] emission);
}
