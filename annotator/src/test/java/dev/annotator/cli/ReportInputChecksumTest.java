package dev.annotator.cli;

import dev.annotator.seq.PublishedGenbankRecords;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.zip.GZIPInputStream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The report names its input by size and CRC-32. The input here is the plasmid record the Biopython distribution
 * ships gzipped, unpacked: its gzip trailer, written by the distributor, holds the CRC-32 and size of exactly these
 * bytes (RFC 1952, section 2.3.1), a value computed outside this project.
 */
class ReportInputChecksumTest {
    @TempDir
    Path dir;

    @Test
    void theReportsInputRowCarriesTheSizeAndCrcTheDistributorsGzipRecorded() throws IOException {
        Path gz = PublishedGenbankRecords.path(PublishedGenbankRecords.PLASMID);
        Path input = dir.resolve("plasmid.gb");
        try (InputStream in = new GZIPInputStream(Files.newInputStream(gz))) {
            Files.write(input, in.readAllBytes());
        }
        Path report = dir.resolve("r.html");
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-q", "-o", dir.resolve("o.gff3").toString(),
                "--report", report.toString(), input.toString());
        assertThat(r.status()).as(r.stderr()).isZero();

        long crc = PublishedGenbankRecords.trailerCrc32(PublishedGenbankRecords.PLASMID);
        long size = PublishedGenbankRecords.trailerSize(PublishedGenbankRecords.PLASMID);
        String html = Files.readString(report, StandardCharsets.UTF_8);
        assertThat(html).contains(input + " (" + size + " bytes, CRC-32 " + String.format(Locale.ROOT, "%08x", crc)
                + ")");
    }
}
