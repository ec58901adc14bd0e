package dev.annotator.simulate;

import dev.annotator.hmm.RandomModels;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelValidator;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Simulate, then train by counting, and get the model back within sampling error: for random valid models whose
 * labels have one state each (so the true segments give the state path), the transition and emission frequencies
 * counted on the simulated records match the model's probabilities. Counting is the maximum-likelihood estimate
 * of a Markov chain's parameters from a known path (Durbin et al. 1998, "Biological Sequence Analysis", section
 * 3.3; recalled from memory); here it is done by the test itself, since the project has no training command yet.
 *
 * <p>Tolerance: Z binomial standard errors sqrt(p(1-p)/n), Z = 5.5, over rows seen at least 400 times. A correct
 * sampler fails one check with probability about 4e-8 (two-sided normal tail), so well under 1e-3 over all checks
 * of all tries; the seed is fixed, so a run is reproducible either way.
 */
class SimulateAndCountTest {
    private static final double Z = 5.5;
    private static final int MIN_ROW = 400;
    private static final String ACGT = "ACGT";

    @Property(tries = 12, seed = "20261203")
    void countingTheSimulationGivesBackTheModel(@ForAll long seed, @ForAll @IntRange(min = 2, max = 4) int states,
                                                @ForAll @IntRange(min = 0, max = 2) int maxOrder) {
        SplittableRandom rng = new SplittableRandom(seed);
        HmmModel model = randomModel(rng, states, maxOrder);
        ModelValidator.validate(model, "random model"); // a valid model, as a user's file would have to be
        SequenceSimulator simulator = new SequenceSimulator(model);

        long[][] transitions = new long[states][states];
        long[][][] emissions = new long[states][][];
        for (int s = 0; s < states; s++) {
            emissions[s] = new long[1 << (2 * model.states().get(s).order())][4];
        }
        for (int r = 0; r < 4; r++) {
            SimulatedRecord sim = simulator.sample("sim" + r, 100_000, rng);
            int[] path = statePath(model, sim);
            byte[] bases = sim.record().bases();
            for (int t = 0; t < bases.length; t++) {
                if (t > 0) {
                    transitions[path[t - 1]][path[t]]++;
                }
                int order = model.states().get(path[t]).order();
                if (t >= order) { // positions with a full context; earlier ones use the reduced tables
                    int context = 0;
                    for (int i = t - order; i < t; i++) {
                        context = context * 4 + ACGT.indexOf(bases[i]);
                    }
                    emissions[path[t]][context][ACGT.indexOf(bases[t])]++;
                }
            }
        }

        int checkedRows = 0;
        for (int i = 0; i < states; i++) {
            double[] expected = new double[states];
            for (Transition tr : model.transitions()) {
                if (model.stateIndex(tr.from()) == i) {
                    expected[model.stateIndex(tr.to())] = tr.probability();
                }
            }
            checkedRows += assertWithinSamplingError(transitions[i], expected, "transitions from state " + i);
            State state = model.states().get(i);
            for (int c = 0; c < emissions[i].length; c++) {
                double[] row = new double[4];
                for (int b = 0; b < 4; b++) {
                    row[b] = state.emission(c, b);
                }
                checkedRows += assertWithinSamplingError(emissions[i][c], row, "state " + i + ", context row " + c);
            }
        }
        assertThat(checkedRows).as("rows with enough counts to check").isGreaterThanOrEqualTo(states * 2);
    }

    /** Returns 1 if the row was checked, 0 if it was seen too rarely to say anything. */
    private static int assertWithinSamplingError(long[] counts, double[] p, String what) {
        long n = 0;
        for (long c : counts) {
            n += c;
        }
        if (n < MIN_ROW) {
            return 0;
        }
        for (int j = 0; j < counts.length; j++) {
            double se = Math.sqrt(p[j] * (1 - p[j]) / n);
            // a forbidden transition or an impossible base must never be counted at all
            assertThat((double) counts[j] / n).as("%s, column %d (n = %d)", what, j, n)
                    .isCloseTo(p[j], within(Z * se + 1e-12));
        }
        return 1;
    }

    /** State index per position: the planted segments name the reported states, the rest is the background. */
    private static int[] statePath(HmmModel model, SimulatedRecord sim) {
        int background = model.stateIndex("s0");
        int[] path = new int[sim.record().length()];
        java.util.Arrays.fill(path, background);
        for (PlantedSegment seg : sim.planted()) {
            int s = model.stateIndex("s" + seg.label().substring(1));
            for (int pos = seg.start(); pos <= seg.end(); pos++) {
                path[pos - 1] = s;
            }
        }
        return path;
    }

    /**
     * Invented: state s0 is the background, state si reports label li; sparse random transitions (each state keeps
     * at least one way out, the background reaches every other state), positive emission rows.
     */
    private static HmmModel randomModel(SplittableRandom rng, int states, int maxOrder) {
        List<Label> labels = new ArrayList<>();
        List<State> stateList = new ArrayList<>();
        for (int s = 0; s < states; s++) {
            labels.add(s == 0 ? new Label("l0", null, null, true, false)
                    : new Label("l" + s, "region", "SO:0000001", false, false));
            int order = rng.nextInt(maxOrder + 1);
            double[] table = new double[4 << (2 * order)];
            for (int row = 0; row < table.length / 4; row++) {
                System.arraycopy(RandomModels.distribution(rng, 4), 0, table, row * 4, 4);
            }
            stateList.add(new State("s" + s, "l" + s, order, table));
        }
        List<Transition> transitions = new ArrayList<>();
        for (int i = 0; i < states; i++) {
            List<Integer> to = new ArrayList<>();
            for (int j = 0; j < states; j++) {
                // the background goes everywhere (so every state is reachable); others keep ~60% of their moves
                if (i == 0 || j == 0 || rng.nextDouble() < 0.6) {
                    to.add(j);
                }
            }
            double[] p = RandomModels.distribution(rng, to.size());
            for (int k = 0; k < to.size(); k++) {
                transitions.add(new Transition("s" + i, "s" + to.get(k), p[k]));
            }
        }
        double[] start = RandomModels.distribution(rng, states);
        return new HmmModel("random", "an invented random model", new Provenance("invented for tests", List.of()),
                labels, stateList, start, transitions);
    }

}
