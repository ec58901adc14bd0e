package dev.annotator.model;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.annotator.error.BadInputException;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/** The optional training record of a model's provenance: written, read back, validated, summarised. */
class TrainingProvenanceJsonTest {
    private static final String SHA = "0123456789abcdef0123456789abcdef0123456789abcdef0123456789abcdef";

    private static HmmModel trained(Training t) {
        HmmModel m = ModelFiles.read(ModelFiles.valid());
        return new HmmModel(m.name(), m.description(), new Provenance("Fitted by baum-welch to a.fa",
                List.of("a note"), t), m.labels(), m.states(), m.start(), m.transitions());
    }

    private static Training full() {
        return new Training("annotator 0.1.0", "annotator train -m toy.json --method baum-welch -o out.json a.fa",
                "2026-12-01T10:15:30Z", "baum-welch", List.of(new InputFingerprint("a.fa", 1234, SHA)),
                List.of(new InputFingerprint("truth.gff3", 56, SHA)), 1000, 12, true, -1234.5678901234567,
                -1300.25);
    }

    @Test
    void trainingRecordSurvivesWriteAndRead() {
        for (Training t : List.of(full(), new Training("annotator 0.1.0", "annotator train --merge-counts x", "d",
                "counting", List.of(), List.of(), 0, 1, null, null, null))) {
            HmmModel m = trained(t);
            String json = ModelJson.toJson(m);
            HmmModel back = reread(json);
            assertThat(back.provenance()).isEqualTo(m.provenance());
            assertThat(ModelJson.toJson(back)).isEqualTo(json);
        }
        // a model written by hand has no training record, and its file no "training" field
        HmmModel plain = ModelFiles.read(ModelFiles.valid());
        assertThat(plain.provenance().training()).isNull();
        assertThat(ModelJson.toJson(plain)).doesNotContain("\"training\"");
    }

    @Test
    void summaryPrintsTheTrainingRecord() {
        String text = ModelSummary.describe(trained(full()));
        assertThat(text).contains("trained: baum-welch by annotator 0.1.0 on 2026-12-01T10:15:30Z\n",
                "  command: annotator train -m toy.json --method baum-welch -o out.json a.fa\n",
                "  input: a.fa, 1234 bytes, sha256 " + SHA + "\n",
                "  labels: truth.gff3, 56 bytes, sha256 " + SHA + "\n",
                "  iterations: 12 (converged)\n",
                "  log-likelihood of the start model: -1300.250000\n",
                "  log-likelihood of this model: -1234.567890\n");
    }

    @Test
    void badTrainingRecordsAreRejected() {
        String json = ModelJson.toJson(trained(full()));
        assertRejected(json.replace(SHA, "ABC"), "provenance.training.inputs[0].sha256 \"ABC\" is not 64 lowercase "
                + "hexadecimal digits");
        assertRejected(json.replace("\"method\": \"baum-welch\"", "\"method\": \"guessing\""),
                "provenance.training.method \"guessing\" is not \"counting\" or \"baum-welch\"");
        assertRejected(json.replace("\"iterations\": 12", "\"iterations\": 1.5"),
                "provenance.training.iterations: expected an integer, found a number");
        assertRejected(json.replace("\"bases\": 1000", "\"bases\": 1000, \"machine\": \"x\""),
                "provenance.training: unknown field \"machine\"");
        ObjectNode tree = ModelFiles.parse(json);
        ((ObjectNode) tree.get("provenance").get("training")).remove("date");
        assertRejected(tree.toString(), "provenance.training: missing field \"date\"");
    }

    private static void assertRejected(String json, String message) {
        assertThatThrownBy(() -> reread(json)).isInstanceOf(BadInputException.class)
                .hasMessage("round-trip.json: " + message);
    }

    private static HmmModel reread(String json) {
        return ModelJson.read(new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "round-trip.json");
    }
}
