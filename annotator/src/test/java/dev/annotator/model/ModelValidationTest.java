package dev.annotator.model;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.annotator.error.BadInputException;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.function.Consumer;

import static dev.annotator.model.ModelFiles.label;
import static dev.annotator.model.ModelFiles.state;
import static dev.annotator.model.ModelFiles.transition;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatCode;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

/** One bad model file per check; each message must be one line naming the file and the thing concerned. */
class ModelValidationTest {

    private static String rejected(Consumer<ObjectNode> change) {
        ObjectNode tree = ModelFiles.valid();
        change.accept(tree);
        return rejected(tree.toString());
    }

    private static String rejected(String text) {
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> ModelFiles.read(text));
        assertThat(e).as("expected the model to be rejected").isNotNull();
        assertThat(e.getMessage()).startsWith(ModelFiles.NAME + ":").doesNotContain("\n");
        assertThat(e.exitCode()).isEqualTo(65);
        return e.getMessage();
    }

    private static String rejected(HmmModel model) {
        BadInputException e = catchThrowableOfType(BadInputException.class,
                () -> ModelValidator.validate(model, ModelFiles.NAME));
        assertThat(e).as("expected the model to be rejected").isNotNull();
        assertThat(e.getMessage()).startsWith(ModelFiles.NAME + ": ").doesNotContain("\n");
        return e.getMessage();
    }

    @Test
    void theBaseModelIsValid() {
        assertThatCode(() -> ModelFiles.read(ModelFiles.valid())).doesNotThrowAnyException();
    }

    // ---- not JSON ----

    @Test
    void syntaxErrorNamesLineAndColumn() {
        String text = ModelFiles.valid().toPrettyString().replace("\"name\" : \"toy\",", "\"name\" : \"toy\"");
        int line = text.lines().toList().indexOf("  \"description\" : \"an invented two-state model\",") + 1;
        assertThat(rejected(text)).startsWith(ModelFiles.NAME + ":" + line + ": not valid JSON: ")
                .contains("(column ");
    }

    @Test
    void truncatedFileIsNotJson() {
        assertThat(rejected("{\n  \"format\": \"annotator-hmm/1\",\n")).contains(": not valid JSON: ");
    }

    @Test
    void trailingContentIsNotJson() {
        assertThat(rejected(ModelFiles.valid().toString() + "\n{}")).contains(":2: not valid JSON: ");
    }

    @Test
    void duplicateKeyIsNotJson() {
        String text = ModelFiles.valid().toString().replace("\"start\":{", "\"start\":{\"hot\":0.25,");
        assertThat(rejected(text)).contains("not valid JSON").contains("Duplicate").contains("hot");
    }

    @Test
    void emptyFile() {
        assertThat(rejected("  \n")).isEqualTo("test.json: empty file, expected a JSON object");
    }

    // ---- wrong shape ----

    @Test
    void topLevelMustBeAnObject() {
        assertThat(rejected("[1, 2]")).isEqualTo("test.json: top level: expected an object, found an array");
    }

    @Test
    void missingTopLevelField() {
        assertThat(rejected(t -> t.remove("transitions")))
                .isEqualTo("test.json: top level: missing field \"transitions\"");
    }

    @Test
    void missingNestedField() {
        assertThat(rejected(t -> state(t, 1).remove("order"))).isEqualTo("test.json: states[1]: missing field \"order\"");
    }

    @Test
    void wrongTypeNamesThePath() {
        assertThat(rejected(t -> transition(t, 2).put("p", "0.8")))
                .isEqualTo("test.json: transitions[2].p: expected a number, found a string");
    }

    @Test
    void orderMustBeAnInteger() {
        assertThat(rejected(t -> state(t, 0).put("order", 1.5)))
                .isEqualTo("test.json: states[0].order: expected an integer, found a number");
    }

    @Test
    void emissionValueMustBeANumber() {
        assertThat(rejected(t -> ((ArrayNode) state(t, 0).get("emissions").get("G")).set(2, "x")))
                .isEqualTo("test.json: states[0].emissions[\"G\"][2]: expected a number, found a string");
    }

    @Test
    void labelsMustBeAnArray() {
        assertThat(rejected(t -> t.putObject("labels"))).isEqualTo("test.json: labels: expected an array, found an object");
    }

    @Test
    void flagsMustBeBooleans() {
        assertThat(rejected(t -> label(t, 1).put("background", "yes")))
                .isEqualTo("test.json: labels[1].background: expected true or false, found a string");
    }

    @Test
    void unknownFieldIsReported() {
        assertThat(rejected(t -> state(t, 0).set("emission", state(t, 0).remove("emissions"))))
                .isEqualTo("test.json: states[0]: unknown field \"emission\"");
    }

    // ---- format tag ----

    @Test
    void unknownFormatTag() {
        assertThat(rejected(t -> t.put("format", "annotator-hmm/2")))
                .isEqualTo("test.json: unknown format \"annotator-hmm/2\" (this version reads \"annotator-hmm/1\")");
    }

    @Test
    void missingFormatTag() {
        assertThat(rejected(t -> t.remove("format"))).contains("missing field \"format\"");
    }

    // ---- names ----

    @Test
    void duplicateStateNames() {
        assertThat(rejected(t -> state(t, 1).put("name", "hot"))).isEqualTo("test.json: duplicate state name \"hot\"");
    }

    @Test
    void duplicateLabelNames() {
        assertThat(rejected(t -> label(t, 1).put("name", "rich"))).isEqualTo("test.json: duplicate label name \"rich\"");
    }

    @Test
    void noBackgroundLabel() {
        assertThat(rejected(t -> label(t, 1).put("background", false).put("feature_type", "region")))
                .contains("no background label");
    }

    @Test
    void twoBackgroundLabels() {
        assertThat(rejected(t -> label(t, 0).put("background", true)))
                .contains("2 background labels (\"rich\", \"plain\")");
    }

    @Test
    void reportedLabelNeedsFeatureType() {
        assertThat(rejected(t -> label(t, 0).remove("feature_type"))).startsWith("test.json: label \"rich\": no feature_type");
    }

    @Test
    void featureTypeIsOneWord() {
        assertThat(rejected(t -> label(t, 0).put("feature_type", "CpG island")))
                .startsWith("test.json: label \"rich\": feature_type \"CpG island\" is not one word");
    }

    @Test
    void soAccessionFormat() {
        assertThat(rejected(t -> label(t, 0).put("so_accession", "SO:307")))
                .contains("label \"rich\": so_accession \"SO:307\" is not of the form SO:0000000");
    }

    @Test
    void stateWithUnknownLabel() {
        assertThat(rejected(t -> state(t, 0).put("label", "island")))
                .isEqualTo("test.json: state \"hot\": unknown label \"island\"");
    }

    @Test
    void labelWithoutStates() {
        assertThat(rejected(t -> ((ArrayNode) t.get("labels")).addObject().put("name", "spare").put("feature_type", "x")))
                .isEqualTo("test.json: label \"spare\" is used by no state");
    }

    @Test
    void nameWithControlCharacter() {
        assertThat(rejected(t -> label(t, 0).put("name", "ri\nch"))).contains("contains a control character");
    }

    @Test
    void unknownStateInStart() {
        assertThat(rejected(t -> ((ObjectNode) t.get("start")).put("warm", 0.0)))
                .isEqualTo("test.json: start: unknown state \"warm\"");
    }

    @Test
    void unknownStateInTransition() {
        assertThat(rejected(t -> transition(t, 1).put("to", "warm")))
                .isEqualTo("test.json: transition \"hot\" -> \"warm\": unknown state \"warm\"");
    }

    @Test
    void duplicateTransition() {
        assertThat(rejected(t -> {
            transition(t, 0).put("p", 0.45);
            ((ArrayNode) t.get("transitions")).addObject().put("from", "hot").put("to", "hot").put("p", 0.45);
        })).isEqualTo("test.json: duplicate transition \"hot\" -> \"hot\"");
    }

    // ---- probabilities ----

    @Test
    void negativeProbability() {
        assertThat(rejected(t -> transition(t, 0).put("p", -0.1)))
                .isEqualTo("test.json: transition \"hot\" -> \"hot\": probability is negative (-0.1)");
    }

    @Test
    void probabilityAboveOne() {
        assertThat(rejected(t -> ((ArrayNode) state(t, 1).get("emissions").get("")).set(0, 1.5)))
                .isEqualTo("test.json: state \"cold\": emissions[\"\"]: P(A) is above 1 (1.5)");
    }

    @Test
    void nanProbability() {
        HmmModel m = ModelFiles.read(ModelFiles.valid());
        List<Transition> ts = new java.util.ArrayList<>(m.transitions());
        ts.set(3, new Transition("cold", "hot", Double.NaN));
        assertThat(rejected(copy(m, m.states(), m.start(), ts)))
                .isEqualTo("test.json: transition \"cold\" -> \"hot\": probability is not a number (NaN)");
    }

    @Test
    void infiniteProbability() {
        HmmModel m = ModelFiles.read(ModelFiles.valid());
        assertThat(rejected(copy(m, m.states(), new double[] {Double.POSITIVE_INFINITY, 0}, m.transitions())))
                .isEqualTo("test.json: start probability of state \"hot\" is infinite");
    }

    @Test
    void emissionRowMustSumToOne() {
        assertThat(rejected(t -> ((ArrayNode) state(t, 0).get("emissions").get("C")).set(3, 0.1001)))
                .isEqualTo("test.json: state \"hot\": emissions[\"C\"] values sum to 1.0001, expected 1 (within 1.0E-6)");
    }

    @Test
    void rowWithinToleranceIsAccepted() {
        ObjectNode t = ModelFiles.valid();
        ((ArrayNode) state(t, 0).get("emissions").get("C")).set(3, 0.1000005);
        assertThatCode(() -> ModelFiles.read(t)).doesNotThrowAnyException();
    }

    @Test
    void outgoingTransitionsMustSumToOne() {
        assertThat(rejected(t -> transition(t, 1).put("p", 0.05)))
                .isEqualTo("test.json: state \"hot\": outgoing transitions sum to 0.95, expected 1 (within 1.0E-6)");
    }

    @Test
    void startMustSumToOne() {
        assertThat(rejected(t -> ((ObjectNode) t.get("start")).put("cold", 0.5)))
                .isEqualTo("test.json: start probabilities sum to 0.75, expected 1 (within 1.0E-6)");
    }

    // ---- emission tables ----

    @Test
    void missingContext() {
        assertThat(rejected(t -> ((ObjectNode) state(t, 0).get("emissions")).remove("G")))
                .isEqualTo("test.json: state \"hot\": emissions has 3 contexts, order 1 needs 4^1 = 4 (missing \"G\")");
    }

    @Test
    void contextOfWrongLength() {
        assertThat(rejected(t -> ((ObjectNode) state(t, 0).get("emissions")).set("AA", state(t, 0).get("emissions").get("A"))))
                .isEqualTo("test.json: state \"hot\": emissions key \"AA\" is not a context of 1 base over A, C, G, T (order 1)");
    }

    @Test
    void contextOutsideAlphabet() {
        assertThat(rejected(t -> ((ObjectNode) state(t, 0).get("emissions")).set("N",
                ((ObjectNode) state(t, 0).get("emissions")).remove("T"))))
                .contains("state \"hot\": emissions key \"N\" is not a context");
    }

    @Test
    void lowerCaseContextIsRejected() {
        assertThat(rejected(t -> ((ObjectNode) state(t, 0).get("emissions")).set("t",
                ((ObjectNode) state(t, 0).get("emissions")).remove("T"))))
                .contains("emissions key \"t\" is not a context");
    }

    @Test
    void rowOfThreeValues() {
        assertThat(rejected(t -> ((ArrayNode) state(t, 0).get("emissions").get("T")).remove(3)))
                .isEqualTo("test.json: state \"hot\": emissions[\"T\"] has 3 values, expected 4 (P of A, C, G, T)");
    }

    @Test
    void orderAboveLimitIsCheckedBeforeTheTable() {
        // the table is empty: the message must be about the order, proving no table of 4^9 rows was expected
        assertThat(rejected(t -> state(t, 0).put("order", 9).putObject("emissions")))
                .isEqualTo("test.json: state \"hot\": order 9 is outside 0..8");
    }

    @Test
    void hugeOrderIsRejectedWithoutOverflow() {
        String text = ModelFiles.valid().toString().replace("\"order\":1", "\"order\":123456789012345678901234567890");
        assertThat(rejected(text)).isEqualTo("test.json: state \"hot\": order 123456789012345678901234567890 is outside 0..8");
    }

    @Test
    void negativeOrder() {
        assertThat(rejected(t -> state(t, 1).put("order", -1))).isEqualTo("test.json: state \"cold\": order -1 is outside 0..8");
    }

    @Test
    void tableSizeMustMatchOrderInModelsBuiltInCode() {
        HmmModel m = ModelFiles.read(ModelFiles.valid());
        State hot = m.states().get(0);
        State wrong = new State(hot.name(), hot.label(), 2, hot.emissions());
        assertThat(rejected(copy(m, List.of(wrong, m.states().get(1)), m.start(), m.transitions())))
                .isEqualTo("test.json: state \"hot\": emission table has 16 values, order 2 needs 16 rows of 4 = 64");
    }

    // ---- graph ----

    @Test
    void unreachableState() {
        assertThat(rejected(t -> {
            ((ObjectNode) t.get("start")).put("hot", 1.0).remove("cold");
            transition(t, 1).put("p", 0.0);
            transition(t, 0).put("p", 1.0);
        })).isEqualTo("test.json: state \"cold\": unreachable from the start (no path of non-zero transitions leads to it)");
    }

    @Test
    void stateWithoutOutgoingTransition() {
        assertThat(rejected(t -> {
            ((ArrayNode) t.get("transitions")).remove(3);
            ((ArrayNode) t.get("transitions")).remove(2);
        })).isEqualTo("test.json: state \"cold\": no outgoing transition (every state must list where it can go next)");
    }

    private static HmmModel copy(HmmModel m, List<State> states, double[] start, List<Transition> transitions) {
        return new HmmModel(m.name(), m.description(), m.provenance(), m.labels(), states, start, transitions);
    }
}
