package dev.annotator.io;

import dev.annotator.error.IoFailureException;
import dev.annotator.error.UsageException;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.UUID;

/**
 * An output file that appears at its target path only when complete: bytes go to a hidden temporary file in
 * the same directory (so the final rename stays on one file system and is atomic), {@link #commit()} renames
 * it into place, and {@link #close()} without a commit deletes it. A failed or interrupted run therefore never
 * leaves a partial file at the target path.
 *
 * <p>A symbolic link is followed: the file it points to is replaced, the link stays. A target that exists and is
 * not a regular file (a device such as /dev/null or /dev/stdout, a named pipe) cannot be replaced by renaming, so
 * it is written directly.
 *
 * <p>{@link #create} replaces an existing file; {@link #createNew} refuses one, both when it is created and when
 * it is committed (a file that appeared in between is not replaced either).
 */
public final class AtomicOutputFile implements AutoCloseable {
    private final Path target;
    private final Path destination;
    private final Path temporary;
    private final OutputStream stream;
    // removes the temporary file if the process is interrupted (SIGINT, SIGTERM) before commit or close
    private final Thread cleanupOnExit;
    private final boolean replaceExisting;
    private boolean committed;

    /**
     * @param target      the path as the user gave it (for messages)
     * @param destination where the file lands (a link's target resolved)
     * @param temporary   null when writing directly to a device or pipe
     */
    private AtomicOutputFile(Path target, Path destination, Path temporary, OutputStream stream,
                             boolean replaceExisting) {
        this.target = target;
        this.replaceExisting = replaceExisting;
        this.destination = destination;
        this.temporary = temporary;
        this.stream = stream;
        if (temporary != null) {
            this.cleanupOnExit = new Thread(() -> deleteQuietly(temporary), "annotator-output-cleanup");
            Runtime.getRuntime().addShutdownHook(cleanupOnExit);
        } else {
            this.cleanupOnExit = null;
        }
    }

    /**
     * An output that replaces whatever regular file is at {@code target} when committed.
     *
     * @throws IoFailureException when the directory is missing or not writable
     */
    public static AtomicOutputFile create(Path target) {
        return create(target, true);
    }

    /**
     * An output that must not replace an existing regular file (devices and pipes are still written).
     *
     * @throws UsageException     a regular file exists at {@code target} (or where its link points)
     * @throws IoFailureException when the directory is missing or not writable
     */
    public static AtomicOutputFile createNew(Path target) {
        return create(target, false);
    }

    private static AtomicOutputFile create(Path target, boolean replaceExisting) {
        if (Files.exists(target) && !Files.isRegularFile(target) && !Files.isDirectory(target)) {
            try {
                return new AtomicOutputFile(target, target, null, new BufferedOutputStream(Files.newOutputStream(target), 1 << 16),
                        true);
            } catch (IOException e) {
                throw new IoFailureException(target + ": cannot write (" + reason(e) + ")", e);
            }
        }
        Path absolute = target.toAbsolutePath();
        if (Files.isSymbolicLink(absolute)) {
            try {
                absolute = absolute.toRealPath();
            } catch (IOException dangling) {
                // the link points to a file not yet there: create that file, as writing through the link would
                try {
                    absolute = absolute.resolveSibling(Files.readSymbolicLink(absolute)).toAbsolutePath().normalize();
                } catch (IOException e) {
                    throw new IoFailureException(target + ": cannot follow link (" + reason(e) + ")", e);
                }
            }
        }
        Path dir = absolute.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new IoFailureException(target + ": output directory " + dir + " does not exist");
        }
        if (Files.isDirectory(absolute)) {
            throw new IoFailureException(target + ": is a directory");
        }
        if (!replaceExisting && Files.exists(absolute, LinkOption.NOFOLLOW_LINKS)) {
            throw new UsageException(target + ": already exists");
        }
        try {
            // created like any new file (mode from the umask), unlike createTempFile's owner-only mode, so the
            // renamed output has the permissions a user expects
            Path tmp = dir.resolve("." + absolute.getFileName() + "." + UUID.randomUUID() + ".partial");
            Files.createFile(tmp);
            return new AtomicOutputFile(target, absolute, tmp, new BufferedOutputStream(Files.newOutputStream(tmp), 1 << 16),
                    replaceExisting);
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
            if (temporary == null) {
                committed = true;
                return;
            }
            if (replaceExisting) {
                try {
                    Files.move(temporary, destination, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(temporary, destination, StandardCopyOption.REPLACE_EXISTING);
                }
            } else {
                // an atomic move may silently replace (rename(2) does); a plain move checks for the target first
                Files.move(temporary, destination);
            }
            committed = true;
            forgetCleanup();
        } catch (FileAlreadyExistsException e) {
            throw new UsageException(target + ": already exists (it appeared while this run was writing); not replaced");
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
        if (temporary != null) {
            deleteQuietly(temporary);
        }
        forgetCleanup();
    }

    private void forgetCleanup() {
        if (cleanupOnExit == null) {
            return;
        }
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
        if (e instanceof java.nio.file.FileSystemException fse && fse.getReason() != null) {
            // the plain reason ("Permission denied"); the message would name our hidden temporary file
            return fse.getReason().toLowerCase(java.util.Locale.ROOT);
        }
        if (e instanceof java.nio.file.AccessDeniedException) {
            return "permission denied";
        }
        String m = e.getMessage();
        return m == null ? e.getClass().getSimpleName() : m;
    }
}
