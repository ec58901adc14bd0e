package dev.annotator.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/** {@code models} and {@code model check}, compared with the shipped model file read directly as JSON. */
class ModelCommandsTest {
    private static final Path MODELS = Path.of(System.getProperty("basedir", "."), "..", "models");

    @Test
    void modelsListsEveryShippedFileWithItsDescription() throws IOException {
        CliRun.Result r = CliRun.run("models");
        assertThat(r.status()).isZero();
        assertThat(r.stderr()).isEmpty();
        List<String> lines = r.out().lines().toList();
        try (Stream<Path> files = Files.list(MODELS)) {
            List<Path> json = files.filter(p -> p.toString().endsWith(".json")).toList();
            assertThat(lines).hasSameSizeAs(json);
            for (Path f : json) {
                JsonNode model = new ObjectMapper().readTree(f.toFile());
                assertThat(lines).anyMatch(l -> l.startsWith(model.get("name").asText() + " ")
                        && l.endsWith(" " + model.get("description").asText()));
            }
        }
        assertThat(lines).anyMatch(l -> l.startsWith("cpg-island "));
    }

    @Test
    void checkPrintsTheSegmentLengthsTheTransitionsImply() throws IOException {
        CliRun.Result r = CliRun.run("model", "check", "cpg-island");
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stderr()).isEmpty();

        // A label of one state with self-transition p lasts a geometric number of bases, whose mean is 1/(1 - p)
        // (a standard result of probability, recalled from memory); p is read straight from the shipped file.
        JsonNode model = new ObjectMapper().readTree(MODELS.resolve("cpg-island.json").toFile());
        Map<String, Double> expected = new HashMap<>();
        for (JsonNode t : model.get("transitions")) {
            if (t.get("from").asText().equals(t.get("to").asText())) {
                expected.put(t.get("from").asText(), 1 / (1 - t.get("p").asDouble()));
            }
        }
        // the file's provenance: islands of about 1 kb separated by about 20 kb
        assertThat(expected.get("island")).isCloseTo(1000, within(1e-6));
        assertThat(expected.get("background")).isCloseTo(20000, within(1e-3));

        List<String> lines = r.out().lines().toList();
        int heading = lines.indexOf("expected segment length (bases):");
        assertThat(heading).isNotNegative();
        Map<String, Double> printed = new HashMap<>();
        for (String line : lines.subList(heading + 1, lines.size())) {
            if (!line.startsWith("  ")) {
                break;
            }
            String[] cols = line.strip().split("\\s+");
            printed.put(cols[0], Double.parseDouble(cols[1]));
        }
        assertThat(printed).containsOnlyKeys("island", "background");
        assertThat(printed.get("island")).isCloseTo(expected.get("island"), within(0.05));
        assertThat(printed.get("background")).isCloseTo(expected.get("background"), within(0.05));
        assertThat(lines).contains("  island      1000.0", "  background  20000.0");
    }

    @Test
    void checkAcceptsTheShippedFileByPathToo() {
        CliRun.Result byName = CliRun.run("model", "check", "cpg-island");
        CliRun.Result byPath = CliRun.run("model", "check", MODELS.resolve("cpg-island.json").toString());
        assertThat(byPath.status()).as(byPath.stderr()).isZero();
        assertThat(byPath.out()).isEqualTo(byName.out());
    }
}
