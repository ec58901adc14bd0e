package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.State;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.List;

import static dev.annotator.train.PublishedBaumWelchStepTest.transition;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Counting against the closed-form maximum-likelihood estimate when the state path is known (Durbin, Eddy, Krogh
 * &amp; Mitchison, Biological Sequence Analysis, 1998, section 3.3, "estimation when the state sequence is
 * known", recalled from memory): a_kl = A_kl / sum over l' of A_kl', e_k(b) = E_k(b) / sum over b' of E_k(b'),
 * with A and E the numbers of uses of each transition and emission along the path. With a pseudocount of 1 every
 * count is raised by one first (Laplace's rule, common practice). The counts below were made by hand.
 *
 * <p>Model (invented): "rich" of order 1 and "plain" of order 0, one label each. The record starts in the
 * order-0 state, so every base of the order-1 state has its full context and the closed form applies exactly.
 */
class CountingByHandTest {
    static HmmModel model() {
        return TestModels.model(new String[] {"rich", "plain"}, new double[] {0.3, 0.7},
                new double[][] {{0.9, 0.1}, {0.2, 0.8}}, new int[] {1, 0},
                new double[][] {
                        {0.1, 0.4, 0.4, 0.1, 0.1, 0.3, 0.5, 0.1, 0.2, 0.3, 0.3, 0.2, 0.1, 0.4, 0.4, 0.1},
                        {0.3, 0.2, 0.2, 0.3}});
    }

    //                       position  1 2 3 4 5 6 7 8
    static final byte[] X = "ATCGCGTA".getBytes(StandardCharsets.US_ASCII);
    //                       label     p p r r r r p p   (rich = label 0, plain = label 1)
    static final byte[] PATH = {1, 1, 0, 0, 0, 0, 1, 1};

    // by hand: start plain 1. Transitions plain->plain 2 (1-2, 7-8), plain->rich 1 (2-3), rich->rich 3 (3-4, 4-5,
    // 5-6), rich->plain 1 (6-7). plain emits A twice (1, 8), T twice (2, 7). rich emits C after T (3), G after C
    // (4, 6), C after G (5); nothing after A.

    @Test
    void maximumLikelihoodWithoutPseudocounts() {
        HmmModel m = count(0);
        assertThat(m.start()).containsExactly(0.0, 1.0);
        assertThat(transition(m, "plain", "plain")).isCloseTo(2.0 / 3, within(1e-15));
        assertThat(transition(m, "plain", "rich")).isCloseTo(1.0 / 3, within(1e-15));
        assertThat(transition(m, "rich", "rich")).isCloseTo(3.0 / 4, within(1e-15));
        assertThat(transition(m, "rich", "plain")).isCloseTo(1.0 / 4, within(1e-15));
        assertThat(m.states().get(1).emissions()).containsExactly(0.5, 0.0, 0.0, 0.5);
        State rich = m.states().get(0);
        assertThat(row(rich, 3)).as("after T").containsExactly(0.0, 1.0, 0.0, 0.0);
        assertThat(row(rich, 1)).as("after C").containsExactly(0.0, 0.0, 1.0, 0.0);
        assertThat(row(rich, 2)).as("after G").containsExactly(0.0, 1.0, 0.0, 0.0);
        // a context never seen keeps its row: there is nothing to estimate it from
        assertThat(row(rich, 0)).as("after A").containsExactly(0.1, 0.4, 0.4, 0.1);
    }

    @Test
    void laplaceEstimateWithPseudocountOne() {
        HmmModel m = count(1);
        assertThat(m.start()[0]).isCloseTo(1.0 / 3, within(1e-15));
        assertThat(m.start()[1]).isCloseTo(2.0 / 3, within(1e-15));
        assertThat(transition(m, "plain", "plain")).isCloseTo(3.0 / 5, within(1e-15));
        assertThat(transition(m, "plain", "rich")).isCloseTo(2.0 / 5, within(1e-15));
        assertThat(transition(m, "rich", "rich")).isCloseTo(4.0 / 6, within(1e-15));
        assertThat(transition(m, "rich", "plain")).isCloseTo(2.0 / 6, within(1e-15));
        double[] plain = m.states().get(1).emissions();
        double[] expected = {3.0 / 8, 1.0 / 8, 1.0 / 8, 3.0 / 8};
        for (int b = 0; b < 4; b++) {
            assertThat(plain[b]).isCloseTo(expected[b], within(1e-15));
        }
        State rich = m.states().get(0);
        assertRow(row(rich, 3), 1.0 / 5, 2.0 / 5, 1.0 / 5, 1.0 / 5);
        assertRow(row(rich, 1), 1.0 / 6, 1.0 / 6, 3.0 / 6, 1.0 / 6);
        assertRow(row(rich, 2), 1.0 / 5, 2.0 / 5, 1.0 / 5, 1.0 / 5);
        assertRow(row(rich, 0), 0.25, 0.25, 0.25, 0.25);
    }

    /**
     * A record that starts in the order-1 state: its first base has no context and is emitted from the averaged
     * table, so its count is shared among the four contexts in proportion to their probability of the base under
     * the start model (the documented rule): C has probability .4, .3, .3, .4 after A, C, G, T (sum 1.4).
     */
    @Test
    void aBaseWithoutFullContextIsSharedAmongTheContextsItMayHaveFollowed() {
        byte[] x = "CG".getBytes(StandardCharsets.US_ASCII);
        TrainingOptions counting = new TrainingOptions(TrainingMethod.COUNTING, 0, 0, 0, 0, 1, Freeze.NONE);
        HmmModel m;
        try (ExpectationRunner runner = new ExpectationRunner(1)) {
            m = new Trainer(counting, (r, rs, i, ll, g, b, s) -> { }).train(model(),
                    new InMemoryData(List.of(new CountItem("x", x, new byte[] {0, 0})), runner)).model();
        }
        State rich = m.states().get(0);
        // after A: C 0.4/1.4 only; after C: C 0.3/1.4 and G 1 (base 2); after G, T: C only
        assertThat(row(rich, 0)).containsExactly(0.0, 1.0, 0.0, 0.0);
        assertRow(row(rich, 1), 0, 0.3 / 1.7, 1.4 / 1.7, 0);
        assertThat(row(rich, 2)).containsExactly(0.0, 1.0, 0.0, 0.0);
        assertThat(row(rich, 3)).containsExactly(0.0, 1.0, 0.0, 0.0);
    }

    private static HmmModel count(double pseudocount) {
        TrainingOptions counting = new TrainingOptions(TrainingMethod.COUNTING, pseudocount, 0, 0, 0, 1, Freeze.NONE);
        try (ExpectationRunner runner = new ExpectationRunner(1)) {
            return new Trainer(counting, (r, rs, i, ll, g, b, s) -> { }).train(model(),
                    new InMemoryData(List.of(new CountItem("x", X, PATH)), runner)).model();
        }
    }

    private static double[] row(State s, int context) {
        return java.util.Arrays.copyOfRange(s.emissions(), context * 4, context * 4 + 4);
    }

    private static void assertRow(double[] got, double... expected) {
        for (int b = 0; b < 4; b++) {
            assertThat(got[b]).as("column %d", b).isCloseTo(expected[b], within(1e-15));
        }
    }
}
