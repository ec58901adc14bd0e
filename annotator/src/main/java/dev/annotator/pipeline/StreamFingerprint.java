package dev.annotator.pipeline;

import dev.annotator.io.RawInputObserver;
import dev.annotator.model.InputFingerprint;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;

/**
 * Size and SHA-256 of an input taken from the bytes as the run reads them (no second pass over the file). The
 * digest runs on a thread of its own, fed copies of the bytes through a short queue: reading a long record is the
 * one part of a run that cannot use both cores, and hashing on the reading thread would lengthen it. The thread
 * also sets the digest up (the first use of the security providers takes a few milliseconds). The reader gathers
 * the bytes into buffers of a megabyte, handed back and forth between the threads, so it allocates nothing per read
 * and wakes the digest once per megabyte rather than once per read.
 */
final class StreamFingerprint implements RawInputObserver, AutoCloseable {
    /** Buffers waiting to be hashed; the reader waits when the digest falls this far behind. */
    private static final int QUEUE = 8;
    private static final int BUFFER = 1 << 20;
    private static final Chunk END = new Chunk(new byte[0], 0);

    private record Chunk(byte[] bytes, int length) {
    }

    private final BlockingQueue<Chunk> chunks = new ArrayBlockingQueue<>(QUEUE);
    /** Buffers the digest is done with; the reader takes one before allocating. */
    private final BlockingQueue<byte[]> free = new ArrayBlockingQueue<>(QUEUE + 1);
    private final Thread digester;
    /** The buffer the reader is filling, and how much of it is filled. */
    private byte[] filling;
    private int filled;
    private String sha256;
    private long bytes;
    private boolean ended;

    StreamFingerprint() {
        digester = new Thread(this::digest, "input-sha256");
        digester.setDaemon(true);
        digester.start();
    }

    private void digest() {
        MessageDigest sha;
        try {
            sha = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            sha = null; // every Java platform has SHA-256; should this one not, the chunks are still taken
        }
        try {
            for (Chunk chunk = chunks.take(); chunk != END; chunk = chunks.take()) {
                if (sha != null) {
                    sha.update(chunk.bytes(), 0, chunk.length());
                }
                free.offer(chunk.bytes());
            }
            if (sha != null) {
                sha256 = HexFormat.of().formatHex(sha.digest());
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    @Override
    public void consumed(byte[] b, int offset, int length) {
        bytes += length;
        while (length > 0) {
            if (filling == null) {
                filling = free.poll();
                if (filling == null) {
                    filling = new byte[BUFFER];
                }
                filled = 0;
            }
            int n = Math.min(length, BUFFER - filled);
            System.arraycopy(b, offset, filling, filled, n);
            filled += n;
            offset += n;
            length -= n;
            if (filled == BUFFER) {
                handOver();
            }
        }
    }

    private void handOver() {
        put(new Chunk(filling, filled));
        filling = null;
    }

    private void put(Chunk chunk) {
        try {
            chunks.put(chunk);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while hashing the input", e);
        }
    }

    /** Call once the input has been read to its end: waits for the digest to catch up. */
    InputFingerprint finish(String name) {
        end();
        if (sha256 == null) {
            throw new IllegalStateException("no SHA-256 of the input: none on this platform, or hashing interrupted");
        }
        return new InputFingerprint(name, bytes, sha256);
    }

    /** Ends the digest thread (also when the run failed before the end of its input). */
    @Override
    public void close() {
        end();
    }

    private void end() {
        if (ended) {
            return;
        }
        ended = true;
        if (filling != null && filled > 0) {
            handOver();
        }
        put(END);
        try {
            digester.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while hashing the input", e);
        }
    }
}
