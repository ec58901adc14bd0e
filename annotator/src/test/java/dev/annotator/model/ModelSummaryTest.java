package dev.annotator.model;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class ModelSummaryTest {
    private static final double[] UNIFORM = {0.25, 0.25, 0.25, 0.25};

    private static HmmModel model(List<Label> labels, List<String[]> states, double[] start, List<Transition> ts) {
        List<State> list = new ArrayList<>();
        for (String[] s : states) {
            list.add(new State(s[0], s[1], 0, UNIFORM));
        }
        HmmModel m = new HmmModel("t", "invented", new Provenance("invented for tests", List.of()), labels, list, start, ts);
        ModelValidator.validate(m, "t");
        return m;
    }

    private static Label reported(String name) {
        return new Label(name, "region", null, false, false);
    }

    private static Label background(String name) {
        return new Label(name, null, null, true, false);
    }

    /** Three states g1, g2, g3 form label "gene"; b is the background. */
    private static HmmModel threeStateGene(double toG1, double toG3) {
        return model(List.of(reported("gene"), background("bg")),
                List.of(new String[] {"g1", "gene"}, new String[] {"g2", "gene"}, new String[] {"g3", "gene"},
                        new String[] {"b", "bg"}),
                new double[] {0, 0, 0, 1},
                List.of(new Transition("g1", "g1", 0.5), new Transition("g1", "g2", 0.3), new Transition("g1", "g3", 0.2),
                        new Transition("g2", "g2", 0.8), new Transition("g2", "g3", 0.2),
                        new Transition("g3", "g3", 0.9), new Transition("g3", "g1", 0.05), new Transition("g3", "b", 0.05),
                        new Transition("b", "b", 0.99), new Transition("b", "g1", toG1), new Transition("b", "g3", toG3)));
    }

    @Test
    void shippedModelHasKilobaseIslandsInTwentyKilobasesOfBackground() {
        Map<String, Double> lengths = ModelSummary.expectedSegmentLengths(ModelFiles.shipped("cpg-island"));
        // 1/(1 - 0.999) and 1/(1 - 0.99995): the rule of thumb the model file states
        assertThat(lengths).containsOnlyKeys("island", "background");
        assertThat(lengths.get("island")).isCloseTo(1000, within(1e-6));
        assertThat(lengths.get("background")).isCloseTo(20000, within(1e-4));
    }

    @Test
    void threeStateLabelWorkedByHand() {
        // Expected steps x_i before leaving {g1,g2,g3}, from x = 1 + T_QQ x:
        //   x2 = 1 + 0.8 x2 + 0.2 x3               -> x2 = 5 + x3
        //   x1 = 1 + 0.5 x1 + 0.3 x2 + 0.2 x3      -> x1 = 5 + x3
        //   x3 = 1 + 0.9 x3 + 0.05 x1              -> 0.05 x3 = 1.25, x3 = 25, x1 = x2 = 30
        // entering only at g1 gives 30; the background stays 1/(1 - 0.99) = 100
        Map<String, Double> lengths = ModelSummary.expectedSegmentLengths(threeStateGene(0.01, 0));
        assertThat(lengths.get("gene")).isCloseTo(30, within(1e-9));
        assertThat(lengths.get("bg")).isCloseTo(100, within(1e-9));
    }

    @Test
    void entryDistributionWeighsWhereTheLabelIsEntered() {
        // entering at g1 with 0.006 and at g3 with 0.004: 0.6 * 30 + 0.4 * 25 = 28
        Map<String, Double> lengths = ModelSummary.expectedSegmentLengths(threeStateGene(0.006, 0.004));
        assertThat(lengths.get("gene")).isCloseTo(28, within(1e-9));
    }

    @Test
    void labelThatCannotBeLeftIsInfinite() {
        HmmModel m = model(List.of(reported("trap"), background("bg")),
                List.of(new String[] {"b", "bg"}, new String[] {"x", "trap"}),
                new double[] {1, 0},
                List.of(new Transition("b", "b", 0.5), new Transition("b", "x", 0.5), new Transition("x", "x", 1)));
        Map<String, Double> lengths = ModelSummary.expectedSegmentLengths(m);
        assertThat(lengths.get("trap")).isInfinite();
        assertThat(lengths.get("bg")).isCloseTo(2, within(1e-9)); // entered only at the start
        assertThat(ModelSummary.describe(m)).contains("trap  infinite");
    }

    @Test
    void labelOnlyAtTheStartUsesTheStartDistribution() {
        // "lead" is left for good after a mean of 1/(1 - 0.75) = 4 bases and never re-entered
        HmmModel m = model(List.of(reported("lead"), background("bg")),
                List.of(new String[] {"l", "lead"}, new String[] {"b", "bg"}),
                new double[] {1, 0},
                List.of(new Transition("l", "l", 0.75), new Transition("l", "b", 0.25), new Transition("b", "b", 1)));
        assertThat(ModelSummary.expectedSegmentLengths(m).get("lead")).isCloseTo(4, within(1e-9));
    }

    @Test
    void agreesWithSimulatedSegments() {
        // An independent check by sampling: two labels entered from two background states with different
        // long-run weight, so the entry weighting matters. Mean segment length of a long simulated path must
        // match the computed expectation (tolerance: a few standard errors of tens of thousands of segments).
        // Weighting both entries of "a" alike would give (2.5 + 20) / 2 = 11.25 instead of about 8.3.
        HmmModel m = model(List.of(reported("a"), reported("c"), background("bg")),
                List.of(new String[] {"a1", "a"}, new String[] {"a2", "a"}, new String[] {"c1", "c"},
                        new String[] {"b1", "bg"}, new String[] {"b2", "bg"}),
                new double[] {0, 0, 0, 1, 0},
                List.of(new Transition("a1", "a1", 0.6), new Transition("a1", "b1", 0.4),
                        new Transition("a2", "a2", 0.95), new Transition("a2", "b2", 0.05),
                        new Transition("c1", "c1", 0.8), new Transition("c1", "b2", 0.2),
                        new Transition("b1", "b1", 0.7), new Transition("b1", "a1", 0.2), new Transition("b1", "b2", 0.1),
                        new Transition("b2", "b2", 0.5), new Transition("b2", "a2", 0.2), new Transition("b2", "c1", 0.1),
                        new Transition("b2", "b1", 0.2)));
        Map<String, Double> expected = ModelSummary.expectedSegmentLengths(m);
        Map<String, double[]> simulated = simulate(m, 3_000_000, new Random(20240611L));
        for (String label : List.of("a", "c", "bg")) {
            double[] s = simulated.get(label);
            assertThat(s[0] / s[1]).as(label).isCloseTo(expected.get(label), within(0.02 * expected.get(label)));
        }
    }

    /** Label to {bases, segments}; the first and the last (unfinished) segment are left out. */
    private static Map<String, double[]> simulate(HmmModel m, int steps, Random random) {
        int k = m.stateCount();
        double[][] t = new double[k][k];
        for (Transition tr : m.transitions()) {
            t[m.stateIndex(tr.from())][m.stateIndex(tr.to())] = tr.probability();
        }
        int state = m.stateIndex("b1");
        Map<String, double[]> out = new HashMap<>();
        String current = m.states().get(state).label();
        int run = 0;
        boolean first = true;
        for (int i = 0; i < steps; i++) {
            String label = m.states().get(state).label();
            if (!label.equals(current)) {
                if (!first) {
                    double[] acc = out.computeIfAbsent(current, x -> new double[2]);
                    acc[0] += run;
                    acc[1]++;
                }
                first = false;
                current = label;
                run = 0;
            }
            run++;
            double u = random.nextDouble();
            int next = 0;
            while (next < k - 1 && (u -= t[state][next]) >= 0) {
                next++;
            }
            state = next;
        }
        return out;
    }

    @Test
    void describeNamesEverythingACheckerNeeds() {
        String text = ModelSummary.describe(ModelFiles.shipped("cpg-island"));
        assertThat(text).contains("model: cpg-island\n")
                .contains("description: CpG islands")
                .contains("source: Durbin, Eddy, Krogh & Mitchison")
                .contains("  note: The switching probabilities are a rule of thumb (common practice)")
                .contains("  island      reported as CpG_island (SO:0000307), with composition attributes\n")
                .contains("  background  background, not reported\n")
                .contains("  island      label island      order 1  start 0.047619048\n")
                .contains("transitions: 4 allowed of 4 possible")
                .contains("expected segment length (bases):\n  island      1000.0\n  background  20000.0\n");
    }
}
