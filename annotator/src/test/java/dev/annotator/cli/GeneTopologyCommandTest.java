package dev.annotator.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelJson;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static dev.annotator.cli.CliAssertions.assertOneLineError;
import static org.assertj.core.api.Assertions.assertThat;

/**
 * {@code annotator model gene-topology}. Exit 2 for a bad command line is the README's status for usage errors
 * (common practice).
 */
class GeneTopologyCommandTest {
    private static final int USAGE = 2;

    @TempDir
    Path dir;

    @Test
    void writesAModelThatModelCheckAccepts() throws IOException {
        Path out = dir.resolve("start.json");
        CliRun.Result r = CliRun.run("model", "gene-topology", "--coding-order", "2", "--noncoding-order", "1",
                "--upstream", "3", "-o", out.toString());
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stderr()).isEmpty();
        assertThat(r.stdout()).isEmpty();

        CliRun.Result check = CliRun.run("model", "check", out.toString());
        assertThat(check.status()).as(check.stderr()).isZero();
        assertThat(check.stderr()).isEmpty();

        // the file is the library's topology with those settings, byte for byte
        HmmModel expected = GeneTopology.build("gene-model", GeneticCode.TABLE_11, 2, 1, 3);
        assertThat(Files.readString(out, StandardCharsets.UTF_8)).isEqualTo(ModelJson.toJson(expected));
        // read with a plain JSON parser: two stranded labels, states with codon positions
        JsonNode tree = new ObjectMapper().readTree(out.toFile());
        assertThat(tree.get("labels").findValuesAsText("strand")).containsExactly("+", "-");
        assertThat(tree.get("states").findValues("codon_position")).hasSize(18);
    }

    @Test
    void writesToStandardOutputByDefault() {
        CliRun.Result r = CliRun.run("model", "gene-topology", "--coding-order", "2", "--noncoding-order", "0",
                "--stops", "TAA,TAG", "--name", "table4-genes");
        assertThat(r.status()).as(r.stderr()).isZero();
        HmmModel m = ModelJson.read(new java.io.ByteArrayInputStream(r.stdout()), "stdout");
        assertThat(m.name()).isEqualTo("table4-genes");
        // TGA read as tryptophan (NCBI table 4, recalled from memory): allowed inside genes
        assertThat(m.provenance().source()).contains("stops TAA, TAG").doesNotContain("TGA");
    }

    @Test
    void codingOrderBelowTwoIsAUsageError() {
        Path out = dir.resolve("start.json");
        CliRun.Result r = CliRun.run("model", "gene-topology", "--coding-order", "1", "-o", out.toString());
        assertOneLineError(r, USAGE, "--coding-order 1 is outside 2..8");
        assertThat(out).doesNotExist();
        assertOneLineError(CliRun.run("model", "gene-topology", "--coding-order", "9", "-o", out.toString()), USAGE,
                "--coding-order 9");
    }

    @Test
    void aStopThatIsNoCodonIsAUsageError() {
        Path out = dir.resolve("start.json");
        CliRun.Result r = CliRun.run("model", "gene-topology", "--stops", "TAA,XYZ", "-o", out.toString());
        assertOneLineError(r, USAGE, "XYZ");
        assertThat(out).doesNotExist();
        // a codon both start and stop
        assertOneLineError(CliRun.run("model", "gene-topology", "--starts", "ATG,TAA", "-o", out.toString()), USAGE,
                "TAA");
    }

    @Test
    void existingOutputIsRefusedWithoutForce() throws IOException {
        String old = "an earlier model that must survive\n";
        Path out = Files.writeString(dir.resolve("start.json"), old);
        CliRun.Result refused = CliRun.run("model", "gene-topology", "--coding-order", "2", "-o", out.toString());
        assertOneLineError(refused, USAGE, out + ": already exists (use --force to replace it)");
        assertThat(Files.readString(out)).isEqualTo(old);

        CliRun.Result forced = CliRun.run("model", "gene-topology", "--coding-order", "2", "--force", "-o",
                out.toString());
        assertThat(forced.status()).as(forced.stderr()).isZero();
        assertThat(Files.readString(out)).startsWith("{");
        try (Stream<Path> files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString()).toList()).isEqualTo(List.of("start.json"));
        }
    }
}
