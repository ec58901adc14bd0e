package dev.annotator.io;

import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.Random;
import java.util.zip.Deflater;
import java.util.zip.GZIPInputStream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The track's gzip: the JDK's own gzip reader gives back the text, and the compressed body is exactly what a
 * deflater at level 4 makes of it (the gzip member is a 10-byte header, raw deflate data and an 8-byte trailer,
 * RFC 1952).
 */
class TextGzipOutputStreamTest {
    @Test
    void readsBackAndIsLevelFourDeflate() throws IOException {
        StringBuilder text = new StringBuilder();
        Random random = new Random(7);
        for (int i = 0; i < 20_000; i++) {
            text.append("chr1\t").append(i * 13).append('\t').append(i * 13 + 13).append('\t')
                    .append(String.format("0.%03d", random.nextInt(1000))).append('\n');
        }
        byte[] plain = text.toString().getBytes(StandardCharsets.US_ASCII);
        ByteArrayOutputStream gz = new ByteArrayOutputStream();
        try (TextGzipOutputStream out = new TextGzipOutputStream(gz, 1 << 16)) {
            out.write(plain);
        }
        byte[] member = gz.toByteArray();
        try (GZIPInputStream in = new GZIPInputStream(new ByteArrayInputStream(member))) {
            assertThat(in.readAllBytes()).isEqualTo(plain);
        }

        Deflater reference = new Deflater(4, true);
        reference.setInput(plain);
        reference.finish();
        ByteArrayOutputStream body = new ByteArrayOutputStream();
        byte[] buffer = new byte[1 << 16];
        while (!reference.finished()) {
            body.write(buffer, 0, reference.deflate(buffer));
        }
        reference.end();
        assertThat(Arrays.copyOfRange(member, 10, member.length - 8)).isEqualTo(body.toByteArray());
        assertThat(member.length).isLessThan(plain.length / 3);
    }
}
