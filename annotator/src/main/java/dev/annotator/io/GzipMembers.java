package dev.annotator.io;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.util.zip.CRC32;
import java.util.zip.DataFormatException;
import java.util.zip.Inflater;
import java.util.zip.ZipException;

/**
 * Decompresses gzip data (RFC 1952): one member or several back to back, each checked against its CRC-32 and
 * size. Unlike {@link java.util.zip.GZIPInputStream}, which stops without a word at anything after a member that
 * does not parse as the next one, this refuses such data: a second member cut short inside its header, or bytes
 * appended to the file, would otherwise drop records silently.
 *
 * <p>Errors are {@link ZipException} or {@link EOFException} ({@link InputOpener#translate} turns them into bad
 * input); data after the last member is a {@link TrailingData}.
 */
final class GzipMembers extends InputStream {
    // RFC 1952, section 2.3.1: magic bytes, the deflate method, and the header flags
    private static final int ID1 = 0x1f;
    private static final int ID2 = 0x8b;
    private static final int DEFLATE = 8;
    private static final int FHCRC = 2;
    private static final int FEXTRA = 4;
    private static final int FNAME = 8;
    private static final int FCOMMENT = 16;
    private static final int RESERVED = 0xE0;

    /** Bytes after the end of the last member that do not start another one. */
    static final class TrailingData extends ZipException {
        TrailingData() {
            super("data after the end of the gzip data");
        }
    }

    private final InputStream in;
    private final byte[] buf;
    /** Compressed bytes not yet handed to the inflater or read as header or trailer: buf[pos, len). */
    private int pos;
    private int len;
    private final Inflater inflater = new Inflater(true); // raw deflate: the gzip framing is read here
    private final CRC32 crc = new CRC32();
    private long memberSize;
    private boolean eof;
    private final byte[] single = new byte[1];

    /** Reads the first member's header at once, so a damaged start fails when the input is opened. */
    GzipMembers(InputStream in, int bufferSize) throws IOException {
        this.in = in;
        this.buf = new byte[bufferSize];
        readHeader();
    }

    @Override
    public int read() throws IOException {
        return read(single, 0, 1) < 0 ? -1 : single[0] & 0xFF;
    }

    @Override
    public int read(byte[] b, int off, int n) throws IOException {
        if (eof) {
            return -1;
        }
        if (n == 0) {
            return 0;
        }
        while (true) {
            if (inflater.finished()) {
                pos = len - inflater.getRemaining(); // what the inflater did not use belongs to the trailer
                readTrailer();
                if (!nextMember()) {
                    eof = true;
                    return -1;
                }
                continue;
            }
            if (inflater.needsInput()) {
                // bytes left over from a header are used first
                if (pos == len && !fill()) {
                    throw new EOFException("gzip data ends inside a member");
                }
                inflater.setInput(buf, pos, len - pos);
                pos = len;
            }
            int got;
            try {
                got = inflater.inflate(b, off, n);
            } catch (DataFormatException e) {
                throw new ZipException("invalid deflate data: " + e.getMessage());
            }
            if (got > 0) {
                crc.update(b, off, got);
                memberSize += got;
                return got;
            }
            if (inflater.needsDictionary()) {
                throw new ZipException("deflate data asks for a preset dictionary");
            }
        }
    }

    @Override
    public int available() {
        return eof ? 0 : 1; // as InflaterInputStream: "maybe more", never a promise of a byte count
    }

    @Override
    public void close() throws IOException {
        inflater.end();
        in.close();
    }

    private void readHeader() throws IOException {
        CRC32 header = new CRC32(); // FHCRC: the low 16 bits of the CRC-32 of the header bytes before it
        if (headerByte(header) != ID1 || headerByte(header) != ID2) {
            throw new ZipException("not in gzip format");
        }
        if (headerByte(header) != DEFLATE) {
            throw new ZipException("unsupported compression method");
        }
        int flags = headerByte(header);
        if ((flags & RESERVED) != 0) {
            throw new ZipException("reserved gzip header flags set");
        }
        skipHeaderBytes(header, 6); // modification time, extra flags, operating system
        if ((flags & FEXTRA) != 0) {
            skipHeaderBytes(header, headerByte(header) | headerByte(header) << 8);
        }
        if ((flags & FNAME) != 0) {
            while (headerByte(header) != 0) {
                // the original file name is not needed
            }
        }
        if ((flags & FCOMMENT) != 0) {
            while (headerByte(header) != 0) {
                // nor the comment
            }
        }
        if ((flags & FHCRC) != 0) {
            long expected = readByte() | readByte() << 8;
            if ((header.getValue() & 0xFFFF) != expected) {
                throw new ZipException("gzip header checksum does not match");
            }
        }
        inflater.reset();
        crc.reset();
        memberSize = 0;
    }

    private int headerByte(CRC32 header) throws IOException {
        int b = readByte();
        header.update(b);
        return b;
    }

    private void skipHeaderBytes(CRC32 header, int count) throws IOException {
        for (int i = 0; i < count; i++) {
            headerByte(header);
        }
    }

    private void readTrailer() throws IOException {
        long expectedCrc = readIntLittleEndian();
        long expectedSize = readIntLittleEndian();
        if (crc.getValue() != expectedCrc) {
            throw new ZipException("CRC-32 of the decompressed data does not match the gzip trailer");
        }
        if ((memberSize & 0xFFFFFFFFL) != expectedSize) {
            throw new ZipException("decompressed size does not match the gzip trailer");
        }
    }

    /** True if another member starts here, false at the clean end of the input. */
    private boolean nextMember() throws IOException {
        if (pos == len && !fill()) {
            return false;
        }
        if ((buf[pos] & 0xFF) != ID1) {
            throw new TrailingData();
        }
        readHeader();
        return true;
    }

    private long readIntLittleEndian() throws IOException {
        return readByte() | (long) readByte() << 8 | (long) readByte() << 16 | (long) readByte() << 24;
    }

    private int readByte() throws IOException {
        if (pos == len && !fill()) {
            throw new EOFException("gzip data ends inside a member header or trailer");
        }
        return buf[pos++] & 0xFF;
    }

    /** Refills the buffer; only called when the inflater holds none of its bytes. False at the end of input. */
    private boolean fill() throws IOException {
        int n;
        do {
            n = in.read(buf, 0, buf.length);
        } while (n == 0);
        pos = 0;
        len = Math.max(n, 0);
        return n > 0;
    }
}
