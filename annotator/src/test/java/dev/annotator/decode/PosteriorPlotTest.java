package dev.annotator.decode;

import dev.annotator.hmm.ForwardBackward;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelCompiler;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.SimulationRun;
import dev.annotator.seq.SequenceRecord;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.Arrays;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The report's plot bins (maximum and mean of the label posterior per bin), collected window by window and block by
 * block, checked against posteriors of the whole record computed directly with {@link ForwardBackward} (itself
 * checked against brute-force enumeration in the kernel tests). 700 points give bins of 86 bases, which straddle
 * the 3,000-base windows and the kernel's 16,384-base blocks.
 */
class PosteriorPlotTest {
    private static final int LENGTH = 60_000;
    private static final int POINTS = 700;

    @ParameterizedTest
    @CsvSource({
            "cpg-island, POSTERIOR, 3000, false", // plot fed by the posterior runs from the one state's rows
            "cpg-island, POSTERIOR, 4194304, false", // one window of several blocks
            "cpg-island, POSTERIOR, 3000, true", // with a track: the general per-base path
            "cpg-island, VITERBI, 3000, false", // the whole record's profile, the one-state label's rows
            "cpg-island, POSTERIOR_VITERBI, 3000, true",
            "three-state, POSTERIOR, 3000, false", // a label of two states: its summed posterior fed by the runs
            "three-state, VITERBI, 3000, false"}) // the whole record's profile, summed per base
    void binsHoldTheMaximumAndMeanPosterior(String modelName, DecodeMethod method, int window, boolean track) {
        HmmModel model = modelName.equals("three-state") ? AnnotatorTest.threeStateModel()
                : ModelLoader.load(modelName);
        String labelName = model.reportedLabels().get(0).name();
        SequenceRecord sampled = new SimulationRun(model).sample(List.of("r"), new int[]{LENGTH}, 11L).get(0).record();
        byte[] bases = sampled.bases().clone();
        Arrays.fill(bases, 9_000, 9_300, (byte) 'N');
        SequenceRecord record = new SequenceRecord("r", "", bases);

        double[] direct = new double[LENGTH];
        int island = model.labelIndex(labelName);
        int[] stateLabel = model.stateLabels();
        new ForwardBackward(ModelCompiler.compile(model)).run(bases, (t, posterior, emission) -> {
            for (int s = 0; s < posterior.length; s++) {
                if (stateLabel[s] == island) {
                    direct[t] += posterior[s];
                }
            }
        });

        Annotator annotator = new Annotator(model, method, 0, window,
                new ProfileOptions(labelName, 1, track, true, POINTS, false));
        PosteriorPlot plot = annotator.annotate(record).profile().plot();

        int bin = PosteriorPlot.binSize(LENGTH, POINTS);
        assertThat(bin).isEqualTo(86);
        assertThat(plot.binSize()).isEqualTo(bin);
        assertThat(plot.bins()).isEqualTo((LENGTH - 1) / bin + 1);
        // the bins hold floats; windows agree with the undivided record within 1e-12
        double tolerance = 1e-6;
        for (int b = 0; b < plot.bins(); b++) {
            int from = b * bin;
            int to = Math.min(LENGTH, from + bin);
            double max = Arrays.stream(direct, from, to).max().orElseThrow();
            double mean = Arrays.stream(direct, from, to).sum() / (to - from);
            assertThat((double) plot.max()[b]).as("maximum of bin %d", b).isCloseTo(max,
                    org.assertj.core.data.Offset.offset(tolerance));
            assertThat((double) plot.mean()[b]).as("mean of bin %d", b).isCloseTo(mean,
                    org.assertj.core.data.Offset.offset(tolerance));
        }
        // GC: bins of 86 bases are shorter than the 200 bp over which island criteria judge GC (Gardiner-Garden &
        // Frommer 1987), so each bin's value is the GC of the 200 bases around its centre, moved inside the record
        // at its ends; counted here with the conformance tests' own letter count
        for (int b = 0; b < plot.bins(); b++) {
            int centre = Math.min(LENGTH, b * bin + bin / 2);
            int from = Math.max(0, Math.min(LENGTH, centre - 100 + 200) - 200);
            dev.annotator.conformance.BaseCounts counts = dev.annotator.conformance.BaseCounts.of(bases, from + 1,
                    from + 200);
            if (counts.unambiguous() == 0) {
                assertThat(plot.gc()[b]).as("GC of bin %d", b).isNaN();
            } else {
                assertThat(plot.gc()[b]).as("GC of bin %d", b)
                        .isEqualTo((float) (counts.c() + counts.g()) / counts.unambiguous());
            }
        }
        // stretches of the label and of the background both occur, so the bins are not flat
        assertThat(Arrays.stream(direct).max().orElseThrow() - Arrays.stream(direct).min().orElseThrow())
                .isGreaterThan(0.6);
    }
}
