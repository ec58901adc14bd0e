package dev.annotator.seq;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.GZIPInputStream;

/**
 * The three published GenBank records in test-data/genbank (provenance in test-data/README.md), and their raw text
 * read with the JDK's own gzip stream, so tests can check the readers against the file itself.
 */
public final class PublishedGenbankRecords {
    /** Chlamydia trachomatis D/UW-3/CX genome: one record, 1,042,519 bp. */
    public static final String CHLAMYDIA = "ct.gbk.gz";
    /** Yersinia pestis plasmid pPCP1: one record, 9,609 bp. */
    public static final String PLASMID = "NC_005816.gb.gz";
    /** Arabidopsis thaliana chloroplast: one record, 154,478 bp, spliced CDS. */
    public static final String CHLOROPLAST = "NC_000932.gb.gz";
    public static final List<String> ALL = List.of(CHLAMYDIA, PLASMID, CHLOROPLAST);

    private PublishedGenbankRecords() {
    }

    public static Path path(String file) {
        return testData("genbank", file);
    }

    /** A path under the top-level test-data folder (tests run in the module directory). */
    public static Path testData(String first, String... more) {
        return Path.of(System.getProperty("basedir", "."), "..", "test-data").resolve(Path.of(first, more)).normalize();
    }

    /** The decompressed lines of a published record. */
    public static List<String> rawLines(String file) {
        try (InputStream in = new GZIPInputStream(Files.newInputStream(path(file)))) {
            return new String(in.readAllBytes(), StandardCharsets.ISO_8859_1).lines().toList();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * The CRC32 field of a published file's gzip trailer (RFC 1952, section 2.3.1: the CRC-32 of the uncompressed
     * data, little-endian in the 4 bytes before the last 4), as its distributor's gzip wrote it.
     */
    public static long trailerCrc32(String file) {
        return trailerField(file, 8);
    }

    /** The ISIZE field of a published file's gzip trailer: the uncompressed size modulo 2^32 (RFC 1952). */
    public static long trailerSize(String file) {
        return trailerField(file, 4);
    }

    private static long trailerField(String file, int fromEnd) {
        try {
            byte[] gz = Files.readAllBytes(path(file));
            int at = gz.length - fromEnd;
            return (gz[at] & 0xFFL) | (gz[at + 1] & 0xFFL) << 8 | (gz[at + 2] & 0xFFL) << 16
                    | (gz[at + 3] & 0xFFL) << 24;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The bases of the (single) ORIGIN section, as written: position numbers and blanks dropped. */
    public static String rawBases(String file) {
        StringBuilder bases = new StringBuilder();
        boolean inOrigin = false;
        for (String line : rawLines(file)) {
            if (line.startsWith("ORIGIN")) {
                inOrigin = true;
            } else if (line.startsWith("//")) {
                inOrigin = false;
            } else if (inOrigin) {
                bases.append(line.replaceAll("[\\s0-9]", ""));
            }
        }
        return bases.toString();
    }
}
