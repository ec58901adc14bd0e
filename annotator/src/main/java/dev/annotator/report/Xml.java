package dev.annotator.report;

import java.io.IOException;
import java.io.Writer;

/** Writes well-formed markup: every text and attribute value escaped, every element closed. */
final class Xml {
    private final Writer out;

    Xml(Writer out) {
        this.out = out;
    }

    void open(String name, String... attributes) throws IOException {
        out.write('<');
        out.write(name);
        attributes(attributes);
        out.write('>');
    }

    void close(String name) throws IOException {
        out.write("</" + name + ">\n");
    }

    /** An element holding only text (empty text gives an empty element). */
    void element(String name, String text, String... attributes) throws IOException {
        out.write('<');
        out.write(name);
        attributes(attributes);
        if (text.isEmpty()) {
            out.write("/>");
            return;
        }
        out.write('>');
        text(text);
        out.write("</" + name + ">");
    }

    void text(String text) throws IOException {
        out.write(escape(text));
    }

    private void attributes(String[] attributes) throws IOException {
        for (int i = 0; i < attributes.length; i += 2) {
            out.write(' ');
            out.write(attributes[i]);
            out.write("=\"");
            out.write(escape(attributes[i + 1]));
            out.write('"');
        }
    }

    static String escape(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                default -> b.append(c < 0x20 && c != '\n' && c != '\t' ? '?' : c);
            }
        }
        return b.toString();
    }
}
