package dev.annotator.error;

/**
 * The command line asks for something the tool refuses to do although every option parsed: replacing an existing
 * output without {@code --force}, or writing over one of the run's own inputs (exit 2, as for any bad command line:
 * the fix is in the command, not in the data or the machine).
 */
public final class UsageException extends AnnotatorException {
    public UsageException(String message) {
        super(message);
    }

    @Override
    public int exitCode() {
        return ExitCodes.USAGE;
    }
}
