package dev.annotator.hmm;

/**
 * The most probable state path.
 *
 * @param states         state index per position (states are numbered in model-file order)
 * @param logProbability natural log of the joint probability P(path, sequence)
 */
public record ViterbiPath(int[] states, double logProbability) {
}
