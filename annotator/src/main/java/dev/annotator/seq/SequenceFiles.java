package dev.annotator.seq;

import dev.annotator.io.InputFormat;
import dev.annotator.io.InputOpener;
import dev.annotator.io.RawInputObserver;

import java.io.InputStream;
import java.util.function.Consumer;

/**
 * Opens a sequence file in the format its first line shows: GenBank flat file (a {@code LOCUS} line) or FASTA.
 * Standard input ("-") is read as FASTA.
 */
public final class SequenceFiles {
    private SequenceFiles() {
    }

    /** With no length limit beyond one Java array and no observer. */
    public static SequenceReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings) {
        return open(pathOrDash, stdin, warnings, RecordLengthLimit.ARRAY, null);
    }

    /**
     * @param limit    refuse longer records (FASTA: as soon as the first base too many is read)
     * @param rawBytes sees the raw bytes read (may be null), for progress and checksums
     */
    public static SequenceReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings,
                                      RecordLengthLimit limit, RawInputObserver rawBytes) {
        return open(pathOrDash, stdin, warnings, limit, rawBytes, false);
    }

    /**
     * @param inflateAhead inflate gzip input on a thread of its own, ahead of the parser (for callers that may use
     *                     more than one thread)
     */
    public static SequenceReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings,
                                      RecordLengthLimit limit, RawInputObserver rawBytes, boolean inflateAhead) {
        if (!InputOpener.STDIN.equals(pathOrDash) && InputFormat.detect(pathOrDash) == InputFormat.GENBANK) {
            return GenbankRecordReader.open(pathOrDash, stdin, rawBytes, inflateAhead);
        }
        return FastaRecordReader.open(pathOrDash, stdin, warnings, limit, rawBytes, inflateAhead);
    }
}
