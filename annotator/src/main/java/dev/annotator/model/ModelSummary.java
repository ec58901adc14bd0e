package dev.annotator.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** Describes a model in words for people checking a model file before they use it. */
public final class ModelSummary {
    private ModelSummary() {
    }

    /** Multi-line text ending in a newline: identity, provenance, labels, states, transitions, segment lengths. */
    public static String describe(HmmModel model) {
        StringBuilder out = new StringBuilder();
        out.append("model: ").append(model.name()).append('\n');
        out.append("description: ").append(model.description()).append('\n');
        out.append("source: ").append(model.provenance().source()).append('\n');
        for (String note : model.provenance().notes()) {
            out.append("  note: ").append(note).append('\n');
        }
        Training training = model.provenance().training();
        if (training != null) {
            training(training, out);
        }

        out.append("labels: ").append(model.labels().size()).append('\n');
        List<String[]> rows = new ArrayList<>();
        for (Label l : model.labels()) {
            String what;
            if (l.background()) {
                what = "background, not reported";
            } else {
                what = "reported as " + l.featureType()
                        + (l.soAccession() == null ? "" : " (" + l.soAccession() + ")")
                        + (l.composition() ? ", with composition attributes" : "");
            }
            rows.add(new String[] {l.name(), what});
        }
        table(rows, out);

        out.append("states: ").append(model.stateCount()).append('\n');
        rows.clear();
        double[] start = model.start();
        for (int s = 0; s < model.stateCount(); s++) {
            State st = model.states().get(s);
            rows.add(new String[] {st.name(), "label " + st.label(), "order " + st.order(),
                    "start " + Numbers.show(start[s])});
        }
        table(rows, out);

        int k = model.stateCount();
        out.append("transitions: ").append(model.transitions().size()).append(" allowed of ").append((long) k * k)
                .append(" possible; the others are forbidden\n");

        out.append("expected segment length (bases):\n");
        rows.clear();
        for (Map.Entry<String, Double> e : expectedSegmentLengths(model).entrySet()) {
            rows.add(new String[] {e.getKey(), length(e.getValue())});
        }
        table(rows, out);
        return out.toString();
    }

    /**
     * Expected length in bases of a segment of each label, in label order, as implied by the transitions;
     * {@code Double.POSITIVE_INFINITY} for a label that, once entered, can never be left. For the states Q of a
     * label this is the entry distribution times (I - T_QQ)^-1 times a vector of ones, the entry distribution
     * being the long-run flow of transitions into Q from outside (the start distribution for a label that is
     * not re-entered). The model must be valid.
     */
    public static Map<String, Double> expectedSegmentLengths(HmmModel model) {
        return SegmentLengths.compute(model);
    }

    private static void training(Training t, StringBuilder out) {
        out.append("trained: ").append(t.method()).append(" by ").append(t.tool()).append(" on ").append(t.date())
                .append('\n');
        out.append("  command: ").append(t.command()).append('\n');
        for (InputFingerprint f : t.inputs()) {
            out.append("  input: ").append(f.name()).append(", ").append(f.bytes()).append(" bytes, sha256 ")
                    .append(f.sha256()).append('\n');
        }
        for (InputFingerprint f : t.labels()) {
            out.append("  labels: ").append(f.name()).append(", ").append(f.bytes()).append(" bytes, sha256 ")
                    .append(f.sha256()).append('\n');
        }
        out.append("  bases: ").append(t.bases()).append('\n');
        out.append("  iterations: ").append(t.iterations());
        if (t.converged() != null) {
            out.append(t.converged() ? " (converged)" : " (stopped before converging)");
        }
        out.append('\n');
        if (t.startLogLikelihood() != null) {
            out.append("  log-likelihood of the start model: ").append(Numbers.logLikelihood(t.startLogLikelihood()))
                    .append('\n');
        }
        if (t.logLikelihood() != null) {
            out.append("  log-likelihood of this model: ").append(Numbers.logLikelihood(t.logLikelihood()))
                    .append('\n');
        }
    }

    private static String length(double v) {
        if (Double.isInfinite(v)) {
            return "infinite (the label cannot be left once entered)";
        }
        return String.format(Locale.ROOT, "%.1f", v);
    }

    private static void table(List<String[]> rows, StringBuilder out) {
        int cols = 0;
        for (String[] r : rows) {
            cols = Math.max(cols, r.length);
        }
        int[] width = new int[cols];
        for (String[] r : rows) {
            for (int c = 0; c < r.length; c++) {
                width[c] = Math.max(width[c], r[c].length());
            }
        }
        for (String[] r : rows) {
            StringBuilder line = new StringBuilder("  ");
            for (int c = 0; c < r.length; c++) {
                line.append(r[c]);
                if (c + 1 < r.length) {
                    line.append(" ".repeat(width[c] - r[c].length() + 2));
                }
            }
            out.append(line).append('\n');
        }
    }
}
