package dev.annotator.train;

/**
 * How to train.
 *
 * @param method        counting or Baum-Welch
 * @param pseudocount   added to the expected count of every parameter that is not zero in the model being
 *                      re-estimated (a symmetric Dirichlet prior); zeros stay zero
 * @param maxIterations Baum-Welch M-steps at most
 * @param tolerance     Baum-Welch stops when the log-likelihood gain per base falls below this
 * @param restarts      Baum-Welch runs from perturbed copies of the start model, besides the run from the start
 *                      model itself; the run of highest log-likelihood is kept
 * @param seed          seeds the perturbations
 * @param freeze        the part of the model left as it is
 */
public record TrainingOptions(TrainingMethod method, double pseudocount, int maxIterations, double tolerance,
                              int restarts, long seed, Freeze freeze) {
    public TrainingOptions {
        if (!(pseudocount >= 0) || Double.isInfinite(pseudocount)) {
            throw new IllegalArgumentException("pseudocount must be a finite number, at least 0");
        }
        if (maxIterations < 0) {
            throw new IllegalArgumentException("max iterations must not be negative");
        }
        if (!(tolerance >= 0) || Double.isInfinite(tolerance)) {
            throw new IllegalArgumentException("tolerance must be a finite number, at least 0");
        }
        if (restarts < 0) {
            throw new IllegalArgumentException("restarts must not be negative");
        }
    }
}
