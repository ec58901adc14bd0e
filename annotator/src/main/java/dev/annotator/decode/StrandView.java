package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.State;
import dev.annotator.model.Transition;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The model a gene model is decoded with for one strand. One state path cannot hold two genes that share bases,
 * yet genes on opposite strands often do (convergent genes whose stop codons overlap by a few bases are common in
 * compact genomes). So each strand is decoded on its own: in the view for strand s, the other strand's genes are
 * background, still explained by their own states, and may be entered or left at any codon (a crossing) from
 * where a gene of strand s ends or to where the way to a gene of strand s begins. A gene of strand s is thus
 * called whole even where the neighbouring gene on the other strand overlaps it, and that neighbour is called
 * whole in the other view.
 *
 * <p>Crossings are new transitions sharing {@link #CROSSING} of their source state's probability; the other
 * transitions of that state are scaled down by 1 - CROSSING.
 */
final class StrandView {
    /** Probability a source state gives to all its crossings together. */
    static final double CROSSING = 1e-3;

    private StrandView() {
    }

    /** Whether a model has gene labels on both strands, so that it is decoded strand by strand. */
    static boolean applies(HmmModel model) {
        boolean plus = false;
        boolean minus = false;
        for (Label l : model.labels()) {
            plus |= l.strand() == '+';
            minus |= l.strand() == '-';
        }
        return plus && minus;
    }

    static HmmModel full(HmmModel joint, char strand) {
        String background = joint.backgroundLabel().name();
        Set<String> otherLabels = new HashSet<>();
        Set<String> keptLabels = new HashSet<>();
        List<Label> labels = new ArrayList<>();
        for (Label l : joint.labels()) {
            if (l.stranded() && l.strand() != strand) {
                otherLabels.add(l.name());
            } else {
                labels.add(l);
                if (l.stranded()) {
                    keptLabels.add(l.name());
                }
            }
        }
        Set<String> other = new HashSet<>();
        List<State> states = new ArrayList<>();
        for (State s : joint.states()) {
            if (otherLabels.contains(s.label())) {
                other.add(s.name());
                states.add(new State(s.name(), background, s.order(), s.emissions(), 0));
            } else {
                states.add(s);
            }
        }
        Map<String, List<Transition>> out = new HashMap<>();
        for (Transition t : joint.transitions()) {
            out.computeIfAbsent(t.from(), k -> new ArrayList<>()).add(t);
        }
        Map<String, String> labelOf = new HashMap<>();
        Set<String> open = new HashSet<>();
        for (State s : joint.states()) {
            labelOf.put(s.name(), s.label());
        }
        for (Transition t : joint.transitions()) {
            if (t.from().equals(t.to()) && labelOf.get(t.from()).equals(background)) {
                open.add(t.from());
            }
        }
        // the other strand's codon states, where a crossing may enter or leave
        List<String> codons = new ArrayList<>();
        for (State s : joint.states()) {
            if (other.contains(s.name()) && s.codonPosition() != 0) {
                codons.add(s.name());
            }
        }
        // where a gene of this strand ends, and where the ways out of open background lead
        Set<String> exits = new HashSet<>();
        Set<String> ways = new HashSet<>();
        for (Transition t : joint.transitions()) {
            boolean fromKept = keptLabels.contains(labelOf.get(t.from()));
            if (fromKept && !keptLabels.contains(labelOf.get(t.to()))) {
                exits.add(t.from());
            }
            if (open.contains(t.from()) && !open.contains(t.to()) && !other.contains(t.to())) {
                ways.add(t.to());
            }
        }
        List<Transition> transitions = new ArrayList<>();
        for (State s : joint.states()) {
            List<Transition> from = out.getOrDefault(s.name(), List.of());
            List<String> extra = new ArrayList<>();
            if (exits.contains(s.name())) {
                extra.addAll(codons);
            }
            if (codons.contains(s.name())) {
                extra.addAll(ways);
            }
            Set<String> existing = new HashSet<>();
            for (Transition t : from) {
                existing.add(t.to());
            }
            extra.removeIf(existing::contains);
            double keep = extra.isEmpty() ? 1.0 : 1.0 - CROSSING;
            for (Transition t : from) {
                transitions.add(new Transition(t.from(), t.to(), t.probability() * keep));
            }
            for (String to : extra) {
                transitions.add(new Transition(s.name(), to, CROSSING / extra.size()));
            }
        }
        return new HmmModel(joint.name() + " (" + strand + " strand)", joint.description(), joint.provenance(), labels,
                states, joint.start(), transitions);
    }

    /**
     * The view without the other strand's start, stop and upstream states: its genes are explained by their codon
     * cycle alone, entered and left at any codon from background. Fewer states, so a faster decoding.
     */
    static HmmModel of(HmmModel joint, char strand) {
        HmmModel fullView = full(joint, strand);
        String background = joint.backgroundLabel().name();
        Set<String> otherLabels = new HashSet<>();
        for (Label l : joint.labels()) {
            if (l.stranded() && l.strand() != strand) {
                otherLabels.add(l.name());
            }
        }
        // the other strand's codon cycle: its states with a codon position that reach themselves through such states
        Map<String, List<String>> succ = new HashMap<>();
        for (Transition t : joint.transitions()) {
            succ.computeIfAbsent(t.from(), k -> new ArrayList<>()).add(t.to());
        }
        Set<String> otherStates = new HashSet<>();
        for (State s : joint.states()) {
            if (otherLabels.contains(s.label())) {
                otherStates.add(s.name());
            }
        }
        Set<String> cycle = new HashSet<>();
        for (String st : otherStates) {
            if (reaches(st, st, succ, otherStates)) {
                cycle.add(st);
            }
        }
        Set<String> removed = new HashSet<>(otherStates);
        removed.removeAll(cycle);
        // background states reachable only through removed states (the other strand's upstream stretch)
        String open = null;
        for (Transition t : joint.transitions()) {
            if (t.from().equals(t.to()) && joint.states().get(joint.stateIndex(t.from())).label().equals(background)) {
                open = t.from();
            }
        }
        Set<String> live = new HashSet<>();
        java.util.ArrayDeque<String> todo = new java.util.ArrayDeque<>(List.of(open));
        todo.addAll(cycle);
        while (!todo.isEmpty()) {
            String st = todo.poll();
            if (removed.contains(st) || !live.add(st)) {
                continue;
            }
            todo.addAll(succ.getOrDefault(st, List.of()));
        }
        for (State s : joint.states()) {
            if (!live.contains(s.name())) {
                removed.add(s.name());
            }
        }
        // and states whose every way on was removed (the other strand's stretch before its start codon)
        boolean changed = true;
        while (changed) {
            changed = false;
            for (State s : joint.states()) {
                if (!removed.contains(s.name())
                        && succ.getOrDefault(s.name(), List.of()).stream().allMatch(removed::contains)) {
                    removed.add(s.name());
                    changed = true;
                }
            }
        }
        List<State> states = new ArrayList<>();
        List<Double> startList = new ArrayList<>();
        double[] fullStart = fullView.start();
        for (int i = 0; i < fullView.states().size(); i++) {
            State s = fullView.states().get(i);
            if (!removed.contains(s.name())) {
                states.add(s);
                startList.add(fullStart[i]);
            }
        }
        Map<String, List<Transition>> rows = new java.util.LinkedHashMap<>();
        for (State s : states) {
            rows.put(s.name(), new ArrayList<>());
        }
        for (Transition t : fullView.transitions()) {
            if (!removed.contains(t.from()) && !removed.contains(t.to())) {
                rows.get(t.from()).add(t);
            }
        }
        // background enters and leaves the other strand's genes at any codon
        for (String c : cycle) {
            rows.get(open).add(new Transition(open, c, CROSSING / cycle.size()));
            rows.get(c).add(new Transition(c, open, CROSSING / 2));
        }
        List<Transition> transitions = new ArrayList<>();
        for (List<Transition> row : rows.values()) {
            double sum = 0;
            for (Transition t : row) {
                sum += t.probability();
            }
            for (Transition t : row) {
                transitions.add(new Transition(t.from(), t.to(), t.probability() / sum));
            }
        }
        double[] start = new double[states.size()];
        double total = startList.stream().mapToDouble(Double::doubleValue).sum();
        for (int i = 0; i < start.length; i++) {
            start[i] = startList.get(i) / total;
        }
        return new HmmModel(fullView.name(), fullView.description(), fullView.provenance(), fullView.labels(), states,
                start, transitions);
    }

    private static boolean reaches(String from, String target, Map<String, List<String>> succ, Set<String> within) {
        Set<String> seen = new HashSet<>();
        java.util.ArrayDeque<String> todo = new java.util.ArrayDeque<>(succ.getOrDefault(from, List.of()));
        while (!todo.isEmpty()) {
            String st = todo.poll();
            if (st.equals(target)) {
                return true;
            }
            if (within.contains(st) && seen.add(st)) {
                todo.addAll(succ.getOrDefault(st, List.of()));
            }
        }
        return false;
    }
}
