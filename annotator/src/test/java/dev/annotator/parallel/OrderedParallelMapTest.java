package dev.annotator.parallel;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.atomic.AtomicLong;

import static org.assertj.core.api.Assertions.assertThat;

/** Results in input order whatever the threads do, and never more weight in flight than the budget. */
class OrderedParallelMapTest {

    @Test
    void keepsInputOrderAndTheWeightBudget() {
        SplittableRandom rng = new SplittableRandom(5);
        List<Integer> weights = new ArrayList<>();
        for (int i = 0; i < 300; i++) {
            weights.add(1 + rng.nextInt(100));
        }
        long budget = 150;
        AtomicLong running = new AtomicLong();
        AtomicLong peak = new AtomicLong();
        List<Integer> out = new ArrayList<>();
        try (OrderedParallelMap<Integer, Integer> map = new OrderedParallelMap<>(4, w -> {
            peak.accumulateAndGet(running.addAndGet(w), Math::max);
            busyWait(w * 2_000L);
            running.addAndGet(-w);
            return w;
        }, out::add, w -> w, budget)) {
            weights.forEach(map::submit);
            map.finish();
        }
        assertThat(out).containsExactlyElementsOf(weights);
        assertThat(peak.get()).isLessThanOrEqualTo(budget);
        // the budget still lets several items run at once, or the test would not be testing it
        assertThat(peak.get()).isGreaterThan(100);
    }

    @Test
    void anItemHeavierThanTheBudgetStillGoesThroughAlone() {
        List<Integer> out = new ArrayList<>();
        AtomicLong running = new AtomicLong();
        AtomicLong peak = new AtomicLong();
        try (OrderedParallelMap<Integer, Integer> map = new OrderedParallelMap<>(2, w -> {
            peak.accumulateAndGet(running.addAndGet(w), Math::max);
            busyWait(200_000L);
            running.addAndGet(-w);
            return w;
        }, out::add, w -> w, 10)) {
            for (int w : new int[] {3, 50, 4, 60, 5}) {
                map.submit(w);
            }
            map.finish();
        }
        assertThat(out).containsExactly(3, 50, 4, 60, 5);
        assertThat(peak.get()).isEqualTo(60);
    }

    private static void busyWait(long nanos) {
        long end = System.nanoTime() + nanos;
        while (System.nanoTime() < end) {
            Thread.onSpinWait();
        }
    }
}
