package dev.annotator.decode;

import dev.annotator.hmm.ImpossibleSequenceException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.simulate.SequenceSimulator;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Viterbi decoding runs its path and its forward-backward pass at once inside a fork-join pool: the annotation is
 * the same as on one thread (profile included), and a sequence the model cannot emit fails with the same position.
 */
class ViterbiInPoolTest {
    @Test
    void sameAnnotationInAPoolAsOnOneThread() throws Exception {
        HmmModel model = ModelLoader.load("cpg-island");
        SequenceRecord record = new SequenceSimulator(model).sample("v", 300_000, new SplittableRandom(3)).record();
        Annotator annotator = new Annotator(model, DecodeMethod.VITERBI, 0, Annotator.WINDOW,
                new ProfileOptions(null, 1, true, true, 200, true));
        RecordAnnotation alone = annotator.annotate(record);
        RecordAnnotation pooled = new ForkJoinPool(2).submit(() -> annotator.annotate(record)).get();
        assertThat(alone.segments()).isNotEmpty();
        assertThat(pooled.segments()).isEqualTo(alone.segments());
        assertThat(pooled.logLikelihood()).isEqualTo(alone.logLikelihood());
        RecordProfile a = alone.profile();
        RecordProfile b = pooled.profile();
        assertThat(b.composition()).isEqualTo(a.composition());
        assertThat(b.logOddsBitsPerBase()).isEqualTo(a.logOddsBitsPerBase());
        assertThat(b.plot().max()).containsExactly(a.plot().max());
        assertThat(b.plot().mean()).containsExactly(a.plot().mean());
        assertThat(b.track().runs()).isEqualTo(a.track().runs());
        for (int i = 0; i < a.track().runs(); i++) {
            assertThat(b.track().start(i)).isEqualTo(a.track().start(i));
            assertThat(b.track().milli(i)).isEqualTo(a.track().milli(i));
        }
    }

    @Test
    void anImpossibleSequenceFailsAtTheSamePositionInAPool() {
        // no state emits T, so the first T (base 12) has probability 0 on every path
        HmmModel model = new HmmModel("no-t", "no state emits T",
                new dev.annotator.model.Provenance("invented for a test", java.util.List.of()),
                java.util.List.of(new dev.annotator.model.Label("rich", "CpG_island", "SO:0000307", false, true),
                        new dev.annotator.model.Label("background", null, null, true, false)),
                java.util.List.of(new dev.annotator.model.State("rich", "rich", 0, new double[]{0.2, 0.4, 0.4, 0}),
                        new dev.annotator.model.State("bg", "background", 0, new double[]{0.4, 0.3, 0.3, 0})),
                new double[]{0.5, 0.5},
                java.util.List.of(new dev.annotator.model.Transition("rich", "rich", 0.9),
                        new dev.annotator.model.Transition("rich", "bg", 0.1),
                        new dev.annotator.model.Transition("bg", "bg", 0.9),
                        new dev.annotator.model.Transition("bg", "rich", 0.1)));
        Annotator annotator = new Annotator(model, DecodeMethod.VITERBI, 0, Annotator.WINDOW);
        SequenceRecord record = new SequenceRecord("x", "", "ACGCGAACCGGTAAC".getBytes(StandardCharsets.US_ASCII));
        int position = positionOf(() -> annotator.annotate(record));
        assertThat(position).isEqualTo(11);
        assertThatThrownBy(() -> new ForkJoinPool(2).submit(() -> annotator.annotate(record)).get())
                .isInstanceOf(ExecutionException.class)
                .cause().isInstanceOf(ImpossibleSequenceException.class)
                .satisfies(e -> assertThat(((ImpossibleSequenceException) e).position()).isEqualTo(position));
    }

    private static int positionOf(Runnable run) {
        try {
            run.run();
        } catch (ImpossibleSequenceException e) {
            return e.position();
        }
        throw new AssertionError("expected the sequence to be impossible");
    }
}
