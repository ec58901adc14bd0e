package dev.annotator.hmm;

/**
 * A posterior-Viterbi path together with the log-likelihood of the sequence, both from the one forward-backward
 * pass that produced the posteriors.
 *
 * @param path          the valid path of largest summed posterior
 * @param logLikelihood natural log of P(sequence | model)
 */
public record PosteriorDecoding(PosteriorPath path, double logLikelihood) {
}
