package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/**
 * Posterior-Viterbi's max-sum visits states grouped by how many allowed successors they have (one: no comparison
 * and no back-pointer; two; more). Checked on models that mix all of these, and states whose only outgoing
 * transitions have probability 0, against the plain scan of every successor in state order
 * ({@link ScanAllSuccessorsMaxSum}, bit for bit) and against enumeration of every path (the optimum as Fariselli,
 * Martelli and Casadio 2005, BMC Bioinformatics 6(Suppl 4):S12, define it).
 */
class PosteriorViterbiSuccessorGroupsTest {

    @Test
    void groupedPassEqualsThePlainScanBitForBit() {
        SplittableRandom rng = new SplittableRandom(20261202L);
        int decoded = 0;
        int impossible = 0;
        for (int trial = 0; trial < 300; trial++) {
            int states = 2 + rng.nextInt(24);
            boolean withDeadEnds = trial % 3 == 2;
            HmmParameters p = mixedFanModel(rng, states, rng.nextInt(3), withDeadEnds, 0.15);
            int length = 1 + rng.nextInt(3000);
            byte[] seq = withDeadEnds ? RandomModels.sequence(rng, length, 0.05)
                    : StructuralZeroModels.sampledSequence(p, rng, length, 0.05);
            int block = 1 + rng.nextInt(700);
            String where = "trial " + trial + ", " + states + " states, length " + length + ", block " + block;
            PosteriorViterbi kernel = new PosteriorViterbi(p, block);
            double[] posterior = new double[length * states];
            double[] emission = new double[length * states];
            try {
                new ForwardBackward(p, block).run(seq, (start, end, post, em) -> {
                    System.arraycopy(post, 0, posterior, start * states, (end - start) * states);
                    System.arraycopy(em, 0, emission, start * states, (end - start) * states);
                });
            } catch (ImpossibleSequenceException e) {
                assertThatThrownBy(() -> kernel.decode(seq)).as(where).isInstanceOf(ImpossibleSequenceException.class);
                impossible++;
                continue;
            }
            PosteriorPath want;
            try {
                want = ScanAllSuccessorsMaxSum.decode(p, posterior, emission, PosteriorViterbi.TIE_TOLERANCE);
            } catch (ImpossibleSequenceException e) {
                // valid under forward-backward, yet no path passes the positivity rule: only from dead ends
                assertThatThrownBy(() -> kernel.decode(seq)).as(where)
                        .isInstanceOfSatisfying(ImpossibleSequenceException.class,
                                got -> assertThat(got.position()).isEqualTo(e.position()));
                impossible++;
                continue;
            }
            PosteriorPath got = kernel.decode(seq);
            assertThat(got.path()).as(where).isEqualTo(want.path());
            assertThat(Double.doubleToRawLongBits(got.posteriorSum())).as(where + " sum")
                    .isEqualTo(Double.doubleToRawLongBits(want.posteriorSum()));
            decoded++;
        }
        // the comparison must actually run on most trials
        assertThat(decoded).isGreaterThan(200);
        assertThat(impossible).isLessThan(100);
    }

    /**
     * Posteriors on a coarse grid with zeros make exact ties common, and offsets below the tolerance make near
     * ties: the tie rule (within the tolerance, the lower-numbered successor) must pick what the plain scan picks.
     */
    @Test
    void tiesAndNearTiesResolveAsThePlainScan() {
        SplittableRandom rng = new SplittableRandom(7L);
        int compared = 0;
        for (int trial = 0; trial < 400; trial++) {
            int states = 2 + rng.nextInt(12);
            HmmParameters p = mixedFanModel(rng, states, 0, trial % 4 == 3, 0);
            int length = 1 + rng.nextInt(200);
            double[] posterior = new double[length * states];
            for (int i = 0; i < posterior.length; i++) {
                int step = rng.nextInt(12) == 0 ? 0 : 1 + rng.nextInt(4);
                double nudge = rng.nextInt(3) == 0 ? rng.nextDouble() * 2e-12 : 0;
                posterior[i] = step == 0 ? 0 : step * 0.25 + nudge;
            }
            PosteriorViterbi kernel = new PosteriorViterbi(p);
            PosteriorPath want;
            try {
                want = ScanAllSuccessorsMaxSum.decode(p, posterior, posterior, PosteriorViterbi.TIE_TOLERANCE);
            } catch (ImpossibleSequenceException e) {
                assertThatThrownBy(() -> kernel.decode(posterior))
                        .isInstanceOfSatisfying(ImpossibleSequenceException.class,
                                got -> assertThat(got.position()).isEqualTo(e.position()));
                continue;
            }
            PosteriorPath got = kernel.decode(posterior);
            assertThat(got.path()).as("trial %d", trial).isEqualTo(want.path());
            assertThat(Double.doubleToRawLongBits(got.posteriorSum())).as("trial %d sum", trial)
                    .isEqualTo(Double.doubleToRawLongBits(want.posteriorSum()));
            compared++;
        }
        assertThat(compared).isGreaterThan(200);
    }

    @Test
    void mixedFanModelsReachTheEnumeratedOptimum() {
        SplittableRandom rng = new SplittableRandom(11L);
        int possible = 0;
        for (int trial = 0; trial < 300; trial++) {
            int states = 2 + rng.nextInt(3);
            HmmParameters p = mixedFanModel(rng, states, 2, false, 0.25);
            int length = 1 + rng.nextInt(7);
            byte[] seq = StructuralZeroModels.sampledSequence(p, rng, length, 0.1);
            String where = "trial " + trial + " seq " + new String(seq);
            PosteriorPathEnumeration truth = new PosteriorPathEnumeration(p, seq);
            PosteriorPath got = new PosteriorViterbi(p, 1 + rng.nextInt(3)).decode(seq);
            // Fariselli et al. 2005: an allowed path, and among allowed paths the largest plain sum of posteriors
            assertThat(PosteriorPathEnumeration.isValid(p, truth.posterior, got.states())).as(where).isTrue();
            assertThat(PosteriorPathEnumeration.sum(truth.posterior, got.states())).as(where)
                    .isCloseTo(truth.bestSum, within(1e-9));
            assertThat(got.posteriorSum()).as(where).isCloseTo(truth.bestSum, within(1e-9));
            possible++;
        }
        assertThat(possible).isEqualTo(300);
    }

    @Test
    void backPointersAreKeptOnlyForStatesWithSeveralSuccessors() {
        // 0 -> {0, 1}; 1 -> {2}; 2 -> {0, 1, 2}; 3 -> {3} plus a listed transition of probability 0 to 0
        List<int[]> pairs = List.of(new int[]{0, 0}, new int[]{0, 1}, new int[]{1, 2}, new int[]{2, 0},
                new int[]{2, 1}, new int[]{2, 2}, new int[]{3, 3}, new int[]{3, 0});
        List<Double> probs = List.of(0.5, 0.5, 1.0, 0.2, 0.3, 0.5, 1.0, 0.0);
        HmmParameters p = RandomModels.assemble(new SplittableRandom(1), new double[]{0.25, 0.25, 0.25, 0.25},
                pairs, probs, 0, () -> new double[]{0.25, 0.25, 0.25, 0.25});
        assertThat(new PosteriorViterbi(p).backPointerBytesPerBase()).isEqualTo(2);
    }

    /**
     * States with one successor (chains), two, or three to six, at random; with {@code deadEnds} some states list
     * only transitions of probability 0. Emission rows have zeros at {@code zeroRate}.
     */
    static HmmParameters mixedFanModel(SplittableRandom rng, int states, int maxOrder, boolean deadEnds,
                                       double zeroRate) {
        double[] start = StructuralZeroModels.sparseDistribution(rng, states, 0.3);
        List<int[]> pairs = new ArrayList<>();
        List<Double> probs = new ArrayList<>();
        for (int i = 0; i < states; i++) {
            double kind = rng.nextDouble();
            int fan = kind < 0.5 ? 1 : kind < 0.75 ? 2 : 3 + rng.nextInt(4);
            fan = Math.min(fan, states);
            boolean dead = deadEnds && rng.nextDouble() < 0.15;
            // distinct successors, any of them possibly the state itself
            List<Integer> pool = new ArrayList<>();
            for (int j = 0; j < states; j++) {
                pool.add(j);
            }
            double[] row = RandomModels.distribution(rng, fan);
            for (int f = 0; f < fan; f++) {
                int j = pool.remove(rng.nextInt(pool.size()));
                pairs.add(new int[]{i, j});
                probs.add(dead ? 0.0 : row[f]);
            }
        }
        return RandomModels.assemble(rng, start, pairs, probs, maxOrder,
                () -> StructuralZeroModels.sparseDistribution(rng, 4, zeroRate));
    }
}
