package dev.annotator.train;

import dev.annotator.model.HmmModel;

/**
 * What a training run produced.
 *
 * @param model              the trained numbers (name, description and provenance still those of the start model)
 * @param iterations         M-steps done
 * @param converged          whether the stopping rule was met (null for counting)
 * @param logLikelihood      log-likelihood of the data under {@code model}
 * @param startLogLikelihood log-likelihood of the data under the start model
 * @param bases              bases counted
 * @param run                which run was kept: 0 for the start model, r for the r-th perturbation
 */
public record TrainingResult(HmmModel model, int iterations, Boolean converged, double logLikelihood,
                             double startLogLikelihood, long bases, int run) {
}
