package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

/** Where outputs land: through links, onto devices, to standard output, and what a bare command does. */
class OutputPathsTest {

    @TempDir
    Path dir;

    private Path simulated() {
        Path fasta = dir.resolve("in.fa");
        assertThat(CliRun.run("simulate", "-m", "cpg-island", "--length", "20000", "--seed", "3", "-o",
                fasta.toString()).status()).isZero();
        return fasta;
    }

    @Test
    void aSymbolicLinkIsWrittenThroughAndStaysALink() throws Exception {
        Path fasta = simulated();
        Path real = dir.resolve("real.gff3");
        Path link = Files.createSymbolicLink(dir.resolve("link.gff3"), real);
        CliRun.Result viaLink = CliRun.run("annotate", "-q", "-m", "cpg-island", "-o", link.toString(), fasta.toString());
        CliRun.Result direct = CliRun.run("annotate", "-q", "-m", "cpg-island", fasta.toString());
        assertThat(viaLink.status()).isZero();
        assertThat(Files.isSymbolicLink(link)).isTrue();
        assertThat(Files.readAllBytes(real)).isEqualTo(direct.stdout());
    }

    @Test
    void aDeviceIsWrittenDirectlyNotReplaced() throws Exception {
        Path devNull = Path.of("/dev/null");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.exists(devNull));
        Path fasta = simulated();
        CliRun.Result r = CliRun.run("annotate", "-q", "-m", "cpg-island", "-o", "/dev/null", fasta.toString());
        assertThat(r.status()).isZero();
        assertThat(Files.isRegularFile(devNull)).as("/dev/null must stay a device").isFalse();
    }

    @Test
    void simulateWritesFastaToStandardOutputWithDash() {
        CliRun.Result r = CliRun.run("simulate", "-m", "cpg-island", "--length", "150", "--seed", "9", "-o", "-");
        assertThat(r.status()).isZero();
        String text = new String(r.stdout(), StandardCharsets.US_ASCII);
        assertThat(text).startsWith(">sim1\n");
        assertThat(text.replaceAll(">sim1\n|\n", "")).hasSize(150).matches("[ACGT]+");
    }

    @Test
    void bareCommandsAreUsageErrors() {
        CliRun.Result top = CliRun.run();
        assertThat(top.status()).isEqualTo(2);
        assertThat(top.stderr()).contains("Usage: annotator");
        assertThat(top.stdout()).isEmpty();
        assertThat(CliRun.run("model").status()).isEqualTo(2);
    }
}
