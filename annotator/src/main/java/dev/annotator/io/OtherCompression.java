package dev.annotator.io;

/**
 * Recognises compressed formats that are not gzip by their magic bytes, so that such an input is refused with its
 * name ("xz-compressed data") rather than as FASTA with a strange first character. None of these can be the start
 * of a FASTA file, which begins with '>' (or ';'), so recognising them never refuses a valid input.
 */
final class OtherCompression {
    // bzip2: "BZh"; xz: FD 37 7A 58 5A 00 (the .xz format specification, section 2.1.1.1); Zstandard: 28 B5 2F FD
    // (RFC 8878, section 3.1.1, the magic number 0xFD2FB528 in little-endian order); zip: "PK" 03 04 (PKWARE
    // APPNOTE, local file header signature). All recalled from memory.
    private static final int[][] MAGIC = {
            {'B', 'Z', 'h'},
            {0xFD, '7', 'z', 'X', 'Z', 0x00},
            {0x28, 0xB5, 0x2F, 0xFD},
            {'P', 'K', 0x03, 0x04}};
    private static final String[] NAME = {"bzip2", "xz", "zstd", "zip"};

    private OtherCompression() {
    }

    /** The format's name, or null when {@code head} starts like none of them. */
    static String of(byte[] head) {
        for (int f = 0; f < MAGIC.length; f++) {
            if (startsWith(head, MAGIC[f])) {
                return NAME[f];
            }
        }
        return null;
    }

    private static boolean startsWith(byte[] head, int[] magic) {
        if (head.length < magic.length) {
            return false;
        }
        for (int i = 0; i < magic.length; i++) {
            if ((head[i] & 0xFF) != magic[i]) {
                return false;
            }
        }
        return true;
    }
}
