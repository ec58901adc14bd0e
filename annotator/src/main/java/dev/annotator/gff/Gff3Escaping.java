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
    private static final boolean[] COLUMN_PLAIN = plainExcept("%");
    private static final boolean[] ATTRIBUTE_PLAIN = plainExcept("%;=&,");
    private static final boolean[] COMMENT_PLAIN = plainExcept("");

    private Gff3Escaping() {
    }

    /** Column 1. */
    static void seqid(String s, StringBuilder out) {
        int i = firstToEncode(s, SEQID_PLAIN, true);
        if (i == s.length()) {
            out.append(s);
        } else {
            seqidFrom(s, i, out);
        }
    }

    /** Columns 2 and 3: what would break the line or column structure, plus the escape character itself. */
    static void column(String s, StringBuilder out) {
        encode(s, COLUMN_PLAIN, out);
    }

    /** A tag or one value in column 9. */
    static void attribute(String s, StringBuilder out) {
        encode(s, ATTRIBUTE_PLAIN, out);
    }

    /** Comment text: a comment must stay on one line, so only control characters are encoded. */
    static void comment(String s, StringBuilder out) {
        encode(s, COMMENT_PLAIN, out);
    }

    /*
     * Text with nothing to encode, which is nearly all of it (IDs, numbers, names), is found by one scan and
     * appended whole; the character-by-character loops below run only from the first character that needs them.
     */

    /** Index of the first character of s that is not plain (ASCII and marked in the table), or s.length(). */
    private static int firstToEncode(String s, boolean[] plain, boolean nonAsciiEncoded) {
        int n = s.length();
        for (int i = 0; i < n; i++) {
            char c = s.charAt(i);
            if (c < 128 ? !plain[c] : nonAsciiEncoded) {
                return i;
            }
        }
        return n;
    }

    private static void encode(String s, boolean[] plain, StringBuilder out) {
        int i = firstToEncode(s, plain, false);
        if (i == s.length()) {
            out.append(s);
        } else {
            encodeFrom(s, i, plain, out);
        }
    }

    private static void encodeFrom(String s, int from, boolean[] plain, StringBuilder out) {
        out.append(s, 0, from);
        for (int i = from; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c < 128 && !plain[c]) {
                percent(c, out);
            } else {
                out.append(c);
            }
        }
    }

    private static void seqidFrom(String s, int from, StringBuilder out) {
        out.append(s, 0, from);
        for (int i = from; i < s.length(); ) {
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

    /** ASCII characters that stay literal: all but control characters and those in {@code encoded}. */
    private static boolean[] plainExcept(String encoded) {
        boolean[] t = new boolean[128];
        for (char c = 0; c < 128; c++) {
            t[c] = !isControl(c) && encoded.indexOf(c) < 0;
        }
        return t;
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
