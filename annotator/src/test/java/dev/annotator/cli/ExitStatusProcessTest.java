package dev.annotator.cli;

import org.junit.jupiter.api.Test;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.assertj.core.api.Assertions.assertThat;

/** The exit status reaches the operating system when the command line runs as its own process. */
class ExitStatusProcessTest {
    private static final Path DEV_FULL = Path.of("/dev/full");

    private record Outcome(int status, String stderr) {
    }

    @Test
    void exitStatusReachesTheOperatingSystem() throws IOException, InterruptedException {
        Path input = CliRun.testData("bad", "digit-in-sequence.fa");
        Outcome bad = run(ProcessBuilder.Redirect.DISCARD, "annotate", "-m", "cpg-island", input.toString());
        // 65 = EX_DATAERR of BSD sysexits(3) (recalled from memory), as the README's exit status table says
        assertThat(bad.status()).as(bad.stderr()).isEqualTo(65);
        assertThat(bad.stderr()).isEqualTo("annotator: error: " + input + ":3: record seqA: invalid character '9' "
                + "(0x39) in sequence" + System.lineSeparator());

        // Linux's /dev/full fails every write with ENOSPC; the process's real standard output must report it
        // (74, EX_IOERR) rather than lose the output and exit 0
        if (Files.exists(DEV_FULL) && !Files.isRegularFile(DEV_FULL) && Files.isWritable(DEV_FULL)) {
            Outcome full = run(ProcessBuilder.Redirect.to(DEV_FULL.toFile()), "annotate", "-m", "cpg-island",
                    CliRun.testData("fasta", "two-records.fa").toString());
            assertThat(full.status()).as(full.stderr()).isEqualTo(74);
            assertThat(full.stderr()).startsWith("annotator: error: <stdout>: write failed").hasLineCount(1);
        }
    }

    private static Outcome run(ProcessBuilder.Redirect stdout, String... args)
            throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java")
                .toString(), "-cp", System.getProperty("java.class.path"), "dev.annotator.cli.Main"));
        command.addAll(List.of(args));
        Process p = new ProcessBuilder(command)
                .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")))
                .redirectOutput(stdout)
                .start();
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).as("finished").isTrue();
        return new Outcome(p.exitValue(), err);
    }
}
