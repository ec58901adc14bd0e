package dev.annotator.hmm;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Random models with structural zeros everywhere a model can have them: states that cannot start, forbidden
 * transitions, and emission entries of exactly zero (each row keeps at least one base it can emit), plus
 * sequences drawn from such a model so that they are guaranteed possible.
 */
final class StructuralZeroModels {
    private StructuralZeroModels() {
    }

    static HmmParameters model(SplittableRandom rng, int states, int maxOrder, double zeroRate) {
        double[] start = sparseDistribution(rng, states, zeroRate);
        List<int[]> pairs = new ArrayList<>();
        List<Double> probs = new ArrayList<>();
        for (int i = 0; i < states; i++) {
            double[] row = sparseDistribution(rng, states, zeroRate + 0.2);
            for (int j = 0; j < states; j++) {
                if (row[j] > 0) {
                    pairs.add(new int[]{i, j});
                    probs.add(row[j]);
                }
            }
        }
        return RandomModels.assemble(rng, start, pairs, probs, maxOrder, () -> sparseDistribution(rng, 4, zeroRate));
    }

    /** A probability vector with entries set to exactly 0 at the given rate, never all of them. */
    static double[] sparseDistribution(SplittableRandom rng, int n, double zeroRate) {
        double[] d = RandomModels.distribution(rng, n);
        int keep = rng.nextInt(n);
        double sum = 0;
        for (int i = 0; i < n; i++) {
            if (i != keep && rng.nextDouble() < zeroRate) {
                d[i] = 0;
            }
            sum += d[i];
        }
        for (int i = 0; i < n; i++) {
            d[i] /= sum;
        }
        return d;
    }

    /**
     * A sequence drawn from the model's own chain and emissions, so at least one path emits it with positive
     * probability; then bases replaced by N at the given rate, which keeps it possible (a missing base emits with
     * probability 1, and a shortened context reads a reduced table, an average that includes the drawn entry).
     */
    static byte[] sampledSequence(HmmParameters p, SplittableRandom rng, int length, double missingRate) {
        int k = p.stateCount();
        byte[] seq = new byte[length];
        int[] codes = new int[length];
        double[] weights = new double[k];
        int state = 0;
        for (int t = 0; t < length; t++) {
            for (int j = 0; j < k; j++) {
                weights[j] = t == 0 ? p.start(j) : p.transition(state, j);
            }
            state = RandomModels.draw(weights, rng);
            int order = Math.min(p.order(state), t);
            int context = 0;
            for (int back = order; back >= 1; back--) {
                // oldest context base most significant, as HmmParameters lays out its rows
                context = context * 4 + codes[t - back];
            }
            double[] row = new double[4];
            for (int b = 0; b < 4; b++) {
                row[b] = p.emission(state, order, context, b);
            }
            codes[t] = RandomModels.draw(row, rng);
            seq[t] = (byte) "ACGT".charAt(codes[t]);
        }
        for (int t = 0; t < length; t++) {
            if (rng.nextDouble() < missingRate) {
                seq[t] = 'N';
            }
        }
        return seq;
    }
}
