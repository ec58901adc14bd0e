package dev.annotator.model;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;

/** Builds the JSON tree of a model, fields in the documented order, optional fields only when they say something. */
final class ModelTreeWriter {
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    private ModelTreeWriter() {
    }

    static JsonNode tree(HmmModel model) {
        ObjectNode root = NODES.objectNode();
        root.put("format", ModelJson.FORMAT);
        root.put("name", model.name());
        root.put("description", model.description());
        ObjectNode provenance = root.putObject("provenance");
        provenance.put("source", model.provenance().source());
        ArrayNode notes = provenance.putArray("notes");
        model.provenance().notes().forEach(notes::add);
        Training training = model.provenance().training();
        if (training != null) {
            ObjectNode t = provenance.putObject("training");
            t.put("tool", training.tool());
            t.put("command", training.command());
            t.put("date", training.date());
            t.put("method", training.method());
            fingerprints(t.putArray("inputs"), training.inputs());
            if (!training.labels().isEmpty()) {
                fingerprints(t.putArray("labels"), training.labels());
            }
            t.put("bases", training.bases());
            t.put("iterations", training.iterations());
            if (training.converged() != null) {
                t.put("converged", training.converged());
            }
            if (training.logLikelihood() != null) {
                t.put("log_likelihood", training.logLikelihood());
            }
            if (training.startLogLikelihood() != null) {
                t.put("start_log_likelihood", training.startLogLikelihood());
            }
        }

        ArrayNode labels = root.putArray("labels");
        for (Label l : model.labels()) {
            ObjectNode n = labels.addObject();
            n.put("name", l.name());
            if (l.featureType() != null) {
                n.put("feature_type", l.featureType());
            }
            if (l.soAccession() != null) {
                n.put("so_accession", l.soAccession());
            }
            if (l.background()) {
                n.put("background", true);
            }
            if (l.composition()) {
                n.put("composition", true);
            }
            if (l.stranded()) {
                n.put("strand", String.valueOf(l.strand()));
            }
            if (l.minLength() > 0) {
                n.put("min_length", l.minLength());
            }
        }

        ArrayNode states = root.putArray("states");
        for (State s : model.states()) {
            ObjectNode n = states.addObject();
            n.put("name", s.name());
            n.put("label", s.label());
            n.put("order", s.order());
            if (s.codonPosition() != 0) {
                n.put("codon_position", s.codonPosition());
            }
            ObjectNode emissions = n.putObject("emissions");
            int rows = EmissionContexts.count(s.order());
            for (int r = 0; r < rows; r++) {
                ArrayNode row = emissions.putArray(EmissionContexts.name(r, s.order()));
                for (int b = 0; b < 4; b++) {
                    row.add(s.emission(r, b));
                }
            }
        }

        // states left out of "start" start with probability 0
        ObjectNode start = root.putObject("start");
        double[] p = model.start();
        for (int s = 0; s < p.length; s++) {
            if (p[s] != 0) {
                start.put(model.states().get(s).name(), p[s]);
            }
        }

        ArrayNode transitions = root.putArray("transitions");
        for (Transition t : model.transitions()) {
            ObjectNode n = transitions.addObject();
            n.put("from", t.from());
            n.put("to", t.to());
            n.put("p", t.probability());
        }
        return root;
    }

    private static void fingerprints(ArrayNode array, java.util.List<InputFingerprint> files) {
        for (InputFingerprint f : files) {
            ObjectNode n = array.addObject();
            n.put("name", f.name());
            n.put("bytes", f.bytes());
            n.put("sha256", f.sha256());
        }
    }
}
