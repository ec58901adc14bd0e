package dev.annotator.simulate;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Checks sampled records against what the model implies, not against earlier output of the simulator.
 *
 * <p>Tolerances are Z binomial (or run-length) standard errors with Z = 4.5: with a fixed seed the tests are
 * deterministic, and a correct sampler would fail a single such check with probability about 7e-6 for a fresh
 * seed (two-sided normal tail), so roughly 1e-4 over all checks here.
 */
class SequenceSimulatorTest {
    private static final double Z = 4.5;
    private static final String ACGT = "ACGT";

    private static final Label BACKGROUND = new Label("background", "region", "SO:0000001", true, false);
    // SO accession recalled from memory; not used by the simulator
    private static final Label ISLAND = new Label("island", "CpG_island", "SO:0000307", false, true);

    private static final double A_BB = 0.99;
    private static final double A_II = 0.9;
    private static final double[] BG_EMISSION = {0.30, 0.20, 0.20, 0.30};
    // order 1, rows by preceding base A, C, G, T
    private static final double[] ISLAND_EMISSION = {
            0.20, 0.30, 0.35, 0.15,
            0.15, 0.35, 0.30, 0.20,
            0.15, 0.35, 0.35, 0.15,
            0.10, 0.35, 0.40, 0.15};

    private static HmmModel twoStateModel() {
        return new HmmModel("two-state", "test", new Provenance("invented for tests", List.of()),
                List.of(BACKGROUND, ISLAND),
                List.of(new State("bg", "background", 0, BG_EMISSION), new State("isl", "island", 1, ISLAND_EMISSION)),
                new double[]{0.5, 0.5},
                List.of(new Transition("bg", "bg", A_BB), new Transition("bg", "isl", 1 - A_BB),
                        new Transition("isl", "isl", A_II), new Transition("isl", "bg", 1 - A_II)));
    }

    private static List<SimulatedRecord> sampleMany(HmmModel model, int records, int length, long seed) {
        SequenceSimulator sim = new SequenceSimulator(model);
        SplittableRandom rng = new SplittableRandom(seed);
        List<SimulatedRecord> out = new ArrayList<>();
        for (int r = 0; r < records; r++) {
            out.add(sim.sample("sim" + r, length, rng));
        }
        return out;
    }

    @Test
    void meanRunLengthsMatchTheGeometricExpectation() {
        // A state with self-transition a is left after a geometric number of steps: P(L = l) = a^(l-1) (1 - a),
        // mean 1/(1-a), variance a/(1-a)^2 (geometric distribution; as in Durbin et al. 1998, "Biological
        // Sequence Analysis", ch. 3 - recalled from memory). Runs that touch a record end are cut short, so only
        // runs with both ends inside the record are counted. With a = 0.9 (mean 10, sd 9.5) and ~180k runs the
        // tolerance is about 0.1 base, so a run one base too long or short is far outside it.
        List<SimulatedRecord> sims = sampleMany(twoStateModel(), 10, 2_000_000, 42);
        double islandSum = 0;
        long islandCount = 0;
        double gapSum = 0;
        long gapCount = 0;
        for (SimulatedRecord sim : sims) {
            List<PlantedSegment> segs = sim.planted();
            int len = sim.record().length();
            for (int i = 0; i < segs.size(); i++) {
                PlantedSegment p = segs.get(i);
                assertThat(p.label()).isEqualTo("island");
                if (p.start() > 1 && p.end() < len) {
                    islandSum += p.length();
                    islandCount++;
                }
                if (i > 0) {
                    // with two states, the gap between consecutive island runs is exactly one background run
                    gapSum += p.start() - segs.get(i - 1).end() - 1;
                    gapCount++;
                }
            }
        }
        assertThat(islandCount).isGreaterThan(150_000);
        assertMeanRunLength(islandSum / islandCount, A_II, islandCount);
        assertMeanRunLength(gapSum / gapCount, A_BB, gapCount);
    }

    private static void assertMeanRunLength(double observed, double selfTransition, long n) {
        double expected = 1 / (1 - selfTransition);
        double se = Math.sqrt(selfTransition) / (1 - selfTransition) / Math.sqrt(n);
        assertThat(observed).isCloseTo(expected, within(Z * se));
    }

    @Test
    void baseFrequenciesMatchTheEmissionTablesOfTheStateInUse() {
        // Inside planted segments every base comes from the order-1 island table given the preceding base,
        // whichever state emitted that preceding base; outside, from the order-0 background table.
        List<SimulatedRecord> sims = sampleMany(twoStateModel(), 10, 2_000_000, 7);
        long[][] pair = new long[4][4];
        long[] single = new long[4];
        for (SimulatedRecord sim : sims) {
            byte[] b = sim.record().bases();
            boolean[] inIsland = new boolean[b.length];
            for (PlantedSegment p : sim.planted()) {
                for (int pos = p.start(); pos <= p.end(); pos++) {
                    inIsland[pos - 1] = true;
                }
            }
            for (int i = 0; i < b.length; i++) {
                int cur = ACGT.indexOf(b[i]);
                if (!inIsland[i]) {
                    single[cur]++;
                } else if (i > 0) {
                    pair[ACGT.indexOf(b[i - 1])][cur]++;
                }
            }
        }
        assertFrequencies(single, BG_EMISSION, 0, 1_000_000);
        for (int prev = 0; prev < 4; prev++) {
            assertFrequencies(pair[prev], ISLAND_EMISSION, prev * 4, 200_000);
        }
    }

    /** Each observed proportion lies within Z binomial standard errors sqrt(p(1-p)/n) of the table value. */
    private static void assertFrequencies(long[] counts, double[] table, int offset, long minN) {
        long n = 0;
        for (long c : counts) {
            n += c;
        }
        assertThat(n).as("sample size").isGreaterThanOrEqualTo(minN);
        for (int b = 0; b < 4; b++) {
            double p = table[offset + b];
            double se = Math.sqrt(p * (1 - p) / n);
            assertThat((double) counts[b] / n).as("base %s, row at %d", ACGT.charAt(b), offset)
                    .isCloseTo(p, within(Z * se));
        }
    }

    @Test
    void recordStartsUseTheReducedOrderTables() {
        // One order-2 state. Per HmmParameters' documented rule, the order-j table averages the order-(j+1) table
        // over the oldest context base with equal weights; computed here directly from the full table:
        // base 1 ~ mean of all 16 rows, base 2 ~ mean over the oldest base of rows (o, b1), base 3 ~ row (b1, b2).
        double[] table = new double[64];
        for (int row = 0; row < 16; row++) {
            double sum = 0;
            for (int b = 0; b < 4; b++) {
                table[row * 4 + b] = 1 + (row * 7 + b * 3) % 5 + (row == 5 && b == 0 ? 6 : 0);
                sum += table[row * 4 + b];
            }
            for (int b = 0; b < 4; b++) {
                table[row * 4 + b] /= sum;
            }
        }
        HmmModel model = new HmmModel("one-state", "test", new Provenance("invented for tests", List.of()),
                List.of(BACKGROUND), List.of(new State("only", "background", 2, table)), new double[]{1},
                List.of(new Transition("only", "only", 1)));
        List<SimulatedRecord> sims = sampleMany(model, 300_000, 3, 99);

        long[] first = new long[4];
        long[][] second = new long[4][4];
        long[][][] third = new long[4][4][4];
        for (SimulatedRecord sim : sims) {
            byte[] b = sim.record().bases();
            int b1 = ACGT.indexOf(b[0]);
            int b2 = ACGT.indexOf(b[1]);
            int b3 = ACGT.indexOf(b[2]);
            first[b1]++;
            second[b1][b2]++;
            third[b1][b2][b3]++;
            assertThat(sim.planted()).isEmpty();
        }

        double[] order0 = new double[4];
        double[] order1 = new double[16];
        for (int ctx = 0; ctx < 16; ctx++) {
            for (int b = 0; b < 4; b++) {
                order0[b] += table[ctx * 4 + b] / 16;
                order1[(ctx % 4) * 4 + b] += table[ctx * 4 + b] / 4; // ctx % 4 is the newer context base
            }
        }
        assertFrequencies(first, order0, 0, 300_000);
        for (int b1 = 0; b1 < 4; b1++) {
            assertFrequencies(second[b1], order1, b1 * 4, 50_000);
            for (int b2 = 0; b2 < 4; b2++) {
                assertFrequencies(third[b1][b2], table, (b1 * 4 + b2) * 4, 5_000);
            }
        }
    }

    @Test
    void plantedSegmentsAreTheMaximalRunsOfAReportedLabel() {
        // Emissions that identify the state: background emits only A, the two island states only C or G.
        // Both island states share one label, so a planted segment is a maximal run of [CG], across the
        // switch between the two island states, and including runs at the record ends.
        HmmModel model = new HmmModel("marked", "test", new Provenance("invented for tests", List.of()),
                List.of(BACKGROUND, ISLAND),
                List.of(new State("bg", "background", 0, new double[]{1, 0, 0, 0}),
                        new State("c", "island", 0, new double[]{0, 1, 0, 0}),
                        new State("g", "island", 1, new double[]{
                                0, 0, 1, 0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0, 1, 0})),
                new double[]{0.3, 0.4, 0.3},
                List.of(new Transition("bg", "bg", 0.8), new Transition("bg", "c", 0.1), new Transition("bg", "g", 0.1),
                        new Transition("c", "c", 0.7), new Transition("c", "g", 0.2), new Transition("c", "bg", 0.1),
                        new Transition("g", "g", 0.7), new Transition("g", "c", 0.2), new Transition("g", "bg", 0.1)));
        int touchingStart = 0;
        int touchingEnd = 0;
        for (SimulatedRecord sim : sampleMany(model, 200, 500, 5)) {
            String seq = new String(sim.record().bases(), java.nio.charset.StandardCharsets.US_ASCII);
            assertThat(seq).matches("[ACG]*");
            List<PlantedSegment> expected = new ArrayList<>();
            Matcher m = Pattern.compile("[CG]+").matcher(seq);
            while (m.find()) {
                expected.add(new PlantedSegment("island", m.start() + 1, m.end()));
            }
            assertThat(sim.planted()).isEqualTo(expected);
            touchingStart += seq.charAt(0) != 'A' ? 1 : 0;
            touchingEnd += seq.charAt(seq.length() - 1) != 'A' ? 1 : 0;
        }
        assertThat(touchingStart).isPositive();
        assertThat(touchingEnd).isPositive();
    }

    @Test
    void sameSeedSameOutputOtherSeedOtherOutput() {
        SequenceSimulator sim = new SequenceSimulator(twoStateModel());
        SimulatedRecord a = sim.sample("r", 100_000, new SplittableRandom(123));
        SimulatedRecord b = sim.sample("r", 100_000, new SplittableRandom(123));
        SimulatedRecord c = sim.sample("r", 100_000, new SplittableRandom(124));
        assertThat(b.record().bases()).isEqualTo(a.record().bases());
        assertThat(b.planted()).isEqualTo(a.planted());
        assertThat(c.record().bases()).isNotEqualTo(a.record().bases());
    }

    @Test
    void emptyAndSingleBaseRecords() {
        SequenceSimulator sim = new SequenceSimulator(twoStateModel());
        SimulatedRecord empty = sim.sample("e", 0, new SplittableRandom(1));
        assertThat(empty.record().length()).isZero();
        assertThat(empty.planted()).isEmpty();
        SimulatedRecord one = sim.sample("o", 1, new SplittableRandom(1));
        assertThat(one.record().length()).isEqualTo(1);
        assertThat(one.planted()).allSatisfy(p -> assertThat(p).isEqualTo(new PlantedSegment("island", 1, 1)));
    }
}
