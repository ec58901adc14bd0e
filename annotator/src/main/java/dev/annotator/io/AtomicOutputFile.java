package dev.annotator.io;

import dev.annotator.error.IoFailureException;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.UUID;

/**
 * An output file that appears at its target path only when complete: bytes go to a hidden temporary file in
 * the same directory (so the final rename stays on one file system and is atomic), {@link #commit()} renames
 * it into place, and {@link #close()} without a commit deletes it. A failed or interrupted run therefore never
 * leaves a partial file at the target path.
 */
public final class AtomicOutputFile implements AutoCloseable {
    private final Path target;
    private final Path temporary;
    private final OutputStream stream;
    // removes the temporary file if the process is interrupted (SIGINT, SIGTERM) before commit or close
    private final Thread cleanupOnExit;
    private boolean committed;

    private AtomicOutputFile(Path target, Path temporary, OutputStream stream) {
        this.target = target;
        this.temporary = temporary;
        this.stream = stream;
        this.cleanupOnExit = new Thread(() -> deleteQuietly(temporary), "annotator-output-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanupOnExit);
    }

    /**
     * @throws IoFailureException when the directory is missing or not writable
     */
    public static AtomicOutputFile create(Path target) {
        Path absolute = target.toAbsolutePath();
        Path dir = absolute.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new IoFailureException(target + ": output directory " + dir + " does not exist");
        }
        if (Files.isDirectory(absolute)) {
            throw new IoFailureException(target + ": is a directory");
        }
        try {
            // created like any new file (mode from the umask), unlike createTempFile's owner-only mode, so the
            // renamed output has the permissions a user expects
            Path tmp = dir.resolve("." + absolute.getFileName() + "." + UUID.randomUUID() + ".partial");
            Files.createFile(tmp);
            return new AtomicOutputFile(target, tmp, new BufferedOutputStream(Files.newOutputStream(tmp), 1 << 16));
        } catch (IOException e) {
            throw new IoFailureException(target + ": cannot create output in " + dir + " (" + reason(e) + ")", e);
        }
    }

    public Path target() {
        return target;
    }

    /** The stream to write to; buffered. Do not close it: commit or close this object instead. */
    public OutputStream stream() {
        return stream;
    }

    /** Flushes, closes and renames the temporary file to the target path. */
    public void commit() {
        try {
            stream.close();
            try {
                Files.move(temporary, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING);
            }
            committed = true;
            forgetCleanup();
        } catch (IOException e) {
            throw new IoFailureException(target + ": write failed (" + reason(e) + ")", e);
        }
    }

    /** Discards the temporary file unless {@link #commit()} succeeded. */
    @Override
    public void close() {
        if (committed) {
            return;
        }
        try {
            stream.close();
        } catch (IOException ignored) {
            // the output is being discarded; the original failure is what the user needs to see
        }
        deleteQuietly(temporary);
        forgetCleanup();
    }

    private void forgetCleanup() {
        try {
            Runtime.getRuntime().removeShutdownHook(cleanupOnExit);
        } catch (IllegalStateException shuttingDown) {
            // the hook is running or about to; it deletes a file that may already be gone, which is harmless
        }
    }

    private static void deleteQuietly(Path file) {
        try {
            Files.deleteIfExists(file);
        } catch (IOException ignored) {
            // nothing more can be done; the temporary name is hidden and marked .partial
        }
    }

    static String reason(IOException e) {
        String m = e.getMessage();
        return m == null ? e.getClass().getSimpleName() : m;
    }
}
