package dev.annotator.model;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * An immutable hidden Markov model as a user writes it: named states with labels and k-th order emissions,
 * a start distribution and a sparse list of allowed transitions. Construction checks only that the parts fit
 * together by name; {@link ModelValidator} checks the numbers.
 */
public final class HmmModel {
    private final String name;
    private final String description;
    private final Provenance provenance;
    private final List<Label> labels;
    private final List<State> states;
    private final double[] start;
    private final List<Transition> transitions;
    private final Map<String, Integer> stateIndex = new HashMap<>();
    private final Map<String, Integer> labelIndex = new HashMap<>();

    public HmmModel(String name, String description, Provenance provenance, List<Label> labels,
                    List<State> states, double[] start, List<Transition> transitions) {
        this.name = name;
        this.description = description;
        this.provenance = provenance;
        this.labels = List.copyOf(labels);
        this.states = List.copyOf(states);
        this.start = start.clone();
        this.transitions = List.copyOf(transitions);
        for (int i = 0; i < this.states.size(); i++) {
            stateIndex.putIfAbsent(this.states.get(i).name(), i);
        }
        for (int i = 0; i < this.labels.size(); i++) {
            labelIndex.putIfAbsent(this.labels.get(i).name(), i);
        }
    }

    public String name() {
        return name;
    }

    public String description() {
        return description;
    }

    public Provenance provenance() {
        return provenance;
    }

    public List<Label> labels() {
        return labels;
    }

    public List<State> states() {
        return states;
    }

    public int stateCount() {
        return states.size();
    }

    /** Start probabilities in state order (a copy). */
    public double[] start() {
        return start.clone();
    }

    public List<Transition> transitions() {
        return transitions;
    }

    /** Index of the named state, or -1. */
    public int stateIndex(String stateName) {
        return stateIndex.getOrDefault(stateName, -1);
    }

    /** Index of the named label, or -1. */
    public int labelIndex(String labelName) {
        return labelIndex.getOrDefault(labelName, -1);
    }

    /** For each state (in state order) the index of its label in {@link #labels()}. */
    public int[] stateLabels() {
        int[] out = new int[states.size()];
        for (int s = 0; s < out.length; s++) {
            out[s] = labelIndex(states.get(s).label());
        }
        return out;
    }

    /** Labels that become GFF3 features: all but the background, in file order. */
    public List<Label> reportedLabels() {
        List<Label> out = new ArrayList<>();
        for (Label l : labels) {
            if (!l.background()) {
                out.add(l);
            }
        }
        return out;
    }

    public Label backgroundLabel() {
        for (Label l : labels) {
            if (l.background()) {
                return l;
            }
        }
        throw new IllegalStateException("model " + name + " has no background label");
    }

    /** The longest emission context of any state. */
    public int maxOrder() {
        int max = 0;
        for (State s : states) {
            max = Math.max(max, s.order());
        }
        return max;
    }
}
