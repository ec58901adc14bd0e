package dev.annotator.error;

/** Exit statuses of the command line; the numbers follow BSD sysexits.h so scripts can branch on them. */
public final class ExitCodes {
    public static final int OK = 0;
    /** Bad command line (unknown option, missing argument, invalid value), or an output it may not replace. */
    public static final int USAGE = 2;
    /** Input data is malformed: FASTA, model file, label file. (EX_DATAERR) */
    public static final int DATA = 65;
    /** An input file does not exist or cannot be opened. (EX_NOINPUT) */
    public static final int NO_INPUT = 66;
    /** Unexpected internal failure. (EX_SOFTWARE) */
    public static final int SOFTWARE = 70;
    /** Reading or writing failed midway, or an output cannot be created. (EX_IOERR) */
    public static final int IO = 74;

    private ExitCodes() {
    }
}
