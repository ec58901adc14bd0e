package dev.annotator.train;

import dev.annotator.model.HmmModel;

/**
 * The training data as the iterations see it: E-steps under a given model. Implementations decide where the
 * sequences live (files read once per call, arrays in memory) and how many threads count them; results must not
 * depend on the number of threads.
 */
public interface CountSource {
    /** Expected counts (with labels: restricted to each base's label) and log-likelihood under {@code model}. */
    ModelCounts count(HmmModel model);

    /** The log-likelihood alone (with labels: of the sequences and their labels), by the forward pass. */
    double logLikelihood(HmmModel model);
}
