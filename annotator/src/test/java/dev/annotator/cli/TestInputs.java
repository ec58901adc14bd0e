package dev.annotator.cli;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;
import java.util.zip.GZIPOutputStream;

/** Inputs made at run time: invented sequence, and gzip made with the JDK's own compressor. */
final class TestInputs {
    private TestInputs() {
    }

    /** Invented sequence: uniform random bases, 60 per line, records named rand1, rand2, ... */
    static byte[] randomFasta(int records, int length, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        StringBuilder sb = new StringBuilder();
        for (int r = 1; r <= records; r++) {
            sb.append(">rand").append(r).append('\n');
            for (int i = 0; i < length; i++) {
                sb.append("ACGT".charAt(rng.nextInt(4)));
                if (i % 60 == 59 || i == length - 1) {
                    sb.append('\n');
                }
            }
        }
        return sb.toString().getBytes(StandardCharsets.US_ASCII);
    }

    static byte[] gzip(byte[] data) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (GZIPOutputStream gz = new GZIPOutputStream(bytes)) {
            gz.write(data);
        }
        return bytes.toByteArray();
    }
}
