package dev.annotator.model;

import java.util.Arrays;

/**
 * One hidden state with a k-th order emission table: the probability of the next base given the k
 * preceding bases. {@code emissions} holds 4^k rows of 4 (A, C, G, T), rows ordered by the context read as a
 * base-4 number with the oldest base most significant (order 1: rows A, C, G, T; order 2: AA, AC, ... TT).
 */
public record State(String name, String label, int order, double[] emissions, int codonPosition) {

    public State {
        emissions = emissions.clone();
        if (codonPosition < 0 || codonPosition > 3) {
            throw new IllegalArgumentException("codon position must be 0 (none) or 1..3, got " + codonPosition);
        }
    }

    /** A state that is no codon position. */
    public State(String name, String label, int order, double[] emissions) {
        this(name, label, order, emissions, 0);
    }

    @Override
    public double[] emissions() {
        return emissions.clone();
    }

    /** P(base | context) without copying the table. */
    public double emission(int context, int base) {
        return emissions[context * 4 + base];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof State s && s.name.equals(name) && s.label.equals(label) && s.order == order
                && s.codonPosition == codonPosition && Arrays.equals(s.emissions, emissions);
    }

    @Override
    public int hashCode() {
        return 31 * name.hashCode() + Arrays.hashCode(emissions);
    }

    @Override
    public String toString() {
        return "State[" + name + ", label=" + label + ", order=" + order + "]";
    }
}
