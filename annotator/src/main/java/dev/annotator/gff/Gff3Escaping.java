package dev.annotator.gff;

import java.nio.charset.StandardCharsets;

/**
 * Percent-encoding of GFF3 columns, following the GFF3 specification v1.26 (Sequence Ontology), section
 * "Description of the Format" (tab, newline, carriage return, '%' and control characters in every column;
 * ';' '=' '&amp;' ',' in addition inside column 9) and "Column 1: seqid" (everything outside
 * {@code [a-zA-Z0-9.:^*$@!+_?-|]}).
 *
 * <p>The specification forbids encoding any other character, so non-ASCII text stays literal in columns 2, 3 and 9;
 * only the seqid encodes it, one UTF-8 byte at a time, because the seqid's allowed set is ASCII.
 */
final class Gff3Escaping {
    private static final char[] HEX = "0123456789ABCDEF".toCharArray();
    private static final boolean[] SEQID_PLAIN = seqidPlain();

    private Gff3Escaping() {
    }

    /** Column 1. */
    static void seqid(String s, StringBuilder out) {
        for (int i = 0; i < s.length(); ) {
            int cp = s.codePointAt(i);
            i += Character.charCount(cp);
            if (cp < 128 && SEQID_PLAIN[cp]) {
                out.append((char) cp);
            } else {
                for (byte b : new String(Character.toChars(cp)).getBytes(StandardCharsets.UTF_8)) {
                    percent(b & 0xFF, out);
                }
            }
        }
    }

    /** Columns 2 and 3: what would break the line or column structure, plus the escape character itself. */
    static void column(String s, StringBuilder out) {
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (isControl(c) || c == '%') {
                percent(c, out);
            } else {
                out.append(c);
            }
        }
    }

    /** A tag or one value in column 9. */
    static void attribute(String s, StringBuilder out) {
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (isControl(c) || c == '%' || c == ';' || c == '=' || c == '&' || c == ',') {
                percent(c, out);
            } else {
                out.append(c);
            }
        }
    }

    /** Comment text: a comment must stay on one line, so only control characters are encoded. */
    static void comment(String s, StringBuilder out) {
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (isControl(c)) {
                percent(c, out);
            } else {
                out.append(c);
            }
        }
    }

    private static boolean isControl(char c) {
        return c < 0x20 || c == 0x7F;
    }

    private static void percent(int b, StringBuilder out) {
        out.append('%').append(HEX[b >> 4]).append(HEX[b & 0xF]);
    }

    private static boolean[] seqidPlain() {
        boolean[] t = new boolean[128];
        for (char c = 'a'; c <= 'z'; c++) {
            t[c] = true;
            t[Character.toUpperCase(c)] = true;
        }
        for (char c = '0'; c <= '9'; c++) {
            t[c] = true;
        }
        // The spec writes the set as [a-zA-Z0-9.:^*$@!+_?-|]. Read as a regex, "?-|" would be a range that also
        // admits '[', '\', ']', '`', '{'; the characters are taken literally here, which only ever encodes more
        // and so decodes to the same seqid under either reading.
        for (char c : ".:^*$@!+_?-|".toCharArray()) {
            t[c] = true;
        }
        return t;
    }
}
