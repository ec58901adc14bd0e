package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Forward likelihood, posteriors and Viterbi against exhaustive enumeration of all state paths on tiny random
 * models: the definition of the HMM evaluated directly, independent of the dynamic programming under test.
 */
class KernelsAgainstEnumerationTest {

    @Test
    void likelihoodPosteriorsAndViterbiEqualEnumeration() {
        SplittableRandom rng = new SplittableRandom(20261201L);
        int ties = 0;
        for (int trial = 0; trial < 400; trial++) {
            int states = 2 + rng.nextInt(2);
            HmmParameters p = RandomModels.model(rng, states, 2, trial % 3 == 0);
            int length = 1 + rng.nextInt(8);
            byte[] seq = RandomModels.sequence(rng, length, 0.1);
            BruteForceEnumeration truth = new BruteForceEnumeration(p, seq);
            if (truth.likelihood == 0) {
                continue;
            }
            // a small block forces several checkpoints even on 8 bases
            int block = 1 + rng.nextInt(4);
            ForwardBackward fb = new ForwardBackward(p, block);
            double[][] post = new double[length][states];
            int[] visits = new int[length];
            double logLik = fb.run(seq, (t, gamma, e) -> {
                post[t] = gamma.clone();
                visits[t]++;
            });
            String where = "trial " + trial + " seq " + new String(seq);
            assertThat(logLik).as(where).isCloseTo(Math.log(truth.likelihood), within(1e-10));
            assertThat(fb.logLikelihood(seq)).as(where).isCloseTo(Math.log(truth.likelihood), within(1e-10));
            for (int t = 0; t < length; t++) {
                assertThat(visits[t]).isEqualTo(1);
                for (int s = 0; s < states; s++) {
                    assertThat(post[t][s]).as(where + " t=" + t + " s=" + s)
                            .isCloseTo(truth.posterior[t][s], within(1e-12));
                }
            }
            ViterbiPath vp = new Viterbi(p).decode(seq);
            assertThat(vp.logProbability()).as(where).isCloseTo(Math.log(truth.bestProbability), within(1e-10));
            double kernelPathJoint = BruteForceEnumeration.joint(p, seq, vp.states());
            assertThat(Math.log(kernelPathJoint)).as(where).isCloseTo(vp.logProbability(), within(1e-10));
            if (!java.util.Arrays.equals(vp.states(), truth.bestPath)) {
                // only an exact tie may pick a different path: then both paths score the same
                assertThat(kernelPathJoint).as(where + " tie").isCloseTo(truth.bestProbability,
                        within(1e-12 * truth.bestProbability));
                ties++;
            }
        }
        // ties come from forbidden transitions and missing bases making two paths' products identical; they must stay rare
        assertThat(ties).isLessThan(20);
    }
}
