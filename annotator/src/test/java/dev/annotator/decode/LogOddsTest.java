package dev.annotator.decode;

import dev.annotator.hmm.ForwardBackward;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelCompiler;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.SimulationRun;
import dev.annotator.seq.SequenceRecord;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The summary's log-odds per base, collected window by window, against the per-base definition applied to
 * posteriors and emissions computed directly with {@link ForwardBackward} over the whole record: the sum over the
 * bases of log2 {@link SegmentAccumulator#emissionRatio}, divided by the length. For a two-state model the ratio
 * is taken straight from the two emissions (no posterior), which this checks against the general form; a label of
 * two states against one goes the general way.
 */
class LogOddsTest {
    @ParameterizedTest
    @CsvSource({"cpg-island, 3000", "cpg-island, 4194304", "three-state, 3000"})
    void logOddsAreTheSumOfThePerBaseRatios(String modelName, int window) {
        HmmModel model = modelName.equals("three-state") ? AnnotatorTest.threeStateModel()
                : ModelLoader.load(modelName);
        SequenceRecord record = new SimulationRun(model).sample(List.of("r"), new int[]{40_000}, 5L).get(0).record();
        byte[] bases = record.bases();
        int k = model.states().size();
        int[] stateLabel = model.stateLabels();
        List<String> reported = model.reportedLabels().stream().map(l -> l.name()).toList();
        double[] expected = new double[reported.size()];
        new ForwardBackward(ModelCompiler.compile(model)).run(bases, (t, posterior, emission) -> {
            for (int r = 0; r < reported.size(); r++) {
                int label = model.labelIndex(reported.get(r));
                boolean[] mask = new boolean[k];
                double lp = 0;
                for (int s = 0; s < k; s++) {
                    mask[s] = stateLabel[s] == label;
                    lp += mask[s] ? posterior[s] : 0;
                }
                expected[r] += Math.log(SegmentAccumulator.emissionRatio(mask, lp, posterior, emission, 0))
                        / Math.log(2);
            }
        });

        RecordProfile profile = new Annotator(model, DecodeMethod.POSTERIOR, 0, window,
                new ProfileOptions(null, 1, false, true, 0, true)).annotate(record).profile();
        for (int r = 0; r < reported.size(); r++) {
            assertThat(profile.logOddsBitsPerBase().get(reported.get(r))).as(reported.get(r))
                    .isCloseTo(expected[r] / bases.length, within(1e-9));
        }
        // a record of both kinds of stretch, so the figure is not trivially 0
        assertThat(Math.abs(expected[0])).isGreaterThan(1e-3 * bases.length);
    }
}
