package dev.annotator.evaluate;

import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputOpener;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;

/** The format of a reference annotation file, told by its content rather than its name. */
public enum TruthFormat {
    GFF3,
    /** A GenBank flat file: its first record opens with a LOCUS line. */
    GENBANK;

    /** How far to look for the first non-blank character: the file is only peeked at, never held. */
    private static final int MAX_LEADING_BLANKS = 1 << 20;

    /**
     * GENBANK when the first non-blank line starts with {@code LOCUS}, else GFF3. Standard input ("-") cannot be
     * read twice, so it is taken to be GFF3 without looking.
     */
    public static TruthFormat detect(String pathOrDash) {
        if (InputOpener.STDIN.equals(pathOrDash)) {
            return GFF3;
        }
        String name = InputOpener.displayName(pathOrDash);
        try (InputStream in = InputOpener.open(pathOrDash, InputStream.nullInputStream());
             BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            int previous = '\n';
            int c = reader.read();
            for (int n = 0; c >= 0 && Character.isWhitespace(c) && n < MAX_LEADING_BLANKS; n++) {
                previous = c;
                c = reader.read();
            }
            boolean atLineStart = previous == '\n' || previous == '\r';
            if (!atLineStart) {
                return GFF3;
            }
            for (char expected : "LOCUS".toCharArray()) {
                if (c != expected) {
                    return GFF3;
                }
                c = reader.read();
            }
            return GENBANK;
        } catch (IOException e) {
            throw new IoFailureException(name + ": read failed: " + e.getMessage(), e);
        }
    }
}
