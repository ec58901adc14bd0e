package dev.annotator.seq;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputOpener;

import java.io.IOException;
import java.io.InputStream;
import java.util.HashMap;
import java.util.Map;

/**
 * Reads GenBank flat-file records one at a time (plain or gzip, file or stdin): each record's sequence, and the
 * keys and locations of its feature table. Only what annotation needs is read: LOCUS, DEFINITION, ACCESSION,
 * VERSION, the FEATURES table (keys and locations, qualifiers skipped) and the ORIGIN sequence; other sections are
 * passed over.
 *
 * <p>Seqid: the VERSION (accession.version) when the record has one, else the first ACCESSION, else the LOCUS
 * name. The same record downloaded as FASTA from the INSDC databases is named by accession.version, so a
 * GenBank file and the FASTA of the same record give the same seqid, and GFF3 files of those databases use it in
 * column 1. Bases are kept as written (GenBank writes them in lower case), as {@link FastaRecordReader} keeps
 * FASTA bytes; {@link BaseCode} ignores case.
 *
 * <p>Why not BioJava's {@code GenbankReader} (biojava-core 7.2.2), which parses the three published records of
 * test-data/genbank correctly and fast: a record without ORIGIN silently gets the previous record's sequence (its
 * parser does not reset the sequence between records), bases are upper-cased and '.' and '~' rewritten to '-',
 * the length on the LOCUS line is not checked against the sequence, and its errors carry no line number. Our
 * reader checks all of those and names file and line; the test compares the two on the published records.
 *
 * <p>Memory: the current record's bases (one byte each, grown by doubling up to the declared length) and its
 * feature locations; lines are limited to {@link #MAX_LINE_LENGTH} bytes.
 */
public final class GenbankRecordReader implements SequenceReader {
    /** Longer lines are not GenBank (sequence lines hold 60 bases, text wraps at 80 columns). */
    static final int MAX_LINE_LENGTH = 1 << 20;

    private final String fileName;
    private final InputStream in;
    private final LineSource lines;
    private final Map<String, Long> firstSeenAt = new HashMap<>();
    private long records;
    private boolean finished;
    private boolean failed;

    private GenbankRecordReader(String fileName, InputStream in) {
        this.fileName = fileName;
        this.in = in;
        this.lines = new LineSource(in, fileName, MAX_LINE_LENGTH);
    }

    /**
     * Opens a GenBank file, or standard input for "-". Gzip is detected from the data.
     *
     * @throws dev.annotator.error.MissingInputException the file does not exist or cannot be read
     */
    public static GenbankRecordReader open(String pathOrDash, InputStream stdin) {
        return open(pathOrDash, stdin, null);
    }

    /** As above, also showing the raw input bytes read to {@code rawBytes} (may be null), for progress and checksums. */
    public static GenbankRecordReader open(String pathOrDash, InputStream stdin,
                                           dev.annotator.io.RawInputObserver rawBytes) {
        return open(pathOrDash, stdin, rawBytes, false);
    }

    /** As above; with {@code inflateAhead}, gzip input is inflated on a thread of its own (see InputOpener). */
    public static GenbankRecordReader open(String pathOrDash, InputStream stdin,
                                           dev.annotator.io.RawInputObserver rawBytes, boolean inflateAhead) {
        return new GenbankRecordReader(InputOpener.displayName(pathOrDash),
                InputOpener.open(pathOrDash, stdin, rawBytes, inflateAhead));
    }

    /**
     * The next record's sequence, or null at the end of the input.
     *
     * @throws BadInputException  malformed GenBank or gzip data, or no record in the whole input
     * @throws IoFailureException reading failed
     */
    public SequenceRecord next() {
        GenbankEntry entry = nextEntry();
        return entry == null ? null : entry.sequence();
    }

    /** As {@link #next()}, with the record's feature table. */
    public GenbankEntry nextEntry() {
        if (finished) {
            return null;
        }
        if (failed) {
            throw new IllegalStateException(fileName + ": reader used after a failure");
        }
        failed = true; // cleared only if this call gets through
        GenbankEntry entry;
        try {
            entry = readEntry();
        } catch (IOException e) {
            throw new IoFailureException(fileName + ": read failed: " + e.getMessage(), e);
        }
        failed = false;
        return entry;
    }

    private GenbankEntry readEntry() throws IOException {
        if (!skipBlankLines()) {
            finished = true;
            if (records == 0) {
                throw new BadInputException(fileName + ": no GenBank records (empty input)");
            }
            return null;
        }
        if (!isKeyword("LOCUS")) {
            throw fail(lines.number(), (records == 0 ? "not GenBank: expected a LOCUS line, found '"
                    : "expected a LOCUS line after the end of the previous record, found '") + preview() + "'");
        }
        long locusLine = lines.number();
        LocusLine locus = LocusLine.parse(lines.text(), fileName + ":" + locusLine);
        RecordBody body = new RecordBody(locus, locusLine);
        while (true) {
            if (!lines.advance()) {
                throw fail(lines.number(), "record " + locus.name()
                        + ": input ends before the record's closing '//' line");
            }
            if (lines.startsWith("//")) {
                break;
            }
            body.accept();
        }
        GenbankEntry entry = body.finish(lines.number());
        records++;
        return entry;
    }

    private boolean skipBlankLines() throws IOException {
        while (lines.advance()) {
            if (!lines.isBlank()) {
                return true;
            }
        }
        return false;
    }

    /** The line starts with this section keyword, followed by a blank or nothing. */
    private boolean isKeyword(String keyword) {
        return lines.startsWith(keyword) && (lines.length() == keyword.length()
                || lines.bytes()[keyword.length()] == ' ' || lines.bytes()[keyword.length()] == '\t');
    }

    private String preview() {
        String text = lines.text().strip();
        text = text.length() > 40 ? text.substring(0, 40) + "..." : text;
        StringBuilder shown = new StringBuilder();
        for (char c : text.toCharArray()) {
            shown.append(c < 0x20 || c == 0x7f ? '?' : c);
        }
        return shown.toString();
    }

    private BadInputException fail(long line, String what) {
        return new BadInputException(fileName + ":" + line + ": " + what);
    }

    /** The sections of one record after its LOCUS line, fed line by line. */
    private final class RecordBody {
        private static final int HEADER = 0;
        private static final int DEFINITION = 1;
        private static final int FEATURES = 2;
        private static final int ORIGIN = 3;
        private static final int OTHER = 4;

        private final LocusLine locus;
        private final long locusLine;
        private final FeatureTableCollector features = new FeatureTableCollector();
        private final StringBuilder definition = new StringBuilder();
        private String accession;
        private String version;
        private int section = HEADER;
        private boolean originSeen;
        private byte[] bases;
        private int count;

        RecordBody(LocusLine locus, long locusLine) {
            this.locus = locus;
            this.locusLine = locusLine;
            // a LOCUS line could claim any length: reserve at most 16 MiB before seeing the bases
            this.bases = new byte[(int) Math.min(locus.length(), 1 << 24)];
        }

        void accept() {
            if (section == ORIGIN) {
                sequenceLine();
                return;
            }
            if (lines.isBlank()) {
                return;
            }
            byte first = lines.bytes()[0];
            if (first == ' ' || first == '\t') {
                continuation();
                return;
            }
            String text = lines.text();
            String keyword = text.split("\\s+", 2)[0];
            String value = text.substring(keyword.length()).strip();
            switch (keyword) {
                case "LOCUS" -> throw fail(lines.number(), "LOCUS line inside record " + locus.name()
                        + " (its closing '//' line is missing)");
                case "DEFINITION" -> {
                    definition.append(value);
                    section = DEFINITION;
                }
                case "ACCESSION" -> {
                    accession = firstWord(value);
                    section = HEADER;
                }
                case "VERSION" -> {
                    version = firstWord(value);
                    section = HEADER;
                }
                case "FEATURES" -> section = FEATURES;
                case "ORIGIN" -> {
                    if (originSeen) {
                        throw fail(lines.number(), "record " + locus.name() + ": second ORIGIN line");
                    }
                    originSeen = true;
                    section = ORIGIN;
                }
                default -> section = OTHER;
            }
        }

        private void continuation() {
            if (section == DEFINITION) {
                definition.append(' ').append(lines.text().strip());
            } else if (section == FEATURES) {
                features.accept(lines.text(), lines.number());
            }
        }

        /** A line of ORIGIN: an optional position number, then bases in blocks separated by blanks. */
        private void sequenceLine() {
            byte[] line = lines.bytes();
            int n = lines.length();
            int i = 0;
            while (i < n && (line[i] == ' ' || line[i] == '\t')) {
                i++;
            }
            int digitsFrom = i;
            long position = 0;
            while (i < n && line[i] >= '0' && line[i] <= '9' && position < Long.MAX_VALUE / 10) {
                position = position * 10 + (line[i] - '0');
                i++;
            }
            if (i > digitsFrom && position != count + 1L) {
                throw fail(lines.number(), "record " + locus.name() + ": sequence line numbered " + position
                        + ", expected " + (count + 1L) + " (a line of bases lost or repeated)");
            }
            for (; i < n; i++) {
                byte b = line[i];
                if (b == ' ' || b == '\t') {
                    continue;
                }
                if (!BaseCode.isValid(b)) {
                    throw fail(lines.number(), "record " + locus.name() + ": invalid character " + describe(b)
                            + " in sequence");
                }
                if (count == locus.length()) {
                    throw fail(lines.number(), "record " + locus.name() + ": more bases than the "
                            + locus.length() + " on its LOCUS line (line " + locusLine + ")");
                }
                if (count == bases.length) {
                    bases = java.util.Arrays.copyOf(bases, (int) Math.min(2L * bases.length, locus.length()));
                }
                bases[count++] = b;
            }
        }

        GenbankEntry finish(long endLine) {
            if (!originSeen) {
                throw fail(endLine, "record " + locus.name() + ": no ORIGIN section (the record has no sequence)");
            }
            if (count != locus.length()) {
                throw fail(endLine, "record " + locus.name() + ": sequence has " + count
                        + " bases, its LOCUS line (line " + locusLine + ") says " + locus.length());
            }
            String seqid = version != null ? version : accession != null ? accession : locus.name();
            Long first = firstSeenAt.putIfAbsent(seqid, locusLine);
            if (first != null) {
                throw fail(locusLine, "duplicate record name '" + seqid + "' (first seen at line " + first + ")");
            }
            byte[] exact = count == bases.length ? bases : java.util.Arrays.copyOf(bases, count);
            SequenceRecord sequence = new SequenceRecord(seqid, definition.toString(), exact);
            return new GenbankEntry(sequence, locus.name(), locus.circular(), features.finish());
        }
    }

    /** The first word of a header value, or null when there is none (an empty VERSION line). */
    private static String firstWord(String value) {
        String word = value.split("\\s+", 2)[0];
        return word.isEmpty() ? null : word;
    }

    /** As the FASTA reader shows bytes: printable ASCII quoted with its code, anything else as its code alone. */
    private static String describe(byte b) {
        int v = b & 0xFF;
        String hex = String.format("0x%02x", v);
        return v > 0x20 && v < 0x7f ? "'" + (char) v + "' (" + hex + ")" : hex;
    }

    @Override
    public void close() {
        try {
            in.close();
        } catch (IOException e) {
            throw new IoFailureException(fileName + ": close failed: " + e.getMessage(), e);
        }
    }
}
