package dev.annotator.model;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.annotator.error.BadInputException;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

class ModelJsonTest {

    /** An invented model using every optional part of the format: orders 0 and 2, a zero start, notes. */
    private static HmmModel everything() {
        double[] order2 = new double[64];
        for (int row = 0; row < 16; row++) {
            // awkward binary fractions on purpose: they must survive writing and reading bit for bit
            double a = 0.1 + row * 0.01;
            double c = 0.2 / 3;
            double g = 0.30000000000000004;
            order2[row * 4] = a;
            order2[row * 4 + 1] = c;
            order2[row * 4 + 2] = g;
            order2[row * 4 + 3] = 1 - a - c - g;
        }
        return new HmmModel("every-part", "uses every field", new Provenance("invented", List.of("a \"quoted\" note", "ünïcode")),
                List.of(new Label("exon", "exon", "SO:0000147", false, false),
                        new Label("island", "CpG_island", null, false, true),
                        new Label("rest", null, null, true, false)),
                List.of(new State("e", "exon", 2, order2),
                        new State("i", "island", 0, new double[] {0.1, 0.4, 0.4, 0.1}),
                        new State("r", "rest", 0, new double[] {0.25, 0.25, 0.25, 0.25})),
                new double[] {0, 1e-7, 1 - 1e-7},
                List.of(new Transition("e", "e", 0.9), new Transition("e", "r", 0.1),
                        new Transition("i", "i", 0.999), new Transition("i", "r", 0.001),
                        new Transition("r", "r", 0.99), new Transition("r", "e", 0.005), new Transition("r", "i", 0.005)));
    }

    private static HmmModel reread(String json) {
        return ModelJson.read(new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "round-trip.json");
    }

    @Test
    void modelSurvivesWriteAndRead() {
        HmmModel m = everything();
        ModelValidator.validate(m, "in-memory");
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ModelJson.write(m, out);
        HmmModel back = reread(out.toString(StandardCharsets.UTF_8));

        assertThat(back.name()).isEqualTo(m.name());
        assertThat(back.description()).isEqualTo(m.description());
        assertThat(back.provenance()).isEqualTo(m.provenance());
        assertThat(back.labels()).isEqualTo(m.labels());
        assertThat(back.states()).isEqualTo(m.states()); // State.equals compares the tables exactly
        assertThat(back.start()).isEqualTo(m.start());
        assertThat(back.transitions()).isEqualTo(m.transitions());
        assertThat(ModelJson.toJson(back)).isEqualTo(out.toString(StandardCharsets.UTF_8));
    }

    @Test
    void shippedFileIsInWrittenForm() {
        // the shipped file is kept byte-identical to what the writer produces, so a diff shows real changes
        String text = ModelFiles.shippedText("cpg-island");
        assertThat(ModelJson.toJson(reread(text))).isEqualTo(text);
    }

    @Test
    void outputDoesNotDependOnKeyOrderInTheInput() {
        ObjectNode a = ModelFiles.valid();
        ObjectNode b = ModelFiles.valid();
        ObjectNode emissions = (ObjectNode) ModelFiles.state(b, 0).get("emissions");
        ObjectNode reversed = emissions.objectNode();
        for (String key : List.of("T", "G", "C", "A")) {
            reversed.set(key, emissions.get(key));
        }
        ModelFiles.state(b, 0).set("emissions", reversed);
        ObjectNode start = (ObjectNode) b.get("start");
        b.set("start", start.objectNode().put("cold", 0.75).put("hot", 0.25));
        assertThat(ModelJson.toJson(ModelFiles.read(b))).isEqualTo(ModelJson.toJson(ModelFiles.read(a)));
    }

    @Test
    void emissionRowsAreOrderedOldestBaseFirst() {
        HmmModel m = everything();
        String json = ModelJson.toJson(m);
        ObjectNode tree = ModelFiles.parse(json);
        ObjectNode emissions = (ObjectNode) ModelFiles.state(tree, 0).get("emissions");
        // the 16 keys of an order-2 table in row order, oldest (left) base most significant
        assertThat(emissions.fieldNames()).toIterable().containsExactly(
                "AA", "AC", "AG", "AT", "CA", "CC", "CG", "CT", "GA", "GC", "GG", "GT", "TA", "TC", "TG", "TT");
        // distinct rows: "AC" (A then C) is row 1 and "CA" row 4, not the other way round
        emissions.putArray("AC").add(0.7).add(0.1).add(0.1).add(0.1);
        emissions.putArray("CA").add(0.1).add(0.1).add(0.1).add(0.7);
        State e = ModelFiles.read(tree).states().get(0);
        assertThat(e.emission(1, 0)).isEqualTo(0.7);
        assertThat(e.emission(4, 3)).isEqualTo(0.7);
        assertThat(EmissionContexts.row("AC")).isEqualTo(1);
        assertThat(EmissionContexts.name(4, 2)).isEqualTo("CA");
    }

    @Test
    void orderZeroUsesTheEmptyContext() {
        String json = ModelJson.toJson(everything());
        assertThat(json).contains("\"emissions\": {\n        \"\": [0.1, 0.4, 0.4, 0.1]\n      }");
    }

    @Test
    void statesLeftOutOfStartStartWithZero() {
        HmmModel m = everything();
        assertThat(ModelFiles.parse(ModelJson.toJson(m)).get("start").has("e")).isFalse();
        assertThat(reread(ModelJson.toJson(m)).start()[0]).isZero();
    }

    @Test
    void optionalLabelFieldsDefault() {
        ObjectNode t = ModelFiles.valid();
        HmmModel m = ModelFiles.read(t);
        assertThat(m.labels().get(0)).isEqualTo(new Label("rich", "region", "SO:0000001", false, false));
        assertThat(m.labels().get(1)).isEqualTo(new Label("plain", null, null, true, false));
    }

    @Test
    void notesAreOptional() {
        ObjectNode t = ModelFiles.valid();
        ((ObjectNode) t.get("provenance")).remove("notes");
        assertThat(ModelFiles.read(t).provenance().notes()).isEmpty();
    }

    @Test
    void writingIsPrettyAndEndsWithNewline() {
        String json = ModelJson.toJson(everything());
        assertThat(json).startsWith("{\n  \"format\": \"annotator-hmm/1\",\n  \"name\": \"every-part\",").endsWith("}\n");
        assertThat(json).contains("    {\"from\": \"r\", \"to\": \"i\", \"p\": 0.005}\n");
    }

    @Test
    void aStreamLongerThanTheSizeLimitIsStoppedWhileBeingRead() {
        // whitespace is valid JSON padding, so only the size limit can stop this stream; it is made as it is read
        long total = ModelJson.MAX_FILE_BYTES + (1 << 20);
        long[] served = {0};
        InputStream padding = new InputStream() {
            @Override
            public int read() {
                return served[0]++ < total ? ' ' : -1;
            }

            @Override
            public int read(byte[] b, int off, int len) {
                int n = (int) Math.min(len, total - served[0]);
                if (n <= 0) {
                    return -1;
                }
                java.util.Arrays.fill(b, off, off + n, (byte) ' ');
                served[0] += n;
                return n;
            }
        };
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> ModelJson.read(padding, "pipe"));
        assertThat(e).hasMessage("pipe: larger than 64 MiB, the most a model file may be");
        assertThat(served[0]).isLessThan(total);
    }

    @Test
    void parserMessagesLoseTheParserSettingsTheyName() {
        // messages as Jackson 2.21 words them; the user cannot act on the names of its settings
        assertThat(ModelJson.withoutParserSettings("Non-standard token 'NaN': enable "
                + "`JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS` to allow")).isEqualTo("Non-standard token 'NaN'");
        assertThat(ModelJson.withoutParserSettings("Trailing token (of type START_OBJECT) found after value (bound as "
                + "`com.fasterxml.jackson.databind.JsonNode`): not allowed as per "
                + "`DeserializationFeature.FAIL_ON_TRAILING_TOKENS`"))
                .isEqualTo("Trailing token (of type START_OBJECT) found after value");
        assertThat(ModelJson.withoutParserSettings("Document nesting depth (1001) exceeds the maximum allowed (1000, "
                + "from `StreamReadConstraints.getMaxNestingDepth()`)"))
                .isEqualTo("Document nesting depth (1001) exceeds the maximum allowed (1000)");
    }
}
