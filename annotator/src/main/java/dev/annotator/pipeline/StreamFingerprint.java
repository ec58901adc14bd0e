package dev.annotator.pipeline;

import dev.annotator.io.RawInputObserver;
import dev.annotator.model.InputFingerprint;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** Size and SHA-256 of an input taken from the bytes as the run reads them (no second pass over the file). */
final class StreamFingerprint implements RawInputObserver {
    private final MessageDigest sha;
    private long bytes;

    StreamFingerprint() {
        try {
            sha = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }

    @Override
    public void consumed(byte[] b, int offset, int length) {
        sha.update(b, offset, length);
        bytes += length;
    }

    /** Call once the input has been read to its end. */
    InputFingerprint finish(String name) {
        return new InputFingerprint(name, bytes, HexFormat.of().formatHex(sha.digest()));
    }
}
