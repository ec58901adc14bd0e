package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.InputFingerprint;
import dev.annotator.model.Provenance;
import dev.annotator.model.Training;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Writes the provenance of a trained model: where its numbers come from, in words and as a training record. */
public final class TrainingProvenance {
    private TrainingProvenance() {
    }

    /**
     * @param start     the model training started from
     * @param method    how the numbers were fitted
     * @param options   the settings (pseudocount, freeze, restarts)
     * @param sharded   number of shard count files merged, 0 for a run on the inputs themselves
     */
    public static Provenance describe(HmmModel start, TrainingMethod method, TrainingOptions options,
                                      List<InputFingerprint> inputs, List<InputFingerprint> labels, long bases,
                                      int iterations, Boolean converged, Double logLikelihood,
                                      Double startLogLikelihood, int sharded, int keptRun, RunStamp stamp) {
        String data = inputs.size() == 1 ? inputs.get(0).name() : inputs.size() + " sequence files";
        String source = "Fitted by " + method.word() + " to " + data + (labels.isEmpty() ? "" : " with known labels")
                + ", starting from model " + start.name();
        List<String> notes = new ArrayList<>();
        notes.add("Start model " + start.name() + ": " + start.provenance().source());
        notes.add("States, labels, emission orders and allowed transitions are the start model's; training changed "
                + "only the probabilities.");
        if (options.pseudocount() > 0) {
            notes.add("Pseudocount " + number(options.pseudocount()) + " added to the expected count of every "
                    + "trained probability that was not zero; zeros stayed zero.");
        } else {
            notes.add("No pseudocounts: maximum-likelihood estimates.");
        }
        switch (options.freeze()) {
            case TRANSITIONS -> notes.add("Start probabilities and transitions kept from the start model "
                    + "(--freeze transitions).");
            case EMISSIONS -> notes.add("Emissions kept from the start model (--freeze emissions).");
            default -> { }
        }
        if (method == TrainingMethod.BAUM_WELCH && options.restarts() > 0) {
            notes.add("Best of " + (options.restarts() + 1) + " runs by log-likelihood (the start model and "
                    + options.restarts() + " perturbations of it, seed " + options.seed() + "): run " + keptRun
                    + " kept.");
        }
        if (sharded > 0) {
            notes.add("M-step of " + sharded + " shard count " + (sharded == 1 ? "file" : "files")
                    + " merged; the log-likelihood of this model is known only after its own E-step.");
        }
        Training training = new Training(stamp.tool(), stamp.command(), stamp.date(), method.word(), inputs, labels,
                bases, iterations, converged, logLikelihood, startLogLikelihood);
        return new Provenance(source, notes, training);
    }

    private static String number(double x) {
        return x == Math.rint(x) && Math.abs(x) < 1e15 ? String.valueOf((long) x) : String.format(Locale.ROOT, "%s", x);
    }
}
