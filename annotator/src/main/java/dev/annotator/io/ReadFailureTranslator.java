package dev.annotator.io;

import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;

/**
 * Turns IOExceptions raised while reading into the project's one-line, exit-coded exceptions, so that
 * parsers layered on top (which may wrap or swallow checked exceptions) pass them through unchanged.
 */
final class ReadFailureTranslator extends FilterInputStream {
    private final String name;
    private final boolean gzip;

    ReadFailureTranslator(InputStream in, String name, boolean gzip) {
        super(in);
        this.name = name;
        this.gzip = gzip;
    }

    @Override
    public int read() {
        try {
            return in.read();
        } catch (IOException e) {
            throw InputOpener.translate(e, name, gzip);
        }
    }

    @Override
    public int read(byte[] b, int off, int len) {
        try {
            return in.read(b, off, len);
        } catch (IOException e) {
            throw InputOpener.translate(e, name, gzip);
        }
    }

    @Override
    public long skip(long n) {
        try {
            return in.skip(n);
        } catch (IOException e) {
            throw InputOpener.translate(e, name, gzip);
        }
    }

    @Override
    public int available() {
        try {
            return in.available();
        } catch (IOException e) {
            throw InputOpener.translate(e, name, gzip);
        }
    }

    @Override
    public boolean markSupported() {
        return false;
    }
}
