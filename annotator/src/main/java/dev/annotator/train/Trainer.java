package dev.annotator.train;

import dev.annotator.model.HmmModel;

import java.util.SplittableRandom;

/**
 * Runs a training method over a {@link CountSource}: counting (one E-step along the labels, one M-step) or
 * Baum-Welch iterations from the start model and from perturbed copies of it.
 *
 * <p>Baum-Welch: each iteration re-estimates the model from the counts of the previous E-step and runs the
 * E-step of the new model, which also gives its log-likelihood; it stops when the gain per base falls below the
 * tolerance, or after the maximum number of iterations. Restarts run one after another with perturbations drawn
 * from one generator seeded once, so a seed fixes the result; the run of highest log-likelihood is kept (the
 * earliest on a tie).
 */
public final class Trainer {
    private final TrainingOptions options;
    private final IterationProgress progress;

    public Trainer(TrainingOptions options, IterationProgress progress) {
        this.options = options;
        this.progress = progress;
    }

    public TrainingResult train(HmmModel start, CountSource data) {
        return options.method() == TrainingMethod.COUNTING ? count(start, data) : baumWelch(start, data);
    }

    /** One E-step (along the labels) and one M-step, then the log-likelihood of the result. */
    private TrainingResult count(HmmModel start, CountSource data) {
        long t0 = System.nanoTime();
        ModelCounts counts = data.count(start);
        HmmModel model = Reestimation.mStep(start, counts, options.pseudocount(), options.freeze());
        double logLik = data.logLikelihood(model);
        progress.report(0, 1, 1, logLik, logLik - counts.logLikelihood(), counts.bases(),
                (System.nanoTime() - t0) / 1e9);
        return new TrainingResult(model, 1, null, logLik, counts.logLikelihood(), counts.bases(), 0);
    }

    private TrainingResult baumWelch(HmmModel start, CountSource data) {
        int runs = options.restarts() + 1;
        SplittableRandom rng = new SplittableRandom(options.seed());
        TrainingResult best = null;
        for (int run = 0; run < runs; run++) {
            HmmModel from = run == 0 ? start : Perturbation.perturb(start, rng, options.freeze());
            TrainingResult r = iterate(from, data, run, runs);
            if (best == null || r.logLikelihood() > best.logLikelihood()) {
                best = r;
            }
        }
        return best;
    }

    private TrainingResult iterate(HmmModel from, CountSource data, int run, int runs) {
        long t0 = System.nanoTime();
        ModelCounts counts = data.count(from);
        double startLogLik = counts.logLikelihood();
        long bases = counts.bases();
        progress.report(run, runs, 0, startLogLik, Double.NaN, bases, (System.nanoTime() - t0) / 1e9);
        HmmModel model = from;
        int iterations = 0;
        boolean converged = false;
        while (iterations < options.maxIterations()) {
            t0 = System.nanoTime();
            HmmModel next = Reestimation.mStep(model, counts, options.pseudocount(), options.freeze());
            ModelCounts nextCounts = data.count(next);
            iterations++;
            double gain = nextCounts.logLikelihood() - counts.logLikelihood();
            progress.report(run, runs, iterations, nextCounts.logLikelihood(), gain, bases,
                    (System.nanoTime() - t0) / 1e9);
            model = next;
            counts = nextCounts;
            if (!(gain / Math.max(1, bases) >= options.tolerance())) {
                converged = true;
                break;
            }
        }
        return new TrainingResult(model, iterations, converged, counts.logLikelihood(), startLogLik, bases, run);
    }
}
