package dev.annotator.train;

import dev.annotator.hmm.RandomModels;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelValidator;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/** Models built from arrays for training tests: one label per state, the last state's label is the background. */
final class TestModels {
    private TestModels() {
    }

    /**
     * @param names       state names (each gets a label of the same name; the last is the background)
     * @param start       start probabilities
     * @param transitions k x k probabilities; a negative entry means "not listed" (forbidden)
     * @param orders      emission order per state
     * @param emissions   full-order table per state
     */
    static HmmModel model(String[] names, double[] start, double[][] transitions, int[] orders, double[][] emissions) {
        int[] own = new int[names.length];
        for (int s = 0; s < own.length; s++) {
            own[s] = s;
        }
        return model(names, own, start, transitions, orders, emissions);
    }

    /**
     * As above, with several states per label: state s has label "L" + labelOf[s]; the highest label index is the
     * background.
     */
    static HmmModel model(String[] names, int[] labelOf, double[] start, double[][] transitions, int[] orders,
                          double[][] emissions) {
        int k = names.length;
        int labelCount = java.util.Arrays.stream(labelOf).max().orElse(0) + 1;
        boolean own = labelCount == k;
        List<Label> labels = new ArrayList<>();
        for (int l = 0; l < labelCount; l++) {
            boolean background = l == labelCount - 1;
            String name = own ? names[l] : "L" + l;
            labels.add(new Label(name, background ? null : "region_" + name, null, background, false));
        }
        List<State> states = new ArrayList<>();
        List<Transition> ts = new ArrayList<>();
        for (int s = 0; s < k; s++) {
            states.add(new State(names[s], labels.get(labelOf[s]).name(), orders[s], emissions[s]));
            for (int j = 0; j < k; j++) {
                if (transitions[s][j] >= 0) {
                    ts.add(new Transition(names[s], names[j], transitions[s][j]));
                }
            }
        }
        HmmModel m = new HmmModel("test", "invented for a test", new Provenance("invented for a test", List.of()),
                labels, states, start, ts);
        ModelValidator.validate(m, "test model");
        return m;
    }

    /** A random valid model: dense or sparse transitions (every row keeps its self-transition), orders 0..maxOrder. */
    static HmmModel random(SplittableRandom rng, int k, int maxOrder, boolean dense) {
        return random(rng, k, maxOrder, dense, null);
    }

    /** As above; with {@code labelOf}, states share labels as it says (see {@link #model(String[], int[], double[], double[][], int[], double[][])}). */
    static HmmModel random(SplittableRandom rng, int k, int maxOrder, boolean dense, int[] labelOf) {
        String[] names = new String[k];
        double[][] a = new double[k][k];
        int[] orders = new int[k];
        double[][] e = new double[k][];
        for (int s = 0; s < k; s++) {
            names[s] = "s" + s;
            boolean[] allowed = new boolean[k];
            int count = 0;
            for (int j = 0; j < k; j++) {
                // s -> s+1 is always listed, so every state is reachable from state 0
                allowed[j] = j == s || j == s + 1 || dense || rng.nextDouble() < 0.6;
                count += allowed[j] ? 1 : 0;
            }
            double[] row = RandomModels.distribution(rng, count);
            int c = 0;
            for (int j = 0; j < k; j++) {
                a[s][j] = allowed[j] ? row[c++] : -1;
            }
            orders[s] = rng.nextInt(maxOrder + 1);
            int rows = 1 << (2 * orders[s]);
            e[s] = new double[rows * 4];
            for (int r = 0; r < rows; r++) {
                System.arraycopy(RandomModels.distribution(rng, 4), 0, e[s], r * 4, 4);
            }
        }
        return labelOf == null ? model(names, RandomModels.distribution(rng, k), a, orders, e)
                : model(names, labelOf, RandomModels.distribution(rng, k), a, orders, e);
    }

    static byte[] sequence(SplittableRandom rng, int length) {
        byte[] s = new byte[length];
        for (int i = 0; i < length; i++) {
            s[i] = (byte) "ACGT".charAt(rng.nextInt(4));
        }
        return s;
    }
}
