package dev.annotator.evaluate;

import htsjdk.samtools.util.OverlapDetector;
import org.apache.commons.math3.stat.descriptive.rank.Median;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/** Expected values in the hand-checked tests were worked out on paper; the arithmetic is shown beside them. */
class IntervalComparisonTest {

    private static Interval iv(long start, long end) {
        return new Interval(start, end);
    }

    @Test
    void mixedHitsAndMisses() {
        ComparisonResult r = IntervalComparison.compare(
                List.of(iv(100, 200), iv(300, 400), iv(500, 600)),
                List.of(iv(110, 195), iv(290, 420), iv(800, 900)));
        // planted 1 <-> call 1: |100-110| = 10, |200-195| = 5; planted 2 <-> call 2: 10, 20; planted 3 missed,
        // call 3 off target. Errors sorted 5 10 10 20 -> median (10+10)/2 = 10
        assertThat(r).isEqualTo(new ComparisonResult(3, 3, 2, 2, 2.0 / 3, 2.0 / 3, 4, 10.0));
    }

    @Test
    void noCalls() {
        ComparisonResult r = IntervalComparison.compare(List.of(iv(1, 10), iv(20, 30)), List.of());
        assertThat(r.recall()).isEqualTo(0.0);
        assertThat(r.precision()).isNaN(); // 0/0
        assertThat(r.medianBoundaryError()).isNaN();
        assertThat(r.plantedCount()).isEqualTo(2);
        assertThat(r.calledCount()).isZero();
        assertThat(r.boundaryErrors()).isZero();
    }

    @Test
    void nothingPlanted() {
        ComparisonResult r = IntervalComparison.compare(List.of(), List.of(iv(1, 10), iv(20, 30)));
        assertThat(r.recall()).isNaN(); // 0/0
        assertThat(r.precision()).isEqualTo(0.0);
        assertThat(r.medianBoundaryError()).isNaN();
    }

    @Test
    void bothEmpty() {
        ComparisonResult r = IntervalComparison.compare(List.of(), List.of());
        assertThat(r.recall()).isNaN();
        assertThat(r.precision()).isNaN();
        assertThat(r.medianBoundaryError()).isNaN();
    }

    @Test
    void oneCallSpanningTwoPlanted() {
        ComparisonResult r = IntervalComparison.compare(List.of(iv(100, 200), iv(300, 400)), List.of(iv(150, 350)));
        // both planted overlap the call (51 bases each) and are paired with it:
        // planted 1: |100-150| = 50, |200-350| = 150; planted 2: |300-150| = 150, |400-350| = 50
        // sorted 50 50 150 150 -> median 100
        assertThat(r).isEqualTo(new ComparisonResult(2, 1, 2, 1, 1.0, 1.0, 4, 100.0));
    }

    @Test
    void pairsWithTheCallOfLargestOverlap() {
        ComparisonResult r = IntervalComparison.compare(List.of(iv(100, 200)), List.of(iv(90, 120), iv(130, 210)));
        // overlaps 21 and 71 -> second call: |100-130| = 30, |200-210| = 10 -> median 20; both calls on target
        assertThat(r).isEqualTo(new ComparisonResult(1, 2, 1, 2, 1.0, 1.0, 2, 20.0));
    }

    @Test
    void equalOverlapsPairWithTheEarlierCall() {
        ComparisonResult r = IntervalComparison.compare(List.of(iv(100, 199)), List.of(iv(180, 230), iv(80, 119)));
        // both overlap 20 bases; the call starting at 80 wins: |100-80| = 20, |199-119| = 80 -> median 50
        assertThat(r.medianBoundaryError()).isEqualTo(50.0);
    }

    @Test
    void oneSharedBaseIsAHitAndAdjacencyIsNot() {
        // closed intervals: [100,200] and [200,300] share base 200; [201,300] shares none
        assertThat(IntervalComparison.compare(List.of(iv(100, 200)), List.of(iv(200, 300))).recall()).isEqualTo(1.0);
        assertThat(IntervalComparison.compare(List.of(iv(100, 200)), List.of(iv(201, 300))).recall()).isEqualTo(0.0);
    }

    @Test
    void aLongEarlyCallIsFoundBehindShortLaterOnes() {
        // sorted by start the calls are [1,1000], [50,60], [70,80]; the planted interval lies under the first only
        ComparisonResult r = IntervalComparison.compare(List.of(iv(500, 510)),
                List.of(iv(70, 80), iv(50, 60), iv(1, 1000)));
        // |500-1| = 499, |510-1000| = 490 -> median 494.5
        assertThat(r).isEqualTo(new ComparisonResult(1, 3, 1, 1, 1.0, 1.0 / 3, 2, 494.5));
    }

    @Test
    void intervalsMustBeOneBasedAndClosed() {
        assertThatThrownBy(() -> iv(0, 5)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> iv(5, 4)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void agreesWithReferenceLibrariesOnRandomSets() {
        // hit counts checked against htsjdk's OverlapDetector (1-based closed Locatable intervals); the median
        // against commons-math3's Median (whose default estimate averages the middle two for an even count),
        // applied to errors from an exhaustive best-overlap pairing
        SplittableRandom rng = new SplittableRandom(2024);
        for (int round = 0; round < 200; round++) {
            List<Interval> planted = randomIntervals(rng, rng.nextInt(0, 30));
            List<Interval> called = randomIntervals(rng, rng.nextInt(0, 30));
            ComparisonResult r = IntervalComparison.compare(planted, called);

            OverlapDetector<htsjdk.samtools.util.Interval> callIndex = OverlapDetector.create(toHtsjdk(called));
            OverlapDetector<htsjdk.samtools.util.Interval> plantedIndex = OverlapDetector.create(toHtsjdk(planted));
            long found = toHtsjdk(planted).stream().filter(callIndex::overlapsAny).count();
            long onTarget = toHtsjdk(called).stream().filter(plantedIndex::overlapsAny).count();
            assertThat(r.plantedFound()).isEqualTo(found);
            assertThat(r.callsOnTarget()).isEqualTo(onTarget);
            if (!planted.isEmpty()) {
                assertThat(r.recall()).isCloseTo((double) found / planted.size(), within(1e-12));
            }

            List<Double> errors = new ArrayList<>();
            for (Interval p : planted) {
                Interval best = null;
                for (Interval c : called) {
                    long ov = p.overlap(c);
                    if (ov > 0 && (best == null || ov > p.overlap(best)
                            || ov == p.overlap(best) && (c.start() < best.start()
                            || c.start() == best.start() && c.end() < best.end()))) {
                        best = c;
                    }
                }
                if (best != null) {
                    errors.add((double) Math.abs(p.start() - best.start()));
                    errors.add((double) Math.abs(p.end() - best.end()));
                }
            }
            double expectedMedian = new Median().evaluate(errors.stream().mapToDouble(Double::doubleValue).toArray());
            assertThat(r.boundaryErrors()).isEqualTo(errors.size());
            if (errors.isEmpty()) {
                assertThat(r.medianBoundaryError()).isNaN();
            } else {
                assertThat(r.medianBoundaryError()).isEqualTo(expectedMedian);
            }
        }
    }

    private static List<Interval> randomIntervals(SplittableRandom rng, int n) {
        List<Interval> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            long start = rng.nextLong(1, 2000);
            out.add(iv(start, start + rng.nextLong(0, rng.nextBoolean() ? 50 : 400)));
        }
        return out;
    }

    private static List<htsjdk.samtools.util.Interval> toHtsjdk(List<Interval> intervals) {
        List<htsjdk.samtools.util.Interval> out = new ArrayList<>();
        for (Interval i : intervals) {
            out.add(new htsjdk.samtools.util.Interval("seq", (int) i.start(), (int) i.end()));
        }
        return out;
    }
}
