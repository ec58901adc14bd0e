package dev.annotator.pipeline;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.seq.RecordLengthLimit;

import java.util.Locale;

/**
 * Sizes an annotation run to the Java heap, so that an input too large for it (a multi-gigabyte line, a gzip that
 * inflates to one) is refused with a message as soon as the reader has seen too much, instead of ending in an
 * OutOfMemoryError somewhere in the parser or a kernel.
 *
 * <p>Bytes per base, from the code as it stands: reading a record peaks at about {@value #READ_BYTES_PER_BASE}
 * (see {@code FastaRecordReader}); a record being decoded holds its own byte per base, plus for Viterbi and
 * posterior-Viterbi back-pointers (Viterbi one byte per state, posterior-Viterbi one per state with several
 * successors), a one-byte state per base (the path) and
 * {@value #EVIDENCE_BYTES_PER_LABEL} bytes per reported label (its posterior and likelihood ratio at each base, kept
 * from the one forward-backward pass for the statistics of the path's runs; see {@code BaseEvidence}). Posterior
 * decoding needs nothing per base beyond the record: the kernels work in fixed-size blocks.
 *
 * @param recordLimit   the longest record the reader accepts: one record read while as many bases as
 *                      {@code basesInFlight} are being decoded still fits in {@value #USABLE_PERCENT}% of the heap
 * @param basesInFlight how many bases may be decoded at once across all threads
 */
record MemoryBudget(RecordLengthLimit recordLimit, long basesInFlight) {
    static final int READ_BYTES_PER_BASE = 4;
    /** The rest of the heap is left for the model, buffers, output and the collector's working room. */
    static final int USABLE_PERCENT = 80;
    static final int EVIDENCE_BYTES_PER_LABEL = 16;

    /** One path with a back-pointer byte per state (Viterbi's layout; posterior-Viterbi's at most). */
    static MemoryBudget of(long maxHeapBytes, int states, int reportedLabels, DecodeMethod method) {
        return of(maxHeapBytes, method == DecodeMethod.POSTERIOR ? 0 : states + 1L, states, reportedLabels, method, 1);
    }

    /**
     * @param pathBytesPerBase     back-pointer and path bytes per base of all the paths a record's decoding holds at
     *                             once (see {@code Annotator.pathBytesPerBase})
     * @param widestBackPointerRow back-pointer bytes per base of the widest single table, which is one Java array
     * @param pathsAtOnce          state paths a record's decoding holds at once (two for a gene model's strand views)
     */
    static MemoryBudget of(long maxHeapBytes, long pathBytesPerBase, int widestBackPointerRow, int reportedLabels,
                           DecodeMethod method, int pathsAtOnce) {
        boolean pathInMemory = method != DecodeMethod.POSTERIOR;
        long decodeBytesPerBase = 1 + (pathInMemory ? pathBytesPerBase
                + (long) pathsAtOnce * EVIDENCE_BYTES_PER_LABEL * reportedLabels : 0);
        long usable = maxHeapBytes / 100 * USABLE_PERCENT;
        long bases = usable / (READ_BYTES_PER_BASE + decodeBytesPerBase);
        if (pathInMemory && widestBackPointerRow > 0) {
            // each back-pointer table of bases x its row is one Java array
            bases = Math.min(bases, RecordLengthLimit.ARRAY_MAX / widestBackPointerRow);
        }
        bases = Math.max(1, Math.min(bases, RecordLengthLimit.ARRAY_MAX));
        String reason = String.format(Locale.ROOT, "the most this run can hold in memory (Java heap limit %d MiB; "
                + "give java more with -Xmx)", maxHeapBytes >> 20);
        return new MemoryBudget(new RecordLengthLimit(bases, reason), bases);
    }

    /** For the heap this JVM may grow to. */
    static MemoryBudget ofThisJvm(long pathBytesPerBase, int widestBackPointerRow, int reportedLabels,
                                  DecodeMethod method, int pathsAtOnce) {
        return of(Runtime.getRuntime().maxMemory(), pathBytesPerBase, widestBackPointerRow, reportedLabels, method,
                pathsAtOnce);
    }
}
