package dev.annotator.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The rows of one table in a markdown file, for tests driven by the tables of test-data/README.md. A table row is a
 * line starting "| `" (its first cell is a file name in code); no cell holds a '|'.
 */
public final class MarkdownTable {
    private MarkdownTable() {
    }

    /**
     * The cells of every row under the heading starting with {@code section}, up to the next "## " heading. Each
     * array holds the pieces of the line split on '|', so index 0 and the last are the empty ends and the cells
     * are 1 to {@code cells}, unstripped.
     */
    public static List<String[]> rows(Path markdown, String section, int cells) {
        List<String> lines;
        try {
            lines = Files.readAllLines(markdown);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        int start = lines.indexOf(lines.stream().filter(l -> l.startsWith(section)).findFirst()
                .orElseThrow(() -> new AssertionError("no section '" + section + "' in " + markdown)));
        List<String[]> rows = new ArrayList<>();
        for (String line : lines.subList(start + 1, lines.size())) {
            if (line.startsWith("## ")) {
                break;
            }
            if (!line.startsWith("| `")) {
                continue; // prose, the header row and its rule
            }
            String[] pieces = line.split("\\|", -1);
            if (pieces.length != cells + 2) {
                throw new AssertionError("row needs " + cells + " cells: " + line);
            }
            rows.add(pieces);
        }
        return rows;
    }

    /** The text inside a cell written as {@code `code`}. */
    public static String code(String cell) {
        String s = cell.strip();
        if (s.length() < 2 || !s.startsWith("`") || !s.endsWith("`")) {
            throw new AssertionError("expected a `code` cell: " + cell);
        }
        return s.substring(1, s.length() - 1);
    }
}
