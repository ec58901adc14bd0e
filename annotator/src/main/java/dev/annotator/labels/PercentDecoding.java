package dev.annotator.labels;

import dev.annotator.error.BadInputException;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;

/** Undoes the percent-encoding of a GFF3 column (specification v1.26, "Description of the Format"). */
public final class PercentDecoding {
    private PercentDecoding() {
    }

    /**
     * The column's text with every %XX replaced by its byte, read as UTF-8.
     *
     * @param where prefix of the error message, such as {@code FILE:LINE: column 1 (seqid)}
     */
    public static String decode(String s, String where) {
        if (s.indexOf('%') < 0) {
            return s;
        }
        ByteArrayOutputStream bytes = new ByteArrayOutputStream(s.length());
        byte[] raw = s.getBytes(StandardCharsets.UTF_8);
        for (int i = 0; i < raw.length; i++) {
            if (raw[i] != '%') {
                bytes.write(raw[i]);
                continue;
            }
            int hi = i + 2 < raw.length ? Character.digit(raw[i + 1], 16) : -1;
            int lo = i + 2 < raw.length ? Character.digit(raw[i + 2], 16) : -1;
            if (hi < 0 || lo < 0) {
                throw new BadInputException(where + ": '%' not followed by two hexadecimal digits");
            }
            bytes.write(hi * 16 + lo);
            i += 2;
        }
        return bytes.toString(StandardCharsets.UTF_8);
    }
}
