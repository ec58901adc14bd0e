package dev.annotator.hmm;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Supplier;

/** Random valid parameter sets and sequences for kernel tests. */
public final class RandomModels {
    private RandomModels() {
    }

    /** A random model; transitions are sparse (each row keeps at least one, self-loop sometimes forbidden). */
    static HmmParameters model(SplittableRandom rng, int states, int maxOrder, boolean dense) {
        double[] start = distribution(rng, states);
        List<int[]> pairs = new ArrayList<>();
        List<Double> probs = new ArrayList<>();
        for (int i = 0; i < states; i++) {
            boolean[] allowed = new boolean[states];
            int count = 0;
            for (int j = 0; j < states; j++) {
                allowed[j] = dense || rng.nextDouble() < 0.7;
                if (allowed[j]) {
                    count++;
                }
            }
            if (count == 0) {
                allowed[rng.nextInt(states)] = true;
                count = 1;
            }
            double[] row = distribution(rng, count);
            int c = 0;
            for (int j = 0; j < states; j++) {
                if (allowed[j]) {
                    pairs.add(new int[]{i, j});
                    probs.add(row[c++]);
                }
            }
        }
        return assemble(rng, start, pairs, probs, maxOrder, () -> distribution(rng, 4));
    }

    /**
     * Parameters from listed transitions (pairs {from, to} with their probabilities), each state given a random
     * order up to {@code maxOrder} and each emission row drawn from {@code emissionRow}, in that order from rng.
     */
    static HmmParameters assemble(SplittableRandom rng, double[] start, List<int[]> pairs, List<Double> probs,
                                  int maxOrder, Supplier<double[]> emissionRow) {
        int[] from = new int[pairs.size()];
        int[] to = new int[pairs.size()];
        double[] prob = new double[pairs.size()];
        for (int t = 0; t < pairs.size(); t++) {
            from[t] = pairs.get(t)[0];
            to[t] = pairs.get(t)[1];
            prob[t] = probs.get(t);
        }
        int[] orders = new int[start.length];
        double[][] tables = new double[orders.length][];
        for (int s = 0; s < orders.length; s++) {
            orders[s] = rng.nextInt(maxOrder + 1);
            int rows = 1 << (2 * orders[s]);
            tables[s] = new double[rows * 4];
            for (int r = 0; r < rows; r++) {
                System.arraycopy(emissionRow.get(), 0, tables[s], r * 4, 4);
            }
        }
        return new HmmParameters(start, from, to, prob, orders, tables);
    }

    /** A random probability vector of n entries, none below about 0.05 / n (used across the test packages). */
    public static double[] distribution(SplittableRandom rng, int n) {
        double[] d = new double[n];
        double sum = 0;
        for (int i = 0; i < n; i++) {
            d[i] = 0.05 + rng.nextDouble();
            sum += d[i];
        }
        for (int i = 0; i < n; i++) {
            d[i] /= sum;
        }
        return d;
    }

    /**
     * An index drawn with chance proportional to its weight; never one of weight 0. Rounding can leave the draw
     * past the last entry, which then goes to the last positive weight.
     */
    static int draw(double[] weights, SplittableRandom rng) {
        double total = 0;
        for (double w : weights) {
            total += w;
        }
        double u = rng.nextDouble() * total;
        for (int i = 0; i < weights.length; i++) {
            u -= weights[i];
            if (u < 0 && weights[i] > 0) {
                return i;
            }
        }
        for (int i = weights.length - 1; i >= 0; i--) {
            if (weights[i] > 0) {
                return i;
            }
        }
        throw new IllegalStateException("no state with positive weight");
    }

    /** Random bases, with N at the given rate and lowercase at random. */
    static byte[] sequence(SplittableRandom rng, int length, double nRate) {
        byte[] s = new byte[length];
        String bases = "ACGTacgt";
        for (int i = 0; i < length; i++) {
            s[i] = rng.nextDouble() < nRate ? (byte) 'N' : (byte) bases.charAt(rng.nextInt(8));
        }
        return s;
    }
}
