package dev.annotator.model;

import dev.annotator.error.IoFailureException;
import dev.annotator.error.MissingInputException;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/** Finds the model a user names: a model file, or failing that a shipped model. */
public final class ModelLoader {
    private ModelLoader() {
    }

    /**
     * Loads {@code pathOrName}: an existing file of that path wins (relative to the working directory); else a
     * shipped model of that name. Errors name the argument as the user wrote it.
     *
     * @throws MissingInputException neither a file nor a shipped model, or the file cannot be opened
     * @throws dev.annotator.error.BadInputException the file is not a valid model
     */
    public static HmmModel load(String pathOrName) {
        return load(pathOrName, Path.of(""));
    }

    /** As {@link #load(String)}, resolving a relative path against {@code workingDir}. */
    static HmmModel load(String pathOrName, Path workingDir) {
        Path path;
        try {
            path = workingDir.resolve(pathOrName);
        } catch (InvalidPathException e) {
            path = null; // not a path on this system (e.g. a NUL byte): it can only be a shipped name
        }
        if (path != null && Files.exists(path)) {
            return loadFile(path, pathOrName);
        }
        return ShippedModels.load(pathOrName).orElseThrow(() -> new MissingInputException(pathOrName
                + ": no such model file or shipped model (shipped: " + String.join(", ", ShippedModels.NAMES) + ")"));
    }

    /** Reads a model file, naming it {@code displayName} in errors. */
    public static HmmModel loadFile(Path path, String displayName) {
        if (Files.isDirectory(path)) {
            throw new MissingInputException(displayName + ": is a directory, not a model file");
        }
        try (InputStream in = Files.newInputStream(path)) {
            // a file's size is known: refuse at once rather than after parsing 64 MiB (a pipe is counted as read)
            if (Files.isRegularFile(path) && Files.size(path) > ModelJson.MAX_FILE_BYTES) {
                throw ModelJson.tooLarge(displayName);
            }
            return ModelJson.read(in, displayName);
        } catch (NoSuchFileException e) {
            throw new MissingInputException(displayName + ": no such file");
        } catch (AccessDeniedException e) {
            throw new MissingInputException(displayName + ": cannot open: permission denied");
        } catch (IOException e) {
            throw new IoFailureException(displayName + ": cannot read: " + e.getMessage(), e);
        }
    }
}
