package dev.annotator.model;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.io.IOException;
import java.io.InputStream;

/**
 * Reads one JSON document into Jackson's tree ({@link JsonNode}) straight from Jackson's streaming parser, with the
 * node types databind's {@code readTree} gives (int, long or big integer nodes by size, double nodes for
 * fractions), duplicate keys refused by the parser and anything after the document refused here.
 *
 * <p>Why not {@code ObjectMapper.readTree}: setting up an {@code ObjectMapper} loads and initialises most of
 * databind, which took 100-150 ms of every run's start-up (measured cold: the shipped models read in 34-49 ms this
 * way against 139-156 ms through a mapper), and a model file needs none of its data binding. Nesting depth is
 * bounded by the parser's own limit (1000 by default), which bounds the recursion below.
 */
final class JsonTree {
    // a JsonFactory is thread-safe once built, so one can be shared
    private static final JsonFactory FACTORY = JsonFactory.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build();
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    private JsonTree() {
    }

    /**
     * The document's root, or null for an input with no JSON value at all.
     *
     * @throws JsonParseException not JSON, a repeated key, or content after the document
     * @throws IOException        reading failed
     */
    static JsonNode read(InputStream in) throws IOException {
        try (JsonParser parser = FACTORY.createParser(in)) {
            JsonToken first = parser.nextToken();
            if (first == null) {
                return null;
            }
            JsonNode root = value(parser, first);
            JsonToken after = parser.nextToken();
            if (after != null) {
                // databind's wording, so messages stay as they were
                throw new JsonParseException(parser, "Trailing token (of type " + after + ") found after value",
                        parser.currentTokenLocation());
            }
            return root;
        }
    }

    private static JsonNode value(JsonParser parser, JsonToken token) throws IOException {
        switch (token) {
            case START_OBJECT -> {
                ObjectNode object = NODES.objectNode();
                for (JsonToken t = parser.nextToken(); t == JsonToken.FIELD_NAME; t = parser.nextToken()) {
                    String name = parser.currentName();
                    object.set(name, value(parser, parser.nextToken()));
                }
                return object;
            }
            case START_ARRAY -> {
                ArrayNode array = NODES.arrayNode();
                for (JsonToken t = parser.nextToken(); t != JsonToken.END_ARRAY; t = parser.nextToken()) {
                    array.add(value(parser, t));
                }
                return array;
            }
            case VALUE_STRING -> {
                return NODES.textNode(parser.getText());
            }
            case VALUE_NUMBER_INT -> {
                return switch (parser.getNumberType()) {
                    case INT -> NODES.numberNode(parser.getIntValue());
                    case LONG -> NODES.numberNode(parser.getLongValue());
                    default -> NODES.numberNode(parser.getBigIntegerValue());
                };
            }
            case VALUE_NUMBER_FLOAT -> {
                return NODES.numberNode(parser.getDoubleValue());
            }
            case VALUE_TRUE -> {
                return NODES.booleanNode(true);
            }
            case VALUE_FALSE -> {
                return NODES.booleanNode(false);
            }
            case VALUE_NULL -> {
                return NODES.nullNode();
            }
            default -> throw new JsonParseException(parser, "Unexpected token " + token, parser.currentTokenLocation());
        }
    }
}
