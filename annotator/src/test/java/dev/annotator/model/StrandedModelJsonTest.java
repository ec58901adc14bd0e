package dev.annotator.model;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.annotator.error.BadInputException;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.function.Consumer;

import static dev.annotator.model.ModelFiles.label;
import static dev.annotator.model.ModelFiles.state;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

/** The {@code strand} of labels and {@code codon_position} of states in model files. */
class StrandedModelJsonTest {

    private static String written(HmmModel m) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ModelJson.write(m, out);
        return out.toString(StandardCharsets.UTF_8);
    }

    @Test
    void geneTopologySurvivesWriteAndRead() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 1, 3);
        String json = written(m);
        HmmModel back = ModelJson.read(new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "genes.json");
        assertThat(back.labels()).isEqualTo(m.labels());
        assertThat(back.states()).isEqualTo(m.states()); // State.equals compares codonPosition and tables exactly
        assertThat(back.start()).isEqualTo(m.start());
        assertThat(back.transitions()).isEqualTo(m.transitions());
        assertThat(back.provenance()).isEqualTo(m.provenance());
        assertThat(written(back)).isEqualTo(json);
        assertThat(back.states()).extracting(State::codonPosition).contains(1, 2, 3, 0);
    }

    @Test
    void strandAndCodonPositionAreWrittenOnlyWhereTheyMeanSomething() throws IOException {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 0, 0);
        // read with a plain JSON parser, not our reader
        JsonNode tree = new ObjectMapper().readTree(written(m));
        for (JsonNode l : tree.get("labels")) {
            String name = l.get("name").asText();
            if (name.equals(GeneTopology.NONCODING)) {
                assertThat(l.has("strand")).isFalse();
            } else {
                assertThat(l.get("strand").isTextual()).isTrue();
                assertThat(l.get("strand").asText()).isEqualTo(name.equals(GeneTopology.FORWARD_LABEL) ? "+" : "-");
            }
        }
        for (JsonNode s : tree.get("states")) {
            String name = s.get("name").asText();
            if (name.equals(GeneTopology.NONCODING)) {
                assertThat(s.has("codon_position")).isFalse();
            } else {
                assertThat(s.get("codon_position").isInt()).isTrue();
                assertThat(s.get("codon_position").asInt()).isEqualTo(name.charAt(name.length() - 1) - '0');
            }
        }
    }

    @Test
    void aStrandedStateInTheSmallModelReadsBack() {
        ObjectNode tree = ModelFiles.valid();
        label(tree, 0).put("strand", "-");
        state(tree, 0).put("codon_position", 2);
        HmmModel m = ModelFiles.read(tree);
        assertThat(m.labels().get(0).strand()).isEqualTo('-');
        assertThat(m.labels().get(1).strand()).isEqualTo('.');
        assertThat(m.states().get(0).codonPosition()).isEqualTo(2);
        assertThat(m.states().get(1).codonPosition()).isZero();
    }

    @Test
    void strandOnTheBackgroundLabel() {
        assertThat(rejected(t -> label(t, 1).put("strand", "+")))
                .isEqualTo("test.json: label \"plain\": the background label has no strand");
    }

    @Test
    void codonPositionOnAStateOfALabelWithoutStrand() {
        assertThat(rejected(t -> state(t, 0).put("codon_position", 1)))
                .isEqualTo("test.json: state \"hot\": codon_position needs a label with a strand (label \"rich\")");
    }

    @Test
    void codonPositionFour() {
        assertThat(rejected(t -> {
            label(t, 0).put("strand", "+");
            state(t, 0).put("codon_position", 4);
        })).isEqualTo("test.json: state \"hot\": codon_position 4 is not 1, 2 or 3");
    }

    @Test
    void codonPositionNotAnInteger() {
        assertThat(rejected(t -> {
            label(t, 0).put("strand", "+");
            state(t, 0).put("codon_position", "1");
        })).isEqualTo("test.json: states[0].codon_position: expected an integer, found a string");
    }

    @Test
    void strandThatIsNoStrand() {
        assertThat(rejected(t -> label(t, 0).put("strand", "x")))
                .isEqualTo("test.json: label \"rich\": strand \"x\" is not \"+\" or \"-\"");
        // '.' means no strand and is written by leaving the field out, so it is refused as a value too
        assertThat(rejected(t -> label(t, 0).put("strand", "."))).contains("strand \".\" is not");
    }

    private static String rejected(Consumer<ObjectNode> change) {
        ObjectNode tree = ModelFiles.valid();
        change.accept(tree);
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> ModelFiles.read(tree));
        assertThat(e).as("expected the model to be rejected").isNotNull();
        assertThat(e.getMessage()).startsWith(ModelFiles.NAME + ": ").doesNotContain("\n");
        assertThat(e.exitCode()).isEqualTo(65);
        return e.getMessage();
    }
}
