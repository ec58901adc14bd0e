package dev.annotator.pipeline;

import dev.annotator.error.IoFailureException;
import dev.annotator.error.MissingInputException;
import dev.annotator.io.InputChecksum;
import dev.annotator.io.RawInputObserver;
import dev.annotator.model.InputFingerprint;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Size and checksum of an input file as stored (compressed or not): SHA-256 for a trained model's provenance,
 * CRC-32 for a report's run summary.
 */
public final class InputFingerprints {
    private InputFingerprints() {
    }

    /**
     * @throws MissingInputException the file does not exist or cannot be read
     */
    public static InputFingerprint of(String name) {
        StreamFingerprint fingerprint = new StreamFingerprint();
        readThrough(name, fingerprint);
        return fingerprint.finish(name);
    }

    /**
     * @throws MissingInputException the file does not exist or cannot be read
     */
    public static InputChecksum checksumOf(String name) {
        StreamChecksum checksum = new StreamChecksum();
        readThrough(name, checksum);
        return checksum.finish(name);
    }

    private static void readThrough(String name, RawInputObserver observer) {
        Path path;
        try {
            path = Path.of(name);
        } catch (InvalidPathException e) {
            throw new MissingInputException(name + ": no such file");
        }
        if (Files.isDirectory(path)) {
            throw new MissingInputException(name + ": is a directory");
        }
        byte[] buf = new byte[1 << 16];
        try (InputStream in = Files.newInputStream(path)) {
            int n;
            while ((n = in.read(buf)) > 0) {
                observer.consumed(buf, 0, n);
            }
        } catch (NoSuchFileException e) {
            throw new MissingInputException(name + ": no such file");
        } catch (AccessDeniedException e) {
            throw new MissingInputException(name + ": cannot be read (permission denied)");
        } catch (IOException e) {
            throw new IoFailureException(name + ": read failed: " + e.getMessage(), e);
        }
    }
}
