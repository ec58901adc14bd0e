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
 * The posterior track built window by window, checked against posteriors of the whole record computed directly
 * with {@link ForwardBackward} (itself checked against brute-force enumeration in the kernel tests). Windows of
 * 3,000 bases (20 of them) make bins straddle window edges for every step below; a step of 5,000 spans whole windows.
 */
class PosteriorTrackTest {
    private static final int LENGTH = 60_000;

    @ParameterizedTest
    @CsvSource({"POSTERIOR, 1", "POSTERIOR, 7", "POSTERIOR, 5000", "VITERBI, 1", "VITERBI, 7"})
    void runsCoverTheRecordAndHoldTheMeanPosteriorOfTheirBins(DecodeMethod method, int step) {
        HmmModel model = ModelLoader.load("cpg-island");
        SequenceRecord sampled = new SimulationRun(model).sample(List.of("r"), new int[]{LENGTH}, 5L).get(0).record();
        byte[] bases = sampled.bases().clone();
        Arrays.fill(bases, 6_000, 6_400, (byte) 'N');
        SequenceRecord record = new SequenceRecord("r", "", bases);

        double[] direct = new double[LENGTH];
        int island = model.labelIndex("island");
        int[] stateLabel = model.stateLabels();
        new ForwardBackward(ModelCompiler.compile(model)).run(bases, (t, posterior, emission) -> {
            for (int s = 0; s < posterior.length; s++) {
                if (stateLabel[s] == island) {
                    direct[t] += posterior[s];
                }
            }
        });

        Annotator annotator = new Annotator(model, method, 0, 3_000, new ProfileOptions("island", step, true, false, 0));
        PosteriorTrack track = annotator.annotate(record).profile().track();

        assertThat(track.start(0)).isZero();
        assertThat(track.end(track.runs() - 1)).isEqualTo(LENGTH);
        double tolerance = 0.0005 + 1e-9; // half a unit of the third decimal, plus the windows' 1e-12 agreement
        for (int i = 0; i < track.runs(); i++) {
            assertThat(track.start(i)).isLessThan(track.end(i));
            assertThat(track.start(i) % step).isZero();
            if (i > 0) {
                assertThat(track.start(i)).isEqualTo(track.end(i - 1));
                assertThat(track.milli(i)).isNotEqualTo(track.milli(i - 1));
            }
            for (int bin = track.start(i); bin < track.end(i); bin += step) {
                int binEnd = Math.min(LENGTH, bin + step);
                double mean = Arrays.stream(direct, bin, binEnd).sum() / (binEnd - bin);
                assertThat(Math.abs(mean - track.milli(i) / 1000.0)).as("bin at %d", bin).isLessThanOrEqualTo(tolerance);
            }
        }
        // the record holds both confident island and background stretches, so the track is not flat
        assertThat(Arrays.stream(direct).max().orElseThrow()).isGreaterThan(0.9);
        assertThat(track.runs()).isGreaterThan(2);
    }
}
