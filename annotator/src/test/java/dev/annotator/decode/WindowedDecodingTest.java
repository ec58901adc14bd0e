package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.simulate.SequenceSimulator;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.ForkJoinPool;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * A record decoded in windows (with certified boundary vectors) against the same record decoded in one piece:
 * identical segments, confidences within 1e-9; and the same result on one thread or in a fork-join pool.
 */
class WindowedDecodingTest {

    private static final int WINDOW = 30_000;

    @Test
    void windowsGiveTheSameSegmentsAsOnePiece() throws Exception {
        HmmModel model = ModelLoader.load("cpg-island");
        SequenceRecord record = new SequenceSimulator(model).sample("w", 1_500_000, new SplittableRandom(17)).record();
        RecordAnnotation whole = new Annotator(model, DecodeMethod.POSTERIOR, 0, Integer.MAX_VALUE).annotate(record);
        Annotator windowed = new Annotator(model, DecodeMethod.POSTERIOR, 0, WINDOW);
        RecordAnnotation sequential = windowed.annotate(record);
        RecordAnnotation parallel = new ForkJoinPool(2).submit(() -> windowed.annotate(record)).get();

        assertThat(whole.segments()).hasSizeGreaterThan(30);
        // the check means something only if some segments were cut by window boundaries and stitched back
        assertThat(whole.segments().stream().filter(s -> (s.start() - 1) / WINDOW != (s.end() - 1) / WINDOW).count())
                .isGreaterThanOrEqualTo(2);
        assertThat(parallel).isEqualTo(sequential);
        List<Segment> a = whole.segments();
        List<Segment> b = sequential.segments();
        assertThat(b).hasSameSizeAs(a);
        for (int i = 0; i < a.size(); i++) {
            assertThat(b.get(i).start()).isEqualTo(a.get(i).start());
            assertThat(b.get(i).end()).isEqualTo(a.get(i).end());
            assertThat(b.get(i).meanPosterior()).isCloseTo(a.get(i).meanPosterior(), within(1e-9));
            assertThat(b.get(i).minPosterior()).isCloseTo(a.get(i).minPosterior(), within(1e-9));
            assertThat(b.get(i).logOddsBits()).isCloseTo(a.get(i).logOddsBits(), within(1e-6));
        }
        assertThat(sequential.logLikelihood()).isCloseTo(whole.logLikelihood(), within(1e-6));
    }

    @Test
    void windowsCountTheBasesOfTheProfileLikeOnePiece() throws Exception {
        HmmModel model = ModelLoader.load("cpg-island");
        byte[] bases = new SequenceSimulator(model).sample("w", 400_000, new SplittableRandom(5)).record()
                .bases().clone();
        // ambiguous runs at the start, across a window boundary, over a whole window and two boundaries, at the end
        java.util.Arrays.fill(bases, 0, 40, (byte) 'N');
        java.util.Arrays.fill(bases, WINDOW - 15, WINDOW + 10, (byte) 'N');
        java.util.Arrays.fill(bases, 3 * WINDOW - 7, 4 * WINDOW + 3, (byte) 'N');
        java.util.Arrays.fill(bases, bases.length - 9, bases.length, (byte) 'R');
        SequenceRecord record = new SequenceRecord("w", "", bases);
        // 500 points give bins of 800 bases, which straddle the window boundaries
        ProfileOptions options = new ProfileOptions(null, 1, false, true, 500, false);
        RecordProfile whole = new Annotator(model, DecodeMethod.POSTERIOR, 0, Integer.MAX_VALUE, options)
                .annotate(record).profile();
        Annotator windowed = new Annotator(model, DecodeMethod.POSTERIOR, 0, WINDOW, options);
        RecordProfile sequential = windowed.annotate(record).profile();
        RecordProfile parallel = new ForkJoinPool(2).submit(() -> windowed.annotate(record)).get().profile();

        for (RecordProfile p : List.of(sequential, parallel)) {
            assertThat(p.composition()).isEqualTo(whole.composition());
            assertThat(p.ambiguousBases()).isEqualTo(whole.ambiguousBases()).isEqualTo(40 + 25 + WINDOW + 10 + 9);
            assertThat(p.longestAmbiguousRun()).isEqualTo(whole.longestAmbiguousRun()).isEqualTo(WINDOW + 10);
            assertThat(p.plot().gc()).containsExactly(whole.plot().gc());
        }
        // the one-piece figures against a direct count: GC of each 800-base bin
        float[] gc = whole.plot().gc();
        assertThat(gc).hasSize(500);
        for (int b = 0; b < gc.length; b++) {
            int clean = 0;
            int strong = 0;
            for (int i = b * 800; i < (b + 1) * 800; i++) {
                clean += "ACGT".indexOf(bases[i]) >= 0 ? 1 : 0;
                strong += bases[i] == 'C' || bases[i] == 'G' ? 1 : 0;
            }
            if (clean == 0) {
                assertThat(gc[b]).as("bin %d", b).isNaN();
            } else {
                assertThat(gc[b]).as("bin %d", b).isEqualTo((float) ((double) strong / clean));
            }
        }
    }
}
