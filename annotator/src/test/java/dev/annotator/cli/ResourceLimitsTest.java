package dev.annotator.cli;

import dev.annotator.model.ModelJson;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Malicious or mistaken inputs that would need more memory than there is: each must be refused with a one-line
 * message once the reader has seen too much, never end in an OutOfMemoryError. The inputs are streamed or written
 * at run time; nothing this large is kept in the repository.
 */
class ResourceLimitsTest {
    private static final long TWO_GIB = 2L << 30;

    @TempDir
    Path dir;

    /**
     * A 2 GiB single line on standard input of a JVM with a 256 MiB heap: a line the parser would buffer whole. The
     * run must stop after about the tenth of it that the heap can hold (so far less than 2 GiB is ever read), exit
     * 65 and say why.
     */
    @ParameterizedTest(name = "{0}")
    @CsvSource({"bases, A, 2, record big: longer than ", "blanks, ' ', 2, line longer than "})
    void twoGibibyteLineFailsFastInASmallHeap(String what, char fill, int line, String message)
            throws IOException, InterruptedException {
        Path out = dir.resolve("calls-" + what + ".gff3");
        Process p = ChildJvm.start(List.of("-Xmx256m"), "annotate", "-m", "cpg-island", "-o", out.toString(), "-");
        AtomicLong written = new AtomicLong();
        Thread feeder = new Thread(() -> feed(p.getOutputStream(), ">big\nAC", fill, TWO_GIB, written));
        feeder.start();
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(120, TimeUnit.SECONDS)).as("finished").isTrue();
        feeder.join(30_000);

        assertThat(p.exitValue()).as(err).isEqualTo(65);
        assertThat(err).hasLineCount(1).startsWith("annotator: error: <stdin>:" + line + ": " + message)
                .contains("the most this run can hold in memory (Java heap limit ").doesNotContain("OutOfMemory");
        // refused early: the heap holds well under 100 M bases here, the pipe a few more kilobytes
        assertThat(written.get()).isLessThan(200L << 20);
        assertThat(out).doesNotExist();
        try (Stream<Path> left = Files.list(dir)) {
            assertThat(left).isEmpty();
        }
    }

    /** Writes {@code head} then {@code fill} up to {@code total} bytes, until done or the reader is gone. */
    private static void feed(OutputStream to, String head, char fill, long total, AtomicLong written) {
        byte[] chunk = new byte[1 << 20];
        Arrays.fill(chunk, (byte) fill);
        try (OutputStream out = to) {
            byte[] h = head.getBytes(StandardCharsets.US_ASCII);
            out.write(h);
            written.addAndGet(h.length);
            while (written.get() < total) {
                out.write(chunk);
                written.addAndGet(chunk.length);
            }
        } catch (IOException readerGone) {
            // the run stopped reading, which is what the test waits for
        }
    }

    @Test
    void twoGibibyteHeaderLineIsRefusedAtOneMebibyte() {
        CountingInput in = new CountingInput(">".getBytes(StandardCharsets.US_ASCII), (byte) 'x', TWO_GIB);
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status;
        try (PrintStream errStream = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            status = Main.run(new String[] {"annotate", "-m", "cpg-island", "-"}, in, OutputStream.nullOutputStream(),
                    errStream);
        }
        assertThat(status).isEqualTo(65);
        assertThat(err.toString(StandardCharsets.UTF_8))
                .isEqualTo("annotator: error: <stdin>:1: header line longer than 1048576 bytes" + System.lineSeparator());
        assertThat(in.served).isLessThan(2L << 20);
    }

    /**
     * An order-12 model with its table (4^12 rows of 4 numbers, over a gigabyte of JSON) is refused by the model
     * file size limit, long before its table could be parsed; without the table, the order check refuses it (see
     * test-data/bad/model-order-12.json).
     */
    @Test
    void modelFileOverTheSizeLimitIsRefused() throws IOException {
        Path model = dir.resolve("order-12.json");
        try (Writer w = Files.newBufferedWriter(model, StandardCharsets.US_ASCII)) {
            w.write("{\"format\": \"annotator-hmm/1\", \"name\": \"huge\", \"description\": \"invented\", "
                    + "\"provenance\": {\"source\": \"invented for tests\"}, \"labels\": [], \"states\": [{\"name\": "
                    + "\"deep\", \"label\": \"x\", \"order\": 12, \"emissions\": {\n");
            char[] context = new char[12];
            long bytes = 0;
            for (int row = 0; bytes <= ModelJson.MAX_FILE_BYTES; row++) {
                for (int i = 0; i < 12; i++) {
                    context[i] = "ACGT".charAt((row >> (2 * (11 - i))) & 3);
                }
                String line = "\"" + new String(context) + "\": [0.25, 0.25, 0.25, 0.25],\n";
                w.write(line);
                bytes += line.length();
            }
        }
        assertThat(Files.size(model)).isGreaterThan(ModelJson.MAX_FILE_BYTES);
        CliRun.Result r = CliRun.run("model", "check", model.toString());
        CliAssertions.assertOneLineError(r, 65, model + ": larger than 64 MiB, the most a model file may be");
    }

    /** simulate samples a record whole: a length beyond the heap is refused before anything is sampled. */
    @Test
    void simulateLengthBeyondTheHeapIsAUsageError() throws IOException, InterruptedException {
        Path fa = dir.resolve("huge.fa");
        Process p = ChildJvm.start(List.of("-Xmx64m"), "simulate", "-m", "cpg-island", "--length", "100000000", "-o",
                fa.toString());
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
        assertThat(p.exitValue()).as(err).isEqualTo(2);
        assertThat(err).hasLineCount(1).startsWith("annotator: error: --length 100000000 is more than one record "
                + "this run can hold in memory (Java heap limit ");
        assertThat(fa).doesNotExist();
    }

    /** Should the sizing ever fall short, the heap running out is still one line and no partial output. */
    @Test
    void outOfMemoryIsOneLineAndLeavesNoOutput() throws IOException {
        InputStream exhausted = new InputStream() {
            @Override
            public int read() {
                throw new OutOfMemoryError("Java heap space (simulated by the test)");
            }

            @Override
            public int read(byte[] b, int off, int len) {
                return read();
            }
        };
        Path out = dir.resolve("calls.gff3");
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status;
        try (PrintStream errStream = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            status = Main.run(new String[] {"annotate", "-m", "cpg-island", "-o", out.toString(), "-"}, exhausted,
                    OutputStream.nullOutputStream(), errStream);
        }
        CliAssertions.assertOneLineError(new CliRun.Result(status, new byte[0], err.toString(StandardCharsets.UTF_8)),
                70, "annotator: error: out of memory (Java heap limit ");
        try (Stream<Path> left = Files.list(dir)) {
            assertThat(left).isEmpty();
        }
    }

    /** {@code head}, then {@code fill} bytes up to {@code total}, made as they are read. */
    private static final class CountingInput extends InputStream {
        private final byte[] head;
        private final byte fill;
        private final long total;
        long served;

        CountingInput(byte[] head, byte fill, long total) {
            this.head = head;
            this.fill = fill;
            this.total = total;
        }

        @Override
        public int read() {
            byte[] one = new byte[1];
            return read(one, 0, 1) < 0 ? -1 : one[0] & 0xFF;
        }

        @Override
        public int read(byte[] b, int off, int len) {
            if (served >= total) {
                return -1;
            }
            int n = (int) Math.min(len, total - served);
            for (int i = 0; i < n; i++) {
                long at = served + i;
                b[off + i] = at < head.length ? head[(int) at] : fill;
            }
            served += n;
            return n;
        }
    }
}
