package dev.annotator.pipeline;

import dev.annotator.io.InputChecksum;
import dev.annotator.seq.PublishedGenbankRecords;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import java.util.zip.GZIPInputStream;

import static org.assertj.core.api.Assertions.assertThat;

/** The CRC-32 a report names its input by, against published values rather than the JDK's CRC-32 alone. */
class StreamChecksumTest {

    @Test
    void publishedCheckValue() {
        StreamChecksum c = new StreamChecksum();
        byte[] digits = "123456789".getBytes(StandardCharsets.US_ASCII);
        c.consumed(digits, 0, digits.length);
        // the check value of CRC-32 (ISO-HDLC, the gzip and zip CRC) in the CRC catalogues, e.g. Williams, "A
        // Painless Guide to CRC Error Detection Algorithms" (1993): CBF43926 (recalled from memory)
        InputChecksum result = c.finish("digits");
        assertThat(result.crc32Hex()).isEqualTo("cbf43926");
        assertThat(result.bytes()).isEqualTo(9);
    }

    /**
     * A gzip file's trailer holds the CRC-32 and size (mod 2^32) of the data it compresses (RFC 1952, section
     * 2.3.1). The GenBank files under test-data were compressed by their distributor, not by this project, so their
     * trailers are values computed outside it. The decompressed bytes are fed in pieces of random sizes from a reused
     * buffer, as a reader would.
     */
    @Test
    void piecesOfAnySizeGiveTheCrcInTheTrailerOfADistributedGzipFile() throws IOException {
        for (String name : PublishedGenbankRecords.ALL) {
            Path gz = PublishedGenbankRecords.path(name);
            byte[] data;
            try (InputStream in = new GZIPInputStream(Files.newInputStream(gz))) {
                data = in.readAllBytes();
            }
            StreamChecksum c = new StreamChecksum();
            Random random = new Random(name.hashCode());
            byte[] buffer = new byte[1 << 17];
            for (int at = 0; at < data.length; ) {
                int length = Math.min(1 + random.nextInt(random.nextBoolean() ? 100 : buffer.length), data.length - at);
                int offset = random.nextInt(buffer.length - length + 1);
                System.arraycopy(data, at, buffer, offset, length);
                c.consumed(buffer, offset, length);
                random.nextBytes(buffer);
                at += length;
            }
            InputChecksum result = c.finish(name);
            assertThat(result.crc32()).as(name).isEqualTo(PublishedGenbankRecords.trailerCrc32(name));
            assertThat(result.bytes() & 0xFFFF_FFFFL).as(name).isEqualTo(PublishedGenbankRecords.trailerSize(name));
        }
    }
}
