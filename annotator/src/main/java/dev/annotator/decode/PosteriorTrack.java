package dev.annotator.decode;

import java.util.Arrays;

/**
 * One label's posterior along a record as contiguous runs covering [0, length): run i spans
 * [start(i), end(i)) with value milli(i) / 1000. Neighbouring runs never have the same value. Kept as
 * primitive arrays (8 bytes a run) because a chromosome has many runs.
 */
public final class PosteriorTrack {
    private final int length;
    private final int[] starts;
    private final short[] millis;
    private final int size;

    PosteriorTrack(int length, int[] starts, short[] millis, int size) {
        this.length = length;
        this.starts = starts;
        this.millis = millis;
        this.size = size;
    }

    public int runs() {
        return size;
    }

    public int start(int i) {
        return starts[i];
    }

    public int end(int i) {
        return i + 1 < size ? starts[i + 1] : length;
    }

    /** The run's value in thousandths (0 to 1000). */
    public int milli(int i) {
        return millis[i];
    }

    /** Appends runs in ascending order, merging a run into the previous one when their values are equal. */
    static final class Builder {
        private final int length;
        private int[] starts = new int[16];
        private short[] millis = new short[16];
        private int size;

        Builder(int length) {
            this.length = length;
        }

        void append(int start, int milli) {
            if (size > 0 && millis[size - 1] == milli) {
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

        PosteriorTrack build() {
            return new PosteriorTrack(length, starts, millis, size);
        }
    }
}
