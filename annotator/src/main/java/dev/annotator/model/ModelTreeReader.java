package dev.annotator.model;

import com.fasterxml.jackson.databind.JsonNode;
import dev.annotator.error.BadInputException;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.Iterator;
import java.util.List;
import java.util.Map;

/**
 * Turns a parsed JSON tree into an {@link HmmModel}, reporting shape errors (missing field, wrong type,
 * unknown field) with their JSON path, and the emission-table layout errors that only exist in the file
 * (context keys, row lengths). Numbers are checked afterwards by {@link ModelValidator}.
 */
final class ModelTreeReader {
    private static final List<String> TOP = List.of("format", "name", "description", "provenance", "labels", "states",
            "start", "transitions");
    private static final List<String> PROVENANCE = List.of("source", "notes", "training");
    private static final List<String> TRAINING = List.of("tool", "command", "date", "method", "inputs", "labels",
            "bases", "iterations", "converged", "log_likelihood", "start_log_likelihood");
    private static final List<String> TRAINING_REQUIRED = List.of("tool", "command", "date", "method", "inputs",
            "bases", "iterations");
    private static final List<String> FINGERPRINT = List.of("name", "bytes", "sha256");
    private static final List<String> LABEL = List.of("name", "feature_type", "so_accession", "background",
            "composition", "strand", "min_length");
    private static final List<String> STATE = List.of("name", "label", "order", "emissions", "codon_position");
    private static final List<String> STATE_REQUIRED = List.of("name", "label", "order", "emissions");
    private static final List<String> TRANSITION = List.of("from", "to", "p");

    private final String file;

    ModelTreeReader(String displayName) {
        this.file = displayName;
    }

    HmmModel read(JsonNode root) {
        requireObject(root, "");
        checkFormat(root);
        requireFields(root, "", TOP, TOP);
        String name = text(root, "name", "");
        String description = text(root, "description", "");
        Provenance provenance = provenance(root.get("provenance"));
        List<Label> labels = new ArrayList<>();
        JsonNode labelArray = array(root, "labels", "");
        for (int i = 0; i < labelArray.size(); i++) {
            labels.add(label(labelArray.get(i), "labels[" + i + "]"));
        }
        List<State> states = new ArrayList<>();
        JsonNode stateArray = array(root, "states", "");
        for (int i = 0; i < stateArray.size(); i++) {
            states.add(state(stateArray.get(i), "states[" + i + "]"));
        }
        // names key the start distribution, so a duplicate must be reported before "start" is read
        String twice = ModelValidator.firstDuplicate(states.stream().map(State::name).toList());
        if (twice != null) {
            throw fail("duplicate state name " + ModelValidator.quote(twice));
        }
        double[] start = start(root.get("start"), states);
        List<Transition> transitions = new ArrayList<>();
        JsonNode transitionArray = array(root, "transitions", "");
        for (int i = 0; i < transitionArray.size(); i++) {
            transitions.add(transition(transitionArray.get(i), "transitions[" + i + "]"));
        }
        return new HmmModel(name, description, provenance, labels, states, start, transitions);
    }

    private void checkFormat(JsonNode root) {
        JsonNode f = root.get("format");
        if (f == null) {
            throw fail("missing field \"format\" (expected \"" + ModelJson.FORMAT + "\")");
        }
        if (!f.isTextual() || !f.textValue().equals(ModelJson.FORMAT)) {
            throw fail("unknown format " + f + " (this version reads \"" + ModelJson.FORMAT + "\")");
        }
    }

    private Provenance provenance(JsonNode node) {
        String path = "provenance";
        requireObject(node, path);
        requireFields(node, path, PROVENANCE, List.of("source"));
        String source = text(node, "source", path);
        List<String> notes = new ArrayList<>();
        if (node.has("notes")) {
            JsonNode arr = array(node, "notes", path);
            for (int i = 0; i < arr.size(); i++) {
                JsonNode n = arr.get(i);
                if (!n.isTextual()) {
                    throw wrongType(path + ".notes[" + i + "]", "a string", n);
                }
                notes.add(n.textValue());
            }
        }
        Training training = node.has("training") ? training(node.get("training"), path + ".training") : null;
        return new Provenance(source, notes, training);
    }

    private Training training(JsonNode node, String path) {
        requireObject(node, path);
        requireFields(node, path, TRAINING, TRAINING_REQUIRED);
        List<InputFingerprint> labels = node.has("labels") ? fingerprints(node, "labels", path) : List.of();
        Boolean converged = node.has("converged") ? flag(node, "converged", path) : null;
        Double logLik = node.has("log_likelihood") ? number(node.get("log_likelihood"), path + ".log_likelihood")
                : null;
        Double startLogLik = node.has("start_log_likelihood")
                ? number(node.get("start_log_likelihood"), path + ".start_log_likelihood") : null;
        return new Training(text(node, "tool", path), text(node, "command", path), text(node, "date", path),
                text(node, "method", path), fingerprints(node, "inputs", path), labels,
                integer(node.get("bases"), path + ".bases"), (int) Math.min(Integer.MAX_VALUE,
                integer(node.get("iterations"), path + ".iterations")), converged, logLik, startLogLik);
    }

    private List<InputFingerprint> fingerprints(JsonNode parent, String field, String path) {
        JsonNode arr = array(parent, field, path);
        List<InputFingerprint> out = new ArrayList<>();
        for (int i = 0; i < arr.size(); i++) {
            String at = join(path, field) + "[" + i + "]";
            JsonNode n = arr.get(i);
            requireObject(n, at);
            requireFields(n, at, FINGERPRINT, FINGERPRINT);
            out.add(new InputFingerprint(text(n, "name", at), integer(n.get("bytes"), at + ".bytes"),
                    text(n, "sha256", at)));
        }
        return out;
    }

    private Label label(JsonNode node, String path) {
        requireObject(node, path);
        requireFields(node, path, LABEL, List.of("name"));
        String strand = optionalText(node, "strand", path);
        if (strand != null && !strand.equals("+") && !strand.equals("-")) {
            throw fail("label " + ModelValidator.quote(text(node, "name", path)) + ": strand "
                    + ModelValidator.quote(strand) + " is not \"+\" or \"-\"");
        }
        return new Label(text(node, "name", path), optionalText(node, "feature_type", path),
                optionalText(node, "so_accession", path), flag(node, "background", path),
                flag(node, "composition", path), strand == null ? '.' : strand.charAt(0), minLength(node, path));
    }

    private State state(JsonNode node, String path) {
        requireObject(node, path);
        requireFields(node, path, STATE, STATE_REQUIRED);
        String name = text(node, "name", path);
        String label = text(node, "label", path);
        JsonNode orderNode = node.get("order");
        if (!orderNode.isIntegralNumber()) {
            throw wrongType(path + ".order", "an integer", orderNode);
        }
        String where = "state " + ModelValidator.quote(name) + ": ";
        // a model file is untrusted: the declared order bounds the table size, so check it before anything else
        if (!orderNode.canConvertToInt() || orderNode.intValue() < 0
                || orderNode.intValue() > ModelValidator.MAX_ORDER) {
            throw fail(where + "order " + orderNode + " is outside 0.." + ModelValidator.MAX_ORDER);
        }
        int order = orderNode.intValue();
        JsonNode emissions = node.get("emissions");
        requireObject(emissions, path + ".emissions");
        int rows = EmissionContexts.count(order);
        BitSet present = new BitSet(rows);
        for (Iterator<String> it = emissions.fieldNames(); it.hasNext(); ) {
            String key = it.next();
            int row = EmissionContexts.row(key);
            if (key.length() != order || row < 0) {
                throw fail(where + "emissions key " + ModelValidator.quote(key) + " is not a context of " + order
                        + (order == 1 ? " base" : " bases") + " over A, C, G, T (order " + order + ")");
            }
            present.set(row);
        }
        if (present.cardinality() != rows) {
            int missing = present.nextClearBit(0);
            throw fail(where + "emissions has " + present.cardinality() + " contexts, order " + order + " needs 4^"
                    + order + " = " + rows + " (missing " + ModelValidator.quote(EmissionContexts.name(missing, order))
                    + ")");
        }
        double[] table = new double[rows * 4];
        for (Map.Entry<String, JsonNode> e : emissions.properties()) {
            String rowPath = path + ".emissions[" + ModelValidator.quote(e.getKey()) + "]";
            JsonNode values = e.getValue();
            if (!values.isArray()) {
                throw wrongType(rowPath, "an array of 4 probabilities", values);
            }
            if (values.size() != 4) {
                throw fail(where + "emissions[" + ModelValidator.quote(e.getKey()) + "] has " + values.size()
                        + " values, expected 4 (P of A, C, G, T)");
            }
            int row = EmissionContexts.row(e.getKey());
            for (int b = 0; b < 4; b++) {
                table[row * 4 + b] = number(values.get(b), rowPath + "[" + b + "]");
            }
        }
        return new State(name, label, order, table, codonPosition(node, path, where));
    }

    private int minLength(JsonNode node, String path) {
        JsonNode n = node.get("min_length");
        if (n == null) {
            return 0;
        }
        if (!n.isIntegralNumber()) {
            throw wrongType(path + ".min_length", "an integer", n);
        }
        if (!n.canConvertToInt() || n.intValue() < 0) {
            throw fail("label " + ModelValidator.quote(text(node, "name", path)) + ": min_length " + n
                    + " is not a length in bases (0 or more)");
        }
        return n.intValue();
    }

    private int codonPosition(JsonNode node, String path, String where) {
        JsonNode n = node.get("codon_position");
        if (n == null) {
            return 0;
        }
        if (!n.isIntegralNumber()) {
            throw wrongType(path + ".codon_position", "an integer", n);
        }
        if (!n.canConvertToInt() || n.intValue() < 1 || n.intValue() > 3) {
            throw fail(where + "codon_position " + n + " is not 1, 2 or 3");
        }
        return n.intValue();
    }

    private double[] start(JsonNode node, List<State> states) {
        requireObject(node, "start");
        double[] start = new double[states.size()];
        for (Map.Entry<String, JsonNode> e : node.properties()) {
            int s = indexOf(states, e.getKey());
            if (s < 0) {
                throw fail("start: unknown state " + ModelValidator.quote(e.getKey()));
            }
            start[s] = number(e.getValue(), "start[" + ModelValidator.quote(e.getKey()) + "]");
        }
        return start;
    }

    private Transition transition(JsonNode node, String path) {
        requireObject(node, path);
        requireFields(node, path, TRANSITION, TRANSITION);
        return new Transition(text(node, "from", path), text(node, "to", path), number(node.get("p"), path + ".p"));
    }

    private static int indexOf(List<State> states, String name) {
        for (int i = 0; i < states.size(); i++) {
            if (states.get(i).name().equals(name)) {
                return i;
            }
        }
        return -1;
    }

    // ---- shape helpers: every error names the JSON path ----

    private void requireObject(JsonNode node, String path) {
        if (!node.isObject()) {
            throw wrongType(path, "an object", node);
        }
    }

    /** Unknown fields first: a misspelt field then reads as a typo, not as the missing field it was meant to be. */
    private void requireFields(JsonNode node, String path, List<String> allowed, List<String> required) {
        for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
            String f = it.next();
            if (!allowed.contains(f)) {
                throw fail(at(path) + "unknown field " + ModelValidator.quote(f));
            }
        }
        for (String f : required) {
            if (!node.has(f)) {
                throw fail(at(path) + "missing field " + ModelValidator.quote(f));
            }
        }
    }

    private String text(JsonNode parent, String field, String path) {
        JsonNode n = parent.get(field);
        if (!n.isTextual()) {
            throw wrongType(join(path, field), "a string", n);
        }
        return n.textValue();
    }

    private String optionalText(JsonNode parent, String field, String path) {
        return parent.has(field) ? text(parent, field, path) : null;
    }

    private boolean flag(JsonNode parent, String field, String path) {
        JsonNode n = parent.get(field);
        if (n == null) {
            return false;
        }
        if (!n.isBoolean()) {
            throw wrongType(join(path, field), "true or false", n);
        }
        return n.booleanValue();
    }

    private JsonNode array(JsonNode parent, String field, String path) {
        JsonNode n = parent.get(field);
        if (!n.isArray()) {
            throw wrongType(join(path, field), "an array", n);
        }
        return n;
    }

    private double number(JsonNode n, String path) {
        if (!n.isNumber()) {
            throw wrongType(path, "a number", n);
        }
        return n.doubleValue();
    }

    private long integer(JsonNode n, String path) {
        if (!n.isIntegralNumber() || !n.canConvertToLong()) {
            throw wrongType(path, "an integer", n);
        }
        return n.longValue();
    }

    private BadInputException wrongType(String path, String expected, JsonNode found) {
        return fail(at(path) + "expected " + expected + ", found " + kind(found));
    }

    private BadInputException fail(String what) {
        return new BadInputException(file + ": " + what);
    }

    private static String at(String path) {
        return path.isEmpty() ? "top level: " : path + ": ";
    }

    private static String join(String path, String field) {
        return path.isEmpty() ? field : path + "." + field;
    }

    private static String kind(JsonNode n) {
        return switch (n.getNodeType()) {
            case STRING -> "a string";
            case NUMBER -> "a number";
            case BOOLEAN -> n.booleanValue() ? "true" : "false";
            case NULL -> "null";
            case ARRAY -> "an array";
            case OBJECT -> "an object";
            default -> n.getNodeType().toString().toLowerCase(java.util.Locale.ROOT);
        };
    }
}
