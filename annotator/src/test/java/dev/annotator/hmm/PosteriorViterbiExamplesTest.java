package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/**
 * Posterior-Viterbi on hand-built models where the answer can be reasoned out, each also confirmed by
 * enumeration. The objective is that of Fariselli, Martelli and Casadio (2005, BMC Bioinformatics
 * 6(Suppl 4):S12): the allowed path of largest plain posterior sum.
 */
class PosteriorViterbiExamplesTest {

    /**
     * Two well-separated compositions in long segments. When the Viterbi state has posterior above 1/2 at every
     * position it is the per-position maximum everywhere; no path can sum more than the per-position maxima, and
     * the Viterbi path is allowed, so by the definition (Fariselli et al. 2005) both decodings must coincide.
     */
    @Test
    void equalsViterbiWhenPosteriorsAreSharp() {
        HmmParameters p = new HmmParameters(new double[]{0.5, 0.5}, new int[]{0, 0, 1, 1}, new int[]{0, 1, 0, 1},
                new double[]{0.999, 0.001, 0.001, 0.999}, new int[]{0, 0},
                new double[][]{{0.499, 0.001, 0.001, 0.499}, {0.001, 0.499, 0.499, 0.001}});
        SplittableRandom rng = new SplittableRandom(7);
        StringBuilder sb = new StringBuilder();
        for (String alphabet : new String[]{"AT", "CG", "AT", "CG"}) {
            for (int i = 0; i < 300; i++) {
                sb.append(alphabet.charAt(rng.nextInt(2)));
            }
        }
        byte[] seq = sb.toString().getBytes();
        int[] viterbi = new Viterbi(p).decode(seq).states();
        double[] sharpest = {1.0};
        new ForwardBackward(p).run(seq, (t, gamma, e) -> sharpest[0] = Math.min(sharpest[0], gamma[viterbi[t]]));
        assertThat(sharpest[0]).as("precondition: Viterbi state's posterior everywhere").isGreaterThan(0.99);

        PosteriorPath got = new PosteriorViterbi(p).decode(seq);
        assertThat(got.states()).isEqualTo(viterbi);
        assertThat(got.posteriorSum()).isGreaterThan(0.99 * seq.length).isLessThanOrEqualTo(seq.length + 1e-9);
    }

    /**
     * Where the two disagree: state 0 is one path on its own, state 1 carries more mass but splits it over
     * successors 1 and 2. Uniform emissions, so on any three bases the joint probabilities are the chain's:
     * 0,0,0 = 0.4; 1,2,2 = 0.6 x 0.45 = 0.27; 1,1,2 = 0.6 x 0.55 x 0.45 = 0.1485; 1,1,1 = 0.1815 (hand arithmetic).
     * Posteriors: t0 {0.4, 0.6, 0}, t1 {0.4, 0.33, 0.27}, t2 {0.4, 0.1815, 0.4185}. Viterbi takes 0,0,0 (sum 1.2);
     * the largest posterior sum is 1,1,2 (0.6 + 0.33 + 0.4185 = 1.3485), a path that is not even the second most
     * probable. This is the known contrast between the two criteria (Fariselli et al. 2005).
     */
    @Test
    void differsFromViterbiWhenMassIsSpreadOverSeveralPaths() {
        HmmParameters p = new HmmParameters(new double[]{0.4, 0.6, 0.0}, new int[]{0, 1, 1, 2},
                new int[]{0, 1, 2, 2}, new double[]{1.0, 0.55, 0.45, 1.0}, new int[]{0, 0, 0},
                new double[][]{{0.25, 0.25, 0.25, 0.25}, {0.25, 0.25, 0.25, 0.25}, {0.25, 0.25, 0.25, 0.25}});
        byte[] seq = "ACG".getBytes();
        PosteriorPathEnumeration truth = new PosteriorPathEnumeration(p, seq);
        BruteForceEnumeration joint = new BruteForceEnumeration(p, seq);
        assertThat(joint.bestPath).containsExactly(0, 0, 0);
        assertThat(truth.bestPath).containsExactly(1, 1, 2);
        assertThat(truth.bestSum).isCloseTo(1.3485, within(1e-12));

        assertThat(new Viterbi(p).decode(seq).states()).containsExactly(0, 0, 0);
        PosteriorPath got = new PosteriorViterbi(p).decode(seq);
        assertThat(got.states()).containsExactly(1, 1, 2);
        assertThat(got.posteriorSum()).isCloseTo(1.3485, within(1e-12));
    }

    /**
     * A toy gene: noncoding N (0) emits any base; coding G (1) cannot emit T (a structural zero, as a stop codon
     * cannot occur inside a gene); G leaves only through a stop S (2, emits only T, then N) or an insertion X (3,
     * emits only T, then back to G). On CGCGTCA the state of largest posterior at each position on its own is
     * G,G,G,G,X,N,N: X then N is forbidden, so that labelling is no path of the model. Posterior-Viterbi must
     * return an allowed path, which at the T cannot be G; by enumeration the best is G,G,G,G,S,N,N, while Viterbi
     * keeps the gene going through the insertion.
     */
    @Test
    void structuralZeroKeepsThePathValidWherePerPositionMaximaAreNot() {
        double[] uniform = {0.25, 0.25, 0.25, 0.25};
        double[] coding = {0.2, 0.4, 0.4, 0.0};
        double[] onlyT = {0.0, 0.0, 0.0, 1.0};
        HmmParameters p = new HmmParameters(new double[]{0.5, 0.5, 0.0, 0.0},
                new int[]{0, 0, 1, 1, 1, 2, 3}, new int[]{0, 1, 1, 2, 3, 0, 1},
                new double[]{0.9, 0.1, 0.8, 0.1, 0.1, 1.0, 1.0}, new int[]{0, 0, 0, 0},
                new double[][]{uniform, coding, onlyT, onlyT});
        byte[] seq = "CGCGTCA".getBytes();
        int at = 4;
        PosteriorPathEnumeration truth = new PosteriorPathEnumeration(p, seq);
        int[] perPosition = truth.perPositionMaximum();
        assertThat(perPosition).containsExactly(1, 1, 1, 1, 3, 0, 0);
        assertThat(PosteriorPathEnumeration.isValid(p, truth.posterior, perPosition)).isFalse();
        assertThat(truth.posterior[at][1]).isZero();

        double[] gAtT = {-1};
        new ForwardBackward(p).run(seq, (t, gamma, e) -> {
            if (t == at) {
                gAtT[0] = gamma[1];
            }
        });
        assertThat(gAtT[0]).as("kernel posterior of G at the T").isZero();

        PosteriorPath got = new PosteriorViterbi(p).decode(seq);
        assertThat(got.states()).containsExactly(truth.bestPath).containsExactly(1, 1, 1, 1, 2, 0, 0);
        assertThat(got.states()[at]).isNotEqualTo(1);
        assertThat(got.posteriorSum()).isCloseTo(truth.bestSum, within(1e-12));
        assertThat(new Viterbi(p).decode(seq).states()).containsExactly(1, 1, 1, 1, 3, 1, 1);
    }

    /**
     * A state that cannot emit the base is not a shortcut. a (0) spreads its mass over five states y (4-8); five
     * states w (9-13) gather d's (1) mass into b (2); the only link from a to b is z (3), which cannot emit T. On
     * ATA, a and d together hold all the posterior at the first base and b most of it at the last, so a,z,b would
     * sum more than any allowed path while z's posterior at the T is 0: the path a,z,b has probability zero, and by
     * the definition (Fariselli et al. 2005) it is excluded.
     */
    @Test
    void zeroEmissionStateIsNeverABridge() {
        int k = 14;
        double[] start = new double[k];
        start[0] = 0.65;
        start[1] = 0.35;
        java.util.List<double[]> arcs = new java.util.ArrayList<>();
        arcs.add(new double[]{0, 3, 0.2});
        arcs.add(new double[]{3, 2, 1.0});
        arcs.add(new double[]{2, 2, 1.0});
        for (int i = 0; i < 5; i++) {
            arcs.add(new double[]{0, 4 + i, 0.2});
            arcs.add(new double[]{4 + i, 4 + i, 1.0});
            arcs.add(new double[]{1, 9 + i, 0.2});
            arcs.add(new double[]{9 + i, 2, 1.0});
        }
        int[] from = new int[arcs.size()];
        int[] to = new int[arcs.size()];
        double[] prob = new double[arcs.size()];
        for (int q = 0; q < arcs.size(); q++) {
            from[q] = (int) arcs.get(q)[0];
            to[q] = (int) arcs.get(q)[1];
            prob[q] = arcs.get(q)[2];
        }
        double[][] tables = new double[k][];
        for (int s = 0; s < k; s++) {
            tables[s] = s == 3 ? new double[]{1 / 3.0, 1 / 3.0, 1 / 3.0, 0.0} : new double[]{0.25, 0.25, 0.25, 0.25};
        }
        HmmParameters p = new HmmParameters(start, from, to, prob, new int[k], tables);
        byte[] seq = "ATA".getBytes();
        PosteriorPathEnumeration truth = new PosteriorPathEnumeration(p, seq);
        int[] bridge = {0, 3, 2};
        assertThat(truth.posterior[1][3]).isZero();
        assertThat(PosteriorPathEnumeration.isValid(p, truth.posterior, bridge)).isFalse();
        assertThat(PosteriorPathEnumeration.sum(truth.posterior, bridge)).as("the tempting bridge")
                .isGreaterThan(truth.bestSum + 0.05);

        for (PosteriorPath got : new PosteriorPath[]{new PosteriorViterbi(p).decode(seq),
                new PosteriorViterbi(p).decode(truth.flatPosterior())}) {
            assertThat(got.states()).containsExactly(truth.bestPath);
            assertThat(got.states()[1]).isNotEqualTo(3);
            assertThat(got.posteriorSum()).isCloseTo(truth.bestSum, within(1e-12));
        }
    }

    @Test
    void emptySequenceGivesEmptyPath() {
        HmmParameters p = new HmmParameters(new double[]{1.0}, new int[]{0}, new int[]{0}, new double[]{1.0},
                new int[]{0}, new double[][]{{0.25, 0.25, 0.25, 0.25}});
        PosteriorPath got = new PosteriorViterbi(p).decode(new byte[0]);
        assertThat(got.path()).isEmpty();
        assertThat(got.posteriorSum()).isZero();
    }

    @Test
    void sequenceNoPathCanEmitIsRejected() {
        HmmParameters p = new HmmParameters(new double[]{1.0}, new int[]{0}, new int[]{0}, new double[]{1.0},
                new int[]{0}, new double[][]{{0.5, 0.5, 0.0, 0.0}});
        assertThatThrownBy(() -> new PosteriorViterbi(p).decode("ACGA".getBytes()))
                .isInstanceOf(ImpossibleSequenceException.class);
        // from posteriors alone: position 1 has no state of positive posterior
        assertThatThrownBy(() -> new PosteriorViterbi(p).decode(new double[]{1.0, 0.0, 1.0}))
                .isInstanceOf(ImpossibleSequenceException.class)
                .extracting(e -> ((ImpossibleSequenceException) e).position()).isEqualTo(1);
    }

    @Test
    void limitsAreStatedNotHit() {
        int k = PosteriorViterbi.MAX_STATES + 1;
        double[] start = new double[k];
        start[0] = 1.0;
        int[] self = new int[k];
        double[] one = new double[k];
        int[] orders = new int[k];
        double[][] tables = new double[k][];
        for (int s = 0; s < k; s++) {
            self[s] = s;
            one[s] = 1.0;
            tables[s] = new double[]{0.25, 0.25, 0.25, 0.25};
        }
        HmmParameters tooMany = new HmmParameters(start, self, self, one, orders, tables);
        assertThatThrownBy(() -> new PosteriorViterbi(tooMany)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("at most 256 states");
        assertThatThrownBy(() -> PosteriorViterbi.checkBackPointersFit(1L << 30, 4))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("exceed one Java array");
        PosteriorViterbi.checkBackPointersFit(1L << 20, 256);
    }
}
