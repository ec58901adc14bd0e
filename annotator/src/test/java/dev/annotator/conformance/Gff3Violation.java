package dev.annotator.conformance;

/**
 * A GFF3 text breaks a rule of the specification as {@link StrictGff3Reader} reads it.
 *
 * @see StrictGff3Reader
 */
public final class Gff3Violation extends RuntimeException {
    private final int line;

    /**
     * @param line 1-based line number of the offending line
     * @param what what is wrong, naming the specification section the rule comes from
     */
    public Gff3Violation(int line, String what) {
        super("line " + line + ": " + what);
        this.line = line;
    }

    public int line() {
        return line;
    }
}
