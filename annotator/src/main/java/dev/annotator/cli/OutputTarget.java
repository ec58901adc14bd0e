package dev.annotator.cli;

import dev.annotator.io.AtomicOutputFile;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

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

    static OutputTarget open(String pathOrDash, OutputStream stdout) {
        if (isStdout(pathOrDash)) {
            return new OutputTarget(null, new BufferedOutputStream(stdout, 1 << 16), "<stdout>");
        }
        AtomicOutputFile f = AtomicOutputFile.create(Path.of(pathOrDash));
        return new OutputTarget(f, f.stream(), pathOrDash);
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
