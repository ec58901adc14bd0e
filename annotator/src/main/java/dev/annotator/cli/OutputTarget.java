package dev.annotator.cli;

import dev.annotator.error.UsageException;
import dev.annotator.io.AtomicOutputFile;
import dev.annotator.io.OutputClash;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.List;

/**
 * Where a command's output goes: stdout for "-" or no path, else a file that appears only on success. Write
 * bytes to {@link #stream()} or text to {@link #writer()}, not both.
 */
final class OutputTarget implements AutoCloseable {
    private final AtomicOutputFile file;
    private final OutputStream stream;
    private final String name;
    private Writer writer;

    private OutputTarget(AtomicOutputFile file, OutputStream stream, String name) {
        this.file = file;
        this.stream = stream;
        this.name = name;
    }

    static boolean isStdout(String pathOrDash) {
        return pathOrDash == null || pathOrDash.equals("-");
    }

    /**
     * The refusals a command makes before it reads anything: an output on one of its inputs or named twice, and,
     * without {@code --force}, an output file that already exists.
     *
     * @throws UsageException (exit 2) for the first such output
     */
    static void refuseBeforeRun(List<String> inputs, List<String> outputs, boolean force) {
        OutputClash.refuse(inputs, outputs);
        if (force) {
            return;
        }
        for (String output : outputs) {
            if (!isStdout(output) && isRegularFile(output)) {
                throw new UsageException(output + ": already exists (use --force to replace it)");
            }
        }
    }

    /** With {@code force} an existing file is replaced on success; without, it is never replaced. */
    static OutputTarget open(String pathOrDash, OutputStream stdout, boolean force) {
        if (isStdout(pathOrDash)) {
            return new OutputTarget(null, new BufferedOutputStream(stdout, 1 << 16), "<stdout>");
        }
        Path path = Path.of(pathOrDash);
        AtomicOutputFile f = force ? AtomicOutputFile.create(path) : AtomicOutputFile.createNew(path);
        return new OutputTarget(f, f.stream(), pathOrDash);
    }

    private static boolean isRegularFile(String path) {
        try {
            return Files.isRegularFile(Path.of(path)); // follows a link, as writing does
        } catch (InvalidPathException e) {
            return false;
        }
    }

    OutputStream stream() {
        return stream;
    }

    Writer writer() {
        if (writer == null) {
            writer = new OutputStreamWriter(stream, StandardCharsets.UTF_8);
        }
        return writer;
    }

    String name() {
        return name;
    }

    /** Flushes; for a file, moves it into place. */
    void commit() throws IOException {
        if (writer != null) {
            writer.flush();
        }
        stream.flush();
        if (file != null) {
            file.commit();
        }
    }

    @Override
    public void close() {
        if (file != null) {
            file.close();
        }
    }
}
