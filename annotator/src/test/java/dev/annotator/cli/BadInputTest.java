package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;

import static dev.annotator.cli.CliAssertions.assertOneLineError;
import static org.assertj.core.api.Assertions.assertThat;

/**
 * Inputs a user can get wrong that are not files of the bad-input corpus (those are run from their table by
 * {@link BadInputCorpusTest}), driven through the command line. Each must end with the documented exit status,
 * one line on standard error that names the culprit, no stack trace, and no output file (final or temporary)
 * left in the output directory.
 *
 * <p>Exit statuses are those of the README's "Exit status" table. 65, 66 and 74 are EX_DATAERR, EX_NOINPUT and
 * EX_IOERR of BSD sysexits(3) (recalled from memory); 2 for a bad command line is common practice.
 */
class BadInputTest {
    private static final int USAGE = 2;
    private static final int DATA = 65;
    private static final int NO_INPUT = 66;
    private static final int IO = 74;

    @TempDir
    Path tmp;

    @Test
    void truncatedGzipIsBadData() throws IOException {
        byte[] gz = TestInputs.gzip(TestInputs.randomFasta(3, 20_000, 5));
        // cut inside the compressed data, and inside the 10-byte member header (RFC 1952, section 2.3)
        for (int keep : new int[] {gz.length / 2, 6}) {
            Path input = Files.write(tmp.resolve("cut-at-" + keep + ".fa.gz"), Arrays.copyOf(gz, keep));
            Path outDir = outDir();
            CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "--threads", "2", "-o",
                    outDir.resolve("calls.gff3").toString(), input.toString());
            assertOneLineError(r, DATA, input + ": truncated or corrupt gzip data");
            assertNothingWritten(r, outDir);
        }
        // the untruncated file is fine, so the failures above come from the cut alone
        Path whole = Files.write(tmp.resolve("whole.fa.gz"), gz);
        assertThat(CliRun.run("annotate", "-q", "-m", "cpg-island", whole.toString()).status()).isZero();
    }

    @Test
    void badRecordAfterGoodOnesLeavesNoPartialOutput() throws IOException {
        // two good records are read (with one thread also decoded and written out) before the third one fails
        byte[] good = TestInputs.randomFasta(2, 50_000, 9);
        byte[] bad = ">late\nACGT\nACGTACXT\n".getBytes(StandardCharsets.US_ASCII);
        Path input = Files.write(tmp.resolve("late-error.fa"), concat(good, bad));
        long badLine = new String(good, StandardCharsets.US_ASCII).lines().count() + 3;
        for (String threads : List.of("1", "2")) {
            Path outDir = outDir();
            CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "--threads", threads, "-o",
                    outDir.resolve("calls.gff3").toString(), input.toString());
            assertOneLineError(r, DATA, input + ":" + badLine + ": record late: invalid character 'X'");
            assertNothingWritten(r, outDir);
        }
    }

    @Test
    void debugAddsTheStackTraceAndOnlyDebugDoes() {
        Path input = CliRun.testData("bad", "digit-in-sequence.fa");
        String error = "annotator: error: " + input + ":3: record seqA: invalid character '9' (0x39) in sequence";
        CliRun.Result plain = CliRun.run("annotate", "-m", "cpg-island", input.toString());
        assertOneLineError(plain, DATA, error);
        CliRun.Result debug = CliRun.run("annotate", "--debug", "-m", "cpg-island", input.toString());
        assertThat(debug.status()).isEqualTo(DATA);
        assertThat(debug.errLines().get(0)).isEqualTo(error);
        assertThat(debug.stderr()).contains("BadInputException").contains("\tat dev.annotator.");
    }

    @Test
    void missingInputFile() throws IOException {
        Path input = tmp.resolve("no-such-input.fa");
        Path outDir = outDir();
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-o", outDir.resolve("calls.gff3").toString(),
                input.toString());
        assertOneLineError(r, NO_INPUT, input + ": no such file");
        assertNothingWritten(r, outDir);
    }

    @Test
    void missingModelName() throws IOException {
        Path outDir = outDir();
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-islands", "-o", outDir.resolve("calls.gff3").toString(),
                CliRun.testData("fasta", "two-records.fa").toString());
        // the message also tells what would have worked
        assertOneLineError(r, NO_INPUT, "cpg-islands: no such model file or shipped model (shipped: cpg-island, bacterial-genes)");
        assertNothingWritten(r, outDir);

        assertOneLineError(CliRun.run("model", "check", "cpg-islands"), NO_INPUT, "cpg-islands: no such model");
        Path simOut = outDir.resolve("sim.fa");
        CliRun.Result sim = CliRun.run("simulate", "-m", "cpg-islands", "--length", "100", "-o", simOut.toString());
        assertOneLineError(sim, NO_INPUT, "cpg-islands: no such model");
        assertNothingWritten(sim, outDir);
    }

    @Test
    void missingOutputDirectory() throws IOException {
        Path missing = tmp.resolve("not-made-yet");
        Path out = missing.resolve("calls.gff3");
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-o", out.toString(),
                CliRun.testData("fasta", "two-records.fa").toString());
        assertOneLineError(r, IO, out + ": output directory " + missing + " does not exist");
        assertThat(missing).doesNotExist();

        // simulate writes two files; the FASTA's directory exists, the truth's does not: neither may appear
        Path outDir = outDir();
        Path truth = missing.resolve("truth.gff3");
        CliRun.Result sim = CliRun.run("simulate", "-m", "cpg-island", "--length", "1000", "-o",
                outDir.resolve("sim.fa").toString(), "--truth", truth.toString());
        assertOneLineError(sim, IO, truth + ": output directory " + missing + " does not exist");
        assertNothingWritten(sim, outDir);
    }

    @Test
    void demoDirectoryThatIsAFile() throws IOException {
        Path file = Files.writeString(tmp.resolve("taken"), "a file, not a directory\n");
        CliRun.Result r = CliRun.run("demo", "--out", file.toString());
        assertOneLineError(r, IO, file + ": exists and is not a directory");
        assertThat(r.stdout()).isEmpty();
        assertThat(Files.readString(file)).isEqualTo("a file, not a directory\n");
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            unknown option           | --colour=red      | -m=cpg-island | Unknown option: '--colour=red'
            missing required option  | --threads=2       | --quiet       | Missing required option: '--model=MODEL'
            zero threads             | --threads=0       | -m=cpg-island | --threads must be at least 1, got 0
            unknown decoding         | --decode=foo      | -m=cpg-island | Invalid value for option '--decode'
            negative minimum length  | --min-length=-5   | -m=cpg-island | --min-length must not be negative
            """)
    void badCommandLineIsUsageError(String why, String option, String other, String what) throws IOException {
        Path outDir = outDir();
        CliRun.Result r = CliRun.run("annotate", option, other, "-o", outDir.resolve("calls.gff3").toString(),
                CliRun.testData("fasta", "two-records.fa").toString());
        assertOneLineError(r, USAGE, what);
        // a usage error points at the help of the command that was mistyped
        assertThat(r.stderr()).contains("(see 'annotator annotate --help')");
        assertNothingWritten(r, outDir);
    }

    @Test
    void usageErrorsOfTheOtherCommands() {
        assertOneLineError(CliRun.run("anotate", "-m", "cpg-island", "x.fa"), USAGE, "'anotate'");
        assertOneLineError(CliRun.run("simulate", "-m", "cpg-island", "-o", tmp.resolve("s.fa").toString()), USAGE,
                "Missing required option: '--length=BP'");
        assertOneLineError(CliRun.run("simulate", "-m", "cpg-island", "--length", "0", "-o",
                tmp.resolve("s.fa").toString()), USAGE, "--length must be at least 1, got 0");
        assertOneLineError(CliRun.run("model", "check"), USAGE, "Missing required parameter: 'MODEL'");
        assertThat(tmp.resolve("s.fa")).doesNotExist();
    }

    private static void assertNothingWritten(CliRun.Result r, Path outDir) throws IOException {
        assertThat(r.stdout()).as("stdout when -o is given").isEmpty();
        try (Stream<Path> left = Files.list(outDir)) {
            // neither the output nor its hidden temporary ".NAME.*.partial" may survive a failed run
            assertThat(left.map(p -> p.getFileName().toString())).isEmpty();
        }
    }

    private Path outDir() throws IOException {
        return Files.createTempDirectory(tmp, "out");
    }

    private static byte[] concat(byte[] a, byte[] b) {
        byte[] both = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, both, a.length, b.length);
        return both;
    }
}
