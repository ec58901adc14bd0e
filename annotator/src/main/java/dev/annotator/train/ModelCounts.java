package dev.annotator.train;

import dev.annotator.hmm.ExpectedCounts;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Transition;

import java.util.Arrays;
import java.util.List;

/**
 * Expected counts of a model's parameters, in the model's own order: start per state, one count per listed
 * transition (in the order of {@link HmmModel#transitions()}), and per state a full-order emission table of counts
 * (rows as in {@link dev.annotator.model.State}). What an E-step produces and an M-step consumes; what a shard
 * writes and a merge adds up. Immutable.
 */
public final class ModelCounts {
    private final double[] start;
    private final double[] transitions;
    private final double[][] emissions;
    private final double logLikelihood;
    private final long bases;
    private final long records;

    public ModelCounts(double[] start, double[] transitions, double[][] emissions, double logLikelihood, long bases,
                       long records) {
        this.start = start.clone();
        this.transitions = transitions.clone();
        this.emissions = new double[emissions.length][];
        for (int s = 0; s < emissions.length; s++) {
            this.emissions[s] = emissions[s].clone();
        }
        this.logLikelihood = logLikelihood;
        this.bases = bases;
        this.records = records;
    }

    /** The kernel's counts (folded into full-order tables) in the model's order. */
    public static ModelCounts of(HmmModel model, ExpectedCounts folded) {
        int k = model.stateCount();
        double[] start = new double[k];
        double[][] emissions = new double[k][];
        for (int s = 0; s < k; s++) {
            start[s] = folded.start(s);
            emissions[s] = folded.fullOrderEmissions(s);
        }
        // the kernel keeps transitions sorted by source, then destination
        long[] keys = new long[folded.transitionCount()];
        for (int q = 0; q < keys.length; q++) {
            keys[q] = (long) folded.transitionFrom(q) * k + folded.transitionTo(q);
        }
        List<Transition> listed = model.transitions();
        double[] transitions = new double[listed.size()];
        for (int i = 0; i < transitions.length; i++) {
            Transition t = listed.get(i);
            int q = Arrays.binarySearch(keys, (long) model.stateIndex(t.from()) * k + model.stateIndex(t.to()));
            transitions[i] = folded.transition(q);
        }
        return new ModelCounts(start, transitions, emissions, folded.logLikelihood(), folded.bases(),
                folded.records());
    }

    /** The sum of both (counts of the same model, in the same layout). */
    public ModelCounts plus(ModelCounts o) {
        if (o.start.length != start.length || o.transitions.length != transitions.length) {
            throw new IllegalArgumentException("counts of different models");
        }
        double[] st = start.clone();
        double[] tr = transitions.clone();
        double[][] em = new double[emissions.length][];
        for (int s = 0; s < st.length; s++) {
            st[s] += o.start[s];
            if (o.emissions[s].length != emissions[s].length) {
                throw new IllegalArgumentException("counts of different models");
            }
            em[s] = emissions[s].clone();
            for (int i = 0; i < em[s].length; i++) {
                em[s][i] += o.emissions[s][i];
            }
        }
        for (int i = 0; i < tr.length; i++) {
            tr[i] += o.transitions[i];
        }
        return new ModelCounts(st, tr, em, logLikelihood + o.logLikelihood, bases + o.bases, records + o.records);
    }

    public double start(int s) {
        return start[s];
    }

    /** Count of the i-th listed transition of the model. */
    public double transition(int i) {
        return transitions[i];
    }

    /** State s's emission counts, rows of 4 (a copy). */
    public double[] emissions(int s) {
        return emissions[s].clone();
    }

    public int stateCount() {
        return start.length;
    }

    public int transitionCount() {
        return transitions.length;
    }

    public double logLikelihood() {
        return logLikelihood;
    }

    public long bases() {
        return bases;
    }

    public long records() {
        return records;
    }
}
