package dev.annotator.decode;

import dev.annotator.hmm.HmmParameters;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import dev.annotator.seq.BaseCode;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Moves the start of every decoded gene upstream within its open reading frame. Between candidate starts of one
 * reading frame a gene model's evidence is often flat (codon statistics of the first codons hardly differ from
 * non-coding sequence), and the decoded start tends to lie too far downstream. Two rules ({@link GeneStarts}):
 * the longest open reading frame (the first start codon after the previous in-frame stop, common practice in
 * prokaryotic annotation), or the 5'-most of the likeliest start codons between there and the decoded start, by
 * the model's own start-codon frequencies (so an ATG is preferred to a GTG or TTG further upstream). Confidence and
 * log-odds are then taken over the whole gene as written.
 *
 * <p>The gene's structure is read from the model, not from state names: the start-codon states are the three
 * states at the gene's 5' end (entered from outside its label on the forward strand, left to outside it on the
 * reverse strand), the codon states are the three that follow them; a triplet is a start when the start-codon
 * states can emit it, and the frame is closed by a triplet the codon states cannot emit (a stop) or a missing
 * base. A 5'-partial gene is not moved.
 */
final class LongestOrfStarts {
    private static final byte[] CODE = BaseCode.table();

    private final HmmParameters p;
    private final boolean byKind;
    private final List<Gene> genes = new ArrayList<>();

    /** The states of one stranded label, in reading order of the forward strand. */
    private record Gene(int label, char strand, int[] startChain, int[] codons) {
    }

    private LongestOrfStarts(HmmModel model, HmmParameters parameters, GeneStarts rule) {
        this.p = parameters;
        this.byKind = rule == GeneStarts.LIKELIEST_START;
        int[] stateLabel = model.stateLabels();
        Map<Integer, List<Integer>> succ = new HashMap<>();
        Map<Integer, List<Integer>> pred = new HashMap<>();
        for (Transition t : model.transitions()) {
            if (t.probability() > 0) {
                int a = model.stateIndex(t.from());
                int b = model.stateIndex(t.to());
                succ.computeIfAbsent(a, k -> new ArrayList<>()).add(b);
                pred.computeIfAbsent(b, k -> new ArrayList<>()).add(a);
            }
        }
        List<Label> labels = model.labels();
        for (int l = 0; l < labels.size(); l++) {
            Label label = labels.get(l);
            if (!label.stranded()) {
                continue;
            }
            Gene g = label.strand() == '+' ? forward(model, l, stateLabel, succ, pred)
                    : reverse(model, l, stateLabel, succ, pred);
            if (g != null) {
                genes.add(g);
            }
        }
    }

    /** The rewriter for a model, or null when no stranded label has the start-and-codon structure. */
    static LongestOrfStarts of(HmmModel model, HmmParameters parameters, GeneStarts rule) {
        LongestOrfStarts s = new LongestOrfStarts(model, parameters, rule);
        return s.genes.isEmpty() ? null : s;
    }

    /** Forward strand: entry state, then two single successors make the start codon; three codon states follow. */
    private static Gene forward(HmmModel m, int l, int[] lab, Map<Integer, List<Integer>> succ,
                                Map<Integer, List<Integer>> pred) {
        int[] chain = follow(boundary(lab, l, pred), succ, 6);
        return chain == null || !inLabel(chain, lab, l) || !positions(m, chain, 1, 2, 3, 1, 2, 3) ? null
                : new Gene(l, '+', new int[]{chain[0], chain[1], chain[2]}, new int[]{chain[3], chain[4], chain[5]});
    }

    /** Reverse strand: exit state, then two single predecessors make the start codon; three codon states precede. */
    private static Gene reverse(HmmModel m, int l, int[] lab, Map<Integer, List<Integer>> succ,
                                Map<Integer, List<Integer>> pred) {
        int[] back = follow(boundary(lab, l, succ), pred, 6);
        if (back == null || !inLabel(back, lab, l)) {
            return null;
        }
        // forward reading order: codon states (positions 3, 2, 1), then the start codon's (3, 2, 1)
        int[] chain = {back[5], back[4], back[3], back[2], back[1], back[0]};
        return !positions(m, chain, 3, 2, 1, 3, 2, 1) ? null
                : new Gene(l, '-', new int[]{chain[3], chain[4], chain[5]}, new int[]{chain[0], chain[1], chain[2]});
    }

    /**
     * The one state of label l with a neighbour (in {@code neighbours}: predecessors for the way in, successors for
     * the way out) outside the label; -1 when there is none or more than one.
     */
    private static int boundary(int[] lab, int l, Map<Integer, List<Integer>> neighbours) {
        int found = -1;
        for (int s = 0; s < lab.length; s++) {
            if (lab[s] == l && neighbours.getOrDefault(s, List.of()).stream().anyMatch(q -> lab[q] != l)) {
                if (found >= 0) {
                    return -1;
                }
                found = s;
            }
        }
        return found;
    }

    private static int[] follow(int from, Map<Integer, List<Integer>> next, int length) {
        if (from < 0) {
            return null;
        }
        int[] out = new int[length];
        out[0] = from;
        for (int i = 1; i < length; i++) {
            List<Integer> n = next.getOrDefault(out[i - 1], List.of());
            if (i < 3 && n.size() != 1) {
                return null;
            }
            if (n.isEmpty()) {
                return null;
            }
            // past the start codon the chain goes on into the codon cycle: take the state of the next position
            out[i] = n.get(0);
        }
        return out;
    }

    private static boolean inLabel(int[] states, int[] lab, int l) {
        for (int s : states) {
            if (lab[s] != l) {
                return false;
            }
        }
        return true;
    }

    private static boolean positions(HmmModel m, int[] states, int... expected) {
        for (int i = 0; i < states.length; i++) {
            State s = m.states().get(states[i]);
            if (s.codonPosition() != expected[i]) {
                return false;
            }
        }
        return true;
    }

    /**
     * The runs with every gene of a known structure starting at its open reading frame's first start codon, sorted
     * by start. A moved gene may now overlap its neighbour on the same strand (genes whose stop and start codons
     * share bases are common in operons), which a single state path cannot hold.
     */
    List<RawSegment> extend(byte[] seq, byte[] path, List<RawSegment> runs, ReportedLabels labels) {
        List<RawSegment> out = new ArrayList<>(runs.size());
        for (RawSegment r : runs) {
            int from = r.start0();
            int to = r.endExclusive();
            for (Gene g : genes) {
                if (g.strand == '+' && to - from >= 3 && (path[from] & 0xFF) == g.startChain[0]) {
                    from = forwardStart(g, seq, from);
                } else if (g.strand == '-' && to - from >= 3 && (path[to - 1] & 0xFF) == g.startChain[2]) {
                    to = reverseStart(g, seq, to);
                }
            }
            out.add(from == r.start0() && to == r.endExclusive() ? r
                    : new RawSegment(r.label(), from, to, new SegmentAccumulator(labels.stateMasks()[r.label()])));
        }
        out.sort(java.util.Comparator.comparingInt(RawSegment::start0).thenComparingInt(RawSegment::endExclusive));
        return out;
    }

    /**
     * The chosen start codon of the forward frame whose decoded start codon is at {@code from}, walking upstream to
     * the previous in-frame stop: the 5'-most one, or with {@link GeneStarts#LIKELIEST_START} the 5'-most of those
     * whose kind the model finds likeliest.
     */
    private int forwardStart(Gene g, byte[] seq, int from) {
        int best = from;
        double bestP = startCodonProbability(g.startChain, seq, from);
        for (int q = from - 3; q >= 0; q -= 3) {
            if (!emits(g.codons, seq, q)) {
                break; // an in-frame stop or a missing base closes the frame
            }
            if (emits(g.startChain, seq, q)) {
                double p = startCodonProbability(g.startChain, seq, q);
                if (p >= bestP) {
                    best = q;
                    bestP = p;
                }
            }
        }
        return best;
    }

    /** As {@link #forwardStart} on the reverse strand: walks right from the start codon ending at {@code to}. */
    private int reverseStart(Gene g, byte[] seq, int to) {
        int best = to;
        double bestP = startCodonProbability(g.startChain, seq, to - 3);
        for (int r = to; r + 3 <= seq.length; r += 3) {
            if (!emits(g.codons, seq, r)) {
                break;
            }
            if (emits(g.startChain, seq, r)) {
                double p = startCodonProbability(g.startChain, seq, r);
                if (p >= bestP) {
                    best = r + 3;
                    bestP = p;
                }
            }
        }
        return best;
    }

    /**
     * How likely the start-codon states find the triplet at q on its own, without the bases before it (each state
     * conditioned only on the triplet's earlier bases): the trained frequency of that kind of start codon. 1 for
     * every triplet under {@link GeneStarts#LONGEST_ORF}, which then takes the 5'-most.
     */
    private double startCodonProbability(int[] states, byte[] seq, int q) {
        if (!byKind) {
            return 1;
        }
        double prob = 1;
        int context = 0;
        for (int i = 0; i < 3; i++) {
            int b = CODE[seq[q + i] & 0xFF];
            prob *= p.emission(states[i], Math.min(i, p.order(states[i])), context & ((1 << (2 * Math.min(i,
                    p.order(states[i])))) - 1), b);
            context = context * 4 + b;
        }
        return prob;
    }

    /** Whether three states can emit the triplet at q (with the record's own preceding bases as context). */
    private boolean emits(int[] states, byte[] seq, int q) {
        for (int i = 0; i < 3; i++) {
            int t = q + i;
            int b = CODE[seq[t] & 0xFF];
            if (b < 0 || b > 3) {
                return false;
            }
            int s = states[i];
            int k = Math.min(p.order(s), t);
            int context = 0;
            for (int c = t - k; c < t; c++) {
                int x = CODE[seq[c] & 0xFF];
                if (x < 0 || x > 3) {
                    return false;
                }
                context = context * 4 + x;
            }
            if (!(p.emission(s, k, context, b) > 0)) {
                return false;
            }
        }
        return true;
    }
}
