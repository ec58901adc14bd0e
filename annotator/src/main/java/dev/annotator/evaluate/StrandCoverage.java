package dev.annotator.evaluate;

import java.util.Arrays;
import java.util.List;

/**
 * The positions of one strand of one record that some feature covers, held as sorted disjoint runs: memory and
 * time follow the number of features, not the record length.
 */
final class StrandCoverage {
    private final long[] starts;
    private final long[] ends;

    private StrandCoverage(long[] starts, long[] ends) {
        this.starts = starts;
        this.ends = ends;
    }

    /** The union of the intervals (1-based, closed; any order, may overlap). */
    static StrandCoverage of(List<Interval> intervals) {
        Interval[] sorted = intervals.toArray(new Interval[0]);
        Arrays.sort(sorted, (a, b) -> Long.compare(a.start(), b.start()));
        long[] s = new long[sorted.length];
        long[] e = new long[sorted.length];
        int n = 0;
        for (Interval i : sorted) {
            // touching runs are joined too: coverage has no boundaries inside it
            if (n > 0 && i.start() <= e[n - 1] + 1) {
                e[n - 1] = Math.max(e[n - 1], i.end());
            } else {
                s[n] = i.start();
                e[n] = i.end();
                n++;
            }
        }
        return new StrandCoverage(Arrays.copyOf(s, n), Arrays.copyOf(e, n));
    }

    /** Number of covered positions. */
    long covered() {
        long sum = 0;
        for (int i = 0; i < starts.length; i++) {
            sum += ends[i] - starts[i] + 1;
        }
        return sum;
    }

    /** Number of positions covered both here and in {@code other} (a merge of the two sorted run lists). */
    long sharedWith(StrandCoverage other) {
        long shared = 0;
        int i = 0;
        int j = 0;
        while (i < starts.length && j < other.starts.length) {
            long lo = Math.max(starts[i], other.starts[j]);
            long hi = Math.min(ends[i], other.ends[j]);
            if (lo <= hi) {
                shared += hi - lo + 1;
            }
            if (ends[i] < other.ends[j]) {
                i++;
            } else {
                j++;
            }
        }
        return shared;
    }

    /** Whether some covered position lies in {@code start..end}. */
    boolean overlaps(long start, long end) {
        // the last run starting at or before end is the only candidate: runs are disjoint and sorted
        int k = Arrays.binarySearch(starts, end);
        int last = k >= 0 ? k : -k - 2;
        return last >= 0 && ends[last] >= start;
    }
}
