package dev.annotator.conformance;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The smallest FASTA reading that serves these tests, kept apart from the project's reader so that the bases a
 * check recounts do not pass through the code under test: '&gt;' starts a record named by the header's first
 * word, every other line is bases, kept byte for byte (case included). LF line ends only.
 */
final class PlainFasta {
    private PlainFasta() {
    }

    /** Record name to bases, in file order. */
    static Map<String, byte[]> read(Path file) throws IOException {
        Map<String, byte[]> records = new LinkedHashMap<>();
        String name = null;
        ByteArrayOutputStream bases = new ByteArrayOutputStream();
        for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
            if (line.startsWith(">")) {
                if (name != null) {
                    records.put(name, bases.toByteArray());
                }
                name = line.substring(1).split("[ \t]", 2)[0];
                bases.reset();
            } else {
                bases.writeBytes(line.getBytes(StandardCharsets.US_ASCII));
            }
        }
        if (name != null) {
            records.put(name, bases.toByteArray());
        }
        return records;
    }
}
