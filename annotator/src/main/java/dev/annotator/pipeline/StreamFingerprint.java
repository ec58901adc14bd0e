package dev.annotator.pipeline;

import dev.annotator.io.RawInputObserver;
import dev.annotator.model.InputFingerprint;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** Size and SHA-256 of an input's bytes as they are read, for a trained model's provenance. Use once. */
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

    InputFingerprint finish(String name) {
        return new InputFingerprint(name, bytes, HexFormat.of().formatHex(sha.digest()));
    }
}
