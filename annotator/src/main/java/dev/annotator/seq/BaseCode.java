package dev.annotator.seq;

/**
 * Maps FASTA bytes to the kernels' alphabet: A=0, C=1, G=2, T=3 (U reads as T), any other IUPAC nucleotide
 * code (N, R, Y, ...) is {@link #MISSING}: a missing observation. Case does not matter (soft-masked bases are
 * ordinary bases). Bytes that are not IUPAC nucleotide codes are {@link #INVALID}.
 */
public final class BaseCode {
    public static final byte MISSING = 4;
    public static final byte INVALID = -1;
    public static final String ALPHABET = "ACGT";

    private static final byte[] CODE = buildTable();

    private BaseCode() {
    }

    /** The code of one FASTA byte: 0-3, {@link #MISSING} or {@link #INVALID}. */
    public static byte of(byte b) {
        return CODE[b & 0xFF];
    }

    /** A private copy of the full 256-entry lookup table, for kernels that index it in their inner loop. */
    public static byte[] table() {
        return CODE.clone();
    }

    public static boolean isValid(byte b) {
        return CODE[b & 0xFF] != INVALID;
    }

    private static byte[] buildTable() {
        byte[] t = new byte[256];
        java.util.Arrays.fill(t, INVALID);
        for (char c : "RYSWKMBDHVN".toCharArray()) {
            t[c] = MISSING;
            t[Character.toLowerCase(c)] = MISSING;
        }
        String bases = "ACGT";
        for (int i = 0; i < 4; i++) {
            t[bases.charAt(i)] = (byte) i;
            t[Character.toLowerCase(bases.charAt(i))] = (byte) i;
        }
        t['U'] = 3;
        t['u'] = 3;
        return t;
    }
}
