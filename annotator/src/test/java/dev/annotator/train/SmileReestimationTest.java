package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Transition;
import org.junit.jupiter.api.Test;
import smile.math.matrix.Matrix;
import smile.sequence.HMM;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Expected counts against an independent general-purpose implementation: Smile 2.6.0, smile.sequence.HMM
 * (LGPL-3.0, Maven Central, test scope). {@code HMM.update(observations, 1)} performs one Baum-Welch
 * re-estimation (read from its bytecode: Rabiner-scaled xi and gamma; a_ij = sum xi / sum over t < n-1 of gamma,
 * b_j(k) = sum of gamma where x_t = k / sum of gamma, pi = gamma at t = 0 averaged over sequences), which are
 * ratios of the expected counts; {@code HMM.fit(observations, labels)} counts along known state paths (the
 * closed-form maximum-likelihood estimate). Smile handles order-0 emissions over dense transitions only.
 */
class SmileReestimationTest {

    @Test
    void oneBaumWelchStepEqualsSmilesUpdate() {
        SplittableRandom rng = new SplittableRandom(21);
        for (int trial = 0; trial < 25; trial++) {
            int k = 2 + rng.nextInt(4);
            HmmModel model = TestModels.random(rng, k, 0, true);
            int records = 1 + rng.nextInt(3);
            List<CountItem> items = new ArrayList<>();
            int[][] obs = new int[records][];
            for (int r = 0; r < records; r++) {
                byte[] seq = TestModels.sequence(rng, 200 + rng.nextInt(3000));
                items.add(new CountItem("r" + r, seq, null));
                obs[r] = codes(seq);
            }
            HMM smile = toSmile(model);
            smile.update(obs, 1);
            HmmModel ours;
            try (ExpectationRunner runner = new ExpectationRunner(1 + trial % 2)) {
                ModelCounts counts = new InMemoryData(items, runner).count(model);
                ours = Reestimation.mStep(model, counts, 0, Freeze.NONE);
            }
            // pi is the mean of gamma_0 over sequences in both: the start counts normalised
            assertSame(ours, smile, "trial " + trial);
        }
    }

    @Test
    void countingEqualsSmilesSupervisedFit() {
        SplittableRandom rng = new SplittableRandom(8);
        for (int trial = 0; trial < 20; trial++) {
            int k = 2 + rng.nextInt(3);
            HmmModel model = TestModels.random(rng, k, 0, true);
            int records = 2 + rng.nextInt(4);
            List<CountItem> items = new ArrayList<>();
            int[][] obs = new int[records][];
            int[][] paths = new int[records][];
            for (int r = 0; r < records; r++) {
                int n = 300 + rng.nextInt(2000);
                byte[] seq = TestModels.sequence(rng, n);
                int[] path = new int[n];
                byte[] labels = new byte[n];
                // runs of random states; every state gets some bases and every pair follows each other somewhere
                int s = rng.nextInt(k);
                for (int t = 0; t < n; t++) {
                    if (rng.nextDouble() < 0.1) {
                        s = rng.nextInt(k);
                    }
                    path[t] = s;
                    labels[t] = (byte) s; // one label per state, in state order
                }
                items.add(new CountItem("r" + r, seq, labels));
                obs[r] = codes(seq);
                paths[r] = path;
            }
            HMM smile = HMM.fit(obs, paths);
            TrainingOptions counting = new TrainingOptions(TrainingMethod.COUNTING, 0, 0, 0, 0, 1, Freeze.NONE);
            HmmModel ours;
            try (ExpectationRunner runner = new ExpectationRunner(1)) {
                ours = new Trainer(counting, (run, runs, it, ll, g, b, sec) -> { })
                        .train(model, new InMemoryData(items, runner)).model();
            }
            assertSame(ours, smile, "trial " + trial);
        }
    }

    private static void assertSame(HmmModel ours, HMM smile, String what) {
        int k = ours.stateCount();
        double[] pi = smile.getInitialStateProbabilities();
        Matrix a = smile.getStateTransitionProbabilities();
        Matrix b = smile.getSymbolEmissionProbabilities();
        for (int i = 0; i < k; i++) {
            assertThat(ours.start()[i]).as(what + " start " + i).isCloseTo(pi[i], within(1e-9));
            for (int base = 0; base < 4; base++) {
                assertThat(ours.states().get(i).emission(0, base)).as(what + " emission " + i + "/" + base)
                        .isCloseTo(b.get(i, base), within(1e-9));
            }
        }
        for (Transition t : ours.transitions()) {
            int i = ours.stateIndex(t.from());
            int j = ours.stateIndex(t.to());
            assertThat(t.probability()).as(what + " transition " + i + "->" + j).isCloseTo(a.get(i, j), within(1e-9));
        }
    }

    private static int[] codes(byte[] seq) {
        int[] out = new int[seq.length];
        for (int t = 0; t < seq.length; t++) {
            out[t] = "ACGT".indexOf(seq[t]);
        }
        return out;
    }

    private static HMM toSmile(HmmModel m) {
        int k = m.stateCount();
        double[][] a = new double[k][k];
        double[][] b = new double[k][4];
        for (Transition t : m.transitions()) {
            a[m.stateIndex(t.from())][m.stateIndex(t.to())] = t.probability();
        }
        for (int i = 0; i < k; i++) {
            for (int base = 0; base < 4; base++) {
                b[i][base] = m.states().get(i).emission(0, base);
            }
        }
        return new HMM(m.start(), new Matrix(a), new Matrix(b));
    }
}
