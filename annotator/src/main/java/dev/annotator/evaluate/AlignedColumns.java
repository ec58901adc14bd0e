package dev.annotator.evaluate;

import java.io.IOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Rows of text cells laid out in columns: the first column left-aligned (names), the others right-aligned
 * (numbers), two spaces apart, no trailing blanks.
 */
final class AlignedColumns {
    private final List<String[]> rows = new ArrayList<>();
    private final List<Integer> rulesBefore = new ArrayList<>();
    private final int width;

    AlignedColumns(String... header) {
        this.width = header.length;
        rows.add(header);
    }

    void row(String... cells) {
        if (cells.length != width) {
            throw new IllegalArgumentException("expected " + width + " cells, got " + cells.length);
        }
        rows.add(cells);
    }

    /** A line of dashes before the next row (such as a total). */
    void rule() {
        rulesBefore.add(rows.size());
    }

    void write(Writer out) throws IOException {
        int[] widths = new int[width];
        for (String[] r : rows) {
            for (int c = 0; c < width; c++) {
                widths[c] = Math.max(widths[c], r[c].length());
            }
        }
        int total = Arrays.stream(widths).sum() + 2 * (width - 1);
        for (int i = 0; i < rows.size(); i++) {
            if (rulesBefore.contains(i)) {
                out.write("-".repeat(total));
                out.write('\n');
            }
            StringBuilder line = new StringBuilder();
            String[] r = rows.get(i);
            for (int c = 0; c < width; c++) {
                if (c > 0) {
                    line.append("  ");
                }
                String pad = " ".repeat(widths[c] - r[c].length());
                line.append(c == 0 ? r[c] + pad : pad + r[c]);
            }
            out.write(line.toString().stripTrailing());
            out.write('\n');
        }
    }
}
