package dev.annotator.error;

/** An input that does not exist or cannot be opened for reading (exit 66). */
public final class MissingInputException extends AnnotatorException {
    public MissingInputException(String message) {
        super(message);
    }

    @Override
    public int exitCode() {
        return ExitCodes.NO_INPUT;
    }
}
