package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.State;
import dev.annotator.model.Transition;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * A random starting point near a model, for restarts: every non-zero probability of the trained part is multiplied
 * by a factor drawn log-uniformly from [1/{@value #SPREAD}, {@value #SPREAD}) and its distribution renormalised.
 * Zeros stay zero, so the structure is kept. The draws follow a fixed order (start, transitions as listed,
 * emission rows state by state), so one generator state gives one model.
 */
public final class Perturbation {
    /** Largest factor (and the inverse of the smallest) applied to a probability. */
    public static final double SPREAD = 4.0;

    private Perturbation() {
    }

    public static HmmModel perturb(HmmModel m, SplittableRandom rng, Freeze freeze) {
        double[] start = m.start();
        List<Transition> transitions = m.transitions();
        if (freeze.trainsTransitions()) {
            start = normalise(scale(start, rng));
            double[] p = new double[transitions.size()];
            for (int i = 0; i < p.length; i++) {
                p[i] = transitions.get(i).probability();
            }
            p = scale(p, rng);
            double[] outSum = new double[m.stateCount()];
            for (int i = 0; i < p.length; i++) {
                outSum[m.stateIndex(transitions.get(i).from())] += p[i];
            }
            List<Transition> out = new ArrayList<>();
            for (int i = 0; i < p.length; i++) {
                Transition t = transitions.get(i);
                out.add(new Transition(t.from(), t.to(), p[i] / outSum[m.stateIndex(t.from())]));
            }
            transitions = out;
        }
        List<State> states = m.states();
        if (freeze.trainsEmissions()) {
            List<State> out = new ArrayList<>();
            for (State s : states) {
                double[] table = s.emissions();
                for (int r = 0; r < table.length; r += 4) {
                    double[] row = normalise(scale(java.util.Arrays.copyOfRange(table, r, r + 4), rng));
                    System.arraycopy(row, 0, table, r, 4);
                }
                out.add(new State(s.name(), s.label(), s.order(), table, s.codonPosition()));
            }
            states = out;
        }
        return new HmmModel(m.name(), m.description(), m.provenance(), m.labels(), states, start, transitions);
    }

    private static double[] scale(double[] p, SplittableRandom rng) {
        double[] out = p.clone();
        double logSpread = Math.log(SPREAD);
        for (int i = 0; i < out.length; i++) {
            double factor = Math.exp((2 * rng.nextDouble() - 1) * logSpread);
            out[i] = out[i] > 0 ? out[i] * factor : 0.0;
        }
        return out;
    }

    private static double[] normalise(double[] p) {
        double sum = 0;
        for (double v : p) {
            sum += v;
        }
        double[] out = new double[p.length];
        for (int i = 0; i < p.length; i++) {
            out[i] = p[i] / sum;
        }
        return out;
    }
}
