package dev.annotator.labels;

import dev.annotator.error.BadInputException;

/** Reading single GFF3 columns with one-line errors that name where the text came from. */
public final class Gff3Columns {
    private Gff3Columns() {
    }

    /**
     * A 1-based position (GFF3 specification v1.26, columns 4 and 5: "1-based integer coordinates").
     *
     * @param where prefix of the error message, such as {@code FILE:LINE: }
     * @param what  the name of the value in the message, such as {@code start}
     */
    public static long coordinate(String s, String where, String what) {
        long v;
        try {
            v = Long.parseLong(s);
        } catch (NumberFormatException e) {
            throw new BadInputException(where + what + " '" + s + "' is not an integer");
        }
        if (v < 1) {
            throw new BadInputException(where + what + " " + v + " is not a positive position (GFF3 counts from 1)");
        }
        return v;
    }
}
