package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * A trained model file is reproducible byte for byte: for any --threads, and with --restarts for the same --seed.
 * Each run is its own process with SOURCE_DATE_EPOCH set, the reproducible-builds.org convention for fixing the
 * timestamp a tool writes (here the provenance date), so that everything else in the file can be compared.
 */
class TrainReproducibilityTest {
    private static final String EPOCH = "1790000000";

    @TempDir
    Path tmp;

    @Test
    void threadsDoNotChangeTheModel() throws Exception {
        // records long enough to be counted as two halves, and several batches
        Path fa = tmp.resolve("sim.fa");
        assertThat(CliRun.run("simulate", "-m", "cpg-island", "--length", "700000", "--records", "3", "--seed", "5",
                "-o", fa.toString()).status()).isZero();
        byte[] one = train(fa, "one", "--threads", "1");
        byte[] two = train(fa, "two", "--threads", "2");
        assertThat(new String(two, StandardCharsets.UTF_8)).isEqualTo(new String(one, StandardCharsets.UTF_8));
        assertThat(new String(one, StandardCharsets.UTF_8)).contains("\"date\": \"2026-09-21T");
    }

    @Test
    void restartsAreReproducibleBySeed() throws Exception {
        Path fa = tmp.resolve("sim.fa");
        assertThat(CliRun.run("simulate", "-m", "cpg-island", "--length", "150000", "--seed", "6", "-o",
                fa.toString()).status()).isZero();
        byte[] first = train(fa, "first", "--restarts", "2", "--seed", "11", "--threads", "2");
        byte[] again = train(fa, "again", "--restarts", "2", "--seed", "11", "--threads", "1");
        assertThat(new String(again, StandardCharsets.UTF_8)).isEqualTo(new String(first, StandardCharsets.UTF_8));
        assertThat(new String(first, StandardCharsets.UTF_8)).contains("Best of 3 runs by log-likelihood");
    }

    /**
     * Runs train in its own process, in a new folder {@code dir} of the temporary directory, with the same relative
     * paths every time (the model records its command line); returns the bytes of the model written.
     */
    private byte[] train(Path fasta, String dir, String... more) throws IOException, InterruptedException {
        Path where = Files.createDirectory(tmp.resolve(dir));
        List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java")
                .toString(), "-cp", System.getProperty("java.class.path"), "dev.annotator.cli.Main", "train", "-q",
                "-m", "cpg-island", "--method", "baum-welch", "--max-iter", "4", "-o", "model.json"));
        command.addAll(List.of(more));
        command.add("../" + fasta.getFileName());
        ProcessBuilder pb = new ProcessBuilder(command).directory(where.toFile())
                .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")));
        pb.environment().put("SOURCE_DATE_EPOCH", EPOCH);
        Process p = pb.start();
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(120, TimeUnit.SECONDS)).as("finished").isTrue();
        assertThat(p.exitValue()).as(err).isZero();
        return Files.readAllBytes(where.resolve("model.json"));
    }
}
