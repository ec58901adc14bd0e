package dev.annotator.seq;

import htsjdk.samtools.reference.FastaSequenceFile;
import htsjdk.samtools.reference.ReferenceSequence;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayOutputStream;
import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class FastaWriterTest {

    private static String write(SequenceRecord... records) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (FastaWriter w = new FastaWriter(bytes)) {
            for (SequenceRecord r : records) {
                w.write(r);
            }
        }
        return bytes.toString(StandardCharsets.UTF_8);
    }

    private static byte[] bases(String s) {
        return s.getBytes(StandardCharsets.US_ASCII);
    }

    @Test
    void headerAndSixtyBaseLines() throws IOException {
        String seq = "ACGT".repeat(30) + "acgtn"; // 125 bases: lines of 60, 60, 5
        String out = write(new SequenceRecord("s1", "demo record", bases(seq)));
        assertThat(out).isEqualTo(">s1 demo record\n" + seq.substring(0, 60) + "\n" + seq.substring(60, 120) + "\n"
                + seq.substring(120) + "\n");
    }

    @Test
    void noTrailingSpaceWithoutDescriptionAndExactMultipleOfTheWidth() throws IOException {
        String seq = "A".repeat(120);
        assertThat(write(new SequenceRecord("x", "", bases(seq)))).isEqualTo(">x\n" + "A".repeat(60) + "\n"
                + "A".repeat(60) + "\n");
        assertThat(write(new SequenceRecord("empty", "", new byte[0]))).isEqualTo(">empty\n");
    }

    @Test
    void namesMustBeOneWord() {
        assertThatThrownBy(() -> write(new SequenceRecord("two words", "", bases("A"))))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> write(new SequenceRecord("", "", bases("A"))))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> write(new SequenceRecord("a", "x\ny", bases("A"))))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void independentReaderSeesTheSameRecords(@TempDir Path dir) throws IOException {
        // read back with htsjdk's FASTA reader (test scope): names, descriptions and bases, across the 64 KiB
        // internal buffer boundary
        SplittableRandom rng = new SplittableRandom(7);
        SequenceRecord[] records = new SequenceRecord[3];
        int[] lengths = {100_003, 1, 59};
        for (int i = 0; i < records.length; i++) {
            byte[] b = new byte[lengths[i]];
            for (int j = 0; j < b.length; j++) {
                b[j] = (byte) "ACGTNacgtn".charAt(rng.nextInt(10));
            }
            records[i] = new SequenceRecord("rec" + i, i == 1 ? "" : "desc " + i, b);
        }
        Path file = dir.resolve("out.fa");
        try (OutputStream os = Files.newOutputStream(file); FastaWriter w = new FastaWriter(os)) {
            for (SequenceRecord r : records) {
                w.write(r);
            }
        }
        try (FastaSequenceFile in = new FastaSequenceFile(file, false)) {
            for (SequenceRecord r : records) {
                ReferenceSequence s = in.nextSequence();
                String header = r.description().isEmpty() ? r.name() : r.name() + " " + r.description();
                assertThat(s.getName()).isEqualTo(header);
                assertThat(s.getBases()).isEqualTo(r.bases());
            }
            assertThat(in.nextSequence()).isNull();
        }
        // every sequence line but a record's last is exactly 60 long; the last holds the remainder
        java.util.List<String> lines = Files.readAllLines(file);
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            boolean lastOfRecord = i + 1 == lines.size() || lines.get(i + 1).startsWith(">");
            if (!line.startsWith(">") && !lastOfRecord) {
                assertThat(line).hasSize(FastaWriter.LINE_WIDTH);
            }
        }
        assertThat(lines.get(lines.size() - 1)).hasSize(59);
    }

    @Test
    void closesTheWrappedStreamOnlyWhenAsked() throws IOException {
        boolean[] closed = new boolean[1];
        OutputStream probe = new FilterOutputStream(new ByteArrayOutputStream()) {
            @Override
            public void close() {
                closed[0] = true;
            }
        };
        new FastaWriter(probe).close();
        assertThat(closed[0]).isFalse();
        new FastaWriter(probe, true).close();
        assertThat(closed[0]).isTrue();
    }
}
