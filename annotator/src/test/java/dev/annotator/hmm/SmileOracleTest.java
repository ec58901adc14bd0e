package dev.annotator.hmm;

import org.junit.jupiter.api.Test;
import smile.math.matrix.Matrix;
import smile.sequence.HMM;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Log-likelihood and Viterbi path against an independent general-purpose implementation: Smile 2.6.0,
 * smile.sequence.HMM (LGPL-3.0, Maven Central, test scope). Smile models order-0 emissions over dense
 * transitions and has no posteriors, so this covers order-0 models on sequences of a few thousand bases; the
 * enumeration test covers higher orders, sparse transitions, missing bases and posteriors.
 */
class SmileOracleTest {

    @Test
    void logLikelihoodAndViterbiAgreeWithSmile() {
        SplittableRandom rng = new SplittableRandom(7L);
        int differing = 0;
        for (int trial = 0; trial < 30; trial++) {
            int states = 2 + rng.nextInt(4);
            HmmParameters p = RandomModels.model(rng, states, 0, true);
            int length = 1000 + rng.nextInt(4000);
            byte[] seq = RandomModels.sequence(rng, length, 0.0);
            int[] observations = new int[length];
            for (int t = 0; t < length; t++) {
                observations[t] = dev.annotator.seq.BaseCode.of(seq[t]);
            }
            HMM oracle = toSmile(p);

            double ours = new ForwardBackward(p, 256).logLikelihood(seq);
            double theirs = oracle.logp(observations);
            assertThat(ours).as("trial %d", trial).isCloseTo(theirs, within(1e-9 * Math.abs(theirs)));

            ViterbiPath vp = new Viterbi(p).decode(seq);
            int[] smilePath = oracle.predict(observations);
            double smileBest = oracle.logp(observations, smilePath);
            double oursUnderSmile = oracle.logp(observations, vp.states());
            // both must score the same under Smile's own evaluation of a path; where the two paths differ, it
            // is a tie to rounding (two paths whose log scores agree to ~1e-12), so the scores are compared
            assertThat(oursUnderSmile).as("trial %d", trial).isCloseTo(smileBest, within(1e-9 * Math.abs(smileBest)));
            assertThat(vp.logProbability()).isCloseTo(smileBest, within(1e-9 * Math.abs(smileBest)));
            if (!java.util.Arrays.equals(vp.states(), smilePath)) {
                differing++;
            }
        }
        assertThat(differing).as("paths differing only by rounding ties").isLessThanOrEqualTo(3);
    }

    private static HMM toSmile(HmmParameters p) {
        int k = p.stateCount();
        double[] pi = new double[k];
        double[][] a = new double[k][k];
        double[][] b = new double[k][4];
        for (int i = 0; i < k; i++) {
            pi[i] = p.start(i);
            for (int j = 0; j < k; j++) {
                a[i][j] = p.transition(i, j);
            }
            for (int base = 0; base < 4; base++) {
                b[i][base] = p.emission(i, 0, 0, base);
            }
        }
        return new HMM(pi, new Matrix(a), new Matrix(b));
    }
}
