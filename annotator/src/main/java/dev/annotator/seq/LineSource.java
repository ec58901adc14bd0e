package dev.annotator.seq;

import dev.annotator.error.BadInputException;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * Hands out the lines of a text input one at a time as bytes, with their 1-based numbers. Line ends are LF or
 * CR LF. A line longer than the limit is refused before it is buffered whole, so no input makes the reader hold
 * more than the limit per line.
 */
final class LineSource {
    private final InputStream in;
    private final String fileName;
    private final int maxLength;
    private final byte[] chunk = new byte[1 << 16];
    private int chunkPos;
    private int chunkEnd;
    private boolean eof;

    private byte[] line = new byte[256];
    private int length;
    private long number;

    LineSource(InputStream in, String fileName, int maxLength) {
        this.in = in;
        this.fileName = fileName;
        this.maxLength = maxLength;
    }

    /** Moves to the next line; false at the end of the input (the last line need not end with a line break). */
    boolean advance() throws IOException {
        length = 0;
        boolean any = false;
        while (true) {
            if (chunkPos == chunkEnd) {
                if (eof || !fill()) {
                    if (!any) {
                        return false;
                    }
                    break;
                }
            }
            any = true;
            byte b = chunk[chunkPos++];
            if (b == '\n') {
                break;
            }
            append(b);
        }
        number++;
        if (length > 0 && line[length - 1] == '\r') {
            length--;
        }
        return true;
    }

    private boolean fill() throws IOException {
        int n = in.read(chunk, 0, chunk.length);
        if (n <= 0) {
            eof = true;
            return false;
        }
        chunkPos = 0;
        chunkEnd = n;
        return true;
    }

    private void append(byte b) {
        if (length == maxLength) {
            throw new BadInputException(fileName + ":" + (number + 1) + ": line longer than " + maxLength + " bytes");
        }
        if (length == line.length) {
            line = java.util.Arrays.copyOf(line, (int) Math.min((long) line.length * 2, maxLength));
        }
        line[length++] = b;
    }

    /** The current line's bytes, valid up to {@link #length()} and only until the next {@link #advance()}. */
    byte[] bytes() {
        return line;
    }

    int length() {
        return length;
    }

    /** The current line's number, 1-based; the number of lines read so far. */
    long number() {
        return number;
    }

    /** The current line as text (UTF-8, invalid bytes replaced), for header fields and messages. */
    String text() {
        return new String(line, 0, length, StandardCharsets.UTF_8);
    }

    boolean startsWith(String prefix) {
        if (length < prefix.length()) {
            return false;
        }
        for (int i = 0; i < prefix.length(); i++) {
            if (line[i] != prefix.charAt(i)) {
                return false;
            }
        }
        return true;
    }

    boolean isBlank() {
        for (int i = 0; i < length; i++) {
            if (line[i] != ' ' && line[i] != '\t') {
                return false;
            }
        }
        return true;
    }
}
