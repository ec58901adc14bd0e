package dev.annotator.io;

import java.util.Locale;

/**
 * An input file as a report names it: its size and the CRC-32 of its bytes as stored (compressed bytes for a
 * gzipped file), the checksum gzip and zip keep, so that a reader can tell whether a file at hand is the one the
 * report was made from.
 *
 * @param name  the path as given on the command line
 * @param bytes its size
 * @param crc32 CRC-32 (ISO-HDLC, as in gzip, RFC 1952) of its bytes, an unsigned 32-bit value
 */
public record InputChecksum(String name, long bytes, long crc32) {
    public InputChecksum {
        if (crc32 < 0 || crc32 > 0xFFFF_FFFFL) {
            throw new IllegalArgumentException("CRC-32 out of range: " + crc32);
        }
    }

    /** The CRC-32 as 8 lowercase hexadecimal digits, as gzip -lv and common checksum tools print it. */
    public String crc32Hex() {
        return String.format(Locale.ROOT, "%08x", crc32);
    }
}
