package dev.annotator.model;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectWriter;
import com.fasterxml.jackson.databind.node.TextNode;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Pretty-prints a JSON tree for people who edit model files: a container that holds only scalars and fits
 * on a line (an emission row, a transition, a label) stays on one line; anything else gets one entry per line.
 * Scalars are encoded by Jackson, so strings are escaped and doubles printed so they read back exactly.
 */
final class JsonLayout {
    private static final int LINE_WIDTH = 120;
    private static final String INDENT = "  ";
    private static final ObjectWriter SCALARS = new ObjectMapper().writer();

    private JsonLayout() {
    }

    static String print(JsonNode root) {
        StringBuilder out = new StringBuilder();
        write(root, "", out);
        return out.append('\n').toString();
    }

    private static void write(JsonNode node, String indent, StringBuilder out) {
        if (!node.isContainerNode()) {
            out.append(scalar(node));
            return;
        }
        boolean object = node.isObject();
        char open = object ? '{' : '[';
        char close = object ? '}' : ']';
        if (node.isEmpty()) {
            out.append(open).append(close);
            return;
        }
        List<String> keys = new ArrayList<>();
        List<JsonNode> values = new ArrayList<>();
        if (object) {
            for (Map.Entry<String, JsonNode> e : node.properties()) {
                keys.add(e.getKey());
                values.add(e.getValue());
            }
        } else {
            node.forEach(values::add);
        }
        String inline = inline(keys, values, object);
        if (inline != null && indent.length() + inline.length() <= LINE_WIDTH) {
            out.append(open).append(inline).append(close);
            return;
        }
        String inner = indent + INDENT;
        out.append(open).append('\n');
        for (int i = 0; i < values.size(); i++) {
            out.append(inner);
            if (object) {
                out.append(key(keys.get(i))).append(": ");
            }
            write(values.get(i), inner, out);
            out.append(i + 1 < values.size() ? ",\n" : "\n");
        }
        out.append(indent).append(close);
    }

    /** The entries on one line, or null when an entry is itself a non-empty container. */
    private static String inline(List<String> keys, List<JsonNode> values, boolean object) {
        StringBuilder line = new StringBuilder();
        for (int i = 0; i < values.size(); i++) {
            JsonNode v = values.get(i);
            if (v.isContainerNode() && !v.isEmpty()) {
                return null;
            }
            if (i > 0) {
                line.append(", ");
            }
            if (object) {
                line.append(key(keys.get(i))).append(": ");
            }
            line.append(v.isContainerNode() ? (v.isObject() ? "{}" : "[]") : scalar(v));
        }
        return line.toString();
    }

    private static String key(String name) {
        return scalar(TextNode.valueOf(name));
    }

    private static String scalar(JsonNode node) {
        try {
            return SCALARS.writeValueAsString(node);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a JSON tree node could not be encoded", e);
        }
    }
}
