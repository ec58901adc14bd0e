package dev.annotator.topology;

import dev.annotator.model.EmissionContexts;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * Writes the untrained protein-coding gene topology for both strands: a non-coding state, and on each strand
 * start-codon states, the three codon positions in a cycle, and stop-codon states.
 *
 * <p>Forward strand, in reading order: {@code start+1 start+2 start+3}, then {@code codon+1 codon+2 codon+3}
 * repeated, then {@code stop+1 stop+2 stop+3}. A reverse-strand gene reads on the forward strand as its reverse
 * complement, so its states come in the mirror order: {@code stop-3 stop-2 stop-1}, {@code codon-3 codon-2
 * codon-1} repeated, {@code start-3 start-2 start-1} (the number is the codon position on the gene's own
 * strand). Genes are separated by at least one non-coding base, so genes of one path never overlap.
 *
 * <p>The genetic code enters only as structural zeros: an emission that would make a codon the code does not
 * allow at that place (a start that is no start codon, a stop inside a gene, a stop that is no stop codon) has
 * probability exactly 0, and training keeps it 0. A state sees the codon's earlier bases through its context,
 * which is why codon states need order 2 at least. Every other entry starts uniform: the model must be trained
 * (by counting along annotated genes) before use.
 */
public final class GeneTopology {
    /** Order of the start- and stop-codon states: enough to see the codon's first two bases. */
    public static final int CODON_SIGNAL_ORDER = 2;
    public static final String NONCODING = "noncoding";
    public static final String FORWARD_LABEL = "cds_forward";
    public static final String REVERSE_LABEL = "cds_reverse";
    /**
     * Genes shorter than this are not reported: 30 codons, start and stop included (common practice; a path
     * through a start codon, a few codons and a stop is allowed by the topology but is no gene worth a call).
     */
    public static final int MIN_GENE_LENGTH = 90;
    /** Default length of the modelled stretch before a start codon. */
    public static final int DEFAULT_UPSTREAM = 12;
    public static final int MAX_UPSTREAM = 60;
    /** Emission order of the upstream states: position-specific, so kept low for the few hundred genes of a genome. */
    public static final int UPSTREAM_ORDER = 1;

    private static final String BASES = "ACGT";

    private GeneTopology() {
    }

    /**
     * @param codingOrder    emission order of the codon-position states (2..8)
     * @param noncodingOrder emission order of the non-coding state (0..8)
     */
    public static HmmModel build(String name, GeneticCode code, int codingOrder, int noncodingOrder) {
        return build(name, code, codingOrder, noncodingOrder, DEFAULT_UPSTREAM);
    }

    /**
     * @param upstream number of bases before each start codon modelled position by position (0 for none): the
     *                 ribosome-binding site lies there, and it is what tells a true start from an in-frame one
     *                 nearby
     */
    public static HmmModel build(String name, GeneticCode code, int codingOrder, int noncodingOrder, int upstream) {
        if (upstream < 0 || upstream > MAX_UPSTREAM) {
            throw new IllegalArgumentException("upstream length must be 0.." + MAX_UPSTREAM + ", got " + upstream);
        }
        if (codingOrder < CODON_SIGNAL_ORDER) {
            throw new IllegalArgumentException("codon states need order " + CODON_SIGNAL_ORDER
                    + " at least to keep stop codons out of genes, got " + codingOrder);
        }
        List<String> starts = code.starts();
        List<String> stops = code.stops();
        List<String> sense = code.senseCodons();
        List<String> startsRc = starts.stream().map(GeneticCode::reverseComplement).toList();
        List<String> stopsRc = stops.stream().map(GeneticCode::reverseComplement).toList();
        List<String> senseRc = sense.stream().map(GeneticCode::reverseComplement).toList();

        List<State> states = new ArrayList<>();
        states.add(new State(NONCODING, NONCODING, noncodingOrder, uniform(noncodingOrder)));
        for (int j = upstream; j >= 1; j--) {
            states.add(new State("upstream+" + j, NONCODING, UPSTREAM_ORDER, uniform(UPSTREAM_ORDER)));
        }
        for (int j = 1; j <= upstream; j++) {
            states.add(new State("upstream-" + j, NONCODING, UPSTREAM_ORDER, uniform(UPSTREAM_ORDER)));
        }
        for (int q = 1; q <= 3; q++) {
            states.add(codonState("start+" + q, FORWARD_LABEL, CODON_SIGNAL_ORDER, starts, q, q));
        }
        for (int q = 1; q <= 3; q++) {
            states.add(codonState("codon+" + q, FORWARD_LABEL, codingOrder, sense, q, q));
        }
        for (int q = 1; q <= 3; q++) {
            states.add(codonState("stop+" + q, FORWARD_LABEL, CODON_SIGNAL_ORDER, stops, q, q));
        }
        // reverse strand: forward reading position q is codon position 4 - q on the gene's strand
        for (int q = 1; q <= 3; q++) {
            states.add(codonState("stop-" + (4 - q), REVERSE_LABEL, CODON_SIGNAL_ORDER, stopsRc, q, 4 - q));
        }
        for (int q = 1; q <= 3; q++) {
            states.add(codonState("codon-" + (4 - q), REVERSE_LABEL, codingOrder, senseRc, q, 4 - q));
        }
        for (int q = 1; q <= 3; q++) {
            states.add(codonState("start-" + (4 - q), REVERSE_LABEL, CODON_SIGNAL_ORDER, startsRc, q, 4 - q));
        }

        List<Transition> t = new ArrayList<>();
        if (upstream == 0) {
            t.add(new Transition(NONCODING, NONCODING, 0.99));
            t.add(new Transition(NONCODING, "start+1", 0.005));
            t.add(new Transition(NONCODING, "stop-3", 0.005));
            t.add(new Transition("stop+3", NONCODING, 1.0));
            t.add(new Transition("start-1", NONCODING, 1.0));
        } else {
            upstreamTransitions(t, upstream);
        }
        chain(t, "start+1", "start+2", "start+3", "codon+1", "codon+2", "codon+3");
        t.add(new Transition("codon+3", "codon+1", 0.997));
        t.add(new Transition("codon+3", "stop+1", 0.003));
        chain(t, "stop+1", "stop+2", "stop+3");
        chain(t, "stop-3", "stop-2", "stop-1", "codon-3", "codon-2", "codon-1");
        t.add(new Transition("codon-1", "codon-3", 0.997));
        t.add(new Transition("codon-1", "start-3", 0.003));
        chain(t, "start-3", "start-2", "start-1");

        // a record may begin inside a gene (a partial gene) or at its first codon
        List<String> openers = new ArrayList<>(List.of("start+1", "codon+1", "codon+2", "codon+3", "stop-3",
                "codon-3", "codon-2", "codon-1"));
        for (int j = 1; j <= upstream; j++) {
            openers.add("upstream+" + j);
            openers.add("upstream-" + j);
        }
        double[] start = new double[states.size()];
        for (int s = 0; s < states.size(); s++) {
            String n = states.get(s).name();
            start[s] = n.equals(NONCODING) ? 0.9 : openers.contains(n) ? 0.1 / openers.size() : 0.0;
        }

        List<Label> labels = List.of(
                new Label(FORWARD_LABEL, "CDS", "SO:0000316", false, false, '+', MIN_GENE_LENGTH),
                new Label(REVERSE_LABEL, "CDS", "SO:0000316", false, false, '-', MIN_GENE_LENGTH),
                new Label(NONCODING, null, null, true, false));
        Provenance provenance = new Provenance("Untrained protein-coding gene topology for " + code.name()
                + " (starts " + String.join(", ", starts) + "; stops " + String.join(", ", stops) + ")",
                List.of("Structural zeros carry the genetic code: emissions that would form a start that is no start "
                                + "codon, a stop inside a gene or a stop that is no stop codon are exactly 0 and stay 0 "
                                + "in training.",
                        "All other values are uniform placeholders; train by counting along annotated genes before "
                                + "use.",
                        "Codon states of order " + codingOrder + " (the preceding bases condition each codon position,"
                                + " common practice for coding statistics); non-coding order " + noncodingOrder + "."));
        return new HmmModel(name, "Protein-coding genes on both strands (" + code.name() + "), codon states of order "
                + codingOrder, provenance, labels, states, start, t);
    }

    /**
     * Ways between genes with the upstream stretches. Every gap between two genes of at least one base has
     * exactly one path, so labels of genes fix the state path and counting stays counting:
     * <ul>
     *   <li>before a forward gene: {@code noncoding -> upstream+L -> ... -> upstream+1 -> start+1}, entered part
     *   way ({@code upstream+j}) straight after a gene when the gap is only j bases;</li>
     *   <li>after a reverse gene (its upstream side, read forwards): {@code start-1 -> upstream-1 -> ... ->
     *   upstream-L -> noncoding}, left part way to a reverse gene ({@code upstream-j -> stop-3}) or, between two
     *   genes that face away from each other, to the forward stretch: {@code upstream-j -> start+1} for a gap of
     *   j bases, {@code upstream-L -> upstream+i} for a gap of L + i.</li>
     * </ul>
     */
    private static void upstreamTransitions(List<Transition> t, int upstream) {
        String fwdFirst = "upstream+" + upstream;
        t.add(new Transition(NONCODING, NONCODING, 0.99));
        t.add(new Transition(NONCODING, fwdFirst, 0.005));
        t.add(new Transition(NONCODING, "stop-3", 0.005));
        for (int j = upstream; j > 1; j--) {
            t.add(new Transition("upstream+" + j, "upstream+" + (j - 1), 1.0));
        }
        t.add(new Transition("upstream+1", "start+1", 1.0));
        double share = 0.5 / upstream;
        t.add(new Transition("stop+3", NONCODING, 0.5));
        for (int j = 1; j <= upstream; j++) {
            t.add(new Transition("stop+3", "upstream+" + j, share));
        }
        t.add(new Transition("start-1", "upstream-1", 1.0));
        for (int j = 1; j < upstream; j++) {
            t.add(new Transition("upstream-" + j, "upstream-" + (j + 1), 0.8));
            t.add(new Transition("upstream-" + j, "stop-3", 0.1));
            t.add(new Transition("upstream-" + j, "start+1", 0.1));
        }
        String revLast = "upstream-" + upstream;
        t.add(new Transition(revLast, NONCODING, 0.5));
        t.add(new Transition(revLast, "stop-3", 0.25));
        t.add(new Transition(revLast, "start+1", 0.05));
        for (int i = 1; i <= upstream; i++) {
            t.add(new Transition(revLast, "upstream+" + i, 0.2 / upstream));
        }
    }

    private static void chain(List<Transition> t, String... names) {
        for (int i = 0; i + 1 < names.length; i++) {
            t.add(new Transition(names[i], names[i + 1], 1.0));
        }
    }

    private static double[] uniform(int order) {
        double[] e = new double[EmissionContexts.count(order) * 4];
        java.util.Arrays.fill(e, 0.25);
        return e;
    }

    /**
     * A state emitting forward-reading position q of triplets from {@code triplets} (as read on the forward
     * strand): in each context row, the bases that continue some triplet whose earlier bases end the context get
     * equal probability; the others are structural zeros. A context no triplet continues cannot occur on an
     * allowed path; its row allows every base any triplet has at q, so reduced-order tables (averages over rows)
     * keep the same zeros.
     */
    private static State codonState(String name, String label, int order, List<String> triplets, int q,
                                    int codonPosition) {
        Set<Character> any = new HashSet<>();
        for (String w : triplets) {
            any.add(w.charAt(q - 1));
        }
        int rows = EmissionContexts.count(order);
        double[] e = new double[rows * 4];
        for (int r = 0; r < rows; r++) {
            String context = EmissionContexts.name(r, order);
            String prefix = context.substring(context.length() - (q - 1));
            Set<Character> allowed = new HashSet<>();
            for (String w : triplets) {
                if (w.startsWith(prefix)) {
                    allowed.add(w.charAt(q - 1));
                }
            }
            if (allowed.isEmpty()) {
                allowed = any;
            }
            for (int b = 0; b < 4; b++) {
                e[r * 4 + b] = allowed.contains(BASES.charAt(b)) ? 1.0 / allowed.size() : 0.0;
            }
        }
        return new State(name, label, order, e, codonPosition);
    }
}
