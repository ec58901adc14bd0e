package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static dev.annotator.cli.CliAssertions.assertOneLineError;
import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * A disk that fills up midway: the first writes succeed, a later one fails. The run must end with 74 (the README's
 * status for a failed write; EX_IOERR of BSD sysexits(3), recalled from memory) and one line naming the output,
 * not with 0 and a silently shortened output. {@link StdoutFailureTest} covers a stream that fails at once.
 */
class WriteFailureTest {
    private static final int IO = 74;
    private static final int ACCEPTED = 100_000;

    @TempDir
    Path dir;

    @Test
    void annotateOutputThatFailsMidway() throws IOException {
        // 3000 short records: the ##sequence-region lines alone come to more than ACCEPTED bytes
        Path input = Files.write(dir.resolve("many.fa"), TestInputs.randomFasta(3000, 100, 4));
        FillingDisk disk = new FillingDisk(ACCEPTED);
        CliRun.Result r = run(disk, "annotate", "-m", "cpg-island", "--threads", "2", input.toString());
        assertOneLineError(r, IO, "<stdout>: write failed (No space left on device)");
        assertThat(disk.accepted).as("bytes written before the disk filled").isEqualTo(ACCEPTED);
    }

    @Test
    void simulateOutputThatFailsMidway() {
        FillingDisk disk = new FillingDisk(ACCEPTED);
        CliRun.Result r = run(disk, "simulate", "-m", "cpg-island", "--length", "500000", "-o", "-");
        assertOneLineError(r, IO, "<stdout>: write failed (No space left on device)");
        assertThat(disk.accepted).isEqualTo(ACCEPTED);
    }

    @Test
    void outputFileOnAFullDevice() throws IOException {
        // Linux's /dev/full fails every write with ENOSPC (null(4), recalled from memory); an output path that is a
        // device is written directly, so the failure comes from the device itself
        Path full = Path.of("/dev/full");
        assumeTrue(Files.exists(full) && Files.isWritable(full) && !Files.isRegularFile(full));
        Path input = Files.write(dir.resolve("many.fa"), TestInputs.randomFasta(3000, 100, 4));
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-o", full.toString(), input.toString());
        assertOneLineError(r, IO, "/dev/full: write failed (No space left on device)");
    }

    private static CliRun.Result run(OutputStream stdout, String... args) {
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status;
        try (PrintStream errStream = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            status = Main.run(args, new ByteArrayInputStream(new byte[0]), stdout, errStream);
        }
        return new CliRun.Result(status, new byte[0], err.toString(StandardCharsets.UTF_8));
    }

    /** Takes {@code capacity} bytes, then fails every write the way a full disk does (ENOSPC's message). */
    private static final class FillingDisk extends OutputStream {
        private final long capacity;
        long accepted;

        FillingDisk(long capacity) {
            this.capacity = capacity;
        }

        @Override
        public void write(int b) throws IOException {
            write(new byte[] {(byte) b}, 0, 1);
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            long room = capacity - accepted;
            accepted += Math.min(room, len);
            if (len > room) {
                throw new IOException("No space left on device");
            }
        }
    }
}
