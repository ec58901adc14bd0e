package dev.annotator.error;

/** Reading or writing failed midway, or an output could not be created (exit 74). */
public final class IoFailureException extends AnnotatorException {
    public IoFailureException(String message, Throwable cause) {
        super(message, cause);
    }

    public IoFailureException(String message) {
        super(message);
    }

    @Override
    public int exitCode() {
        return ExitCodes.IO;
    }
}
