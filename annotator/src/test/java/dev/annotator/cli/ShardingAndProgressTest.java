package dev.annotator.cli;

import dev.annotator.pipeline.ProgressSnapshot;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

/** --id-prefix for shards joined later, and the progress options. */
class ShardingAndProgressTest {

    @TempDir
    Path dir;

    @Test
    void idPrefixKeepsIdsOfJoinedShardsUnique() {
        Path fasta = dir.resolve("in.fa");
        assertThat(CliRun.run("simulate", "-m", "cpg-island", "--length", "200000", "--seed", "4", "-o",
                fasta.toString()).status()).isZero();
        String plain = new String(CliRun.run("annotate", "-q", "-m", "cpg-island", fasta.toString()).stdout(),
                StandardCharsets.UTF_8);
        String prefixed = new String(CliRun.run("annotate", "-q", "-m", "cpg-island", "--id-prefix", "g07_",
                fasta.toString()).stdout(), StandardCharsets.UTF_8);
        assertThat(plain).contains("ID=island_1;");
        assertThat(prefixed).contains("ID=g07_island_1;").doesNotContain("ID=island_");
        assertThat(prefixed.replace("g07_", "")).isEqualTo(plain);
    }

    @Test
    void progressModes() {
        Path fasta = dir.resolve("in.fa");
        CliRun.run("simulate", "-m", "cpg-island", "--length", "5000", "-o", fasta.toString());
        CliRun.Result log = CliRun.run("annotate", "--progress", "log", "-m", "cpg-island", fasta.toString());
        assertThat(log.status()).isZero();
        CliRun.Result bad = CliRun.run("annotate", "--progress", "sometimes", "-m", "cpg-island", fasta.toString());
        assertThat(bad.status()).isEqualTo(2);
        assertThat(bad.stderr()).contains("--progress must be auto, bar, log or none");
    }

    @Test
    void logLineSaysDoneTotalRateAndTimeLeft() {
        // 50 of an estimated 200 Mbp in 10 s: 5 Mbp/s, 150 Mbp left -> 30 s (worked by hand)
        String line = LogProgressLines.line(new ProgressSnapshot(50_000_000, 200_000_000, false, 10.0));
        assertThat(line).isEqualTo("annotator: progress: 50.0 Mbp of ~200.0 Mbp (25%), 5.0 Mbp/s, about 30 s left");
        String unknown = LogProgressLines.line(new ProgressSnapshot(1_000_000, -1, false, 2.0));
        assertThat(unknown).isEqualTo("annotator: progress: 1.0 Mbp, 0.5 Mbp/s");
    }
}
