package dev.annotator.model;

import dev.annotator.error.BadInputException;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Checks that a model is usable by the kernels and the writers: names fit together, every distribution is a
 * distribution, and every state can be reached. The first problem found is thrown as a one-line
 * {@link BadInputException} {@code FILE: what}, naming the state, label, transition or context concerned.
 */
public final class ModelValidator {
    /**
     * Highest emission order a model may declare. An order-k table has 4^(k+1) numbers, so order 8 is already
     * 262,144 per state; the bound keeps an untrusted file from asking for tables that do not fit in memory.
     */
    public static final int MAX_ORDER = 8;

    /** How far a distribution's sum may stray from 1. */
    public static final double SUM_TOLERANCE = 1e-6;

    private static final Pattern SO_ACCESSION = Pattern.compile("SO:\\d{7}");
    private static final Pattern SHA256 = Pattern.compile("[0-9a-f]{64}");

    private final String file;
    private final HmmModel model;

    private ModelValidator(HmmModel model, String displayName) {
        this.file = displayName;
        this.model = model;
    }

    /** Throws {@link BadInputException} for the first problem found; returns normally for a usable model. */
    public static void validate(HmmModel model, String displayName) {
        ModelValidator v = new ModelValidator(model, displayName);
        v.checkTexts();
        v.checkLabels();
        v.checkStates();
        v.checkLabelsUsed();
        v.checkStart();
        v.checkTransitions();
        v.checkReachable();
    }

    private BadInputException fail(String what) {
        return new BadInputException(file + ": " + what);
    }

    private void checkTexts() {
        requireName(model.name(), "model name");
        if (model.description() == null || !isOneLine(model.description())) {
            throw fail("description must be one line of text");
        }
        Provenance p = model.provenance();
        if (p == null || p.source() == null || !isOneLine(p.source())) {
            throw fail("provenance.source must be one line of text");
        }
        for (int i = 0; i < p.notes().size(); i++) {
            if (!isOneLine(p.notes().get(i))) {
                throw fail("provenance.notes[" + i + "] must be one line of text");
            }
        }
        if (p.training() != null) {
            checkTraining(p.training());
        }
    }

    private void checkTraining(Training t) {
        String at = "provenance.training.";
        String[][] texts = {{"tool", t.tool()}, {"command", t.command()}, {"date", t.date()}};
        for (String[] field : texts) {
            if (field[1] == null || field[1].isEmpty() || !isOneLine(field[1])) {
                throw fail(at + field[0] + " must be one line of text");
            }
        }
        if (!Training.COUNTING.equals(t.method()) && !Training.BAUM_WELCH.equals(t.method())) {
            throw fail(at + "method " + quote(t.method()) + " is not \"" + Training.COUNTING + "\" or \""
                    + Training.BAUM_WELCH + "\"");
        }
        checkFingerprints(t.inputs(), at + "inputs");
        checkFingerprints(t.labels(), at + "labels");
        if (t.bases() < 0) {
            throw fail(at + "bases must not be negative");
        }
        if (t.iterations() < 0) {
            throw fail(at + "iterations must not be negative");
        }
        if (t.logLikelihood() != null && !Double.isFinite(t.logLikelihood())) {
            throw fail(at + "log_likelihood must be a finite number");
        }
        if (t.startLogLikelihood() != null && !Double.isFinite(t.startLogLikelihood())) {
            throw fail(at + "start_log_likelihood must be a finite number");
        }
    }

    private void checkFingerprints(List<InputFingerprint> files, String at) {
        for (int i = 0; i < files.size(); i++) {
            InputFingerprint f = files.get(i);
            String where = at + "[" + i + "]";
            if (f.name() == null || f.name().isEmpty() || !isOneLine(f.name())) {
                throw fail(where + ".name must be one line of text");
            }
            if (f.bytes() < 0) {
                throw fail(where + ".bytes must not be negative");
            }
            if (f.sha256() == null || !SHA256.matcher(f.sha256()).matches()) {
                throw fail(where + ".sha256 " + quote(f.sha256()) + " is not 64 lowercase hexadecimal digits");
            }
        }
    }

    private void checkLabels() {
        List<Label> labels = model.labels();
        Set<String> seen = new HashSet<>();
        List<String> backgrounds = new ArrayList<>();
        for (Label l : labels) {
            requireName(l.name(), "label name");
            if (!seen.add(l.name())) {
                throw fail("duplicate label name " + quote(l.name()));
            }
            if (l.background()) {
                backgrounds.add(quote(l.name()));
            }
        }
        if (backgrounds.isEmpty()) {
            throw fail("no background label: exactly one label needs \"background\": true");
        }
        if (backgrounds.size() > 1) {
            throw fail(backgrounds.size() + " background labels (" + String.join(", ", backgrounds)
                    + "): exactly one is allowed");
        }
        for (Label l : labels) {
            String where = "label " + quote(l.name()) + ": ";
            if (!l.background() && (l.featureType() == null || l.featureType().isBlank())) {
                throw fail(where + "no feature_type (every label but the background is reported as a GFF3 feature"
                        + " and needs a type)");
            }
            if (l.featureType() != null && !l.featureType().isBlank() && !isOneWord(l.featureType())) {
                throw fail(where + "feature_type " + quote(l.featureType())
                        + " is not one word (use a Sequence Ontology name such as CpG_island)");
            }
            if (l.soAccession() != null && !SO_ACCESSION.matcher(l.soAccession()).matches()) {
                throw fail(where + "so_accession " + quote(l.soAccession()) + " is not of the form SO:0000000");
            }
            if (l.background() && l.stranded()) {
                throw fail(where + "the background label has no strand");
            }
        }
    }

    private void checkStates() {
        if (model.states().isEmpty()) {
            throw fail("no states");
        }
        List<String> names = new ArrayList<>();
        for (State s : model.states()) {
            requireName(s.name(), "state name");
            names.add(s.name());
        }
        String twice = firstDuplicate(names);
        if (twice != null) {
            throw fail("duplicate state name " + quote(twice));
        }
        for (State s : model.states()) {
            String where = "state " + quote(s.name()) + ": ";
            if (s.label() == null || model.labelIndex(s.label()) < 0) {
                throw fail(where + "unknown label " + quote(s.label()));
            }
            if (s.codonPosition() != 0 && !model.labels().get(model.labelIndex(s.label())).stranded()) {
                throw fail(where + "codon_position needs a label with a strand (label " + quote(s.label()) + ")");
            }
            // the order is checked before its table size is computed: 4^order overflows for large orders
            if (s.order() < 0 || s.order() > MAX_ORDER) {
                throw fail(where + "order " + s.order() + " is outside 0.." + MAX_ORDER);
            }
            int rows = EmissionContexts.count(s.order());
            double[] e = s.emissions();
            if (e.length != rows * 4) {
                throw fail(where + "emission table has " + e.length + " values, order " + s.order() + " needs "
                        + rows + " rows of 4 = " + rows * 4);
            }
            for (int r = 0; r < rows; r++) {
                String row = where + "emissions[" + quote(EmissionContexts.name(r, s.order())) + "]";
                double sum = 0;
                for (int b = 0; b < 4; b++) {
                    double p = e[r * 4 + b];
                    String problem = probabilityProblem(p);
                    if (problem != null) {
                        throw fail(row + ": P(" + "ACGT".charAt(b) + ") " + problem);
                    }
                    sum += p;
                }
                requireSumOne(sum, row + " values");
            }
        }
    }

    private void checkLabelsUsed() {
        Set<String> used = new HashSet<>();
        for (State s : model.states()) {
            used.add(s.label());
        }
        for (Label l : model.labels()) {
            if (!used.contains(l.name())) {
                throw fail("label " + quote(l.name()) + " is used by no state");
            }
        }
    }

    private void checkStart() {
        double[] start = model.start();
        if (start.length != model.stateCount()) {
            throw fail("start has " + start.length + " probabilities for " + model.stateCount() + " states");
        }
        double sum = 0;
        for (int s = 0; s < start.length; s++) {
            String problem = probabilityProblem(start[s]);
            if (problem != null) {
                throw fail("start probability of state " + quote(model.states().get(s).name()) + " " + problem);
            }
            sum += start[s];
        }
        requireSumOne(sum, "start probabilities");
    }

    private void checkTransitions() {
        Set<String> pairs = new HashSet<>();
        double[] outSum = new double[model.stateCount()];
        int[] outCount = new int[model.stateCount()];
        for (Transition t : model.transitions()) {
            String what = "transition " + quote(t.from()) + " -> " + quote(t.to());
            int from = t.from() == null ? -1 : model.stateIndex(t.from());
            int to = t.to() == null ? -1 : model.stateIndex(t.to());
            if (from < 0) {
                throw fail(what + ": unknown state " + quote(t.from()));
            }
            if (to < 0) {
                throw fail(what + ": unknown state " + quote(t.to()));
            }
            if (!pairs.add(from + " " + to)) {
                throw fail("duplicate " + what);
            }
            String problem = probabilityProblem(t.probability());
            if (problem != null) {
                throw fail(what + ": probability " + problem);
            }
            outSum[from] += t.probability();
            outCount[from]++;
        }
        for (int s = 0; s < outSum.length; s++) {
            String where = "state " + quote(model.states().get(s).name());
            if (outCount[s] == 0) {
                throw fail(where + ": no outgoing transition (every state must list where it can go next)");
            }
            requireSumOne(outSum[s], where + ": outgoing transitions");
        }
    }

    private void checkReachable() {
        int k = model.stateCount();
        Map<Integer, List<Integer>> next = new HashMap<>();
        for (Transition t : model.transitions()) {
            if (t.probability() > 0) {
                next.computeIfAbsent(model.stateIndex(t.from()), x -> new ArrayList<>()).add(model.stateIndex(t.to()));
            }
        }
        boolean[] seen = new boolean[k];
        Deque<Integer> queue = new ArrayDeque<>();
        double[] start = model.start();
        for (int s = 0; s < k; s++) {
            if (start[s] > 0) {
                seen[s] = true;
                queue.add(s);
            }
        }
        while (!queue.isEmpty()) {
            for (int j : next.getOrDefault(queue.poll(), List.of())) {
                if (!seen[j]) {
                    seen[j] = true;
                    queue.add(j);
                }
            }
        }
        for (int s = 0; s < k; s++) {
            if (!seen[s]) {
                throw fail("state " + quote(model.states().get(s).name())
                        + ": unreachable from the start (no path of non-zero transitions leads to it)");
            }
        }
    }

    private void requireSumOne(double sum, String what) {
        if (!(Math.abs(sum - 1) <= SUM_TOLERANCE)) {
            throw fail(what + " sum to " + Numbers.show(sum) + ", expected 1 (within " + SUM_TOLERANCE + ")");
        }
    }

    private void requireName(String name, String what) {
        if (name == null || name.isEmpty()) {
            throw fail("empty " + what);
        }
        if (!isOneLine(name)) {
            throw fail(what + " " + quote(name) + " contains a control character");
        }
    }

    /** Null when p is a probability, else what is wrong with it. */
    static String probabilityProblem(double p) {
        if (Double.isNaN(p)) {
            return "is not a number (NaN)";
        }
        if (Double.isInfinite(p)) {
            return "is infinite";
        }
        if (p < 0) {
            return "is negative (" + Numbers.show(p) + ")";
        }
        if (p > 1) {
            return "is above 1 (" + Numbers.show(p) + ")";
        }
        return null;
    }

    /** Names and texts end up inside one-line messages, summaries and GFF3 columns. */
    static boolean isOneLine(String s) {
        return s.codePoints().noneMatch(Character::isISOControl);
    }

    private static boolean isOneWord(String s) {
        return s.codePoints().noneMatch(c -> Character.isISOControl(c) || Character.isWhitespace(c));
    }

    /** The first name that occurs twice, or null. */
    static String firstDuplicate(List<String> names) {
        Set<String> seen = new HashSet<>();
        for (String n : names) {
            if (!seen.add(n)) {
                return n;
            }
        }
        return null;
    }

    /** A name in double quotes, control characters escaped so that a message stays on one line. */
    static String quote(String s) {
        if (s == null) {
            return "(none)";
        }
        StringBuilder out = new StringBuilder("\"");
        s.codePoints().forEach(c -> {
            if (c == '"' || c == '\\') {
                out.append('\\').appendCodePoint(c);
            } else if (Character.isISOControl(c)) {
                out.append(String.format("\\u%04x", c));
            } else {
                out.appendCodePoint(c);
            }
        });
        return out.append('"').toString();
    }
}
