package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Standard output that cannot be written (full disk, closed pipe) must fail the run with 74, the README's status
 * for "reading or writing failed ... broken pipe" (EX_IOERR of BSD sysexits(3), recalled from memory), never
 * end with 0 after output was lost.
 */
class StdoutFailureTest {
    @TempDir
    Path dir;

    @Test
    void annotateToAFullStdout() {
        CliRun.Result r = runOnFullStdout("annotate", "-m", "cpg-island",
                CliRun.testData("fasta", "two-records.fa").toString());
        CliAssertions.assertOneLineError(r, 74, "<stdout>: write failed (No space left on device)");
    }

    @Test
    void listingHelpVersionAndDemoToAFullStdout() {
        for (String[] args : new String[][] {{"models"}, {"model", "check", "cpg-island"}, {"--help"},
                {"annotate", "--help"}, {"--version"}, {"demo", "--out", dir.resolve("demo").toString()}}) {
            CliAssertions.assertOneLineError(runOnFullStdout(args), 74, "<stdout>: write failed");
        }
    }

    /** Like writing to /dev/full: every write fails with ENOSPC's message. */
    private static CliRun.Result runOnFullStdout(String... args) {
        OutputStream full = new OutputStream() {
            @Override
            public void write(int b) throws IOException {
                throw new IOException("No space left on device");
            }

            @Override
            public void write(byte[] b, int off, int len) throws IOException {
                throw new IOException("No space left on device");
            }
        };
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status;
        try (PrintStream errStream = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            status = Main.run(args, new ByteArrayInputStream(new byte[0]), full, errStream);
        }
        return new CliRun.Result(status, new byte[0], err.toString(StandardCharsets.UTF_8));
    }
}
