package dev.annotator.train;

/** Receives one report per iteration, for progress lines. */
@FunctionalInterface
public interface IterationProgress {
    /**
     * @param run           0 for the run from the start model, r for the r-th restart
     * @param runs          number of runs (restarts + 1)
     * @param iteration     M-steps done so far (0: the start model)
     * @param logLikelihood log-likelihood of the data under the current model
     * @param gain          its change since the previous iteration (NaN at iteration 0)
     * @param bases         bases in the data
     * @param seconds       time the iteration took
     */
    void report(int run, int runs, int iteration, double logLikelihood, double gain, long bases, double seconds);
}
