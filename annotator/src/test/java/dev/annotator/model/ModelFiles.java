package dev.annotator.model;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/** Small invented models for tests, as JSON trees to bend one field at a time. */
final class ModelFiles {
    static final String NAME = "test.json";
    static final Path SHIPPED_DIR = Path.of("..", "models");

    private static final ObjectMapper JSON = new ObjectMapper();

    private ModelFiles() {
    }

    /**
     * A valid two-label model: state "hot" (label "rich", order 1), state "cold" (label "plain", order 0,
     * the background).
     */
    static ObjectNode valid() {
        return parse("""
                {
                  "format": "annotator-hmm/1",
                  "name": "toy",
                  "description": "an invented two-state model",
                  "provenance": {"source": "invented for tests", "notes": ["numbers picked by hand"]},
                  "labels": [
                    {"name": "rich", "feature_type": "region", "so_accession": "SO:0000001"},
                    {"name": "plain", "background": true}
                  ],
                  "states": [
                    {"name": "hot", "label": "rich", "order": 1, "emissions": {
                      "A": [0.1, 0.4, 0.4, 0.1], "C": [0.1, 0.3, 0.5, 0.1],
                      "G": [0.2, 0.3, 0.3, 0.2], "T": [0.1, 0.4, 0.4, 0.1]}},
                    {"name": "cold", "label": "plain", "order": 0, "emissions": {"": [0.3, 0.2, 0.2, 0.3]}}
                  ],
                  "start": {"hot": 0.25, "cold": 0.75},
                  "transitions": [
                    {"from": "hot", "to": "hot", "p": 0.9},
                    {"from": "hot", "to": "cold", "p": 0.1},
                    {"from": "cold", "to": "cold", "p": 0.8},
                    {"from": "cold", "to": "hot", "p": 0.2}
                  ]
                }
                """);
    }

    static ObjectNode parse(String json) {
        try {
            return (ObjectNode) JSON.readTree(json);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static HmmModel read(ObjectNode tree) {
        return read(tree.toString());
    }

    static HmmModel read(String text) {
        return ModelJson.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), NAME);
    }

    static ObjectNode state(ObjectNode tree, int i) {
        return (ObjectNode) tree.get("states").get(i);
    }

    static ObjectNode label(ObjectNode tree, int i) {
        return (ObjectNode) tree.get("labels").get(i);
    }

    static ObjectNode transition(ObjectNode tree, int i) {
        return (ObjectNode) tree.get("transitions").get(i);
    }

    static String shippedText(String name) {
        try {
            return Files.readString(SHIPPED_DIR.resolve(name + ".json"));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static HmmModel shipped(String name) {
        try (InputStream in = Files.newInputStream(SHIPPED_DIR.resolve(name + ".json"))) {
            return ModelJson.read(in, name + ".json");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
