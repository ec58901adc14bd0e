package dev.annotator.error;

/** Input data that cannot be used as it is (exit 65). */
public final class BadInputException extends AnnotatorException {
    public BadInputException(String message) {
        super(message);
    }

    public BadInputException(String message, Throwable cause) {
        super(message, cause);
    }

    @Override
    public int exitCode() {
        return ExitCodes.DATA;
    }
}
