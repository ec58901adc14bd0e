package dev.annotator.train;

import dev.annotator.model.HmmModel;
import dev.annotator.model.State;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * One Baum-Welch step on the two-state worked example of Borodovsky &amp; Ekisheva, Problems and Solutions in
 * Biological Sequence Analysis (Cambridge University Press, 2006), p. 80: states H and L, start 0.5/0.5,
 * H->H 0.5, H->L 0.5, L->H 0.4, L->L 0.6; emissions A,C,G,T of H 0.2 0.3 0.3 0.2 and of L 0.3 0.2 0.2 0.3;
 * x = GGCACTGAA. The expected figures are those given in the issue "Train models", recomputed there from the
 * published parameters with no pseudocounts; each is met to the digits given (half a unit of the last digit).
 */
class PublishedBaumWelchStepTest {
    static HmmModel example() {
        return TestModels.model(new String[] {"H", "L"}, new double[] {0.5, 0.5},
                new double[][] {{0.5, 0.5}, {0.4, 0.6}}, new int[] {0, 0},
                new double[][] {{0.2, 0.3, 0.3, 0.2}, {0.3, 0.2, 0.2, 0.3}});
    }

    static final byte[] X = "GGCACTGAA".getBytes(StandardCharsets.US_ASCII);

    @Test
    void oneStepMeetsThePublishedFigures() {
        TrainingOptions once = new TrainingOptions(TrainingMethod.BAUM_WELCH, 0, 1, 0, 0, 1, Freeze.NONE);
        TrainingResult r;
        try (ExpectationRunner runner = new ExpectationRunner(1)) {
            r = new Trainer(once, (run, runs, it, ll, gain, bases, s) -> { })
                    .train(example(), new InMemoryData(List.of(new CountItem("x", X, null)), runner));
        }
        HmmModel m = r.model();
        assertThat(r.iterations()).isEqualTo(1);
        assertThat(r.startLogLikelihood()).isCloseTo(-12.482876, within(5e-7));
        assertThat(r.logLikelihood()).isCloseTo(-11.729799, within(5e-7));

        assertThat(m.start()[0]).isCloseTo(0.61064, within(5e-6));
        assertThat(m.start()[1]).isCloseTo(0.38936, within(5e-6));

        assertThat(transition(m, "H", "H")).isCloseTo(0.498582, within(5e-7));
        assertThat(transition(m, "H", "L")).isCloseTo(0.501418, within(5e-7));
        assertThat(transition(m, "L", "H")).isCloseTo(0.402457, within(5e-7));
        assertThat(transition(m, "L", "L")).isCloseTo(0.597543, within(5e-7));

        double[] h = {0.250853, 0.256124, 0.406206, 0.086817};
        double[] l = {0.405552, 0.192539, 0.269527, 0.132383};
        State stH = m.states().get(0);
        State stL = m.states().get(1);
        for (int b = 0; b < 4; b++) {
            assertThat(stH.emission(0, b)).as("H emits %s", "ACGT".charAt(b)).isCloseTo(h[b], within(5e-7));
            assertThat(stL.emission(0, b)).as("L emits %s", "ACGT".charAt(b)).isCloseTo(l[b], within(5e-7));
        }
    }

    static double transition(HmmModel m, String from, String to) {
        return m.transitions().stream().filter(t -> t.from().equals(from) && t.to().equals(to)).findFirst()
                .orElseThrow().probability();
    }
}
