package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

class SimulateCommandTest {
    @TempDir
    Path dir;

    @Test
    void sameSeedSameFilesOtherSeedOtherFiles() throws IOException {
        Files.createDirectories(dir.resolve("a"));
        Files.createDirectories(dir.resolve("b"));
        Files.createDirectories(dir.resolve("c"));
        simulate("a", "7");
        simulate("b", "7");
        simulate("c", "8");
        assertThat(dir.resolve("b/sim.fa")).hasSameBinaryContentAs(dir.resolve("a/sim.fa"));
        assertThat(dir.resolve("b/truth.gff3")).hasSameBinaryContentAs(dir.resolve("a/truth.gff3"));
        // so the equality above is not that of a constant output
        assertThat(Files.readAllBytes(dir.resolve("c/sim.fa"))).isNotEqualTo(Files.readAllBytes(dir.resolve("a/sim.fa")));
    }

    @Test
    void writesTheRecordsAskedForAndTheirTruth() throws IOException {
        Files.createDirectories(dir.resolve("a"));
        simulate("a", "3");
        List<String> lines = Files.readAllLines(dir.resolve("a/sim.fa"), StandardCharsets.US_ASCII);
        assertThat(lines.stream().filter(l -> l.startsWith(">"))).containsExactly(">sim1", ">sim2", ">sim3");
        long bases = lines.stream().filter(l -> !l.startsWith(">")).mapToLong(String::length).sum();
        assertThat(bases).isEqualTo(3 * 20_000);
        assertThat(lines.stream().filter(l -> !l.startsWith(">"))).allMatch(l -> l.matches("[ACGT]+"));

        GffCalls truth = GffCalls.parse(Files.readAllBytes(dir.resolve("a/truth.gff3")));
        assertThat(truth.regions()).containsOnlyKeys("sim1", "sim2", "sim3");
        // islands of 1000 bases on average in 20,000 of background (the model's transitions): 60 kb should hold
        // some; a Poisson count with mean near 3 is rarely 0 (exp(-3) ~ 5%), and this seed is fixed
        assertThat(truth.calls()).isNotEmpty().allMatch(c -> c.type().equals("CpG_island")
                && c.start() >= 1 && c.end() <= 20_000 && c.start() <= c.end());
    }

    private void simulate(String sub, String seed) {
        CliRun.Result r = CliRun.run("simulate", "-m", "cpg-island", "--length", "20000", "--records", "3",
                "--seed", seed, "-o", dir.resolve(sub + "/sim.fa").toString(),
                "--truth", dir.resolve(sub + "/truth.gff3").toString());
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stdout()).isEmpty();
    }
}
