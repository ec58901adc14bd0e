package dev.annotator.seq;

import dev.annotator.error.AnnotatorException;
import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.error.MissingInputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.SequenceInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.zip.GZIPOutputStream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.tuple;

class FastaRecordReaderTest {

    @TempDir
    Path dir;

    private final List<String> warnings = new ArrayList<>();

    @Test
    void readsRecordsInOrderWithNamesDescriptionsAndBases() throws IOException {
        Path f = write("multi.fa", """
                >chr1 first demo record
                ACGTACGTAC
                GTNNNNACGT
                AC
                >chr2\tsecond\trecord\t
                TTTT
                >  chr3  padded   header \s
                G
                """);
        List<SequenceRecord> records = readAll(f.toString());
        assertThat(records).extracting(SequenceRecord::name, SequenceRecord::description, FastaRecordReaderTest::text)
                .containsExactly(
                        tuple("chr1", "first demo record", "ACGTACGTACGTNNNNACGTAC"),
                        tuple("chr2", "second\trecord", "TTTT"),
                        tuple("chr3", "padded   header", "G"));
        assertThat(records.get(0).length()).isEqualTo(22);
        assertThat(warnings).isEmpty();
    }

    @Test
    void readsTheCheckedInFixture() {
        Path fixture = Path.of(System.getProperty("basedir", "."), "..", "test-data", "fasta", "two-records.fa");
        assertThat(readAll(fixture.toString()))
                .extracting(SequenceRecord::name, SequenceRecord::description, FastaRecordReaderTest::text)
                .containsExactly(
                        tuple("demoA", "invented two-record example; soft-masked tail",
                                "ACGTACGTNNRYACGTCCGGCGCGtataacgt"),
                        tuple("demoB", "", "GGGCCCAAATTTU"));
    }

    @Test
    void gzipAndPlainGiveEqualRecords() throws IOException {
        String fasta = randomFasta(new Random(7), 5, 3000, 70);
        Path plain = write("plain.fa", fasta);
        Path packed = Files.write(dir.resolve("packed.fa.gz"), gzip(fasta.getBytes(StandardCharsets.US_ASCII)));
        List<SequenceRecord> a = readAll(plain.toString());
        List<SequenceRecord> b = readAll(packed.toString());
        assertThat(a).hasSize(5);
        assertThat(b).extracting(SequenceRecord::name).isEqualTo(a.stream().map(SequenceRecord::name).toList());
        assertThat(b).extracting(FastaRecordReaderTest::text).isEqualTo(a.stream().map(FastaRecordReaderTest::text).toList());
    }

    @Test
    void dashReadsStdin() {
        InputStream stdin = new ByteArrayInputStream(">s1\nACGT\n>s2 x\nGG\n".getBytes(StandardCharsets.US_ASCII));
        List<SequenceRecord> records = new ArrayList<>();
        try (FastaRecordReader r = FastaRecordReader.open("-", stdin, warnings::add)) {
            for (SequenceRecord rec; (rec = r.next()) != null; ) {
                records.add(rec);
            }
            assertThat(r.next()).as("stays at the end").isNull();
        }
        assertThat(records).extracting(SequenceRecord::name, FastaRecordReaderTest::text)
                .containsExactly(tuple("s1", "ACGT"), tuple("s2", "GG"));
    }

    @Test
    void errorsFromStdinNameIt() {
        InputStream stdin = new ByteArrayInputStream(">s1\nAC*T\n".getBytes(StandardCharsets.US_ASCII));
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> {
            try (FastaRecordReader r = FastaRecordReader.open("-", stdin, warnings::add)) {
                r.next();
            }
        });
        assertThat(e).hasMessage("<stdin>:2: record s1: invalid character '*' (0x2a) in sequence");
    }

    @Test
    void crlfLineEndsAndMissingFinalNewline() throws IOException {
        Path f = write("crlf.fa", ">a first\r\nACGT\r\nGG\r\n\r\n>b\r\nTTT");
        assertThat(readAll(f.toString())).extracting(SequenceRecord::name, SequenceRecord::description,
                        FastaRecordReaderTest::text)
                .containsExactly(tuple("a", "first", "ACGTGG"), tuple("b", "", "TTT"));
    }

    @Test
    void crlfCountsAsOneLineInMessages() throws IOException {
        Path f = write("crlf-bad.fa", ">a\r\nACGT\r\n\r\nACJT\r\n");
        assertBad(f, f + ":4: record a: invalid character 'J' (0x4a) in sequence");
    }

    @Test
    void loneCarriageReturnsEndLinesToo() throws IOException {
        // java.io.BufferedReader#readLine, which BioJava's reader copies, also ends lines at a lone CR
        Path f = write("cr.fa", ">a x\rACGT\rGG\r>b\rT\r");
        assertThat(readAll(f.toString())).extracting(SequenceRecord::name, SequenceRecord::description,
                        FastaRecordReaderTest::text)
                .containsExactly(tuple("a", "x", "ACGTGG"), tuple("b", "", "T"));
        Path bad = write("cr-bad.fa", ">a\rAC\rA1\r");
        assertBad(bad, bad + ":3: record a: invalid character '1' (0x31) in sequence");
    }

    @Test
    void missingFinalNewlineAfterHeaderIsAnEmptyRecord() throws IOException {
        Path f = write("tail.fa", ">a\nAC\n>b");
        assertThat(readAll(f.toString())).extracting(SequenceRecord::name).containsExactly("a");
        assertThat(warnings).containsExactly(f + ":3: record b has no sequence; skipped");
    }

    @Test
    void softMaskedLowercaseIsKept() throws IOException {
        Path f = write("soft.fa", ">m\nACGTacgtNNnnACgt\nrykm\n");
        assertThat(readAll(f.toString())).extracting(FastaRecordReaderTest::text).containsExactly("ACGTacgtNNnnACgtrykm");
    }

    @Test
    void blanksInsideSequenceLinesAreIgnored() throws IOException {
        Path f = write("blanks.fa", ">b\n  AC GT\tAA  \n\tCC \n");
        SequenceRecord r = readAll(f.toString()).get(0);
        assertThat(text(r)).isEqualTo("ACGTAACC");
        assertThat(r.length()).isEqualTo(8);
    }

    @Test
    void commentLinesAreIgnored() throws IOException {
        Path f = write("comments.fa", "; made up for a test\n>c\nAC\n;between lines\nGT\n");
        assertThat(readAll(f.toString())).extracting(FastaRecordReaderTest::text).containsExactly("ACGT");
    }

    @Test
    void nonAsciiHeaderIsReadAsUtf8() throws IOException {
        Path f = write("utf8.fa", ">séq1 µ-demo\nAC\n".getBytes(StandardCharsets.UTF_8));
        assertThat(readAll(f.toString())).extracting(SequenceRecord::name, SequenceRecord::description)
                .containsExactly(tuple("séq1", "µ-demo"));
    }

    @Test
    void emptyInput() throws IOException {
        Path empty = write("empty.fa", "");
        assertBad(empty, empty + ": no FASTA records (empty input)");
        Path blank = write("blank.fa", "\n  \n\r\n; only a comment\n");
        assertBad(blank, blank + ": no FASTA records (empty input)");
    }

    @Test
    void sequenceBeforeFirstHeader() throws IOException {
        Path f = write("headless.fa", "\nACGT\n>a\nAC\n");
        assertBad(f, f + ":2: sequence data before the first '>' header");
        Path binary = write("binary.fa", new byte[] {0x50, 0x4b, 0x03, 0x04, 0, 0});
        assertBad(binary, binary + ": zip-compressed data; only plain or gzip-compressed input is read "
                + "(decompress it first)");
    }

    @Test
    void whatCannotBeFastaIsNamedForWhatItIs() throws IOException {
        Path fastq = write("reads.fq", "@r1\nACGT\n+\nIIII\n");
        assertBad(fastq, fastq + ":1: not FASTA: expected a '>' header line, found '@'");
        Path bom = write("bom.fa", new byte[] {(byte) 0xef, (byte) 0xbb, (byte) 0xbf, '>', 'a', '\n', 'A', '\n'});
        assertBad(bom, bom + ":1: not FASTA text: byte 0xef before the first '>' header");
        Path nul = write("nul.fa", new byte[] {'\n', 0, '>', 'a'});
        assertBad(nul, nul + ":2: not FASTA text: byte 0x00 before the first '>' header");
    }

    @Test
    void headerWithControlByteOrBrokenUtf8() throws IOException {
        Path esc = write("esc.fa", ">a\nAC\n>b\u001b[0m desc\nGG\n");
        assertBad(esc, esc + ":3: header has control byte 0x1b");
        // DEL is no C0 control byte and stays part of the name (the conformance tests escape it in GFF3)
        assertThat(readAll(write("del.fa", ">a\u007fb desc\nAC\n").toString())).extracting(SequenceRecord::name)
                .containsExactly("a\u007fb");
        // a tab separates name and description and is no control byte here
        assertThat(readAll(write("tab.fa", ">a\tdesc\nAC\n").toString())).extracting(SequenceRecord::name)
                .containsExactly("a");
        Path latin1 = write("latin1.fa", new byte[] {'>', 's', (byte) 0xe9, 'q', '\n', 'A', '\n'});
        assertBad(latin1, latin1 + ":1: header is not valid UTF-8 text");
    }

    @Test
    void headerAndCommentLinesAreBoundedAtOneMebibyte() throws IOException {
        int max = FastaLineScanner.MAX_HEADER_LENGTH;
        // a header line of exactly the limit, '>' included, is read; one byte more is refused
        String name = "n" + "x".repeat(max - 2);
        assertThat(readAll(write("at-limit.fa", ">" + name + "\nACGT\n").toString()))
                .extracting(SequenceRecord::name).containsExactly(name);
        Path over = write("over.fa", ">" + name + "x\nACGT\n");
        assertBad(over, over + ":1: header line longer than " + max + " bytes");
        Path comment = write("comment.fa", ">a\nAC\n;" + "c".repeat(max) + "\nGT\n");
        assertBad(comment, comment + ":3: comment line longer than " + max + " bytes");
    }

    @Test
    void blanksCountTowardsTheLineBoundOfTheRecordLimit() {
        // the parser buffers a whole line, blanks included, before trimming it: a long run of blanks costs as
        // much memory as bases
        RecordLengthLimit ten = new RecordLengthLimit(10, "the test's limit");
        assertThat(scan(">a\nACGTA  CGTA\n", ten)).extracting(FastaRecordReaderTest::text)
                .containsExactly("ACGTACGTA");
        assertThat(catchThrowableOfType(BadInputException.class, () -> scan(">a\nAC         GT\n", ten)))
                .hasMessage("t.fa:2: line longer than 10 bytes, the test's limit");
        assertThat(catchThrowableOfType(BadInputException.class, () -> scan(">a\nAC\n           \nGT\n", ten)))
                .hasMessage("t.fa:3: line longer than 10 bytes, the test's limit");
    }

    @Test
    void headerWithoutName() throws IOException {
        Path bare = write("bare.fa", ">\nACGT\n");
        assertBad(bare, bare + ":1: header has no sequence name");
        Path spaces = write("spaces.fa", ">a\nAC\n>   \t \nGG\n");
        assertBad(spaces, spaces + ":3: header has no sequence name");
    }

    @ParameterizedTest
    @CsvSource({
            "4a, 'J' (0x4a)",
            "31, '1' (0x31)",
            "2a, '*' (0x2a)",
            "2d, '-' (0x2d)",
            "3e, '>' (0x3e)",
            "00, 0x00",
            "0b, 0x0b",
            "7f, 0x7f",
            "ff, 0xff",
            "c3, 0xc3",
    })
    void invalidCharacterInSequence(String hex, String shown) throws IOException {
        byte bad = (byte) Integer.parseInt(hex, 16);
        byte[] data = ">x desc\nACGT\nAC?T\n".getBytes(StandardCharsets.US_ASCII);
        data[data.length - 3] = bad;
        Path f = write("bad-" + hex + ".fa", data);
        assertBad(f, f + ":3: record x: invalid character " + shown + " in sequence");
    }

    @Test
    void duplicateRecordName() throws IOException {
        Path f = write("dup.fa", ">a one\nAC\n>b\nGG\n>a two\nTT\n");
        assertBad(f, f + ":5: duplicate record name 'a' (first seen at line 1)");
    }

    @Test
    void emptyRecordsAreWarnedAndSkipped() throws IOException {
        // BioJava drops "b" here without telling anyone; the scanner's header queue catches it
        Path f = write("holes.fa", ">a\n>b desc\n\n>c\nACGT\n>d\n>e\nGG\n>f\n");
        List<SequenceRecord> records = readAll(f.toString());
        assertThat(records).extracting(SequenceRecord::name, FastaRecordReaderTest::text)
                .containsExactly(tuple("c", "ACGT"), tuple("e", "GG"));
        assertThat(warnings).containsExactly(
                f + ":1: record a has no sequence; skipped",
                f + ":2: record b has no sequence; skipped",
                f + ":6: record d has no sequence; skipped",
                f + ":9: record f has no sequence; skipped");
    }

    @Test
    void onlyEmptyRecordsIsAnError() throws IOException {
        Path f = write("hollow.fa", ">a\n>b\n");
        assertBad(f, f + ": no FASTA records with sequence (2 empty records skipped)");
        assertThat(warnings).hasSize(2);
    }

    @Test
    void truncatedGzip() throws IOException {
        byte[] gz = gzip(randomFasta(new Random(11), 3, 50_000, 60).getBytes(StandardCharsets.US_ASCII));
        Path f = Files.write(dir.resolve("cut.fa.gz"), Arrays.copyOf(gz, gz.length / 2));
        assertBad(f, f + ": truncated or corrupt gzip data");
    }

    @Test
    void readFailureIsIoFailure() {
        InputStream stdin = new SequenceInputStream(
                new ByteArrayInputStream(">a\nACGT\n".getBytes(StandardCharsets.US_ASCII)),
                new InputStream() {
                    @Override
                    public int read() throws IOException {
                        throw new IOException("device gone");
                    }
                });
        IoFailureException e = catchThrowableOfType(IoFailureException.class, () -> {
            try (FastaRecordReader r = FastaRecordReader.open("-", stdin, warnings::add)) {
                while (r.next() != null) {
                    // drain
                }
            }
        });
        assertThat(e).hasMessage("<stdin>: read failed: device gone");
        assertThat(e.exitCode()).isEqualTo(74);
    }

    @Test
    void missingFileIsMissingInput() {
        String path = dir.resolve("absent.fa").toString();
        MissingInputException e = catchThrowableOfType(MissingInputException.class,
                () -> FastaRecordReader.open(path, null, warnings::add));
        assertThat(e).hasMessage(path + ": no such file");
        assertThat(e.exitCode()).isEqualTo(66);
    }

    @Test
    void twelveMegabaseSingleLineRecord() throws IOException {
        byte[] bases = randomBases(new Random(3), 12_000_000);
        ByteArrayOutputStream file = new ByteArrayOutputStream();
        file.writeBytes(">long one line\n".getBytes(StandardCharsets.US_ASCII));
        file.writeBytes(bases);
        file.writeBytes("\n>short\nACGT\n".getBytes(StandardCharsets.US_ASCII));
        Path f = Files.write(dir.resolve("long.fa"), file.toByteArray());
        List<SequenceRecord> records = readAll(f.toString());
        assertThat(records).extracting(SequenceRecord::name).containsExactly("long", "short");
        assertThat(records.get(0).length()).isEqualTo(12_000_000);
        assertThat(Arrays.equals(records.get(0).bases(), bases)).isTrue();
    }

    @Test
    void recordLongerThanTheLimitIsRejected() {
        byte[] data = ">big\nACGTA\nCGTAC\nGT\n".getBytes(StandardCharsets.US_ASCII);
        FastaLineScanner scanner = new FastaLineScanner(new ByteArrayInputStream(data), "t.fa",
                new RecordLengthLimit(10, "the most one record can hold"));
        BadInputException e = catchThrowableOfType(BadInputException.class, () -> {
            try (FastaRecordReader r = new FastaRecordReader("t.fa", scanner, warnings::add)) {
                r.next();
            }
        });
        assertThat(e).hasMessage("t.fa:4: record big: longer than 10 bases, the most one record can hold");
    }

    // ---- helpers ----

    private List<SequenceRecord> scan(String text, RecordLengthLimit limit) {
        FastaLineScanner scanner = new FastaLineScanner(
                new ByteArrayInputStream(text.getBytes(StandardCharsets.US_ASCII)), "t.fa", limit);
        List<SequenceRecord> out = new ArrayList<>();
        try (FastaRecordReader r = new FastaRecordReader("t.fa", scanner, warnings::add)) {
            for (SequenceRecord rec; (rec = r.next()) != null; ) {
                out.add(rec);
            }
        }
        return out;
    }

    private void assertBad(Path f, String message) {
        AnnotatorException e = catchThrowableOfType(AnnotatorException.class, () -> readAll(f.toString()));
        assertThat(e).isInstanceOf(BadInputException.class).hasMessage(message);
        assertThat(e.exitCode()).isEqualTo(65);
    }

    private List<SequenceRecord> readAll(String path) {
        List<SequenceRecord> out = new ArrayList<>();
        try (FastaRecordReader r = FastaRecordReader.open(path, null, warnings::add)) {
            for (SequenceRecord rec; (rec = r.next()) != null; ) {
                out.add(rec);
            }
        }
        return out;
    }

    private Path write(String name, String content) throws IOException {
        return write(name, content.getBytes(StandardCharsets.ISO_8859_1));
    }

    private Path write(String name, byte[] content) throws IOException {
        return Files.write(dir.resolve(name), content);
    }

    static String text(SequenceRecord r) {
        return new String(r.bases(), StandardCharsets.ISO_8859_1);
    }

    static byte[] gzip(byte[] data) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (GZIPOutputStream out = new GZIPOutputStream(bytes)) {
            out.write(data);
        }
        return bytes.toByteArray();
    }

    static byte[] randomBases(Random random, int n) {
        byte[] alphabet = "ACGTACGTACGTacgtN".getBytes(StandardCharsets.US_ASCII);
        byte[] out = new byte[n];
        for (int i = 0; i < n; i++) {
            out[i] = alphabet[random.nextInt(alphabet.length)];
        }
        return out;
    }

    /** Records named rec1..recN with a description, random lengths up to maxLength, wrapped at width. */
    static String randomFasta(Random random, int records, int maxLength, int width) {
        StringBuilder sb = new StringBuilder();
        for (int r = 1; r <= records; r++) {
            sb.append(">rec").append(r).append(" generated record ").append(r).append('\n');
            String seq = new String(randomBases(random, 1 + random.nextInt(maxLength)), StandardCharsets.US_ASCII);
            for (int i = 0; i < seq.length(); i += width) {
                sb.append(seq, i, Math.min(seq.length(), i + width)).append('\n');
            }
        }
        return sb.toString();
    }
}
