package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ShippedModels;
import dev.annotator.pipeline.SimulationRun;
import dev.annotator.simulate.SimulatedRecord;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Baum-Welch is an expectation-maximisation algorithm, so no iteration may lower the log-likelihood (Dempster,
 * Laird &amp; Rubin 1977, recalled from memory); with pseudocounts it is the penalised log-likelihood, the
 * log-likelihood plus the log density of the Dirichlet prior the pseudocounts stand for, that never decreases.
 * Checked on random models (orders 0-2, sparse transitions, missing bases, with and without labels) and on
 * real-sized data (2 Mbp simulated from the shipped model, started from a perturbed copy). Rounding allows a
 * relative slack of 1e-12.
 *
 * <p>The random sequences carry 10% missing bases and run 80 iterations: then many bases are emitted under
 * reduced-order contexts, and an E-step that counted only bases with a full context (not an exact EM step) was
 * seen to lower the likelihood here, so the check does tell the two rules apart.
 */
class LikelihoodNeverDecreasesTest {

    @Test
    void onRandomModels() {
        SplittableRandom rng = new SplittableRandom(17);
        for (int trial = 0; trial < 40; trial++) {
            int k = 2 + rng.nextInt(3);
            boolean labelled = rng.nextBoolean();
            // with labels: two labels of several states each (semi-supervised), dense so every labelling is possible
            int[] labelOf = new int[k];
            for (int s = 0; s < k; s++) {
                labelOf[s] = s < (k + 1) / 2 ? 0 : 1;
            }
            HmmModel model = labelled ? TestModels.random(rng, k, 2, true, labelOf)
                    : TestModels.random(rng, k, 2, rng.nextBoolean());
            double pseudocount = trial % 3 == 0 ? 0 : rng.nextDouble() * 2;
            Freeze freeze = Freeze.values()[rng.nextInt(3)];
            List<CountItem> items = new ArrayList<>();
            for (int r = 0; r < 1 + rng.nextInt(3); r++) {
                int n = 50 + rng.nextInt(3000);
                byte[] seq = TestModels.sequence(rng, n);
                for (int t = 0; t < n; t++) {
                    if (rng.nextDouble() < 0.1) {
                        seq[t] = 'N';
                    }
                }
                byte[] labels = null;
                if (labelled) {
                    labels = new byte[n];
                    byte label = 1;
                    for (int t = 0; t < n; t++) {
                        if (rng.nextDouble() < 0.01) {
                            label = (byte) (1 - label);
                        }
                        labels[t] = label;
                    }
                }
                items.add(new CountItem("r" + r, seq, labels));
            }
            assertNeverDecreases(model, items, pseudocount, freeze, 80, "trial " + trial);
        }
    }

    @Test
    void onRealSizedData() {
        HmmModel truth = ShippedModels.load("cpg-island").orElseThrow();
        List<CountItem> items = new ArrayList<>();
        for (SimulatedRecord r : new SimulationRun(truth).sample(List.of("a", "b"), new int[] {1_200_000, 800_000},
                31)) {
            items.add(new CountItem(r.record().name(), r.record().bases(), null));
        }
        HmmModel start = Perturbation.perturb(truth, new SplittableRandom(4), Freeze.NONE);
        assertNeverDecreases(start, items, 1.0, Freeze.NONE, 15, "2 Mbp");
    }

    private static void assertNeverDecreases(HmmModel model, List<CountItem> items, double pseudocount, Freeze freeze,
                                             int iterations, String what) {
        try (ExpectationRunner runner = new ExpectationRunner(2)) {
            InMemoryData data = new InMemoryData(items, runner);
            ModelCounts counts = data.count(model);
            double objective = counts.logLikelihood() + Reestimation.logPrior(model, pseudocount, freeze);
            for (int i = 1; i <= iterations; i++) {
                model = Reestimation.mStep(model, counts, pseudocount, freeze);
                counts = data.count(model);
                double next = counts.logLikelihood() + Reestimation.logPrior(model, pseudocount, freeze);
                assertThat(next).as("%s, iteration %d (pseudocount %s, freeze %s)", what, i, pseudocount, freeze)
                        .isGreaterThanOrEqualTo(objective - 1e-12 * Math.abs(objective));
                objective = next;
            }
        }
    }
}
