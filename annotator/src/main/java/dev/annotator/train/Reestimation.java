package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;

import java.util.ArrayList;
import java.util.List;

/**
 * The M-step: new probabilities from expected counts, one distribution at a time (the start distribution, each
 * state's outgoing transitions, each emission row), as count / row total. With a pseudocount a, every parameter
 * that is not zero in the current model gets count + a (the maximum a posteriori estimate under a symmetric
 * Dirichlet prior of exponent a + 1); a parameter that is zero stays exactly zero, so an unlisted or zero
 * transition, a zero start probability and a zero emission are never created. A row without counts and without
 * pseudocounts keeps its current values (nothing was observed to change it). The model's structure (states,
 * labels, orders, listed transitions) never changes.
 */
public final class Reestimation {
    private Reestimation() {
    }

    /** The re-estimated model; name, description and provenance are the current model's. */
    public static HmmModel mStep(HmmModel current, ModelCounts counts, double pseudocount, Freeze freeze) {
        int k = current.stateCount();
        if (counts.stateCount() != k || counts.transitionCount() != current.transitions().size()) {
            throw new IllegalArgumentException("counts do not belong to model " + current.name());
        }
        double[] start = current.start();
        if (freeze.trainsTransitions()) {
            double[] c = new double[k];
            for (int s = 0; s < k; s++) {
                c[s] = counts.start(s);
            }
            start = row(start, c, pseudocount);
        }

        List<Transition> listed = current.transitions();
        double[] prob = new double[listed.size()];
        for (int i = 0; i < prob.length; i++) {
            prob[i] = listed.get(i).probability();
        }
        if (freeze.trainsTransitions()) {
            List<List<Integer>> bySource = new ArrayList<>();
            for (int s = 0; s < k; s++) {
                bySource.add(new ArrayList<>());
            }
            for (int i = 0; i < listed.size(); i++) {
                bySource.get(current.stateIndex(listed.get(i).from())).add(i);
            }
            for (List<Integer> out : bySource) {
                double[] cur = new double[out.size()];
                double[] c = new double[out.size()];
                for (int x = 0; x < cur.length; x++) {
                    cur[x] = prob[out.get(x)];
                    c[x] = counts.transition(out.get(x));
                }
                double[] next = row(cur, c, pseudocount);
                for (int x = 0; x < cur.length; x++) {
                    prob[out.get(x)] = next[x];
                }
            }
        }
        List<Transition> transitions = new ArrayList<>(listed.size());
        for (int i = 0; i < listed.size(); i++) {
            transitions.add(new Transition(listed.get(i).from(), listed.get(i).to(), prob[i]));
        }

        List<State> states = new ArrayList<>(k);
        for (int s = 0; s < k; s++) {
            State st = current.states().get(s);
            if (!freeze.trainsEmissions()) {
                states.add(st);
                continue;
            }
            double[] table = st.emissions();
            double[] c = counts.emissions(s);
            double[] cur = new double[4];
            double[] rowCounts = new double[4];
            for (int r = 0; r < table.length / 4; r++) {
                System.arraycopy(table, r * 4, cur, 0, 4);
                System.arraycopy(c, r * 4, rowCounts, 0, 4);
                System.arraycopy(row(cur, rowCounts, pseudocount), 0, table, r * 4, 4);
            }
            states.add(new State(st.name(), st.label(), st.order(), table, st.codonPosition()));
        }
        return new HmmModel(current.name(), current.description(), current.provenance(), current.labels(), states,
                start, transitions);
    }

    /**
     * The log of the prior density the pseudocount stands for, up to a constant: a x sum of log p over the trained
     * parameters that are not zero. Baum-Welch with pseudocounts never lowers log-likelihood + this.
     */
    public static double logPrior(HmmModel model, double pseudocount, Freeze freeze) {
        if (pseudocount == 0) {
            return 0;
        }
        double sum = 0;
        if (freeze.trainsTransitions()) {
            for (double p : model.start()) {
                sum += p > 0 ? Math.log(p) : 0;
            }
            for (Transition t : model.transitions()) {
                sum += t.probability() > 0 ? Math.log(t.probability()) : 0;
            }
        }
        if (freeze.trainsEmissions()) {
            for (State s : model.states()) {
                for (double p : s.emissions()) {
                    sum += p > 0 ? Math.log(p) : 0;
                }
            }
        }
        return pseudocount * sum;
    }

    /** A copy of the model with other provenance. */
    public static HmmModel withProvenance(HmmModel m, String name, Provenance provenance) {
        return new HmmModel(name, m.description(), provenance, m.labels(), m.states(), m.start(), m.transitions());
    }

    private static double[] row(double[] current, double[] counts, double pseudocount) {
        double total = 0;
        for (int i = 0; i < current.length; i++) {
            if (current[i] > 0) {
                total += counts[i] + pseudocount;
            }
        }
        if (!(total > 0)) {
            return current.clone();
        }
        double[] out = new double[current.length];
        for (int i = 0; i < current.length; i++) {
            out[i] = current[i] > 0 ? (counts[i] + pseudocount) / total : 0.0;
        }
        return out;
    }
}
