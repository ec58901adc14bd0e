package dev.annotator.io;

import dev.annotator.error.IoFailureException;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * The kinds of sequence file the tool reads, told apart by their first non-blank line: a FASTA file starts with a
 * '&gt;' header line, a GenBank flat file with its LOCUS line. Anything else is taken for FASTA, whose reader then
 * says precisely what is wrong (empty input, binary data, another format), as it always has.
 */
public enum InputFormat {
    FASTA,
    GENBANK;

    /** How far to look for the first non-blank line; a file blank for this long is no GenBank file. */
    static final int LOOK_AHEAD = 1 << 16;

    /**
     * The format of a file (plain or gzip, detected from the data). Standard input ("-") is FASTA: it cannot be
     * looked at and then read again.
     *
     * @throws dev.annotator.error.MissingInputException the file does not exist or cannot be read
     * @throws dev.annotator.error.BadInputException     its gzip data is damaged where the first line is
     */
    public static InputFormat detect(String pathOrDash) {
        if (InputOpener.STDIN.equals(pathOrDash)) {
            return FASTA;
        }
        try (InputStream in = InputOpener.open(pathOrDash, InputStream.nullInputStream())) {
            return ofFirstLine(firstNonBlankLine(in));
        } catch (IOException e) {
            throw new IoFailureException(InputOpener.displayName(pathOrDash) + ": close failed: " + e.getMessage(), e);
        }
    }

    /** The format a file whose first non-blank line is {@code line} has; null (no such line) is FASTA. */
    public static InputFormat ofFirstLine(String line) {
        if (line == null) {
            return FASTA;
        }
        String s = line.strip();
        boolean locus = s.startsWith("LOCUS") && (s.length() == 5 || Character.isWhitespace(s.charAt(5)));
        return locus ? GENBANK : FASTA;
    }

    /**
     * The first line with a non-blank byte within the look-ahead, or null. Reads only as far as that line ends, so
     * damage further into a gzip file is left for the reader to report with its line number.
     */
    private static String firstNonBlankLine(InputStream in) throws IOException {
        StringBuilder line = new StringBuilder();
        int read = 0;
        int b;
        while (read < LOOK_AHEAD && (b = in.read()) >= 0) {
            read++;
            if (b != '\n') {
                line.append((char) b); // Latin-1: the keywords looked for are ASCII
            } else if (!line.toString().isBlank()) {
                return line.toString();
            } else {
                line.setLength(0);
            }
        }
        return line.toString().isBlank() ? null : line.toString();
    }
}
