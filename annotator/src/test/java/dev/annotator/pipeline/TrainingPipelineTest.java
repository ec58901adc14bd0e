package dev.annotator.pipeline;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelJson;
import dev.annotator.model.ShippedModels;
import dev.annotator.train.Freeze;
import dev.annotator.train.RunStamp;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/** Training from files gives the same model whether the records are kept in memory between E-steps or read again. */
class TrainingPipelineTest {
    @TempDir
    Path tmp;

    @Test
    void readingTheFilesAgainGivesTheSameModelAsKeepingThem() throws IOException {
        HmmModel model = ShippedModels.load("cpg-island").orElseThrow();
        Path a = tmp.resolve("a.fa");
        Path b = tmp.resolve("b.fa");
        try (OutputStream out = Files.newOutputStream(a)) {
            new SimulationRun(model).write("a", 120_000, 3, 1, out, null);
        }
        try (OutputStream out = Files.newOutputStream(b)) {
            new SimulationRun(model).write("b", 90_000, 1, 2, out, null);
        }
        TrainingOptions options = new TrainingOptions(TrainingMethod.BAUM_WELCH, 1, 3, 0, 1, 5, Freeze.NONE);
        RunStamp stamp = new RunStamp("annotator test", "annotator train", "2026-12-01T00:00:00Z");
        List<String> inputs = List.of(a.toString(), b.toString());
        List<String> warnings = new ArrayList<>();
        String kept = ModelJson.toJson(new TrainingPipeline(model, "cpg-island", inputs, null, options, 2,
                warnings::add, Long.MAX_VALUE).train((r, rs, i, ll, g, n, s) -> { }, stamp));
        String reread = ModelJson.toJson(new TrainingPipeline(model, "cpg-island", inputs, null, options, 2,
                warnings::add, 0).train((r, rs, i, ll, g, n, s) -> { }, stamp));
        assertThat(reread).isEqualTo(kept);
        assertThat(warnings).isEmpty();
    }
}
