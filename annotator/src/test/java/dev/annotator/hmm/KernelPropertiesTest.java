package dev.annotator.hmm;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Invariants of the kernels on random valid models and sequences (orders 0-3, sparse or dense transitions, missing
 * bases, any checkpoint block size), through their public API only. The definitions checked are those of any
 * hidden Markov model (Durbin et al. 1998, "Biological Sequence Analysis", ch. 3; recalled from memory): a
 * posterior is a probability distribution over the states at each position, and the Viterbi path is the path of
 * highest joint probability P(path, sequence), so no other path, however it was found, scores higher.
 */
class KernelPropertiesTest {
    private static final int SAMPLED_PATHS = 1000;

    @Property(tries = 150, seed = "20261201")
    void posteriorsAreDistributionsAtEveryPosition(@ForAll long seed, @ForAll @IntRange(min = 1, max = 6) int states,
                                                   @ForAll @IntRange(min = 0, max = 3) int maxOrder,
                                                   @ForAll @IntRange(min = 1, max = 4000) int length,
                                                   @ForAll @IntRange(min = 1, max = 5000) int block,
                                                   @ForAll boolean dense,
                                                   @ForAll @DoubleRange(min = 0, max = 0.3) double missingRate) {
        SplittableRandom rng = new SplittableRandom(seed);
        HmmParameters p = RandomModels.model(rng, states, maxOrder, dense);
        byte[] seq = RandomModels.sequence(rng, length, missingRate);
        int[] visits = new int[length];
        double logLik = new ForwardBackward(p, block).run(seq, (t, gamma, e) -> {
            visits[t]++;
            double sum = 0;
            for (double g : gamma) {
                assertThat(g).as("posterior at %d", t).isBetween(0.0, 1.0);
                sum += g;
            }
            assertThat(sum).as("posterior sum at %d", t).isCloseTo(1.0, within(1e-12));
        });
        assertThat(visits).containsOnly(1);
        assertThat(logLik).isFinite().isLessThanOrEqualTo(0.0);
    }

    @Property(tries = 60, seed = "20261202")
    void viterbiPathScoresAtLeastAsHighAsAThousandOtherPaths(@ForAll long seed,
                                                             @ForAll @IntRange(min = 2, max = 6) int states,
                                                             @ForAll @IntRange(min = 0, max = 3) int maxOrder,
                                                             @ForAll @IntRange(min = 1, max = 1500) int length,
                                                             @ForAll boolean dense) {
        SplittableRandom rng = new SplittableRandom(seed);
        HmmParameters p = RandomModels.model(rng, states, maxOrder, dense);
        byte[] seq = RandomModels.sequence(rng, length, 0.05);
        ViterbiPath best = new Viterbi(p).decode(seq);
        double bestLog = BruteForceEnumeration.logJoint(p, seq, best.states());
        // the kernel's own score is the joint probability of the path it returns
        assertThat(best.logProbability()).isCloseTo(bestLog, within(1e-9 * Math.max(1, Math.abs(bestLog))));
        double slack = 1e-9 * Math.max(1, Math.abs(bestLog));
        for (int i = 0; i < SAMPLED_PATHS; i++) {
            // half drawn from the model's own chain, half the best path with a few positions changed: the second
            // kind are the near misses a wrong back-pointer or tie rule would let win
            int[] other = i % 2 == 0 ? sampleChain(p, length, rng) : perturb(best.states(), states, rng);
            assertThat(BruteForceEnumeration.logJoint(p, seq, other)).as("sampled path %d", i).isLessThanOrEqualTo(bestLog + slack);
        }
    }

    private static int[] sampleChain(HmmParameters p, int length, SplittableRandom rng) {
        int k = p.stateCount();
        int[] path = new int[length];
        double[] start = new double[k];
        for (int s = 0; s < k; s++) {
            start[s] = p.start(s);
        }
        path[0] = RandomModels.draw(start, rng);
        double[] row = new double[k];
        for (int t = 1; t < length; t++) {
            for (int j = 0; j < k; j++) {
                row[j] = p.transition(path[t - 1], j);
            }
            path[t] = RandomModels.draw(row, rng);
        }
        return path;
    }

    private static int[] perturb(int[] path, int states, SplittableRandom rng) {
        int[] other = path.clone();
        int changes = 1 + rng.nextInt(5);
        for (int c = 0; c < changes; c++) {
            int at = rng.nextInt(other.length);
            int run = 1 + rng.nextInt(Math.min(20, other.length - at));
            int to = rng.nextInt(states);
            for (int t = at; t < at + run; t++) {
                other[t] = to;
            }
        }
        return other;
    }
}
