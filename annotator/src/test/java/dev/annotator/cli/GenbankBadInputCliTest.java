package dev.annotator.cli;

import dev.annotator.error.ExitCodes;
import dev.annotator.testing.MarkdownTable;
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
 * The bad GenBank corpus (table "Bad GenBank inputs" in test-data/README.md) through the command line, as a user
 * meets it: a file refused for its sequence is refused by annotate, one refused for a CDS by train when it gives
 * the labels. One error line naming the file and line, exit 65, no output left. The file without a LOCUS line does
 * not look like GenBank and is read as FASTA; it is refused as such (also one line).
 */
class GenbankBadInputCliTest {
    @TempDir
    Path dir;

    record Row(String file, String refusedBy, String message) {
        @Override
        public String toString() {
            return file;
        }
    }

    static List<Row> rows() {
        return MarkdownTable.rows(CliRun.testData("README.md"), "## Bad GenBank inputs", 4).stream()
                .map(c -> new Row(MarkdownTable.code(c[1]), c[2].strip(), MarkdownTable.code(c[4])))
                .toList();
    }

    @ParameterizedTest
    @MethodSource("rows")
    void refusedThroughTheCommandLine(Row row) throws IOException {
        String path = CliRun.testData("bad-genbank", row.file()).toString();
        Path out = dir.resolve("out");
        CliRun.Result r = row.refusedBy().equals("sequence")
                ? CliRun.run("annotate", "-m", "bacterial-genes", "-o", out.toString(), path)
                : CliRun.run("train", "-m", "bacterial-genes", "--method", "counting", "--labels", path, "-o",
                out.toString(), path);
        String expected = row.file().equals("no-locus.gb") ? path + ":1: " : path + row.message();
        CliAssertions.assertOneLineError(r, ExitCodes.DATA, expected);
        try (Stream<Path> left = Files.list(dir)) {
            assertThat(left).as("nothing written").isEmpty();
        }
    }
}
