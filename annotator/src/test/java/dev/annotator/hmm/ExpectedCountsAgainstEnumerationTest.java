package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;
import java.util.concurrent.ForkJoinPool;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/**
 * The E-step kernel against enumeration of every state path on tiny random models: orders 0-2, sparse
 * transitions, missing bases, with and without per-base classes, every block length and every cut into halves.
 * Enumeration evaluates the definition of the expected counts directly (see {@link BruteForceCounts}).
 */
class ExpectedCountsAgainstEnumerationTest {
    private static final double REL = 1e-11;

    @Test
    void countsEqualEnumeration() {
        SplittableRandom rng = new SplittableRandom(11);
        for (int trial = 0; trial < 300; trial++) {
            int states = 1 + rng.nextInt(3);
            HmmParameters p = RandomModels.model(rng, states, 2, false);
            int n = 1 + rng.nextInt(states == 3 ? 7 : 9);
            byte[] seq = RandomModels.sequence(rng, n, 0.15);
            int[] stateClass = null;
            byte[] baseClass = null;
            if (rng.nextBoolean()) {
                stateClass = new int[states];
                for (int s = 0; s < states; s++) {
                    stateClass[s] = rng.nextInt(2);
                }
                baseClass = new byte[n];
                for (int t = 0; t < n; t++) {
                    baseClass[t] = (byte) (rng.nextInt(3) - 1);
                }
            }
            BruteForceCounts expected = new BruteForceCounts(p, seq, stateClass, baseClass);
            if (Double.isInfinite(expected.logLikelihood)) {
                continue; // no allowed path: covered by impossibleSequencesAreReported
            }
            int block = 1 + rng.nextInt(n + 1);
            int split = 2 + rng.nextInt(n + 1);
            ExpectedCounts got = counts(p, stateClass, block, split, seq, baseClass);
            String where = "trial " + trial + " n=" + n + " block=" + block + " split=" + split;
            assertClose(got.logLikelihood(), expected.logLikelihood, where + " log-likelihood");
            assertThat(got.bases()).isEqualTo(n);
            for (int s = 0; s < states; s++) {
                assertClose(got.start(s), expected.start[s], where + " start " + s);
                for (int j = 0; j < states; j++) {
                    assertClose(got.transition(s, j), expected.transition[s][j], where + " transition " + s + j);
                }
                double[] e = got.fullOrderEmissions(s);
                for (int i = 0; i < e.length; i++) {
                    assertClose(e[i], expected.emission[s][i], where + " emission " + s + "/" + i);
                }
            }
        }
    }

    /** Cutting into halves, block length and running the halves as parallel tasks change no bit. */
    @Test
    void resultsDoNotDependOnBlockLengthOrThreads() {
        SplittableRandom rng = new SplittableRandom(5);
        HmmParameters p = RandomModels.model(rng, 4, 2, false);
        byte[] seq = RandomModels.sequence(rng, 5_000, 0.01);
        ExpectedCounts reference = counts(p, null, 5_000, 1_000, seq, null);
        ForkJoinPool pool = new ForkJoinPool(2);
        try {
            for (int block : new int[] {1, 7, 64, 2_500, 1 << 14}) {
                ExpectedCounts same = counts(p, null, block, 1_000, seq, null);
                assertIdentical(same, reference);
                BaumWelchKernel kernel = new BaumWelchKernel(p, null, block, 1_000);
                ExpectedCounts head = kernel.newCounts();
                ExpectedCounts tail = kernel.newCounts();
                pool.submit(() -> kernel.accumulate(seq, null, head, tail, true)).join();
                head.add(tail);
                kernel.fold(head);
                assertIdentical(head, reference);
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void forwardOnlyLikelihoodEqualsTheEStepsLikelihood() {
        SplittableRandom rng = new SplittableRandom(9);
        HmmParameters p = RandomModels.model(rng, 3, 1, false);
        byte[] seq = RandomModels.sequence(rng, 3_000, 0.02);
        double fromCounts = counts(p, null, 100, 1 << 20, seq, null).logLikelihood();
        double forward = new BaumWelchKernel(p, null, 100, 1 << 20).logLikelihood(seq, null);
        assertThat(forward).isEqualTo(fromCounts);
        // and the decoder's forward pass (a separate implementation) agrees to rounding
        assertThat(forward).isCloseTo(new ForwardBackward(p).logLikelihood(seq), within(1e-9));
    }

    /** The first base where every allowed path has probability zero is named, however the record is cut. */
    @Test
    void impossibleSequencesAreReported() {
        // two states that may not follow each other in one direction: class 1 then class 0 is impossible
        HmmParameters p = new HmmParameters(new double[] {0.5, 0.5}, new int[] {0, 0, 1}, new int[] {0, 1, 1},
                new double[] {0.5, 0.5, 1.0}, new int[] {0, 0},
                new double[][] {{0.25, 0.25, 0.25, 0.25}, {0.25, 0.25, 0.25, 0.25}});
        int n = 100;
        byte[] seq = new byte[n];
        java.util.Arrays.fill(seq, (byte) 'A');
        byte[] cls = new byte[n];
        java.util.Arrays.fill(cls, (byte) -1);
        cls[30] = 1;
        cls[70] = 0;
        for (int split : new int[] {2, 50, 80, 1000}) {
            BaumWelchKernel kernel = new BaumWelchKernel(p, new int[] {0, 1}, 8, split);
            assertThatThrownBy(() -> kernel.accumulate(seq, cls, kernel.newCounts(), kernel.newCounts(), false))
                    .isInstanceOfSatisfying(ImpossibleSequenceException.class,
                            e -> assertThat(e.position()).as("split %d", split).isEqualTo(70));
        }
    }

    static ExpectedCounts counts(HmmParameters p, int[] stateClass, int block, int split, byte[] seq,
                                 byte[] baseClass) {
        BaumWelchKernel kernel = new BaumWelchKernel(p, stateClass, block, split);
        ExpectedCounts head = kernel.newCounts();
        ExpectedCounts tail = kernel.newCounts();
        kernel.accumulate(seq, baseClass, head, tail, false);
        head.add(tail);
        kernel.fold(head);
        return head;
    }

    private static void assertIdentical(ExpectedCounts a, ExpectedCounts b) {
        assertThat(a.logLikelihood()).isEqualTo(b.logLikelihood());
        for (int s = 0; s < a.stateCount(); s++) {
            assertThat(a.start(s)).isEqualTo(b.start(s));
            assertThat(a.fullOrderEmissions(s)).isEqualTo(b.fullOrderEmissions(s));
        }
        for (int q = 0; q < a.transitionCount(); q++) {
            assertThat(a.transition(q)).isEqualTo(b.transition(q));
        }
    }

    private static void assertClose(double got, double expected, String what) {
        assertThat(got).as(what).isCloseTo(expected, within(REL * Math.max(1, Math.abs(expected))));
    }
}
