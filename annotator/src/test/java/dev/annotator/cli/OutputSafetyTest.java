package dev.annotator.cli;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.stream.Stream;

import static dev.annotator.cli.CliAssertions.assertOneLineError;
import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * Outputs are never clobbered by accident: an existing output is replaced only with --force, an output on one of
 * the run's inputs is refused even then, and a directory that cannot be written fails before any work. Refusals
 * of the command line's request exit 2, the README's status for a bad command line (common practice for usage
 * errors); an output that cannot be created exits 74 (EX_IOERR of BSD sysexits(3), recalled from memory).
 */
class OutputSafetyTest {
    private static final int USAGE = 2;
    private static final int IO = 74;
    private static final String OLD = "an earlier result that must survive\n";

    @TempDir
    Path dir;

    private Path fasta;

    @BeforeEach
    void input() throws IOException {
        fasta = Files.write(dir.resolve("in.fa"), TestInputs.randomFasta(2, 3_000, 11));
    }

    @Test
    void existingOutputIsRefusedWithoutForceAndReplacedWithIt() throws IOException {
        Path out = Files.writeString(dir.resolve("calls.gff3"), OLD);
        CliRun.Result refused = CliRun.run("annotate", "-m", "cpg-island", "-o", out.toString(), fasta.toString());
        assertOneLineError(refused, USAGE, out + ": already exists (use --force to replace it)");
        assertThat(Files.readString(out)).isEqualTo(OLD);
        assertNoTemporaryFiles();

        CliRun.Result forced = CliRun.run("annotate", "-q", "--force", "-m", "cpg-island", "-o", out.toString(),
                fasta.toString());
        assertThat(forced.status()).as(forced.stderr()).isZero();
        CliRun.Result toStdout = CliRun.run("annotate", "-q", "-m", "cpg-island", fasta.toString());
        assertThat(Files.readAllBytes(out)).isEqualTo(toStdout.stdout());
        assertNoTemporaryFiles();
    }

    @Test
    void anOutputReachedThroughALinkCountsAsExisting() throws IOException {
        Path real = Files.writeString(dir.resolve("real.gff3"), OLD);
        Path link = Files.createSymbolicLink(dir.resolve("link.gff3"), real);
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-o", link.toString(), fasta.toString());
        assertOneLineError(r, USAGE, link + ": already exists (use --force to replace it)");
        assertThat(Files.readString(real)).isEqualTo(OLD);
    }

    @Test
    void simulateRefusesEitherExistingOutput() throws IOException {
        Path fa = dir.resolve("sim.fa");
        Path truth = Files.writeString(dir.resolve("sim.gff3"), OLD);
        CliRun.Result r = CliRun.run("simulate", "-m", "cpg-island", "--length", "500", "-o", fa.toString(),
                "--truth", truth.toString());
        assertOneLineError(r, USAGE, truth + ": already exists (use --force to replace it)");
        assertThat(fa).doesNotExist();
        assertThat(Files.readString(truth)).isEqualTo(OLD);

        CliRun.Result forced = CliRun.run("simulate", "--force", "-m", "cpg-island", "--length", "500", "-o",
                fa.toString(), "--truth", truth.toString());
        assertThat(forced.status()).as(forced.stderr()).isZero();
        assertThat(Files.readString(fa)).startsWith(">sim1\n");
        assertThat(Files.readString(truth)).startsWith("##gff-version 3\n");
    }

    @Test
    void outputOnTheInputIsRefusedEvenWithForce() throws IOException {
        byte[] before = Files.readAllBytes(fasta);
        Path hardLink = Files.createLink(dir.resolve("same-data.fa"), fasta);
        Path symLink = Files.createSymbolicLink(dir.resolve("pointer.fa"), fasta);
        for (Path out : new Path[] {fasta, hardLink, symLink, dir.resolve("sub/../in.fa")}) {
            Files.createDirectories(dir.resolve("sub"));
            CliRun.Result r = CliRun.run("annotate", "--force", "-m", "cpg-island", "-o", out.toString(),
                    fasta.toString());
            assertOneLineError(r, USAGE, out + ": output is also an input (" + fasta + ")");
            assertThat(Files.readAllBytes(fasta)).as("input after -o %s", out).isEqualTo(before);
        }
        assertNoTemporaryFiles();
    }

    @Test
    void outputOnTheModelFileIsRefused() throws IOException {
        Path model = dir.resolve("model.json");
        Files.copy(CliRun.testData("..", "models", "cpg-island.json"), model);
        byte[] before = Files.readAllBytes(model);
        CliRun.Result r = CliRun.run("annotate", "--force", "-m", model.toString(), "-o", model.toString(),
                fasta.toString());
        assertOneLineError(r, USAGE, model + ": output is also an input (" + model + ")");
        assertThat(Files.readAllBytes(model)).isEqualTo(before);

        CliRun.Result sim = CliRun.run("simulate", "--force", "-m", model.toString(), "--length", "100", "-o",
                model.toString());
        assertOneLineError(sim, USAGE, model + ": output is also an input (" + model + ")");
        assertThat(Files.readAllBytes(model)).isEqualTo(before);
    }

    @Test
    void oneFileForBothSimulateOutputsIsRefused() {
        Path both = dir.resolve("both.txt");
        CliRun.Result r = CliRun.run("simulate", "-m", "cpg-island", "--length", "100", "-o", both.toString(),
                "--truth", dir.resolve(".").resolve("both.txt").toString());
        assertOneLineError(r, USAGE, "both.txt: named for two outputs (also " + both + ")");
        assertThat(both).doesNotExist();
    }

    @Test
    void standardStreamsAndDevicesAreNeverRefused() {
        // "-" on both sides: standard input and output are not files that could be replaced
        CliRun.Result r = CliRun.withStdin(TestInputs.randomFasta(1, 500, 2), "annotate", "-q", "-m", "cpg-island",
                "-o", "-", "-");
        assertThat(r.status()).as(r.stderr()).isZero();
        assumeTrue(Files.exists(Path.of("/dev/null")));
        CliRun.Result dev = CliRun.run("annotate", "-q", "-m", "cpg-island", "-o", "/dev/null", fasta.toString());
        assertThat(dev.status()).as(dev.stderr()).isZero();
    }

    @Test
    void outputDirectoryThatCannotBeWrittenFailsBeforeAnyWork() throws IOException {
        Path locked = Files.createDirectory(dir.resolve("locked"));
        Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("r-xr-xr-x"));
        try {
            // the superuser writes anywhere, so the check only means something for other users
            assumeTrue(!Files.isWritable(locked), "running with permission to write a read-only directory");
            Path out = locked.resolve("calls.gff3");
            CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-o", out.toString(), fasta.toString());
            assertOneLineError(r, IO, out + ": cannot create output in " + locked.toAbsolutePath()
                    + " (permission denied)");
        } finally {
            Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("rwxr-xr-x"));
        }
    }

    private void assertNoTemporaryFiles() throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".partial"));
        }
    }
}
