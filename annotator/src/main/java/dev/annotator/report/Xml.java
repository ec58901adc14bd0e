package dev.annotator.report;

import java.io.IOException;

/**
 * Writes well-formed markup: every text and attribute value escaped, every element closed. Writes to a file's
 * writer or, for parts drawn ahead of the file, to a {@link StringBuilder}.
 */
final class Xml {
    private final Appendable out;

    Xml(Appendable out) {
        this.out = out;
    }

    void open(String name, String... attributes) throws IOException {
        out.append('<');
        out.append(name);
        attributes(attributes);
        out.append('>');
    }

    void close(String name) throws IOException {
        out.append("</").append(name).append(">\n");
    }

    /** An element holding only text (empty text gives an empty element). */
    void element(String name, String text, String... attributes) throws IOException {
        out.append('<');
        out.append(name);
        attributes(attributes);
        if (text.isEmpty()) {
            out.append("/>");
            return;
        }
        out.append('>');
        text(text);
        out.append("</").append(name).append('>');
    }

    void text(String text) throws IOException {
        escapeTo(out, text);
    }

    private void attributes(String[] attributes) throws IOException {
        for (int i = 0; i < attributes.length; i += 2) {
            out.append(' ');
            out.append(attributes[i]);
            out.append("=\"");
            escapeTo(out, attributes[i + 1]);
            out.append('"');
        }
    }

    /** {@code s} escaped for text or an attribute value. */
    static String escaped(String s) {
        StringBuilder b = new StringBuilder(s.length() + 16);
        try {
            escapeTo(b, s);
        } catch (IOException e) {
            throw new IllegalStateException("a StringBuilder does not fail", e);
        }
        return b.toString();
    }

    /** Appends {@code s} escaped; most values need no escaping and are appended as they are. */
    private static void escapeTo(Appendable out, String s) throws IOException {
        int n = s.length();
        int i = 0;
        while (i < n && !needsEscape(s.charAt(i))) {
            i++;
        }
        if (i == n) {
            out.append(s);
            return;
        }
        out.append(s, 0, i);
        for (; i < n; i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<' -> out.append("&lt;");
                case '>' -> out.append("&gt;");
                case '&' -> out.append("&amp;");
                case '"' -> out.append("&quot;");
                default -> out.append(c < 0x20 && c != '\n' && c != '\t' ? '?' : c);
            }
        }
    }

    private static boolean needsEscape(char c) {
        return c == '<' || c == '>' || c == '&' || c == '"' || (c < 0x20 && c != '\n' && c != '\t');
    }
}
