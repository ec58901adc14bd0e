package dev.annotator.cli;

import dev.annotator.testing.MarkdownTable;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The bad-input corpus, driven by its own documentation: every row of the table "Bad inputs" in test-data/README.md
 * is run through the command line, so the table is the specification and cannot drift from the files or the tests.
 *
 * <p>Exit statuses are those of the README's "Exit status" table: 65 is EX_DATAERR of BSD sysexits(3) (recalled
 * from memory).
 */
class BadInputCorpusTest {
    private static final Path README = CliRun.testData("README.md");
    private static final Path BAD = CliRun.testData("bad");
    private static final String SECTION = "## Bad inputs";

    /** One table row: the file, how it is used, what is wrong with it, the exit status, the message after the file. */
    record Row(String file, String usedAs, String what, int exit, String message) {
        @Override
        public String toString() {
            return file;
        }
    }

    @TempDir
    Path tmp;

    static List<Row> rows() {
        return MarkdownTable.rows(README, SECTION, 5).stream()
                .map(c -> new Row(MarkdownTable.code(c[1]), c[2].strip(), c[3].strip(),
                        Integer.parseInt(c[4].strip()), MarkdownTable.code(c[5])))
                .toList();
    }

    @Test
    void tableAndFolderListTheSameFilesAndEnoughOfThem() throws IOException {
        List<String> listed = rows().stream().map(Row::file).toList();
        List<String> present;
        try (Stream<Path> files = Files.list(BAD)) {
            present = files.map(p -> p.getFileName().toString()).toList();
        }
        assertThat(listed).doesNotHaveDuplicates().containsExactlyInAnyOrderElementsOf(present);
        // the hardening issue asks for a corpus of at least 40 bad inputs
        assertThat(listed).hasSizeGreaterThanOrEqualTo(40);
        assertThat(rows()).allSatisfy(r -> {
            assertThat(r.usedAs()).isIn("FASTA", "model", "labels");
            assertThat(r.what()).isNotBlank();
            assertThat(r.message()).isNotBlank();
        });
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rows")
    void everyRowFailsAsTheTableSays(Row row) throws IOException {
        Path file = BAD.resolve(row.file());
        Path outDir = Files.createTempDirectory(tmp, "out");
        String out = outDir.resolve("calls.gff3").toString();
        if (row.usedAs().equals("FASTA")) {
            assertFails(row, file, CliRun.run("annotate", "-m", "cpg-island", "-o", out, file.toString()));
        } else if (row.usedAs().equals("labels")) {
            // known features for training by counting, against the two-record fixture
            assertFails(row, file, CliRun.run("train", "-m", "cpg-island", "--method", "counting", "--labels",
                    file.toString(), "-o", outDir.resolve("trained.json").toString(),
                    CliRun.testData("fasta", "two-records.fa").toString()));
        } else {
            assertFails(row, file, CliRun.run("annotate", "-m", file.toString(), "-o", out,
                    CliRun.testData("fasta", "two-records.fa").toString()));
            CliRun.Result check = CliRun.run("model", "check", file.toString());
            assertFails(row, file, check);
        }
        try (Stream<Path> left = Files.list(outDir)) {
            // neither the output nor its hidden temporary ".NAME.*.partial" may survive a failed run
            assertThat(left.map(p -> p.getFileName().toString())).as("files left by a failed run").isEmpty();
        }
    }

    private static void assertFails(Row row, Path file, CliRun.Result r) {
        assertThat(r.status()).as("exit status; stderr: %s", r.stderr()).isEqualTo(row.exit());
        assertThat(r.stdout()).as("stdout").isEmpty();
        List<String> lines = r.errLines();
        assertThat(lines).as("stderr").isNotEmpty();
        // warnings may come first (skipped empty records); the error is the one last line
        assertThat(lines.subList(0, lines.size() - 1)).allMatch(l -> l.startsWith("annotator: warning: "));
        assertThat(lines.get(lines.size() - 1)).startsWith("annotator: error: " + file + row.message())
                .doesNotContain("Exception").doesNotContain("\tat ");
    }
}
