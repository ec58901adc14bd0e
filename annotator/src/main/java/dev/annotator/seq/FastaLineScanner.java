package dev.annotator.seq;

import dev.annotator.error.BadInputException;

import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;

/**
 * Watches FASTA bytes on their way to the parser and stops at the first thing the parser would silently
 * accept or mangle: data before the first header, a header without a name, a non-IUPAC byte in a sequence,
 * a repeated record name, a record too long to hold, a line the parser would have to buffer whole that is too
 * long (a header or comment line over {@link #MAX_HEADER_LENGTH} bytes, a line of blanks over the record limit),
 * binary data where the first header should be, control bytes or invalid UTF-8 in a header. It also keeps line
 * numbers for messages and a queue
 * of the records it has seen to the end, so the reader can pair each parsed record with its header line
 * and notice the empty records the parser drops without a word.
 *
 * <p>Line ends are LF, CR LF or a lone CR, as in {@link java.io.BufferedReader#readLine()}, which the
 * parser uses. A line is a header if its first non-blank byte is '&gt;', a comment if it is ';'. The bytes
 * pass through unchanged.
 *
 * <p>Speed matters: every base goes through {@link #scan}, whose inner loop is one table load and compare
 * per byte over runs of bases; everything else (line ends, blanks, headers) is off that path.
 */
final class FastaLineScanner extends FilterInputStream {
    /**
     * The longest header or comment line, in bytes. The parser buffers a whole line before it looks at it, so an
     * unbounded line is unbounded memory; a header is a name and a description, and a megabyte of it is a
     * mistake (a sequence joined onto its header, a binary file), not a description.
     */
    static final int MAX_HEADER_LENGTH = 1 << 20;

    private static final byte BASE = 0;
    private static final byte BLANK = 1;
    private static final byte LF = 2;
    private static final byte CR = 3;
    private static final byte OTHER = 4;
    private static final byte[] CLASS = buildClasses();

    private static final int LINE_START = 0;
    private static final int HEADER = 1;
    private static final int SEQUENCE = 2;
    private static final int COMMENT = 3;

    private final String fileName;
    private final long maxRecordLength;
    private final String limitReason;
    private final ArrayDeque<ScannedRecord> finished = new ArrayDeque<>();
    private final Map<String, Long> firstSeenAt = new HashMap<>();
    private final byte[] single = new byte[1];

    private int state = LINE_START;
    private long line = 1;
    /** The previous line ended with CR, so an LF now completes that line end rather than ending a line. */
    private boolean afterCr;
    private boolean lineHasBase;
    /** Bytes of the current line so far, line end excluded: what the parser's line buffer holds. */
    private long lineLength;
    private boolean blankAfterBase;
    private boolean ended;
    private int headersSeen;

    private byte[] header = new byte[256];
    private int headerLength;
    private long headerLine;

    /** The record being scanned; {@code currentName == null} until the first header line is complete. */
    private String currentName;
    private String currentDescription;
    private String currentHeaderText;
    private boolean currentAscii;
    private long currentLine;
    private long currentBases;
    private boolean currentInteriorBlanks;

    FastaLineScanner(InputStream in, String fileName) {
        this(in, fileName, RecordLengthLimit.ARRAY);
    }

    /** With a lower record length limit: the memory a run can spare, or a small one for tests. */
    FastaLineScanner(InputStream in, String fileName, RecordLengthLimit limit) {
        super(in);
        this.fileName = fileName;
        this.maxRecordLength = limit.bases();
        this.limitReason = limit.reason();
    }

    /** The oldest record scanned to its end and not yet taken, or null. */
    ScannedRecord pollFinished() {
        return finished.poll();
    }

    /** Header lines seen so far (complete ones). */
    int headersSeen() {
        return headersSeen;
    }

    @Override
    public int read() throws IOException {
        int b = in.read();
        if (b < 0) {
            endOfInput();
        } else {
            single[0] = (byte) b;
            scan(single, 0, 1);
        }
        return b;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        int n = in.read(b, off, len);
        if (n < 0) {
            endOfInput();
        } else {
            scan(b, off, off + n);
        }
        return n;
    }

    /** Skipped bytes must still be scanned, or line numbers and checks would go wrong. */
    @Override
    public long skip(long n) throws IOException {
        byte[] scratch = new byte[(int) Math.min(n, 8192)];
        long skipped = 0;
        while (skipped < n) {
            int got = read(scratch, 0, (int) Math.min(scratch.length, n - skipped));
            if (got < 0) {
                break;
            }
            skipped += got;
        }
        return skipped;
    }

    @Override
    public boolean markSupported() {
        return false;
    }

    private void scan(byte[] buf, int from, int to) {
        final byte[] cls = CLASS;
        int i = from;
        while (i < to) {
            if (state == SEQUENCE) {
                int runStart = i;
                while (i < to && cls[buf[i] & 0xFF] == BASE) {
                    i++;
                }
                if (i > runStart) {
                    afterBases(i - runStart);
                }
                if (i == to) {
                    return;
                }
                byte b = buf[i++];
                switch (cls[b & 0xFF]) {
                    case BLANK -> {
                        blankAfterBase |= lineHasBase;
                        lineLength++;
                        checkLineLength();
                    }
                    case LF -> endLine(false);
                    case CR -> endLine(true);
                    default -> throw invalidCharacter(b);
                }
            } else if (state == LINE_START) {
                atLineStart(buf[i]);
                if (state != SEQUENCE) {
                    i++; // a sequence byte is left for the run loop to count
                }
            } else {
                i = restOfLine(buf, i, to);
            }
        }
    }

    private void afterBases(int run) {
        if (blankAfterBase) {
            currentInteriorBlanks = true;
        }
        lineHasBase = true;
        currentBases += run;
        lineLength += run;
        if (currentBases > maxRecordLength) {
            throw new BadInputException(fileName + ":" + line + ": record " + currentName
                    + ": longer than " + maxRecordLength + " bases, " + limitReason);
        }
    }

    /** Blanks cost the parser's line buffer as much as bases do, so a line of them has the record's bound. */
    private void checkLineLength() {
        if (lineLength > maxRecordLength) {
            throw new BadInputException(fileName + ":" + line + ": line longer than " + maxRecordLength + " bytes, "
                    + limitReason);
        }
    }

    private void atLineStart(byte b) {
        byte c = CLASS[b & 0xFF];
        if (c == LF) {
            if (afterCr) {
                afterCr = false;
            } else {
                line++;
            }
            return;
        }
        afterCr = false;
        if (c == CR) {
            line++;
            afterCr = true;
        } else if (c == BLANK) {
            lineLength++; // leading blanks: the parser trims them, but only after buffering the line
            checkLineLength();
        } else if (b == '>') {
            startHeader();
        } else if (b == ';') {
            state = COMMENT;
        } else if (currentName == null) {
            throw beforeFirstHeader(b);
        } else if (c == BASE) {
            state = SEQUENCE;
        } else {
            throw invalidCharacter(b);
        }
    }

    /** Header or comment: consume up to and including the line end, or to the end of the buffer. */
    private int restOfLine(byte[] buf, int from, int to) {
        int i = from;
        while (i < to && buf[i] != '\n' && buf[i] != '\r') {
            i++;
        }
        lineLength += i - from;
        if (lineLength >= MAX_HEADER_LENGTH) { // the '>' or ';' is not counted, so >= means over the limit
            throw new BadInputException(fileName + ":" + line + ": " + (state == HEADER ? "header" : "comment")
                    + " line longer than " + MAX_HEADER_LENGTH + " bytes");
        }
        if (state == HEADER) {
            appendHeader(buf, from, i - from);
        }
        if (i < to) {
            if (state == HEADER) {
                finishHeader();
            }
            endLine(buf[i] == '\r');
            i++;
        }
        return i;
    }

    private void endLine(boolean cr) {
        line++;
        afterCr = cr;
        state = LINE_START;
        lineLength = 0;
        lineHasBase = false;
        blankAfterBase = false;
    }

    private void startHeader() {
        finishRecord();
        state = HEADER;
        headerLength = 0;
        headerLine = line;
    }

    private void appendHeader(byte[] buf, int from, int length) {
        if (headerLength + length > header.length) {
            header = Arrays.copyOf(header, Math.max(header.length * 2, headerLength + length));
        }
        System.arraycopy(buf, from, header, headerLength, length);
        headerLength += length;
    }

    private void finishHeader() {
        boolean ascii = true;
        for (int i = 0; i < headerLength; i++) {
            byte b = header[i];
            ascii &= b >= 0;
            // tab separates words; any other C0 control byte is a sign of binary data (or a terminal escape that
            // would end up in messages). DEL is left alone: it is inert, and GFF3 escapes it in a seqid
            if (b >= 0 && b < ' ' && b != '\t') {
                throw new BadInputException(fileName + ":" + headerLine + ": header has control byte "
                        + String.format("0x%02x", b));
            }
        }
        String text = ascii ? new String(header, 0, headerLength, StandardCharsets.US_ASCII) : utf8Header();
        // the parser trims every char <= ' ' from the line's end; do the same so the texts can be compared
        int end = text.length();
        while (end > 0 && text.charAt(end - 1) <= ' ') {
            end--;
        }
        text = text.substring(0, end);
        int nameStart = 0;
        while (nameStart < end && text.charAt(nameStart) <= ' ') {
            nameStart++;
        }
        int nameEnd = nameStart;
        while (nameEnd < end && text.charAt(nameEnd) > ' ') {
            nameEnd++;
        }
        if (nameStart == nameEnd) {
            throw new BadInputException(fileName + ":" + headerLine + ": header has no sequence name");
        }
        String name = text.substring(nameStart, nameEnd);
        Long first = firstSeenAt.putIfAbsent(name, headerLine);
        if (first != null) {
            throw new BadInputException(fileName + ":" + headerLine + ": duplicate record name '" + name
                    + "' (first seen at line " + first + ")");
        }
        headersSeen++;
        currentName = name;
        currentDescription = text.substring(nameEnd).trim();
        currentHeaderText = text;
        currentAscii = ascii;
        currentLine = headerLine;
        currentBases = 0;
        currentInteriorBlanks = false;
    }

    private void finishRecord() {
        if (currentName != null) {
            finished.add(new ScannedRecord(currentName, currentDescription, currentHeaderText, currentAscii,
                    currentLine, currentBases, currentInteriorBlanks));
            currentName = null;
        }
    }

    private void endOfInput() {
        if (ended) {
            return;
        }
        ended = true;
        if (state == HEADER) {
            finishHeader(); // last line is a header without a line end
        }
        finishRecord();
        state = LINE_START;
    }

    /** Names are compared and written out as text; bytes that are not UTF-8 would turn into replacement characters. */
    private String utf8Header() {
        try {
            return StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(header, 0, headerLength))
                    .toString();
        } catch (CharacterCodingException e) {
            throw new BadInputException(fileName + ":" + headerLine + ": header is not valid UTF-8 text");
        }
    }

    /**
     * A nucleotide code is sequence without a header; other printable text is another format (FASTQ's '@', a
     * GFF3 '#', an HTML page); anything outside printable ASCII means the file is not text at all (binary data,
     * UTF-16, a byte order mark).
     */
    private BadInputException beforeFirstHeader(byte b) {
        int v = b & 0xFF;
        String where = fileName + ":" + line + ": ";
        if (CLASS[v] == BASE) {
            return new BadInputException(where + "sequence data before the first '>' header");
        }
        if (v < ' ' || v >= 0x7F) {
            return new BadInputException(where + "not FASTA text: byte " + String.format("0x%02x", v)
                    + " before the first '>' header");
        }
        return new BadInputException(where + "not FASTA: expected a '>' header line, found '" + (char) v + "'");
    }

    private BadInputException invalidCharacter(byte b) {
        int v = b & 0xFF;
        String shown = v > ' ' && v < 0x7F
                ? String.format("'%c' (0x%02x)", (char) v, v)
                : String.format("0x%02x", v);
        return new BadInputException(fileName + ":" + line + ": record " + currentName + ": invalid character "
                + shown + " in sequence");
    }

    private static byte[] buildClasses() {
        byte[] t = new byte[256];
        for (int v = 0; v < 256; v++) {
            t[v] = BaseCode.isValid((byte) v) ? BASE : OTHER;
        }
        t[' '] = BLANK;
        t['\t'] = BLANK;
        t['\n'] = LF;
        t['\r'] = CR;
        return t;
    }
}
