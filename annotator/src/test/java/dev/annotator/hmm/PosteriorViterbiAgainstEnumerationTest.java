package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/**
 * Posterior-Viterbi against exhaustive enumeration on tiny random models with structural zeros (states that
 * cannot start, forbidden transitions, bases a state cannot emit), orders 0-2: the optimum as Fariselli, Martelli
 * and Casadio (2005, BMC Bioinformatics 6(Suppl 4):S12) define it, the largest plain sum of posteriors over valid
 * paths, evaluated path by path.
 */
class PosteriorViterbiAgainstEnumerationTest {

    @Test
    void pathIsValidAndItsPosteriorSumIsTheEnumeratedMaximum() {
        SplittableRandom rng = new SplittableRandom(20261211L);
        int possible = 0;
        int impossible = 0;
        int differentTiedPaths = 0;
        for (int trial = 0; trial < 500; trial++) {
            int states = 2 + rng.nextInt(3);
            HmmParameters p = StructuralZeroModels.model(rng, states, 2, 0.25);
            int length = 1 + rng.nextInt(7);
            // half drawn from the model (always possible), half uniform (often impossible under the zeros)
            byte[] seq = trial % 2 == 0 ? StructuralZeroModels.sampledSequence(p, rng, length, 0.1)
                    : RandomModels.sequence(rng, length, 0.1);
            String where = "trial " + trial + " seq " + new String(seq);
            // a small block forces posteriors to arrive in several blocks, last first
            PosteriorViterbi kernel = new PosteriorViterbi(p, 1 + rng.nextInt(4));
            PosteriorPathEnumeration truth = new PosteriorPathEnumeration(p, seq);
            if (truth.likelihood == 0) {
                assertThatThrownBy(() -> kernel.decode(seq)).as(where).isInstanceOf(ImpossibleSequenceException.class);
                impossible++;
                continue;
            }
            possible++;
            assertThat(truth.validPaths).as(where).isPositive();
            PosteriorPath got = kernel.decode(seq);
            int[] path = got.states();
            assertThat(path).as(where).hasSize(length);
            // Fariselli et al. 2005: the decoded path must be an allowed path of the model
            assertThat(PosteriorPathEnumeration.isValid(p, truth.posterior, path)).as(where + " valid").isTrue();
            assertThat(BruteForceEnumeration.joint(p, seq, path)).as(where + " joint").isPositive();
            // Fariselli et al. 2005: among allowed paths, the largest plain sum of posteriors
            double sum = PosteriorPathEnumeration.sum(truth.posterior, path);
            assertThat(sum).as(where + " optimum").isCloseTo(truth.bestSum, within(1e-9));
            assertThat(got.posteriorSum()).as(where + " reported sum").isCloseTo(truth.bestSum, within(1e-9));
            if (!Arrays.equals(path, truth.bestPath)) {
                differentTiedPaths++;
            }

            PosteriorPath fromPosteriors = kernel.decode(truth.flatPosterior());
            assertThat(PosteriorPathEnumeration.isValid(p, truth.posterior, fromPosteriors.states())).as(where).isTrue();
            assertThat(fromPosteriors.posteriorSum()).as(where + " precomputed").isCloseTo(truth.bestSum, within(1e-9));
        }
        // both kinds of case must actually occur, or the test would check less than it claims
        assertThat(possible).isGreaterThan(250);
        assertThat(impossible).isGreaterThan(10);
        // the tie rule (lowest state first, then lowest successor) picks the lexicographically first optimum, as
        // the enumeration does; a different path is only allowed on a tie, which random weights make rare
        assertThat(differentTiedPaths).isLessThan(5);
    }
}
