package dev.annotator.train;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectReader;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.model.EmissionContexts;
import dev.annotator.model.HmmModel;
import dev.annotator.model.InputFingerprint;
import dev.annotator.model.State;
import dev.annotator.model.Transition;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Set;

/**
 * Reads and writes shard count files ({@value #FORMAT}): the expected counts of one E-step, keyed by the names of
 * the model's states and transitions, with the SHA-256 of the model they were computed with. Numbers are written
 * so they read back bit for bit. Reading is strict and checks the counts against the START model of the merge;
 * problems are one-line {@link BadInputException}s {@code FILE: what}.
 */
public final class CountsJson {
    public static final String FORMAT = "annotator-counts/1";

    private static final List<String> FIELDS = List.of("format", "model", "model_sha256", "method", "inputs",
            "labels", "records", "bases", "log_likelihood", "start", "transitions", "emissions");
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;
    private static final ObjectReader READER = new ObjectMapper(JsonFactory.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build())
            .reader().with(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);
    private static final ObjectMapper WRITER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private CountsJson() {
    }

    /** Writes the shard as UTF-8 JSON ending in a newline; the stream is not closed. */
    public static void write(ShardCounts shard, HmmModel model, OutputStream out) {
        ObjectNode root = NODES.objectNode();
        root.put("format", FORMAT);
        root.put("model", shard.modelName());
        root.put("model_sha256", shard.modelSha256());
        root.put("method", shard.method().word());
        fingerprints(root.putArray("inputs"), shard.inputs());
        fingerprints(root.putArray("labels"), shard.labels());
        ModelCounts c = shard.counts();
        root.put("records", c.records());
        root.put("bases", c.bases());
        root.put("log_likelihood", c.logLikelihood());
        ObjectNode start = root.putObject("start");
        for (int s = 0; s < model.stateCount(); s++) {
            start.put(model.states().get(s).name(), c.start(s));
        }
        ArrayNode transitions = root.putArray("transitions");
        for (int i = 0; i < model.transitions().size(); i++) {
            Transition t = model.transitions().get(i);
            transitions.addObject().put("from", t.from()).put("to", t.to()).put("count", c.transition(i));
        }
        ObjectNode emissions = root.putObject("emissions");
        for (int s = 0; s < model.stateCount(); s++) {
            State st = model.states().get(s);
            ObjectNode rows = emissions.putObject(st.name());
            double[] e = c.emissions(s);
            for (int r = 0; r < e.length / 4; r++) {
                ArrayNode row = rows.putArray(EmissionContexts.name(r, st.order()));
                for (int b = 0; b < 4; b++) {
                    row.add(e[r * 4 + b]);
                }
            }
        }
        try {
            out.write(WRITER.writeValueAsBytes(root));
            out.write('\n');
            out.flush();
        } catch (IOException e) {
            throw new IoFailureException("writing counts failed: " + e.getMessage(), e);
        }
    }

    /**
     * Reads a shard file and checks it against the model the merge starts from.
     *
     * @throws BadInputException not a counts file, or counts of another model
     */
    public static ShardCounts read(InputStream in, String name, HmmModel model) {
        JsonNode root;
        try {
            root = READER.readTree(in);
        } catch (JsonProcessingException e) {
            String what = e.getOriginalMessage() == null ? "" : e.getOriginalMessage().replaceAll("\\s+", " ").trim();
            int line = e.getLocation() == null ? 0 : e.getLocation().getLineNr();
            throw new BadInputException(name + (line > 0 ? ":" + line : "") + ": not valid JSON: " + what, e);
        } catch (IOException e) {
            throw new IoFailureException(name + ": read failed: " + e.getMessage(), e);
        }
        return new Reader(name, model).read(root);
    }

    private static void fingerprints(ArrayNode array, List<InputFingerprint> files) {
        for (InputFingerprint f : files) {
            array.addObject().put("name", f.name()).put("bytes", f.bytes()).put("sha256", f.sha256());
        }
    }

    private static final class Reader {
        private final String file;
        private final HmmModel model;

        Reader(String file, HmmModel model) {
            this.file = file;
            this.model = model;
        }

        ShardCounts read(JsonNode root) {
            if (root == null || !root.isObject()) {
                throw fail("not a counts file (expected a JSON object)");
            }
            JsonNode format = root.get("format");
            if (format == null || !format.isTextual() || !format.textValue().equals(FORMAT)) {
                throw fail("not a counts file (format " + (format == null ? "missing" : format.toString())
                        + ", expected \"" + FORMAT + "\")");
            }
            for (Iterator<String> it = root.fieldNames(); it.hasNext(); ) {
                String f = it.next();
                if (!FIELDS.contains(f)) {
                    throw fail("unknown field \"" + f + "\"");
                }
            }
            for (String f : FIELDS) {
                if (!root.has(f)) {
                    throw fail("missing field \"" + f + "\"");
                }
            }
            String sha = text(root, "model_sha256");
            String expected = ModelIdentity.sha256(model);
            if (!sha.equals(expected)) {
                throw fail("counts of model \"" + text(root, "model") + "\" with SHA-256 " + sha
                        + ", but the START model has " + expected + "; merge with the model the E-step ran with");
            }
            TrainingMethod method = TrainingMethod.of(text(root, "method"));
            if (method == null) {
                throw fail("method \"" + text(root, "method") + "\" is not counting or baum-welch");
            }
            int k = model.stateCount();
            double[] start = new double[k];
            JsonNode startNode = object(root, "start");
            requireNames(startNode, "start");
            for (int s = 0; s < k; s++) {
                start[s] = count(startNode, model.states().get(s).name(), "start");
            }
            JsonNode ts = root.get("transitions");
            if (!ts.isArray() || ts.size() != model.transitions().size()) {
                throw fail("transitions: expected " + model.transitions().size() + " entries, one per transition of "
                        + "the model");
            }
            double[] transitions = new double[ts.size()];
            for (int i = 0; i < ts.size(); i++) {
                Transition t = model.transitions().get(i);
                JsonNode n = ts.get(i);
                if (!n.isObject() || !t.from().equals(n.path("from").asText(null))
                        || !t.to().equals(n.path("to").asText(null))) {
                    throw fail("transitions[" + i + "]: expected " + t.from() + " -> " + t.to()
                            + ", in the model's order");
                }
                transitions[i] = count(n, "count", "transitions[" + i + "]");
            }
            JsonNode em = object(root, "emissions");
            requireNames(em, "emissions");
            double[][] emissions = new double[k][];
            for (int s = 0; s < k; s++) {
                State st = model.states().get(s);
                JsonNode rows = em.get(st.name());
                int n = EmissionContexts.count(st.order());
                if (!rows.isObject() || rows.size() != n) {
                    throw fail("emissions[\"" + st.name() + "\"]: expected " + n + " contexts of order " + st.order());
                }
                emissions[s] = new double[n * 4];
                for (int r = 0; r < n; r++) {
                    String ctx = EmissionContexts.name(r, st.order());
                    JsonNode row = rows.get(ctx);
                    String at = "emissions[\"" + st.name() + "\"][\"" + ctx + "\"]";
                    if (row == null || !row.isArray() || row.size() != 4) {
                        throw fail(at + ": expected 4 counts");
                    }
                    for (int b = 0; b < 4; b++) {
                        emissions[s][r * 4 + b] = nonNegative(row.get(b), at);
                    }
                }
            }
            ModelCounts counts = new ModelCounts(start, transitions, emissions, finite(root.get("log_likelihood"),
                    "log_likelihood"), integer(root, "bases"), integer(root, "records"));
            return new ShardCounts(text(root, "model"), sha, method, fingerprints(root, "inputs"),
                    fingerprints(root, "labels"), counts);
        }

        private void requireNames(JsonNode node, String where) {
            Set<String> names = new HashSet<>();
            model.states().forEach(s -> names.add(s.name()));
            for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
                String f = it.next();
                if (!names.contains(f)) {
                    throw fail(where + ": unknown state \"" + f + "\"");
                }
            }
        }

        private List<InputFingerprint> fingerprints(JsonNode root, String field) {
            JsonNode arr = root.get(field);
            if (!arr.isArray()) {
                throw fail(field + ": expected an array");
            }
            List<InputFingerprint> out = new ArrayList<>();
            for (JsonNode n : arr) {
                if (!n.isObject() || !n.path("name").isTextual() || !n.path("bytes").canConvertToLong()
                        || !n.path("sha256").isTextual()) {
                    throw fail(field + ": expected objects with name, bytes and sha256");
                }
                out.add(new InputFingerprint(n.get("name").textValue(), n.get("bytes").longValue(),
                        n.get("sha256").textValue()));
            }
            return out;
        }

        private JsonNode object(JsonNode root, String field) {
            JsonNode n = root.get(field);
            if (!n.isObject()) {
                throw fail(field + ": expected an object");
            }
            return n;
        }

        private String text(JsonNode root, String field) {
            JsonNode n = root.get(field);
            if (n == null || !n.isTextual()) {
                throw fail(field + ": expected a string");
            }
            return n.textValue();
        }

        private long integer(JsonNode root, String field) {
            JsonNode n = root.get(field);
            if (!n.isIntegralNumber() || !n.canConvertToLong() || n.longValue() < 0) {
                throw fail(field + ": expected a non-negative integer");
            }
            return n.longValue();
        }

        private double count(JsonNode parent, String field, String where) {
            JsonNode n = parent.get(field);
            if (n == null) {
                throw fail(where + ": missing \"" + field + "\"");
            }
            return nonNegative(n, where + "." + field);
        }

        private double nonNegative(JsonNode n, String where) {
            double v = finite(n, where);
            if (v < 0) {
                throw fail(where + ": negative count " + v);
            }
            return v;
        }

        private double finite(JsonNode n, String where) {
            if (n == null || !n.isNumber() || !Double.isFinite(n.doubleValue())) {
                throw fail(where + ": expected a finite number");
            }
            return n.doubleValue();
        }

        private BadInputException fail(String what) {
            return new BadInputException(file + ": " + what);
        }
    }
}
