import java.io.BufferedInputStream;
import java.io.FileInputStream;
import java.io.IOException;
import java.io.InputStream;

/**
 * The floor for reading a FASTA file: one buffered pass over the bytes that counts sequence bases (skipping
 * header lines and line breaks), with no parsing beyond that. annotate can never be faster than this.
 */
public final class PlainReadFloor {
    public static void main(String[] args) throws IOException {
        long bases = 0;
        boolean header = false;
        boolean lineStart = true;
        byte[] buf = new byte[1 << 16];
        try (InputStream in = new BufferedInputStream(new FileInputStream(args[0]), 1 << 16)) {
            int n;
            while ((n = in.read(buf)) > 0) {
                for (int i = 0; i < n; i++) {
                    byte b = buf[i];
                    if (lineStart && b == '>') {
                        header = true;
                    }
                    if (b == '\n') {
                        header = false;
                        lineStart = true;
                        continue;
                    }
                    lineStart = false;
                    if (!header && b != '\r') {
                        bases++;
                    }
                }
            }
        }
        System.out.println(bases);
    }
}
