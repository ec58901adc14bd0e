package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The slot-and-overflow layout of the sparse recursions: the same bits as the plain loop over each state's list
 * for every width, and forward-backward on models whose fans need the overflow (more than four predecessors or
 * successors beside states with one) against enumeration of every state path.
 */
class TransitionGroupsTest {

    @Test
    void everyWidthGivesThePlainLoopsBits() {
        SplittableRandom rng = new SplittableRandom(5L);
        for (int trial = 0; trial < 200; trial++) {
            int k = 1 + rng.nextInt(30);
            int[] offset = new int[k + 1];
            List<Integer> others = new ArrayList<>();
            List<Double> probs = new ArrayList<>();
            for (int s = 0; s < k; s++) {
                int fan = rng.nextInt(4) == 0 ? rng.nextInt(Math.min(k, 16) + 1) : 1 + rng.nextInt(Math.min(k, 2));
                for (int f = 0; f < fan; f++) {
                    others.add(rng.nextInt(k));
                    // probabilities of exactly 0 are listed transitions too
                    probs.add(rng.nextInt(10) == 0 ? 0.0 : rng.nextDouble());
                }
                offset[s + 1] = others.size();
            }
            int[] other = others.stream().mapToInt(Integer::intValue).toArray();
            double[] p = probs.stream().mapToDouble(Double::doubleValue).toArray();
            int inOff = rng.nextInt(3);
            double[] in = new double[inOff + k];
            double[] scale = new double[k + 2];
            for (int i = 0; i < in.length; i++) {
                // magnitudes far apart, so that the order of the additions shows in the last bits
                in[i] = rng.nextDouble() * Math.pow(2, rng.nextInt(80) - 40);
            }
            for (int i = 0; i < scale.length; i++) {
                scale[i] = rng.nextDouble();
            }
            double[] want = new double[k];
            double wantSum = 0;
            double[] wantUnscaled = new double[k];
            double wantUnscaledSum = 0;
            for (int s = 0; s < k; s++) {
                double v = 0;
                for (int q = offset[s]; q < offset[s + 1]; q++) {
                    v += in[inOff + other[q]] * p[q];
                }
                wantUnscaled[s] = v;
                wantUnscaledSum += v;
                want[s] = v * scale[2 + s];
                wantSum += want[s];
            }
            for (int width = 1; width <= TransitionGroups.MAX_WIDTH + 1; width++) {
                TransitionGroups g = width <= TransitionGroups.MAX_WIDTH
                        ? new TransitionGroups(offset, other, p, width) : new TransitionGroups(offset, other, p);
                double[] out = new double[k + 1];
                double sum = g.gather(in, inOff, out, 1, scale, 2);
                for (int s = 0; s < k; s++) {
                    assertThat(Double.doubleToRawLongBits(out[1 + s])).as("trial %d width %d state %d", trial,
                            width, s).isEqualTo(Double.doubleToRawLongBits(want[s]));
                }
                assertThat(Double.doubleToRawLongBits(sum)).isEqualTo(Double.doubleToRawLongBits(wantSum));
                double[] plain = new double[k];
                double plainSum = g.gather(in, inOff, plain, 0, null, 0);
                for (int s = 0; s < k; s++) {
                    assertThat(Double.doubleToRawLongBits(plain[s])).isEqualTo(
                            Double.doubleToRawLongBits(wantUnscaled[s]));
                }
                assertThat(Double.doubleToRawLongBits(plainSum)).isEqualTo(
                        Double.doubleToRawLongBits(wantUnscaledSum));
            }
        }
    }

    @Test
    void forwardBackwardWithOverflowingFansEqualsEnumeration() {
        SplittableRandom rng = new SplittableRandom(6L);
        int overflowing = 0;
        for (int trial = 0; trial < 150; trial++) {
            int states = 5 + rng.nextInt(2);
            HmmParameters p = fanModel(rng, states);
            int length = 1 + rng.nextInt(4);
            byte[] seq = RandomModels.sequence(rng, length, 0.1);
            BruteForceEnumeration truth = new BruteForceEnumeration(p, seq);
            if (truth.likelihood == 0) {
                continue;
            }
            if (maxFan(p.predOffset()) > TransitionGroups.MAX_WIDTH
                    || maxFan(p.succOffset()) > TransitionGroups.MAX_WIDTH) {
                overflowing++;
            }
            ForwardBackward fb = new ForwardBackward(p, 1 + rng.nextInt(3));
            double[][] post = new double[length][];
            double logLik = fb.run(seq, (t, gamma, e) -> post[t] = gamma.clone());
            String where = "trial " + trial + " seq " + new String(seq);
            assertThat(logLik).as(where).isCloseTo(Math.log(truth.likelihood), within(1e-10));
            assertThat(fb.logLikelihood(seq)).as(where).isEqualTo(logLik);
            for (int t = 0; t < length; t++) {
                for (int s = 0; s < states; s++) {
                    assertThat(post[t][s]).as(where + " t=" + t + " s=" + s)
                            .isCloseTo(truth.posterior[t][s], within(1e-12));
                }
            }
        }
        assertThat(overflowing).isGreaterThan(100);
    }

    private static int maxFan(int[] offset) {
        int max = 0;
        for (int s = 0; s + 1 < offset.length; s++) {
            max = Math.max(max, offset[s + 1] - offset[s]);
        }
        return max;
    }

    /** Most states with one or two successors, one state that goes everywhere (so every state has it before). */
    private static HmmParameters fanModel(SplittableRandom rng, int states) {
        List<int[]> pairs = new ArrayList<>();
        List<Double> probs = new ArrayList<>();
        int hub = rng.nextInt(states);
        for (int i = 0; i < states; i++) {
            int fan = i == hub ? states : 1 + rng.nextInt(2);
            double[] row = RandomModels.distribution(rng, fan);
            int first = rng.nextInt(states);
            for (int f = 0; f < fan; f++) {
                pairs.add(new int[]{i, (first + f) % states});
                probs.add(row[f]);
            }
        }
        return RandomModels.assemble(rng, RandomModels.distribution(rng, states), pairs, probs, 1,
                () -> RandomModels.distribution(rng, 4));
    }
}
