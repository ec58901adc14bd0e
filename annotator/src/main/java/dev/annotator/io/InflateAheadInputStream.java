package dev.annotator.io;

import java.io.IOException;
import java.io.InputStream;
import java.io.InterruptedIOException;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;

/**
 * Reads its source on a thread of its own, up to {@link #QUEUED} full buffers ahead of the reader, so that inflating
 * gzip data and parsing it use two cores. The bytes and their order are the source's; a failure of the source is
 * raised to the reader, as the same exception, after every byte read before it, and again on every later read.
 *
 * <p>Written here rather than taken from a library: the read-ahead stream of commons-io 2.22.0 was tried and ended
 * silently, as if at the end of the data, on a truncated gzip file, which would lose records without a word.
 */
final class InflateAheadInputStream extends InputStream {
    /** Full buffers waiting for the reader; with the one being filled and the one being read, the memory held. */
    static final int QUEUED = 2;

    /** How long {@link #close()} waits for the filling thread to end. */
    static final long STOP_WAIT_MS = 1_000;

    private static final Object END = new Object();

    private final InputStream source;
    private final BlockingQueue<Object> full = new ArrayBlockingQueue<>(QUEUED);
    private final Thread filler;
    private byte[] current;
    private int position;
    private int limit;
    private boolean ended;
    private Throwable failure;
    private volatile boolean closed;

    /** A filled buffer of the source's bytes. */
    private record Chunk(byte[] bytes, int length) {
    }

    /** What stopped the source. */
    private record Failure(Throwable cause) {
    }

    InflateAheadInputStream(InputStream source, int bufferSize, String threadName) {
        if (bufferSize < 1) {
            throw new IllegalArgumentException("buffer size must be positive");
        }
        this.source = source;
        this.filler = new Thread(() -> fill(bufferSize), threadName);
        filler.setDaemon(true);
        filler.start();
    }

    private void fill(int bufferSize) {
        try {
            while (!closed) {
                byte[] buffer = new byte[bufferSize];
                int n = source.readNBytes(buffer, 0, bufferSize);
                if (n > 0) {
                    full.put(new Chunk(buffer, n));
                }
                if (n < bufferSize) {
                    full.put(END);
                    return;
                }
            }
        } catch (InterruptedException e) {
            // closed by the reader: nobody waits for more
        } catch (Throwable t) {
            if (!closed) {
                try {
                    full.put(new Failure(t));
                } catch (InterruptedException ignored) {
                    // closed meanwhile
                }
            }
        }
    }

    /** False at the end of the data; raises the source's failure once every byte before it has been read. */
    private boolean ensureBytes() throws IOException {
        while (current == null || position == limit) {
            if (ended) {
                return false;
            }
            if (failure != null) {
                throw rethrown(failure);
            }
            if (closed) {
                throw new IOException("stream closed");
            }
            Object next;
            try {
                next = full.take();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while waiting for input");
            }
            if (next == END) {
                ended = true;
                current = null;
            } else if (next instanceof Failure f) {
                failure = f.cause();
                current = null;
            } else {
                Chunk c = (Chunk) next;
                current = c.bytes();
                position = 0;
                limit = c.length();
            }
        }
        return true;
    }

    /** The source's own IOException, unchanged, so that callers translate it as they would without read-ahead. */
    private static IOException rethrown(Throwable t) {
        if (t instanceof IOException io) {
            return io;
        }
        if (t instanceof RuntimeException r) {
            throw r;
        }
        if (t instanceof Error e) {
            throw e;
        }
        return new IOException(t);
    }

    @Override
    public int read() throws IOException {
        if (!ensureBytes()) {
            return -1;
        }
        return current[position++] & 0xFF;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        java.util.Objects.checkFromIndexSize(off, len, b.length);
        if (len == 0) {
            return 0;
        }
        if (!ensureBytes()) {
            return -1;
        }
        int n = Math.min(len, limit - position);
        System.arraycopy(current, position, b, off, n);
        position += n;
        return n;
    }

    @Override
    public int available() {
        return current == null ? 0 : limit - position;
    }

    /**
     * Stops the filling thread and closes the source. Waits (up to {@link #STOP_WAIT_MS} ms) for the thread to end,
     * so that the source's observers are not called after the caller has moved on: a file read is interrupted at
     * once; only a blocking read of a pipe can outlast the wait.
     */
    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        filler.interrupt();
        full.clear(); // a filler waiting to hand over a buffer gets its interrupt, or room to finish its put
        try {
            source.close();
        } finally {
            try {
                filler.join(STOP_WAIT_MS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
