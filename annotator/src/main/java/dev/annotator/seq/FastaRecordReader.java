package dev.annotator.seq;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputOpener;
import org.biojava.nbio.core.sequence.compound.NucleotideCompound;
import org.biojava.nbio.core.sequence.io.FastaReader;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;
import java.util.Map;
import java.util.function.Consumer;

/**
 * Reads FASTA records one at a time, each as one byte per base (plain or gzip input, file or stdin).
 *
 * <p>Parsing is BioJava's {@link FastaReader}, fed through {@link FastaLineScanner}, which rejects what
 * BioJava would accept silently (data before the first header, nameless headers, non-IUPAC bytes,
 * duplicate names) with a one-line {@link BadInputException} naming file and line. Records without bases
 * are reported to the warnings consumer and skipped.
 *
 * <p>Memory: only the current record is held, plus the parser's 8 KiB buffers and the names seen so far
 * (for the duplicate check). For a record of L bases the transient peak is about 4L bytes, all Latin-1:
 * multi-line records reach it when BioJava's StringBuilder (grown by doubling, so up to 2L) is turned into
 * a String (L) and we copy that into our byte[] (L); a single-line record first needs BioJava's line buffer
 * (up to 2L) plus the line String (L), then builder, String and byte[] (L each, 3L). Afterwards only the
 * record's own L bytes stay. Blanks inside sequence lines cost one more L-byte copy to remove. Header and
 * comment lines are bounded by {@link FastaLineScanner#MAX_HEADER_LENGTH}, records by a {@link RecordLengthLimit}
 * (by default the array limit; the pipeline passes what its heap can hold), so no input makes the parser buffer
 * without bound.
 */
public final class FastaRecordReader implements SequenceReader {
    private final String fileName;
    private final FastaLineScanner scanner;
    private final FastaReader<ByteBackedSequence, NucleotideCompound> parser;
    private final Consumer<String> warnings;

    private long recordsReturned;
    private long emptySkipped;
    private boolean finished;
    private boolean failed;

    FastaRecordReader(String fileName, FastaLineScanner scanner, Consumer<String> warnings) {
        this.fileName = fileName;
        this.scanner = scanner;
        this.warnings = warnings;
        this.parser = new FastaReader<>(scanner, new RawHeaderKeeper(), new ByteSequenceCreator());
    }

    /**
     * Opens a FASTA file, or standard input for "-". Gzip is detected from the data.
     *
     * @param warnings receives one-line warnings (records without sequence, which are skipped)
     * @throws dev.annotator.error.MissingInputException the file does not exist or cannot be read
     */
    public static FastaRecordReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings) {
        return open(pathOrDash, stdin, warnings, RecordLengthLimit.ARRAY);
    }

    /**
     * As {@link #open(String, InputStream, Consumer)}, refusing records longer than {@code limit} as soon as the
     * first base too many is read, before the parser has buffered more than that.
     */
    public static FastaRecordReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings,
                                         RecordLengthLimit limit) {
        return open(pathOrDash, stdin, warnings, limit, null);
    }

    /** As above, also showing the raw input bytes read to {@code rawBytes} (may be null), for progress and checksums. */
    public static FastaRecordReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings,
                                         RecordLengthLimit limit, dev.annotator.io.RawInputObserver rawBytes) {
        return open(pathOrDash, stdin, warnings, limit, rawBytes, false);
    }

    /** As above; with {@code inflateAhead}, gzip input is inflated on a thread of its own (see InputOpener). */
    public static FastaRecordReader open(String pathOrDash, InputStream stdin, Consumer<String> warnings,
                                         RecordLengthLimit limit, dev.annotator.io.RawInputObserver rawBytes,
                                         boolean inflateAhead) {
        String name = InputOpener.displayName(pathOrDash);
        InputStream in = InputOpener.open(pathOrDash, stdin, rawBytes, inflateAhead);
        return new FastaRecordReader(name, new FastaLineScanner(in, name, limit), warnings);
    }

    /**
     * The next record with at least one base, or null at the end of the input.
     *
     * @throws BadInputException  malformed FASTA or gzip data, or no record with sequence in the whole input
     * @throws IoFailureException reading failed
     */
    public SequenceRecord next() {
        if (finished) {
            return null;
        }
        if (failed) {
            throw new IllegalStateException(fileName + ": reader used after a failure");
        }
        failed = true; // cleared only if this call gets through
        Map<String, ByteBackedSequence> parsed;
        try {
            parsed = parser.process(1);
        } catch (IOException e) {
            throw new IoFailureException(fileName + ": read failed: " + e.getMessage(), e);
        }
        SequenceRecord record = parsed == null ? finish() : pair(parsed.values().iterator().next());
        failed = false;
        return record;
    }

    /** Matches the parser's record to the scanner's, warning about the empty ones the parser dropped. */
    private SequenceRecord pair(ByteBackedSequence parsed) {
        ScannedRecord scanned = nextNonEmpty();
        if (scanned == null) {
            throw new IllegalStateException(fileName + ": parser returned a record the scanner did not see");
        }
        byte[] bases = scanned.interiorBlanks() ? withoutBlanks(parsed.bases()) : parsed.bases();
        boolean sameHeader = !scanned.asciiHeader() || scanned.headerText().equals(parsed.getOriginalHeader());
        if (bases.length != scanned.bases() || !sameHeader) {
            throw new IllegalStateException(fileName + ":" + scanned.line() + ": parser and scanner disagree on record "
                    + scanned.name() + " (" + bases.length + " vs " + scanned.bases() + " bases)");
        }
        recordsReturned++;
        return new SequenceRecord(scanned.name(), scanned.description(), bases);
    }

    private ScannedRecord nextNonEmpty() {
        ScannedRecord r;
        while ((r = scanner.pollFinished()) != null && r.bases() == 0) {
            warnEmpty(r);
        }
        return r;
    }

    private SequenceRecord finish() {
        finished = true;
        ScannedRecord r;
        while ((r = scanner.pollFinished()) != null) {
            if (r.bases() != 0) {
                throw new IllegalStateException(fileName + ":" + r.line() + ": parser lost record " + r.name());
            }
            warnEmpty(r);
        }
        if (scanner.headersSeen() == 0) {
            throw new BadInputException(fileName + ": no FASTA records (empty input)");
        }
        if (recordsReturned == 0) {
            throw new BadInputException(fileName + ": no FASTA records with sequence (" + emptySkipped
                    + " empty " + (emptySkipped == 1 ? "record" : "records") + " skipped)");
        }
        return null;
    }

    private void warnEmpty(ScannedRecord r) {
        emptySkipped++;
        warnings.accept(fileName + ":" + r.line() + ": record " + r.name() + " has no sequence; skipped");
    }

    /**
     * BioJava trims each line but keeps blanks between bases; FASTA readers generally ignore them (common
     * practice). Compacts in place: the array is ours, fresh from the parser.
     */
    private static byte[] withoutBlanks(byte[] raw) {
        int n = 0;
        for (byte b : raw) {
            if (b != ' ' && b != '\t') {
                raw[n++] = b;
            }
        }
        return Arrays.copyOf(raw, n);
    }

    @Override
    public void close() {
        try {
            parser.close();
        } catch (IOException e) {
            throw new IoFailureException(fileName + ": close failed: " + e.getMessage(), e);
        }
    }
}
