package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The two-state worked example of Borodovsky &amp; Ekisheva, Problems and Solutions in Biological Sequence
 * Analysis (Cambridge University Press, 2006), p. 80: states H and L, start 0.5/0.5, H->H 0.5, H->L 0.5,
 * L->H 0.4, L->L 0.6; order-0 emissions A,C,G,T of H 0.2 0.3 0.3 0.2 and of L 0.3 0.2 0.2 0.3; x = GGCACTGAA.
 * The expected figures were recomputed from the published parameters (the attribution of the example to that
 * page is secondary).
 */
class PublishedWorkedExampleTest {
    static final int H = 0;
    static final int L = 1;
    static final byte[] X = "GGCACTGAA".getBytes(StandardCharsets.US_ASCII);

    static HmmParameters model() {
        return new HmmParameters(
                new double[]{0.5, 0.5},
                new int[]{H, H, L, L}, new int[]{H, L, H, L}, new double[]{0.5, 0.5, 0.4, 0.6},
                new int[]{0, 0},
                new double[][]{{0.2, 0.3, 0.3, 0.2}, {0.3, 0.2, 0.2, 0.3}});
    }

    @Test
    void likelihoodMatchesPublishedExample() {
        double logLik = new ForwardBackward(model()).logLikelihood(X);
        assertThat(Math.exp(logLik)).isCloseTo(3.79101603552e-6, within(1e-16));
    }

    @Test
    void posteriorOfHMatchesPublishedExample() {
        double[] expected = {.61064, .57013, .54826, .36683, .52785, .36476, .52591, .34738, .33976};
        double[] h = new double[X.length];
        new ForwardBackward(model(), 2).run(X, (t, gamma, e) -> h[t] = gamma[H]);
        for (int t = 0; t < X.length; t++) {
            assertThat(h[t]).as("position %d", t + 1).isCloseTo(expected[t], within(5e-6));
        }
    }

    /**
     * The published path HHHLLLLLL has probability 4.251528e-8. At positions 5 and 7 (1-based) the best partial
     * scores of H and L are exactly equal (6.075e-5 and 1.3122e-6, worked by hand). The traceback does not choose
     * between them there: it arrives through the back-pointers of L at the next position, so our tie rule (the
     * state listed first wins) leaves the published path intact.
     */
    @Test
    void viterbiMatchesPublishedExampleWithDocumentedTieBreaking() {
        ViterbiPath vp = new Viterbi(model()).decode(X);
        StringBuilder path = new StringBuilder();
        for (int s : vp.states()) {
            path.append(s == H ? 'H' : 'L');
        }
        assertThat(path.toString()).isEqualTo("HHHLLLLLL");
        assertThat(Math.exp(vp.logProbability())).isCloseTo(4.251528e-8, within(1e-14));
    }
}
