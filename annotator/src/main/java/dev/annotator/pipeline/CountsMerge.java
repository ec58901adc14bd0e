package dev.annotator.pipeline;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputOpener;
import dev.annotator.model.HmmModel;
import dev.annotator.model.InputFingerprint;
import dev.annotator.model.Training;
import dev.annotator.train.CountsJson;
import dev.annotator.train.ModelCounts;
import dev.annotator.train.Reestimation;
import dev.annotator.train.RunStamp;
import dev.annotator.train.ShardCounts;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;
import dev.annotator.train.TrainingProvenance;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;

/**
 * The M-step of a sharded iteration: adds up the count files that E-step jobs wrote for their shares of the data
 * (in the order given) and re-estimates the START model from the total, exactly as an unsharded iteration would.
 *
 * <p>Iterations are numbered across a loop of merges: when START was itself written by a merge over the same
 * inputs, this merge is its iteration + 1, and the gain is START's log-likelihood (known now, from the shards)
 * minus that of the model before it (recorded in START's provenance). Convergence by the tolerance is recorded
 * in the written model and reported, so a workflow can stop the loop.
 */
public final class CountsMerge {
    /** What a merge did: the model and the numbers of its progress line. */
    public record Outcome(HmmModel model, int shards, int iteration, double startLogLikelihood, double gain,
                          long bases, boolean converged) {
    }

    private final HmmModel start;
    private final TrainingOptions options;

    /**
     * @param options pseudocount, freeze and tolerance apply; the method comes from the shards
     */
    public CountsMerge(HmmModel start, TrainingOptions options) {
        this.start = start;
        this.options = options;
    }

    /**
     * @param shardFiles count files written by {@code train --emit-counts} with START
     * @param method     the method the user asked for, or null to take the shards'
     */
    public Outcome merge(List<String> shardFiles, TrainingMethod method, RunStamp stamp) {
        List<ShardCounts> shards = new ArrayList<>();
        for (String f : shardFiles) {
            shards.add(read(f));
        }
        TrainingMethod m = method == null ? shards.get(0).method() : method;
        for (int i = 0; i < shards.size(); i++) {
            if (shards.get(i).method() != m) {
                throw new BadInputException(shardFiles.get(i) + ": counts made by " + shards.get(i).method().word()
                        + ", not " + m.word() + " like " + (method == null ? shardFiles.get(0) : "--method asks"));
            }
        }
        ModelCounts total = shards.get(0).counts();
        List<InputFingerprint> inputs = new ArrayList<>(shards.get(0).inputs());
        List<InputFingerprint> labels = new ArrayList<>(shards.get(0).labels());
        for (int i = 1; i < shards.size(); i++) {
            total = total.plus(shards.get(i).counts());
            inputs.addAll(shards.get(i).inputs());
            for (InputFingerprint l : shards.get(i).labels()) {
                if (!labels.contains(l)) {
                    labels.add(l);
                }
            }
        }
        HmmModel next = Reestimation.mStep(start, total, options.pseudocount(), options.freeze());

        Training before = start.provenance().training();
        boolean continues = m == TrainingMethod.BAUM_WELCH && before != null && m.word().equals(before.method())
                && before.inputs().equals(inputs) && before.startLogLikelihood() != null
                && before.logLikelihood() == null;
        int iteration = continues ? before.iterations() + 1 : 1;
        double gain = continues ? total.logLikelihood() - before.startLogLikelihood() : Double.NaN;
        boolean converged = continues && !(gain / Math.max(1, total.bases()) >= options.tolerance());
        HmmModel out = Reestimation.withProvenance(next, start.name(), TrainingProvenance.describe(start, m, options,
                inputs, labels, total.bases(), iteration, m == TrainingMethod.COUNTING ? null : converged, null,
                total.logLikelihood(), shards.size(), 0, stamp));
        return new Outcome(out, shards.size(), iteration, total.logLikelihood(), gain, total.bases(), converged);
    }

    private ShardCounts read(String file) {
        String name = InputOpener.displayName(file);
        try (InputStream in = InputOpener.open(file, InputStream.nullInputStream())) {
            return CountsJson.read(in, name, start);
        } catch (IOException e) {
            throw new IoFailureException(name + ": read failed: " + e.getMessage(), e);
        }
    }
}
