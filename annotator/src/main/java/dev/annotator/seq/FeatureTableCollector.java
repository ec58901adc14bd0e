package dev.annotator.seq;

import java.util.ArrayList;
import java.util.List;

/**
 * Collects the keys and locations of a GenBank feature table, line by line. By the INSDC feature table layout a
 * key starts in column 6 and everything else (location, qualifiers, continuations) in column 22; qualifiers start
 * with '/'. A location may run over several lines until the first qualifier. A quoted qualifier value may itself
 * run over lines, and such a line may start with '/', so quotes are tracked to avoid taking it for a qualifier.
 */
final class FeatureTableCollector {
    /** Where qualifiers and location continuations start, 0-based (column 22). */
    private static final int BODY_INDENT = 21;

    private final List<FeatureLocation> features = new ArrayList<>();
    private String key;
    private StringBuilder location;
    private long keyLine;
    private boolean inLocation;
    private boolean inQuotes;

    /** One line of the table (after the FEATURES header line), which starts with a blank. */
    void accept(String line, long number) {
        int indent = indent(line);
        if (indent == line.length()) {
            return;
        }
        if (indent < BODY_INDENT && !inQuotes) {
            finishFeature();
            String rest = line.substring(indent);
            int end = firstBlank(rest);
            key = rest.substring(0, end);
            location = new StringBuilder(withoutBlanks(rest.substring(end)));
            keyLine = number;
            inLocation = true;
            return;
        }
        String body = line.substring(indent);
        if (inQuotes) {
            inQuotes = quotesOpen(body, true);
        } else if (body.startsWith("/")) {
            inLocation = false;
            inQuotes = quotesOpen(body, false);
        } else if (inLocation && location != null) {
            location.append(withoutBlanks(body));
        }
        // otherwise an unquoted qualifier value continues: nothing we keep
    }

    /** The features collected; the table is complete. */
    List<FeatureLocation> finish() {
        finishFeature();
        return List.copyOf(features);
    }

    private void finishFeature() {
        if (key != null) {
            features.add(new FeatureLocation(key, location.toString(), keyLine));
        }
        key = null;
        location = null;
        inLocation = false;
    }

    /** Whether a quoted value is still open after this text; a doubled quote inside a value is an escaped quote. */
    private static boolean quotesOpen(String text, boolean open) {
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '"') {
                open = !open;
            }
        }
        return open;
    }

    private static int indent(String line) {
        int i = 0;
        while (i < line.length() && (line.charAt(i) == ' ' || line.charAt(i) == '\t')) {
            i++;
        }
        return i;
    }

    private static int firstBlank(String s) {
        for (int i = 0; i < s.length(); i++) {
            if (Character.isWhitespace(s.charAt(i))) {
                return i;
            }
        }
        return s.length();
    }

    private static String withoutBlanks(String s) {
        return s.replaceAll("\\s+", "");
    }
}
