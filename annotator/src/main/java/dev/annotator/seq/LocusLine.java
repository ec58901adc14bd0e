package dev.annotator.seq;

import dev.annotator.error.BadInputException;

/**
 * The fields of a GenBank LOCUS line that reading needs: the locus name, the declared length in bases and the
 * topology. Columns are not relied on: the GenBank release notes fix them, but older files (such as records
 * written before the 2003 LOCUS layout) space them differently, while the order name, length, "bp" holds in both.
 *
 * @param name     the locus name, the first word after LOCUS
 * @param length   bases the record declares; its sequence must have exactly this many
 * @param circular the molecule is circular (features may then wrap across the origin as joins)
 */
record LocusLine(String name, long length, boolean circular) {

    /** Parses the text of a line starting with "LOCUS"; {@code where} is "FILE:LINE" for messages. */
    static LocusLine parse(String text, String where) {
        String[] words = text.strip().split("\\s+");
        if (words.length < 4) {
            throw new BadInputException(where + ": LOCUS line needs a name and a length in bp");
        }
        if (isDigits(words[1]) && isUnit(words[2])) {
            throw new BadInputException(where + ": LOCUS line has no record name");
        }
        if (!isDigits(words[2]) || !isUnit(words[3])) {
            throw new BadInputException(where + ": LOCUS line needs a name and then a length in bp, found '"
                    + String.join(" ", words[1], words[2], words[3]) + "'");
        }
        if (words[3].equalsIgnoreCase("aa")) {
            throw new BadInputException(where + ": record " + words[1] + " is a protein (length in aa), not DNA");
        }
        long length;
        try {
            length = Long.parseLong(words[2]);
        } catch (NumberFormatException e) {
            length = Long.MAX_VALUE; // more digits than a long: refused just below like any length too large
        }
        if (length < 1 || length > RecordLengthLimit.ARRAY_MAX) {
            throw new BadInputException(where + ": record " + words[1] + ": length " + words[2]
                    + " bp is outside 1.." + RecordLengthLimit.ARRAY_MAX);
        }
        boolean circular = false;
        for (int i = 4; i < words.length; i++) {
            circular |= words[i].equalsIgnoreCase("circular");
        }
        return new LocusLine(words[1], length, circular);
    }

    private static boolean isUnit(String word) {
        return word.equalsIgnoreCase("bp") || word.equalsIgnoreCase("aa");
    }

    private static boolean isDigits(String word) {
        return !word.isEmpty() && word.chars().allMatch(c -> c >= '0' && c <= '9');
    }
}
