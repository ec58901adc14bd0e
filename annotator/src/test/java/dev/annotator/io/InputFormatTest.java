package dev.annotator.io;

import dev.annotator.error.BadInputException;
import dev.annotator.seq.PublishedGenbankRecords;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.FieldSource;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPOutputStream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Telling FASTA from GenBank by the first non-blank line. FASTA: a record starts with a '&gt;' description line
 * (NCBI's FASTA format description, recalled from memory); GenBank: a record starts with its LOCUS line (GenBank
 * release notes, section on the LOCUS format, recalled from memory).
 */
class InputFormatTest {
    @TempDir
    Path tmp;

    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void publishedGzipGenbankFiles(String file) {
        assertThat(InputFormat.detect(PublishedGenbankRecords.path(file).toString())).isEqualTo(InputFormat.GENBANK);
    }

    @Test
    void checkedInFastaFile() {
        Path fasta = PublishedGenbankRecords.testData("fasta", "two-records.fa");
        assertThat(InputFormat.detect(fasta.toString())).isEqualTo(InputFormat.FASTA);
    }

    @Test
    void firstNonBlankLineDecides() throws IOException {
        assertThat(InputFormat.detect(write("a.gb", "\n   \n\t\nLOCUS       X  10 bp  DNA\n")))
                .isEqualTo(InputFormat.GENBANK);
        assertThat(InputFormat.detect(write("b.gb", "\r\nLOCUS\r\n"))).isEqualTo(InputFormat.GENBANK);
        assertThat(InputFormat.detect(write("c.fa", "\n>LOCUS 1\nACGT\n"))).isEqualTo(InputFormat.FASTA);
        // a word that merely starts with LOCUS is not the keyword
        assertThat(InputFormat.detect(write("d.txt", "LOCUSES of control\n"))).isEqualTo(InputFormat.FASTA);
        // anything else goes down the FASTA path, whose reader says what is wrong
        assertThat(InputFormat.detect(write("e.txt", ""))).isEqualTo(InputFormat.FASTA);
        assertThat(InputFormat.detect(write("f.txt", "ID   X; SV 1; linear\n"))).isEqualTo(InputFormat.FASTA);
        assertThat(InputFormat.detect("-")).isEqualTo(InputFormat.FASTA);
    }

    @Test
    void gzipIsLookedInto() throws IOException {
        Path gz = tmp.resolve("x.dat");
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(gz))) {
            out.write("LOCUS       X  10 bp  DNA\n".getBytes(StandardCharsets.US_ASCII));
        }
        assertThat(InputFormat.detect(gz.toString())).isEqualTo(InputFormat.GENBANK);
    }

    /** Damage beyond the first line is left to the reader; damage before it is reported as the reader would. */
    @Test
    void damagedGzip() throws IOException {
        Path cut = PublishedGenbankRecords.testData("bad-genbank", "truncated.gb.gz");
        assertThat(InputFormat.detect(cut.toString())).isEqualTo(InputFormat.GENBANK);
        Path headerOnly = tmp.resolve("h.gz");
        Files.write(headerOnly, new byte[] {0x1f, (byte) 0x8b, 8, 0, 0, 0});
        assertThatThrownBy(() -> InputFormat.detect(headerOnly.toString()))
                .isInstanceOf(BadInputException.class)
                .hasMessage(headerOnly + ": truncated or corrupt gzip data");
    }

    @Test
    void ofFirstLine() {
        assertThat(InputFormat.ofFirstLine("LOCUS       NC_005816  9609 bp")).isEqualTo(InputFormat.GENBANK);
        assertThat(InputFormat.ofFirstLine(">seq1")).isEqualTo(InputFormat.FASTA);
        assertThat(InputFormat.ofFirstLine(null)).isEqualTo(InputFormat.FASTA);
    }

    private String write(String name, String text) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text, StandardCharsets.ISO_8859_1);
        return p.toString();
    }
}
