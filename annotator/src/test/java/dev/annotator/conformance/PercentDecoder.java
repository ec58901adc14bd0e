package dev.annotator.conformance;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.function.IntPredicate;

/**
 * Decodes the RFC 3986 percent-escapes of one GFF3 field and checks, character by character, what a column may
 * hold literally and what it may hold escaped. GFF3 v1.26, "Description of the Format": characters that need
 * encoding are written with "RFC 3986 Percent-Encoding; no other characters may be encoded". A run of escapes is
 * read as UTF-8 bytes, so a character outside ASCII can be escaped byte by byte (the specification recommends
 * Unicode for portability but names no encoding; UTF-8 is our reading).
 */
final class PercentDecoder {
    private PercentDecoder() {
    }

    /**
     * @param what          names the field in messages ("column 1 (seqid)")
     * @param literalOk     characters the field may hold as themselves
     * @param escapeOk      characters the field may hold as escapes
     * @throws Gff3Violation on a malformed escape, escapes that are not UTF-8, a literal character that must be
     *                       encoded, or an escape of a character that must not be
     */
    static String decode(String raw, int line, String what, IntPredicate literalOk, IntPredicate escapeOk) {
        StringBuilder out = new StringBuilder(raw.length());
        int i = 0;
        int n = raw.length();
        while (i < n) {
            if (raw.charAt(i) == '%') {
                ByteArrayOutputStream bytes = new ByteArrayOutputStream();
                int runStart = i;
                while (i < n && raw.charAt(i) == '%') {
                    // RFC 3986 section 2.1: a percent-encoded octet is "%" HEXDIG HEXDIG
                    if (i + 2 >= n || hex(raw.charAt(i + 1)) < 0 || hex(raw.charAt(i + 2)) < 0) {
                        throw new Gff3Violation(line, what + ": '%' not followed by two hex digits at \""
                                + raw.substring(i, Math.min(n, i + 3)) + "\" (Description of the Format, RFC 3986 2.1)");
                    }
                    bytes.write(hex(raw.charAt(i + 1)) * 16 + hex(raw.charAt(i + 2)));
                    i += 3;
                }
                String decoded = utf8(bytes.toByteArray(), line, what, raw.substring(runStart, i));
                for (int j = 0; j < decoded.length(); ) {
                    int cp = decoded.codePointAt(j);
                    if (!escapeOk.test(cp)) {
                        throw new Gff3Violation(line, what + ": " + show(cp) + " is percent-encoded in \""
                                + raw.substring(runStart, i) + "\" but must not be (Description of the Format: "
                                + "no other characters may be encoded)");
                    }
                    j += Character.charCount(cp);
                }
                out.append(decoded);
            } else {
                int cp = raw.codePointAt(i);
                if (!literalOk.test(cp)) {
                    throw new Gff3Violation(line, what + ": " + show(cp) + " must be percent-encoded");
                }
                out.appendCodePoint(cp);
                i += Character.charCount(cp);
            }
        }
        return out.toString();
    }

    /** GFF3 v1.26, "Description of the Format": control characters are %00 through %1F and %7F. */
    static boolean isControl(int cp) {
        return cp < 0x20 || cp == 0x7F;
    }

    static String show(int cp) {
        if (isControl(cp) || cp == ' ') {
            return String.format("U+%04X", cp);
        }
        return "'" + new String(Character.toChars(cp)) + "'";
    }

    private static String utf8(byte[] bytes, int line, String what, String escapes) {
        try {
            return StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new Gff3Violation(line, what + ": escapes \"" + escapes + "\" are not valid UTF-8");
        }
    }

    private static int hex(char c) {
        if (c >= '0' && c <= '9') {
            return c - '0';
        }
        if (c >= 'A' && c <= 'F') {
            return c - 'A' + 10;
        }
        if (c >= 'a' && c <= 'f') {
            return c - 'a' + 10; // RFC 3986 2.1: hex digits are case-insensitive
        }
        return -1;
    }
}
