package dev.annotator.hmm;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.statistics.Statistics;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/**
 * Invariants of posterior-Viterbi on random sparse models with structural zeros, sequences far too long to
 * enumerate and any checkpoint block size. The definition checked is that of Fariselli, Martelli and Casadio
 * (2005, BMC Bioinformatics 6(Suppl 4):S12): the decoded path is an allowed path of the model, and among allowed
 * paths its plain sum of posteriors is largest, so in particular no smaller than that of the Viterbi path, which
 * is allowed too.
 */
class PosteriorViterbiPropertiesTest {

    @Property(tries = 120, seed = "20261211")
    void pathIsAllowedByTheModelAndScoresAtLeastTheViterbiPath(
            @ForAll long seed, @ForAll @IntRange(min = 1, max = 8) int states,
            @ForAll @IntRange(min = 0, max = 3) int maxOrder, @ForAll @IntRange(min = 1, max = 3000) int length,
            @ForAll @IntRange(min = 1, max = 4000) int block, @ForAll @DoubleRange(min = 0, max = 0.4) double zeroRate,
            @ForAll @DoubleRange(min = 0, max = 0.2) double missingRate, @ForAll boolean drawnFromModel) {
        SplittableRandom rng = new SplittableRandom(seed);
        HmmParameters p = StructuralZeroModels.model(rng, states, maxOrder, zeroRate);
        byte[] seq = drawnFromModel ? StructuralZeroModels.sampledSequence(p, rng, length, missingRate)
                : RandomModels.sequence(rng, length, missingRate);
        PosteriorViterbi kernel = new PosteriorViterbi(p, block);
        // most tries must reach the path checks rather than the impossible branch
        Statistics.coverage(coverage -> coverage.check("decoded").percentage(share -> share > 60));
        ViterbiPath viterbi;
        try {
            viterbi = new Viterbi(p).decode(seq);
        } catch (ImpossibleSequenceException e) {
            // no path emits the sequence: posterior-Viterbi must agree rather than invent one
            assertThat(drawnFromModel).as("a sequence drawn from the model is possible").isFalse();
            assertThatThrownBy(() -> kernel.decode(seq)).isInstanceOf(ImpossibleSequenceException.class);
            Statistics.collect("impossible");
            return;
        }
        Statistics.collect("decoded");
        PosteriorPath got = kernel.decode(seq);
        int[] path = got.states();
        assertThat(path).hasSize(length);

        // allowed by the topology: start, every transition, every base's emission under its state and context
        assertThat(p.start(path[0])).as("start of state %d", path[0]).isPositive();
        for (int t = 1; t < length; t++) {
            assertThat(p.transition(path[t - 1], path[t])).as("transition at %d", t).isPositive();
        }
        assertThat(BruteForceEnumeration.logJoint(p, seq, path)).as("ln P(path, seq)").isFinite();

        double[][] posterior = new double[length][];
        new ForwardBackward(p).run(seq, (t, gamma, e) -> posterior[t] = gamma.clone());
        double own = PosteriorPathEnumeration.sum(posterior, path);
        double slack = 1e-9 * length;
        assertThat(got.posteriorSum()).as("reported sum").isCloseTo(own, within(slack));
        assertThat(own).as("sum vs the Viterbi path")
                .isGreaterThanOrEqualTo(PosteriorPathEnumeration.sum(posterior, viterbi.states()) - slack);
        double ceiling = 0;
        for (double[] row : posterior) {
            double max = 0;
            for (double g : row) {
                max = Math.max(max, g);
            }
            ceiling += max;
        }
        assertThat(own).as("sum vs per-position maxima").isLessThanOrEqualTo(ceiling + slack);
    }
}
