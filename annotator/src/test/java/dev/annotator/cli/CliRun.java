package dev.annotator.cli;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;

/** Runs one command line in-process, as a user would type it, on byte-array standard streams. */
final class CliRun {
    private CliRun() {
    }

    /** What the user sees: the exit status and everything printed on each stream. */
    record Result(int status, byte[] stdout, String stderr) {
        String out() {
            return new String(stdout, StandardCharsets.UTF_8);
        }

        List<String> errLines() {
            return stderr.lines().toList();
        }
    }

    static Result run(String... args) {
        return withStdin(new byte[0], args);
    }

    static Result withStdin(byte[] stdin, String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status;
        try (PrintStream errStream = new PrintStream(err, true, StandardCharsets.UTF_8)) {
            status = Main.run(args, new ByteArrayInputStream(stdin), out, errStream);
        }
        return new Result(status, out.toByteArray(), err.toString(StandardCharsets.UTF_8));
    }

    /** A checked-in fixture under the top-level test-data folder (tests run in the module directory). */
    static Path testData(String first, String... more) {
        return Path.of(System.getProperty("basedir", "."), "..", "test-data").resolve(Path.of(first, more))
                .normalize();
    }
}
