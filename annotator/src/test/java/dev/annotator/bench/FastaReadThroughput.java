package dev.annotator.bench;

import dev.annotator.io.InputOpener;
import dev.annotator.seq.FastaRecordReader;
import dev.annotator.seq.SequenceRecord;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;

/**
 * Throughput probe, not a unit test: how fast {@link FastaRecordReader} reads a FASTA file compared with the
 * floor of reading the same bytes and counting bases. Usage: {@code FastaReadThroughput FILE}.
 * Each way runs three times after one untimed warm-up pass (so that the first timed run is not mostly
 * JIT compilation); medians are printed in mega base pairs per second.
 */
public final class FastaReadThroughput {
    private static final int RUNS = 3;

    private FastaReadThroughput() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length != 1) {
            System.err.println("usage: FastaReadThroughput FASTA_FILE");
            System.exit(2);
        }
        String path = args[0];
        double[] ours = new double[RUNS];
        double[] plain = new double[RUNS];
        long oursBases = 0;
        long plainBases = 0;
        readWithRecordReader(path);
        countBasesPlain(path);
        for (int run = 0; run < RUNS; run++) {
            long t0 = System.nanoTime();
            oursBases = readWithRecordReader(path);
            long t1 = System.nanoTime();
            plainBases = countBasesPlain(path);
            long t2 = System.nanoTime();
            ours[run] = oursBases / 1e6 / ((t1 - t0) / 1e9);
            plain[run] = plainBases / 1e6 / ((t2 - t1) / 1e9);
            System.out.printf("run %d: FastaRecordReader %.1f Mbp/s, plain byte count %.1f Mbp/s%n",
                    run + 1, ours[run], plain[run]);
        }
        if (oursBases != plainBases) {
            System.out.printf("warning: base counts differ: reader %d, plain %d%n", oursBases, plainBases);
        }
        double a = median(ours);
        double b = median(plain);
        System.out.printf("bases: %d%n", oursBases);
        System.out.printf("median FastaRecordReader: %.1f Mbp/s%n", a);
        System.out.printf("median plain byte count:  %.1f Mbp/s%n", b);
        System.out.printf("ratio reader / plain:     %.2f%n", a / b);
    }

    private static long readWithRecordReader(String path) {
        long bases = 0;
        try (FastaRecordReader reader = FastaRecordReader.open(path, System.in, System.err::println)) {
            for (SequenceRecord r; (r = reader.next()) != null; ) {
                bases += r.length();
            }
        }
        return bases;
    }

    /** Counts every byte outside header lines that is not a line end; no validation at all. */
    private static long countBasesPlain(String path) throws IOException {
        long bases = 0;
        boolean atLineStart = true;
        boolean inHeader = false;
        byte[] buf = new byte[1 << 16];
        try (InputStream in = InputOpener.open(path, System.in)) {
            for (int n; (n = in.read(buf, 0, buf.length)) > 0; ) {
                for (int i = 0; i < n; i++) {
                    byte b = buf[i];
                    if (b == '\n' || b == '\r') {
                        atLineStart = true;
                        inHeader = false;
                    } else {
                        if (atLineStart && b == '>') {
                            inHeader = true;
                        }
                        atLineStart = false;
                        if (!inHeader) {
                            bases++;
                        }
                    }
                }
            }
        }
        return bases;
    }

    private static double median(double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        return sorted[sorted.length / 2];
    }
}
