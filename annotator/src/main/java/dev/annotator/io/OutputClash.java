package dev.annotator.io;

import dev.annotator.error.UsageException;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.List;

/**
 * Refuses a run whose output would land on one of its own inputs, or two of whose outputs are the same file.
 * Renaming the finished output over an input would destroy the data the run was made from, and two outputs on one
 * path would leave only the last one; neither is what the user meant, so {@code --force} does not lift it.
 *
 * <p>Only regular files (and paths not there yet) can clash: a device such as /dev/null or /dev/stdout is written
 * in place and may be named by several streams on purpose.
 */
public final class OutputClash {
    private OutputClash() {
    }

    /**
     * @param inputs  paths the run reads; "-", null and names that are not existing files (a shipped model's
     *                name) are skipped
     * @param outputs paths the run writes; "-" and null (standard output) are skipped
     * @throws UsageException naming the output and the input it would replace, or the output named twice
     */
    public static void refuse(List<String> inputs, List<String> outputs) {
        for (int o = 0; o < outputs.size(); o++) {
            Path out = fileOrNull(outputs.get(o));
            if (out == null || isSpecial(out)) {
                continue;
            }
            for (String input : inputs) {
                Path in = fileOrNull(input);
                if (in != null && Files.isRegularFile(in) && Files.exists(out) && sameFile(in, out)) {
                    throw new UsageException(outputs.get(o) + ": output is also an input (" + input
                            + "); write the output elsewhere");
                }
            }
            for (int earlier = 0; earlier < o; earlier++) {
                Path other = fileOrNull(outputs.get(earlier));
                if (other != null && sameDestination(other, out)) {
                    throw new UsageException(outputs.get(o) + ": named for two outputs (also " + outputs.get(earlier)
                            + ")");
                }
            }
        }
    }

    private static Path fileOrNull(String pathOrDash) {
        if (pathOrDash == null || pathOrDash.equals(InputOpener.STDIN)) {
            return null;
        }
        try {
            return Path.of(pathOrDash);
        } catch (InvalidPathException e) {
            return null; // cannot be opened either; opening it reports the problem
        }
    }

    private static boolean isSpecial(Path p) {
        return Files.exists(p) && !Files.isRegularFile(p) && !Files.isDirectory(p);
    }

    private static boolean sameFile(Path a, Path b) {
        try {
            return Files.isSameFile(a, b); // follows links and sees through hard links
        } catch (IOException e) {
            return false;
        }
    }

    /** The same file if both exist; else the same place once links in the existing part of the path are followed. */
    private static boolean sameDestination(Path a, Path b) {
        if (Files.exists(a) && Files.exists(b)) {
            return sameFile(a, b);
        }
        return resolved(a).equals(resolved(b));
    }

    private static Path resolved(Path p) {
        Path absolute = p.toAbsolutePath().normalize();
        Path parent = absolute.getParent();
        try {
            return parent == null ? absolute : parent.toRealPath().resolve(absolute.getFileName());
        } catch (IOException e) {
            return absolute;
        }
    }
}
