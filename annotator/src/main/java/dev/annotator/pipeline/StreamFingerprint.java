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
 * one part of a run that cannot use both cores, and hashing on the reading thread would lengthen it.
 */
final class StreamFingerprint implements RawInputObserver, AutoCloseable {
    /** Chunks waiting to be hashed; the reader waits when the digest falls this far behind. */
    private static final int QUEUE = 64;
    private static final byte[] END = new byte[0];

    private final MessageDigest sha;
    private final BlockingQueue<byte[]> chunks = new ArrayBlockingQueue<>(QUEUE);
    private final Thread digester;
    private long bytes;
    private boolean ended;

    StreamFingerprint() {
        try {
            sha = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
        digester = new Thread(this::digest, "input-sha256");
        digester.setDaemon(true);
        digester.start();
    }

    private void digest() {
        try {
            for (byte[] chunk = chunks.take(); chunk != END; chunk = chunks.take()) {
                sha.update(chunk);
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    @Override
    public void consumed(byte[] b, int offset, int length) {
        if (length == 0) {
            return;
        }
        byte[] copy = java.util.Arrays.copyOfRange(b, offset, offset + length);
        put(copy);
        bytes += length;
    }

    private void put(byte[] chunk) {
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
        return new InputFingerprint(name, bytes, HexFormat.of().formatHex(sha.digest()));
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
        put(END);
        try {
            digester.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while hashing the input", e);
        }
    }
}
