package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.seq.SequenceRecord;
import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * A gene model is decoded strand by strand; the whole model's log-likelihood takes a forward pass of its own,
 * run only when a profile needs that pass anyway, and otherwise on request.
 */
class GeneModelLikelihoodTest {
    private static final HmmModel GENES = ModelLoader.load("bacterial-genes");

    private static SequenceRecord randomRecord(long seed, int length) {
        SplittableRandom rng = new SplittableRandom(seed);
        byte[] bases = new byte[length];
        for (int i = 0; i < length; i++) {
            bases[i] = (byte) "ACGT".charAt(rng.nextInt(4));
        }
        return new SequenceRecord("r", "", bases);
    }

    @Test
    void withoutAProfileTheRecordsLikelihoodIsLeftOutAndTheGenesAreTheSame() {
        SequenceRecord record = randomRecord(5, 20_000);
        Annotator plain = new Annotator(GENES, DecodeMethod.POSTERIOR_VITERBI, 0);
        Annotator profiled = new Annotator(GENES, DecodeMethod.POSTERIOR_VITERBI, 0, Annotator.WINDOW,
                new ProfileOptions(null, 1, false, true, 0));
        RecordAnnotation a = plain.annotate(record);
        RecordAnnotation b = profiled.annotate(record);
        assertThat(a.logLikelihood()).isNaN();
        assertThat(a.segments()).isEqualTo(b.segments());
        assertThat(b.logLikelihood()).isFinite();
        assertThat(plain.logLikelihood(record.bases())).isCloseTo(b.logLikelihood(), within(1e-9));
    }

    @Test
    void onRequestTheLikelihoodIsTheWholeModelsNotAStrandViews() {
        SequenceRecord record = randomRecord(9, 5_000);
        double whole = new Annotator(GENES, DecodeMethod.POSTERIOR_VITERBI, 0).logLikelihood(record.bases());
        double forwardView = new Annotator(StrandView.of(GENES, '+'), DecodeMethod.POSTERIOR_VITERBI, 0)
                .logLikelihood(record.bases());
        assertThat(whole).isNotCloseTo(forwardView, within(1.0));
        // every path emits each base with some probability; on uniform random bases a fitted model's figure per
        // base lies near ln(1/4), whatever its states
        assertThat(whole / record.bases().length).isBetween(Math.log(0.25) - 0.2, Math.log(0.25) + 0.2);
    }
}
