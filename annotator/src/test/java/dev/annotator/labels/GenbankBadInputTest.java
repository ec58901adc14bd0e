package dev.annotator.labels;

import dev.annotator.error.AnnotatorException;
import dev.annotator.error.BadInputException;
import dev.annotator.seq.GenbankRecordReader;
import dev.annotator.seq.PublishedGenbankRecords;
import dev.annotator.testing.MarkdownTable;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

/**
 * The bad GenBank corpus, driven by the table "Bad GenBank inputs" in test-data/README.md: each row's file must be
 * refused with a one-line BadInputException (exit 65, EX_DATAERR of BSD sysexits(3), recalled from memory) whose
 * message is the path followed by the row's text.
 */
class GenbankBadInputTest {
    private static final Path README = PublishedGenbankRecords.testData("README.md");
    private static final Path FOLDER = PublishedGenbankRecords.testData("bad-genbank");
    private static final String SECTION = "## Bad GenBank inputs";

    record Row(String file, String refusedBy, String message) {
        @Override
        public String toString() {
            return file;
        }
    }

    static List<Row> rows() {
        return MarkdownTable.rows(README, SECTION, 4).stream()
                .map(c -> new Row(MarkdownTable.code(c[1]), c[2].strip(), MarkdownTable.code(c[4])))
                .toList();
    }

    @Test
    void tableAndFolderListTheSameFiles() throws IOException {
        List<String> present;
        try (Stream<Path> files = Files.list(FOLDER)) {
            present = files.map(p -> p.getFileName().toString()).toList();
        }
        assertThat(rows()).extracting(Row::file).doesNotHaveDuplicates().containsExactlyInAnyOrderElementsOf(present);
        assertThat(rows()).extracting(Row::refusedBy).containsOnly("sequence", "CDS").contains("sequence", "CDS");
    }

    @ParameterizedTest
    @MethodSource("rows")
    void refusedWithOneLineNamingFileAndLine(Row row) {
        String path = FOLDER.resolve(row.file()).toString();
        BadInputException cds = catchThrowableOfType(BadInputException.class,
                () -> GenbankCds.read(path, InputStream.nullInputStream()));
        assertOneLine(cds, path, row);
        BadInputException sequences = catchThrowableOfType(BadInputException.class, () -> readSequences(path));
        if (row.refusedBy().equals("sequence")) {
            assertOneLine(sequences, path, row);
        } else {
            assertThat(sequences).as("sequences of %s read without complaint", row.file()).isNull();
        }
    }

    private static void assertOneLine(AnnotatorException e, String path, Row row) {
        assertThat(e).as(row.file()).isNotNull();
        assertThat(e.exitCode()).isEqualTo(65);
        assertThat(e.getMessage()).startsWith(path + row.message()).doesNotContain("\n", "\r");
    }

    private static void readSequences(String path) {
        try (GenbankRecordReader r = GenbankRecordReader.open(path, InputStream.nullInputStream())) {
            while (r.next() != null) {
                // read to the end: every record's checks run
            }
        }
    }
}
