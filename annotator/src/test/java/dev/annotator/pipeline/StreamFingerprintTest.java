package dev.annotator.pipeline;

import dev.annotator.model.InputFingerprint;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The digest taken from the bytes as a reader sees them, chunk by chunk from a reused buffer, against SHA-256 of
 * the whole data at once.
 */
class StreamFingerprintTest {

    @Test
    void publishedExample() {
        StreamFingerprint f = new StreamFingerprint();
        byte[] abc = "abc".getBytes(StandardCharsets.US_ASCII);
        f.consumed(abc, 0, abc.length);
        // FIPS 180-4 (NIST), the one-block example "abc"; the same digest as coreutils' sha256sum prints for it
        assertThat(f.finish("abc").sha256())
                .isEqualTo("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    }

    @Test
    void chunksOfAnySizeThroughAReusedBufferGiveTheDigestOfTheWhole() throws Exception {
        Random random = new Random(7);
        byte[] data = new byte[24_000_000];
        random.nextBytes(data);
        StreamFingerprint f = new StreamFingerprint();
        // the caller refills one buffer after every call, as a buffered reader does
        byte[] buffer = new byte[3 << 20];
        int at = 0;
        while (at < data.length) {
            int size = switch (random.nextInt(5)) {
                case 0 -> 1 << 16; // the usual read
                case 1 -> 1 + random.nextInt(1 << 16);
                case 2 -> 1 << 20;
                case 3 -> (1 << 20) + 1 + random.nextInt(2 << 20);
                default -> 1 + random.nextInt(100);
            };
            int length = Math.min(size, data.length - at);
            int offset = random.nextInt(buffer.length - length + 1);
            System.arraycopy(data, at, buffer, offset, length);
            f.consumed(buffer, offset, length);
            random.nextBytes(buffer);
            at += length;
        }
        InputFingerprint result = f.finish("random.bin");

        // reference: SHA-256 (FIPS 180-4) of the whole array in one call of the JDK's implementation
        String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(data));
        assertThat(result.sha256()).isEqualTo(expected);
        assertThat(result.bytes()).isEqualTo(data.length);
        assertThat(result.name()).isEqualTo("random.bin");
    }
}
