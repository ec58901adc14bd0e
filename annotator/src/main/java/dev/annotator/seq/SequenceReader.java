package dev.annotator.seq;

/**
 * Records of one sequence file, one at a time, whatever its format. Close it when done (also after a failure).
 */
public interface SequenceReader extends AutoCloseable {
    /**
     * The next record, or null at the end of the input.
     *
     * @throws dev.annotator.error.BadInputException  malformed data
     * @throws dev.annotator.error.IoFailureException reading failed
     */
    SequenceRecord next();

    @Override
    void close();
}
