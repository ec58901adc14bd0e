package dev.annotator.cli;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.io.IOException;
import java.io.OutputStream;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * A run interrupted midway leaves nothing at its output path: not the output, not its temporary file. Tested on
 * a real child process that has written part of its output when the signal arrives.
 *
 * <p>A process started in the background by a non-interactive shell ignores SIGINT, and so do its children, so
 * the child is started through {@code env --default-signal} (GNU coreutils) to get the default disposition back,
 * and the test checks in /proc that the child's JVM has a handler for the signal before sending it (proc(5):
 * SigCgt is the mask of caught signals, bit n-1 for signal n; recalled from memory).
 */
class InterruptTest {
    private static final Path ENV = Path.of("/usr/bin/env");

    @TempDir
    Path dir;

    @ParameterizedTest(name = "SIG{0}")
    @CsvSource({"INT, 2", "TERM, 15"})
    void interruptedRunLeavesNoOutput(String signal, int number) throws Exception {
        assumeTrue(Files.isDirectory(Path.of("/proc/self")), "needs /proc to see the child's signal handlers");
        assumeTrue(envResetsSignals(), "needs env --default-signal (GNU coreutils 8.31 or later)");
        Path out = dir.resolve("calls.gff3");
        List<String> command = new ArrayList<>(List.of(ENV.toString(), "--default-signal=" + signal));
        command.addAll(ChildJvm.command(List.of(), "annotate", "-m", "cpg-island", "--threads", "1", "-o",
                out.toString(), "-").command());
        Process p = new ProcessBuilder(command).redirectOutput(ProcessBuilder.Redirect.DISCARD)
                .redirectError(dir.resolve("stderr.txt").toFile()).start();
        OutputStream stdin = p.getOutputStream();
        try {
            // records go in while the run waits for more input, as from a slow pipe; it decodes them and writes
            // their segments to its temporary file, until that file holds some bytes
            Path partial = null;
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
            for (int r = 1; partial == null || Files.size(partial) == 0; r++) {
                assertThat(System.nanoTime()).as("temporary output written within 120 s").isLessThan(deadline);
                assertThat(p.isAlive()).as("child still running").isTrue();
                String record = new String(TestInputs.randomFasta(1, 100_000, r), StandardCharsets.US_ASCII);
                stdin.write(record.replaceFirst(">rand1\n", ">r" + r + "\n").getBytes(StandardCharsets.US_ASCII));
                stdin.flush();
                Thread.sleep(20);
                partial = temporaryFile().orElse(null);
            }
            assertThat(out).doesNotExist();
            assertThat(catches(p.pid(), number)).as("child's JVM handles SIG%s", signal).isTrue();

            Process kill = new ProcessBuilder("kill", "-" + signal, Long.toString(p.pid())).start();
            assertThat(kill.waitFor(10, TimeUnit.SECONDS)).isTrue();
            assertThat(kill.exitValue()).isZero();
            assertThat(p.waitFor(60, TimeUnit.SECONDS)).as("child ended after SIG%s", signal).isTrue();
        } finally {
            p.destroyForcibly();
            try {
                stdin.close();
            } catch (IOException childGone) {
                // the pipe's reader has exited; nothing left to close
            }
        }
        // the JVM exits with 128 + the signal's number after running its shutdown hooks (common practice for
        // shells and the JVM alike)
        assertThat(p.exitValue()).as(Files.readString(dir.resolve("stderr.txt"))).isEqualTo(128 + number);
        try (Stream<Path> left = Files.list(dir)) {
            assertThat(left.map(f -> f.getFileName().toString())).containsExactly("stderr.txt");
        }
    }

    private Optional<Path> temporaryFile() throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.filter(f -> f.getFileName().toString().endsWith(".partial")).findFirst();
        }
    }

    /** Whether the process has a handler installed for the signal (SigCgt in /proc/PID/status). */
    private static boolean catches(long pid, int signal) throws IOException {
        for (String line : Files.readAllLines(Path.of("/proc", Long.toString(pid), "status"))) {
            if (line.startsWith("SigCgt:")) {
                return new BigInteger(line.substring("SigCgt:".length()).strip(), 16).testBit(signal - 1);
            }
        }
        return false;
    }

    private static boolean envResetsSignals() throws InterruptedException {
        try {
            Process p = new ProcessBuilder(ENV.toString(), "--default-signal=INT", "true")
                    .redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
            return p.waitFor(10, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException e) {
            return false;
        }
    }
}
