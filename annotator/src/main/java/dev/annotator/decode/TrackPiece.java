package dev.annotator.decode;

import java.util.Arrays;
import java.util.List;

/**
 * The posterior track of one decoding window, built from positions that arrive last to first. Bins lie at
 * multiples of the step from the record's start, so a bin may straddle a window edge: its part inside this window
 * is kept as a partial sum ({@link #low} below the window's first complete bin, {@link #high} above its last) and
 * finished when the windows are joined in order ({@link #join}).
 */
final class TrackPiece {
    private final int windowStart;
    private final int windowEnd;
    private final int recordLength;
    private final int step;
    // complete bins, collected in descending order, equal neighbours merged
    private int[] starts = new int[16];
    private short[] millis = new short[16];
    private int size;
    private Partial low;
    private Partial high;
    // the bin being summed
    private int binStart = -1;
    private double sum;

    /** Part of a bin: its start, the sum of its posteriors seen so far and how many bases that was. */
    record Partial(int binStart, double sum, int count) {
    }

    TrackPiece(int windowStart, int windowEnd, int recordLength, int step) {
        this.windowStart = windowStart;
        this.windowEnd = windowEnd;
        this.recordLength = recordLength;
        this.step = step;
    }

    /** Whether the bins are single bases, so {@link #addBases} can be used. */
    boolean perBase() {
        return step == 1;
    }

    /**
     * With bins of one base: the posteriors of the bases [from, to), base t's at
     * {@code values[(t - from) * stride + offset]}, taken last to first as {@link #add} takes them, in one loop that
     * merges equal neighbours as it goes (a call per base, and a bin closed per base, cost as much as the decoding's
     * own bookkeeping). Do not mix with {@link #add}.
     */
    void addBases(int from, int to, double[] values, int stride, int offset) {
        for (int t = to - 1; t >= from; t--) {
            pushDescending(t, milli(values[(t - from) * stride + offset]));
        }
    }

    /** The label posterior at {@code t}; positions must descend. */
    void add(int t, double p) {
        if (t < binStart || binStart < 0) {
            finishBin();
            binStart = t - t % step;
            sum = 0;
        }
        sum += p;
    }

    private void finishBin() {
        if (binStart < 0) {
            return;
        }
        int binEnd = (int) Math.min((long) binStart + step, recordLength);
        int from = Math.max(binStart, windowStart);
        int to = Math.min(binEnd, windowEnd);
        if (binStart < windowStart) {
            low = new Partial(binStart, sum, to - from);
        } else if (binEnd > windowEnd) {
            high = new Partial(binStart, sum, to - from);
        } else {
            pushDescending(binStart, milli(sum / (binEnd - binStart)));
        }
        binStart = -1;
    }

    private void pushDescending(int start, int milli) {
        if (size > 0 && millis[size - 1] == milli) {
            starts[size - 1] = start; // the run grows downwards
            return;
        }
        if (size == starts.length) {
            starts = Arrays.copyOf(starts, size * 2);
            millis = Arrays.copyOf(millis, size * 2);
        }
        starts[size] = start;
        millis[size] = (short) milli;
        size++;
    }

    static int milli(double p) {
        return (int) Math.max(0, Math.min(1000, Math.round(p * 1000)));
    }

    /** Ends collection: the last bin is closed. */
    void finish() {
        finishBin();
    }

    /** Joins the windows' pieces, given in window order, into the record's track. */
    static PosteriorTrack join(List<TrackPiece> pieces, int recordLength) {
        PosteriorTrack.Builder out = new PosteriorTrack.Builder(recordLength);
        Partial pending = null;
        for (TrackPiece piece : pieces) {
            if (piece.low != null) {
                if (pending != null && pending.binStart() == piece.low.binStart()) {
                    pending = new Partial(pending.binStart(), pending.sum() + piece.low.sum(),
                            pending.count() + piece.low.count());
                } else {
                    flush(out, pending);
                    pending = piece.low;
                }
            }
            if (piece.size > 0 || piece.high != null) {
                flush(out, pending);
                pending = null;
                for (int i = piece.size - 1; i >= 0; i--) {
                    out.append(piece.starts[i], piece.millis[i]);
                }
                pending = piece.high;
            }
        }
        flush(out, pending);
        return out.build();
    }

    private static void flush(PosteriorTrack.Builder out, Partial bin) {
        if (bin != null) {
            out.append(bin.binStart(), milli(bin.sum() / bin.count()));
        }
    }
}
