package dev.annotator.evaluate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * Compares called intervals with planted (true) ones on one sequence for one label.
 *
 * <p>Recall counts planted intervals hit by at least one call; precision counts calls that hit at least one
 * planted interval; a single base of overlap is a hit. Each hit planted interval is paired with the call that
 * overlaps it most (ties: the call that starts first, then ends first), so one call spanning two planted
 * intervals is paired with both. The boundary error of a pair is |start difference| and |end difference|, both
 * pooled; the result reports their median (mean of the middle two for an even count).
 *
 * <p>Intervals may be given in any order and may overlap within a set; cost is O((n + m) log m) plus the number
 * of overlapping pairs.
 */
public final class IntervalComparison {
    private static final Comparator<Interval> BY_START_THEN_END =
            Comparator.comparingLong(Interval::start).thenComparingLong(Interval::end);

    private IntervalComparison() {
    }

    public static ComparisonResult compare(List<Interval> planted, List<Interval> called) {
        Interval[] calls = called.toArray(new Interval[0]);
        Arrays.sort(calls, BY_START_THEN_END);
        long[] callStarts = new long[calls.length];
        long[] maxEndSoFar = new long[calls.length]; // lets the backward scan stop once no earlier call can reach
        for (int i = 0; i < calls.length; i++) {
            callStarts[i] = calls[i].start();
            maxEndSoFar[i] = Math.max(calls[i].end(), i > 0 ? maxEndSoFar[i - 1] : Long.MIN_VALUE);
        }

        boolean[] callHit = new boolean[calls.length];
        int plantedFound = 0;
        List<Long> errors = new ArrayList<>();
        for (Interval p : planted) {
            int best = -1;
            long bestOverlap = 0;
            // calls[0..hi) start at or before p.end; scan them from the right while one could still reach p.start
            for (int i = firstStartAfter(callStarts, p.end()) - 1; i >= 0 && maxEndSoFar[i] >= p.start(); i--) {
                long ov = p.overlap(calls[i]);
                if (ov > 0) {
                    callHit[i] = true;
                    // scanning right to left, ">=" leaves the leftmost call among equal overlaps
                    if (ov >= bestOverlap) {
                        best = i;
                        bestOverlap = ov;
                    }
                }
            }
            if (best >= 0) {
                plantedFound++;
                errors.add(Math.abs(p.start() - calls[best].start()));
                errors.add(Math.abs(p.end() - calls[best].end()));
            }
        }
        int callsOnTarget = 0;
        for (boolean h : callHit) {
            callsOnTarget += h ? 1 : 0;
        }
        return new ComparisonResult(planted.size(), calls.length, plantedFound, callsOnTarget,
                ratio(plantedFound, planted.size()), ratio(callsOnTarget, calls.length), errors.size(),
                median(errors));
    }

    private static double ratio(int part, int whole) {
        return whole == 0 ? Double.NaN : (double) part / whole;
    }

    private static double median(List<Long> values) {
        if (values.isEmpty()) {
            return Double.NaN;
        }
        long[] v = values.stream().mapToLong(Long::longValue).toArray();
        Arrays.sort(v);
        int n = v.length;
        return n % 2 == 1 ? v[n / 2] : (v[n / 2 - 1] + v[n / 2]) / 2.0;
    }

    /** Index of the first start greater than {@code position} (binary search over sorted starts). */
    private static int firstStartAfter(long[] starts, long position) {
        int lo = 0;
        int hi = starts.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (starts[mid] <= position) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
