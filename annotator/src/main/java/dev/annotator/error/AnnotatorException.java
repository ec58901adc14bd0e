package dev.annotator.error;

/**
 * A failure the user can act on. The message is one line that names the file (and line or record)
 * and says what is wrong; the command line prints it after "annotator: error: " and exits with
 * {@link #exitCode()}.
 */
public abstract class AnnotatorException extends RuntimeException {

    protected AnnotatorException(String message) {
        super(message);
    }

    protected AnnotatorException(String message, Throwable cause) {
        super(message, cause);
    }

    /** Process exit status, following the BSD sysexits convention. */
    public abstract int exitCode();
}
