package dev.annotator.seq;

import java.io.Closeable;
import java.io.Flushable;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;

/**
 * Writes {@link SequenceRecord}s as FASTA: a header line {@code >name description} (no trailing space when the
 * description is empty), then the bases exactly as held, {@value #LINE_WIDTH} per line, {@code '\n'} line ends.
 *
 * <p>Bases are copied into an internal buffer in line-sized slices, so the cost per base is one array copy
 * whether or not the target stream is buffered. The wrapped stream is closed by {@link #close()} only when the
 * constructor was asked to; otherwise {@code close()} just flushes.
 */
public final class FastaWriter implements Closeable, Flushable {
    /** Bases per line (common practice for FASTA output). */
    public static final int LINE_WIDTH = 60;

    private static final int BUFFER_SIZE = 1 << 16;

    private final OutputStream out;
    private final boolean closeUnderlying;
    private final byte[] buffer = new byte[BUFFER_SIZE];
    private int used;

    /** Wraps {@code out}; {@link #close()} will not close it. */
    public FastaWriter(OutputStream out) {
        this(out, false);
    }

    /** Wraps {@code out}; {@link #close()} closes it when {@code closeUnderlying} is true. */
    public FastaWriter(OutputStream out, boolean closeUnderlying) {
        this.out = out;
        this.closeUnderlying = closeUnderlying;
    }

    public void write(SequenceRecord record) throws IOException {
        String name = record.name();
        String description = record.description() == null ? "" : record.description();
        if (name == null || name.isEmpty() || name.chars().anyMatch(c -> c <= ' ')) {
            // the name is the header's first word: it ends at the first white space
            throw new IllegalArgumentException("FASTA record name must be one non-empty word, got '" + name + "'");
        }
        if (description.indexOf('\n') >= 0 || description.indexOf('\r') >= 0) {
            throw new IllegalArgumentException("record " + name + ": description must be one line");
        }
        put((byte) '>');
        put(name.getBytes(StandardCharsets.UTF_8));
        if (!description.isEmpty()) {
            put((byte) ' ');
            put(description.getBytes(StandardCharsets.UTF_8));
        }
        put((byte) '\n');
        byte[] bases = record.bases();
        for (int off = 0; off < bases.length; off += LINE_WIDTH) {
            put(bases, off, Math.min(LINE_WIDTH, bases.length - off));
            put((byte) '\n');
        }
    }

    @Override
    public void flush() throws IOException {
        drain();
        out.flush();
    }

    @Override
    public void close() throws IOException {
        flush();
        if (closeUnderlying) {
            out.close();
        }
    }

    private void put(byte b) throws IOException {
        if (used == buffer.length) {
            drain();
        }
        buffer[used++] = b;
    }

    private void put(byte[] src) throws IOException {
        put(src, 0, src.length);
    }

    private void put(byte[] src, int off, int len) throws IOException {
        while (len > 0) {
            if (used == buffer.length) {
                drain();
            }
            int n = Math.min(len, buffer.length - used);
            System.arraycopy(src, off, buffer, used, n);
            used += n;
            off += n;
            len -= n;
        }
    }

    private void drain() throws IOException {
        if (used > 0) {
            out.write(buffer, 0, used);
            used = 0;
        }
    }
}
