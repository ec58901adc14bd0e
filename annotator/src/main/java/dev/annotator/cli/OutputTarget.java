package dev.annotator.cli;

import dev.annotator.io.AtomicOutputFile;

import java.io.BufferedWriter;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * Where a command's text output goes: stdout for "-" or no path, else a file that appears only on success.
 */
final class OutputTarget implements AutoCloseable {
    private final AtomicOutputFile file;
    private final Writer writer;
    private final String name;

    private OutputTarget(AtomicOutputFile file, Writer writer, String name) {
        this.file = file;
        this.writer = writer;
        this.name = name;
    }

    static OutputTarget open(String pathOrDash, OutputStream stdout) {
        if (pathOrDash == null || pathOrDash.equals("-")) {
            return new OutputTarget(null, new BufferedWriter(new OutputStreamWriter(stdout, StandardCharsets.UTF_8),
                    1 << 16), "<stdout>");
        }
        AtomicOutputFile f = AtomicOutputFile.create(Path.of(pathOrDash));
        return new OutputTarget(f, new OutputStreamWriter(f.stream(), StandardCharsets.UTF_8), pathOrDash);
    }

    Writer writer() {
        return writer;
    }

    String name() {
        return name;
    }

    /** Flushes; for a file, moves it into place. */
    void commit() throws java.io.IOException {
        writer.flush();
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
