package dev.annotator.io;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.error.MissingInputException;

import java.io.BufferedInputStream;
import java.io.EOFException;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.zip.ZipException;

/**
 * Opens an input named on the command line: a file path, or "-" for standard input. Gzip is recognised by
 * its magic bytes, not by the file name, so "reads.fa" that is really compressed still works and
 * "x.fa.gz" that was already unpacked is read as it is.
 *
 * <p>The stream returned never throws {@link IOException} for data problems: a truncated or corrupt gzip
 * member, or data after the last member, surfaces as {@link BadInputException}, any other read failure as {@link IoFailureException}, both
 * with a one-line message naming the input.
 */
public final class InputOpener {
    /** The path that stands for standard input. */
    public static final String STDIN = "-";

    /** Large enough that inflating and reading a multi-gigabyte file is not dominated by call overhead. */
    static final int BUFFER_SIZE = 1 << 16;

    /** Each of the two buffers between the inflating thread and the parser: few hand-overs, little memory. */
    static final int INFLATE_AHEAD_BUFFER = 1 << 20;

    private static final int GZIP_MAGIC_1 = 0x1f;
    private static final int GZIP_MAGIC_2 = 0x8b;

    private InputOpener() {
    }

    /** The name used for an input in messages: the path as given, or "&lt;stdin&gt;" for "-". */
    public static String displayName(String pathOrDash) {
        return STDIN.equals(pathOrDash) ? "<stdin>" : pathOrDash;
    }

    /**
     * Opens a file or, for "-", the given standard input (which is not closed when the returned stream is).
     *
     * @throws MissingInputException the file does not exist, is a directory or cannot be read
     * @throws BadInputException     the input starts like gzip but its header is cut short or damaged
     * @throws IoFailureException    reading the first bytes failed
     */
    public static InputStream open(String pathOrDash, InputStream stdin) {
        return open(pathOrDash, stdin, null);
    }

    /**
     * As {@link #open(String, InputStream)}, showing the bytes taken from the file or stdin (compressed bytes for
     * gzip) to {@code rawBytes} when it is not null: progress against the file's size, checksums.
     */
    public static InputStream open(String pathOrDash, InputStream stdin, RawInputObserver rawBytes) {
        return open(pathOrDash, stdin, rawBytes, false);
    }

    /**
     * As {@link #open(String, InputStream, RawInputObserver)}; with {@code inflateAhead}, gzip input is read and
     * inflated on a thread of its own, a buffer ahead of the caller. Inflating costs about as much as parsing
     * (some 6 ns per base), and on a single long record nothing else can use the second core while the record is
     * read. The bytes are the same; a gzip error surfaces up to two buffers earlier than it would otherwise, which
     * can pre-empt a format error in the last megabytes before it. The raw-byte observer is then called from that
     * thread. Plain input is read as it is: copying it costs less than the hand-over. Memory: four buffers of
     * {@link #INFLATE_AHEAD_BUFFER} bytes at most.
     */
    public static InputStream open(String pathOrDash, InputStream stdin, RawInputObserver rawBytes,
                                   boolean inflateAhead) {
        String name = displayName(pathOrDash);
        InputStream raw = STDIN.equals(pathOrDash) ? new KeepOpenInputStream(stdin) : openFile(pathOrDash);
        if (rawBytes != null) {
            raw = new ObservedInputStream(raw, rawBytes);
        }
        BufferedInputStream buffered = new BufferedInputStream(raw, BUFFER_SIZE);
        boolean gzip = false;
        try {
            byte[] head = peek(buffered, 6);
            gzip = head.length >= 2 && (head[0] & 0xFF) == GZIP_MAGIC_1 && (head[1] & 0xFF) == GZIP_MAGIC_2;
            String other = gzip ? null : OtherCompression.of(head);
            if (other != null) {
                throw new BadInputException(name + ": " + other + "-compressed data; only plain or gzip-compressed "
                        + "input is read (decompress it first)");
            }
            // the first member header is read here, so a damaged one fails at once
            InputStream data = gzip ? new GzipMembers(buffered, BUFFER_SIZE) : buffered;
            if (gzip && inflateAhead) {
                data = new InflateAheadInputStream(data, INFLATE_AHEAD_BUFFER, "input-inflate");
            }
            return new ReadFailureTranslator(data, name, gzip);
        } catch (IOException e) {
            closeQuietly(buffered);
            throw translate(e, name, gzip);
        } catch (BadInputException e) {
            closeQuietly(buffered);
            throw e;
        }
    }

    private static InputStream openFile(String path) {
        Path file;
        try {
            file = Path.of(path);
        } catch (InvalidPathException e) {
            throw new MissingInputException(path + ": no such file");
        }
        if (!Files.exists(file)) {
            throw new MissingInputException(path + ": no such file");
        }
        if (Files.isDirectory(file)) {
            throw new MissingInputException(path + ": is a directory");
        }
        if (!Files.isReadable(file)) {
            throw new MissingInputException(path + ": cannot be read (permission denied)");
        }
        try {
            return Files.newInputStream(file);
        } catch (NoSuchFileException e) {
            // removed between the checks above and the open
            throw new MissingInputException(path + ": no such file");
        } catch (AccessDeniedException e) {
            throw new MissingInputException(path + ": cannot be read (permission denied)");
        } catch (IOException e) {
            throw new MissingInputException(path + ": cannot be opened: " + e.getMessage());
        }
    }

    /** Up to {@code n} first bytes, fewer if the input is shorter; the stream is left where it was. */
    private static byte[] peek(BufferedInputStream in, int n) throws IOException {
        in.mark(n);
        byte[] head = in.readNBytes(n);
        in.reset();
        return head;
    }

    /**
     * EOFException and ZipException come from the inflater (input ends inside a member, bad deflate data,
     * CRC or size mismatch in the trailer); they mean the data is bad, not that the device failed.
     */
    static RuntimeException translate(IOException e, String name, boolean gzip) {
        if (gzip && e instanceof GzipMembers.TrailingData) {
            return new BadInputException(name + ": data after the end of the gzip data (a damaged further member, "
                    + "or bytes appended to the file)", e);
        }
        if (gzip && (e instanceof EOFException || e instanceof ZipException)) {
            return new BadInputException(name + ": truncated or corrupt gzip data", e);
        }
        return new IoFailureException(name + ": read failed: " + e.getMessage(), e);
    }

    private static void closeQuietly(InputStream in) {
        try {
            in.close();
        } catch (IOException ignored) {
            // the open already failed; that failure is the one to report
        }
    }

    /** Standard input belongs to the process, not to whoever reads it. */
    private static final class KeepOpenInputStream extends FilterInputStream {
        KeepOpenInputStream(InputStream in) {
            super(in);
        }

        @Override
        public void close() {
            // deliberately left open
        }
    }

    /** Shows every byte read to an observer. */
    private static final class ObservedInputStream extends FilterInputStream {
        private final RawInputObserver observer;
        private final byte[] one = new byte[1];

        ObservedInputStream(InputStream in, RawInputObserver observer) {
            super(in);
            this.observer = observer;
        }

        @Override
        public int read() throws IOException {
            int b = in.read();
            if (b >= 0) {
                one[0] = (byte) b;
                observer.consumed(one, 0, 1);
            }
            return b;
        }

        @Override
        public int read(byte[] b, int off, int len) throws IOException {
            int n = in.read(b, off, len);
            if (n > 0) {
                observer.consumed(b, off, n);
            }
            return n;
        }

        @Override
        public long skip(long n) throws IOException {
            // skipped bytes would be missing from a checksum: read them instead
            byte[] buf = new byte[(int) Math.min(n, 1 << 16)];
            int r = read(buf, 0, buf.length);
            return Math.max(r, 0);
        }
    }
}
