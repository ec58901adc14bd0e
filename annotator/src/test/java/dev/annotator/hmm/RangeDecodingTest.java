package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Decoding a sequence in pieces, each given the forward vector before it and the backward vector at its end,
 * must reproduce whole-sequence decoding: posteriors within 1e-9, log-likelihoods summing to the whole.
 */
class RangeDecodingTest {

    @Test
    void piecesWithExactBoundaryVectorsEqualTheWhole() {
        SplittableRandom rng = new SplittableRandom(99);
        for (int trial = 0; trial < 20; trial++) {
            int states = 2 + rng.nextInt(4);
            HmmParameters p = RandomModels.model(rng, states, 2, trial % 2 == 0);
            int n = 2000 + rng.nextInt(5000);
            byte[] seq = RandomModels.sequence(rng, n, 0.02);
            ForwardBackward fb = new ForwardBackward(p, 1 + rng.nextInt(700));
            double[][] whole = new double[n][];
            double total = fb.run(seq, (t, g, e) -> whole[t] = g.clone());

            int cut1 = 1 + rng.nextInt(n / 2);
            int cut2 = cut1 + 1 + rng.nextInt(n - cut1 - 1);
            int[] cuts = {0, cut1, cut2, n};
            double sum = 0;
            for (int piece = 0; piece < 3; piece++) {
                int from = cuts[piece];
                int to = cuts[piece + 1];
                double[] before = from == 0 ? null : fb.forwardVector(seq, 0, from, null);
                double[] last = to == n ? null : fb.backwardVector(seq, to - 1, n, null);
                double[][] got = new double[n][];
                sum += fb.runRange(seq, from, to, before, last, (start, end, post, em) -> {
                    for (int t = start; t < end; t++) {
                        got[t] = java.util.Arrays.copyOfRange(post, (t - start) * states, (t - start + 1) * states);
                    }
                });
                for (int t = from; t < to; t++) {
                    for (int s = 0; s < states; s++) {
                        assertThat(got[t][s]).as("trial %d t %d", trial, t).isCloseTo(whole[t][s], within(1e-9));
                    }
                }
            }
            assertThat(sum).isCloseTo(total, within(1e-9 * Math.abs(total)));
        }
    }

    /** The certified boundary vectors from a limited stretch agree with the exact ones from the whole record. */
    @Test
    void certifiedBoundaryVectorsMatchExactOnes() {
        SplittableRandom rng = new SplittableRandom(5);
        for (int trial = 0; trial < 6; trial++) {
            HmmParameters p = RandomModels.model(rng, 2 + rng.nextInt(3), 2, false);
            int n = 200_000;
            byte[] seq = RandomModels.sequence(rng, n, 0.001);
            ForwardBackward fb = new ForwardBackward(p);
            int cut = 60_000 + rng.nextInt(80_000);
            double[] exactAlpha = fb.forwardVector(seq, 0, cut, null);
            double[] exactBeta = fb.backwardVector(seq, cut - 1, n, null);
            double[] alpha = BoundaryVectors.forwardBefore(fb, seq, cut);
            double[] beta = BoundaryVectors.backwardAt(fb, seq, cut - 1);
            for (int s = 0; s < alpha.length; s++) {
                assertThat(alpha[s]).isCloseTo(exactAlpha[s], within(1e-11));
                assertThat(beta[s]).isCloseTo(exactBeta[s], within(1e-11));
            }
        }
    }
}
