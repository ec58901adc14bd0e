package dev.annotator.train;

import dev.annotator.hmm.BaumWelchKernel;
import dev.annotator.hmm.ImpossibleSequenceException;
import dev.annotator.labels.LabelledInterval;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelCompiler;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Picks the features of stranded labels (genes on one strand) that a gene model can be trained on. A gene is a
 * whole unit of the topology, from its start codon to its stop codon, so two checks apply that labels of other
 * kinds do not need:
 * <ul>
 *   <li>the model must be able to emit the feature under its label at all: a gene with a start codon the model
 *   does not allow, a stop inside, or a length that is not a whole number of codons is not;</li>
 *   <li>genes of one state path cannot overlap or touch (the topology puts a non-coding base between two genes).
 *   </li>
 * </ul>
 * Genes that fail, and every gene of a group that overlaps or touches, are left out, and so are their bases:
 * the span they cover is excluded from training. Labelling those bases non-coding instead would teach the
 * non-coding state coding statistics (in a compact bacterial genome about one gene in six overlaps a neighbour).
 * Features of labels without a strand are passed on unchanged. The first check runs the label-restricted forward
 * pass on the feature with enough bases before it for full emission contexts.
 */
public final class WholeFeatureScreen {
    private final HmmModel model;
    private final BaumWelchKernel kernel;
    private final int background;
    private final int context;

    /**
     * Features kept; spans to leave out of training (1-based, inclusive, as intervals with label -1, sorted and
     * disjoint); and how many of the stranded features were dropped for each reason.
     */
    public record Outcome(List<LabelledInterval> kept, List<LabelledInterval> excluded, int stranded,
                          int notEmittable, int overlapping) {
    }

    public WholeFeatureScreen(HmmModel model) {
        this.model = model;
        var parameters = ModelCompiler.compile(model);
        this.kernel = new BaumWelchKernel(parameters, model.stateLabels(), BaumWelchKernel.DEFAULT_BLOCK,
                Integer.MAX_VALUE);
        this.background = model.labelIndex(model.backgroundLabel().name());
        this.context = parameters.maxOrder() + 1;
    }

    /** Whether the model has labels for genes on one strand, the features this screen is for. */
    public static boolean applies(HmmModel model) {
        return model.labels().stream().anyMatch(Label::stranded);
    }

    /**
     * @param bases    the record's bases
     * @param features its labelled features (any order; coordinates inside the record)
     */
    public Outcome screen(byte[] bases, List<LabelledInterval> features) {
        List<LabelledInterval> sorted = new ArrayList<>();
        List<LabelledInterval> kept = new ArrayList<>();
        for (LabelledInterval f : features) {
            (model.labels().get(f.label()).stranded() ? sorted : kept).add(f);
        }
        sorted.sort(Comparator.comparingLong(LabelledInterval::start).thenComparingLong(LabelledInterval::line));
        List<LabelledInterval> excluded = new ArrayList<>();
        int notEmittable = 0;
        int overlapping = 0;
        int i = 0;
        while (i < sorted.size()) {
            // a group: features that overlap or touch, directly or through each other
            int j = i + 1;
            long reach = sorted.get(i).end();
            while (j < sorted.size() && sorted.get(j).start() <= reach + 1) {
                reach = Math.max(reach, sorted.get(j).end());
                j++;
            }
            LabelledInterval first = sorted.get(i);
            if (j == i + 1 && emittable(bases, first)) {
                kept.add(first);
            } else {
                for (int g = i; g < j; g++) {
                    if (emittable(bases, sorted.get(g))) {
                        overlapping++;
                    } else {
                        notEmittable++;
                    }
                }
                excluded.add(new LabelledInterval(first.seqid(), first.start(), reach, -1, first.line()));
            }
            i = j;
        }
        return new Outcome(kept, excluded, sorted.size(), notEmittable, overlapping);
    }

    private boolean emittable(byte[] bases, LabelledInterval f) {
        int from = (int) Math.max(0, f.start() - 1 - context);
        int to = (int) Math.min(bases.length, f.end() + 1);
        byte[] window = java.util.Arrays.copyOfRange(bases, from, to);
        byte[] classes = new byte[window.length];
        java.util.Arrays.fill(classes, (byte) background);
        java.util.Arrays.fill(classes, (int) f.start() - 1 - from, (int) f.end() - from, (byte) f.label());
        try {
            return kernel.logLikelihood(window, classes) > Double.NEGATIVE_INFINITY;
        } catch (ImpossibleSequenceException e) {
            return false;
        }
    }
}
