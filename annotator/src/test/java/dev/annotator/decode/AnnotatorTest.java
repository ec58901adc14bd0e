package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import dev.annotator.seq.SequenceRecord;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * Segments against per-base values computed independently: posteriors by enumerating all state paths of a
 * three-state model (two island-like states sharing one label) on short sequences, runs and their statistics
 * derived from those by the definitions in the GFF3 output documentation.
 */
class AnnotatorTest {

    static HmmModel threeStateModel() {
        List<Label> labels = List.of(
                new Label("rich", "CpG_island", "SO:0000307", false, true),
                new Label("background", null, null, true, false));
        List<State> states = List.of(
                new State("rich1", "rich", 0, new double[]{0.1, 0.4, 0.4, 0.1}),
                new State("rich2", "rich", 1, new double[]{
                        0.2, 0.3, 0.3, 0.2, 0.1, 0.3, 0.5, 0.1, 0.2, 0.4, 0.3, 0.1, 0.1, 0.4, 0.4, 0.1}),
                new State("bg", "background", 0, new double[]{0.3, 0.2, 0.2, 0.3}));
        List<Transition> transitions = List.of(
                new Transition("rich1", "rich1", 0.6), new Transition("rich1", "rich2", 0.3),
                new Transition("rich1", "bg", 0.1), new Transition("rich2", "rich1", 0.5),
                new Transition("rich2", "bg", 0.5), new Transition("bg", "bg", 0.7),
                new Transition("bg", "rich1", 0.3));
        return new HmmModel("test", "three states", new Provenance("invented for a test", List.of()),
                labels, states, new double[]{0.2, 0.1, 0.7}, transitions);
    }

    @Test
    void posteriorSegmentsFollowEnumeratedPosteriors() {
        HmmModel model = threeStateModel();
        var p = dev.annotator.model.ModelCompiler.compile(model);
        SplittableRandom rng = new SplittableRandom(5);
        int checked = 0;
        for (int trial = 0; trial < 200; trial++) {
            byte[] seq = randomBases(rng, 1 + rng.nextInt(9));
            double[] richPosterior = enumerateLabelPosterior(p, seq);
            List<int[]> expectedRuns = new ArrayList<>();
            for (int t = 0; t < seq.length; t++) {
                if (richPosterior[t] > 0.5 && (t == 0 || richPosterior[t - 1] <= 0.5)) {
                    int u = t;
                    while (u < seq.length && richPosterior[u] > 0.5) {
                        u++;
                    }
                    expectedRuns.add(new int[]{t + 1, u});
                }
            }
            RecordAnnotation a = new Annotator(model, DecodeMethod.POSTERIOR, 0)
                    .annotate(new SequenceRecord("r", "", seq));
            assertThat(a.segments()).hasSize(expectedRuns.size());
            for (int i = 0; i < expectedRuns.size(); i++) {
                Segment s = a.segments().get(i);
                int[] run = expectedRuns.get(i);
                assertThat(s.start()).isEqualTo(run[0]);
                assertThat(s.end()).isEqualTo(run[1]);
                double sum = 0;
                double min = 1;
                for (int t = run[0] - 1; t < run[1]; t++) {
                    sum += richPosterior[t];
                    min = Math.min(min, richPosterior[t]);
                }
                assertThat(s.meanPosterior()).isCloseTo(sum / s.length(), within(1e-12));
                assertThat(s.minPosterior()).isCloseTo(min, within(1e-12));
                checked++;
            }
        }
        assertThat(checked).isGreaterThan(50);
    }

    @Test
    void minLengthDropsShortSegmentsAndViterbiRunsFollowThePath() {
        HmmModel model = threeStateModel();
        byte[] seq = "ATATATCGCGCGCGGCGCATATATATTATACGCGCGCCGCGATAT".getBytes(StandardCharsets.US_ASCII);
        var p = dev.annotator.model.ModelCompiler.compile(model);
        int[] path = new dev.annotator.hmm.Viterbi(p).decode(seq).states();
        RecordAnnotation v = new Annotator(model, DecodeMethod.VITERBI, 0).annotate(new SequenceRecord("r", "", seq));
        // every base of a called segment is in a "rich" state on the path, and the bases around it are not
        int covered = 0;
        for (Segment s : v.segments()) {
            for (int t = s.start() - 1; t < s.end(); t++) {
                assertThat(path[t]).isLessThan(2);
            }
            if (s.start() > 1) {
                assertThat(path[s.start() - 2]).isEqualTo(2);
            }
            if (s.end() < seq.length) {
                assertThat(path[s.end()]).isEqualTo(2);
            }
            covered += s.length();
        }
        int richOnPath = 0;
        for (int state : path) {
            richOnPath += state < 2 ? 1 : 0;
        }
        assertThat(covered).isEqualTo(richOnPath).isPositive();

        RecordAnnotation all = new Annotator(model, DecodeMethod.POSTERIOR, 0).annotate(new SequenceRecord("r", "", seq));
        RecordAnnotation longOnly = new Annotator(model, DecodeMethod.POSTERIOR, 5).annotate(new SequenceRecord("r", "", seq));
        assertThat(longOnly.segments()).isEqualTo(all.segments().stream().filter(s -> s.length() >= 5).toList());
    }

    @Test
    void logOddsOfSingleStateLabelsIsTheMarkovChainLikelihoodRatio() {
        // with one state per label, log_odds = sum of log2(P_island(x_t | x_t-1) / P_background(x_t | x_t-1))
        double[] plus = new double[16];
        double[] minus = new double[16];
        SplittableRandom rng = new SplittableRandom(11);
        for (int r = 0; r < 4; r++) {
            double[] a = dist(rng);
            double[] b = dist(rng);
            System.arraycopy(a, 0, plus, r * 4, 4);
            System.arraycopy(b, 0, minus, r * 4, 4);
        }
        HmmModel model = new HmmModel("two", "two chains", new Provenance("test", List.of()),
                List.of(new Label("island", "CpG_island", "SO:0000307", false, true), new Label("bg", null, null, true, false)),
                List.of(new State("in", "island", 1, plus), new State("out", "bg", 1, minus)),
                new double[]{0.5, 0.5},
                List.of(new Transition("in", "in", 0.99), new Transition("in", "out", 0.01),
                        new Transition("out", "out", 0.99), new Transition("out", "in", 0.01)));
        byte[] seq = randomBases(new SplittableRandom(3), 400);
        RecordAnnotation a = new Annotator(model, DecodeMethod.POSTERIOR, 0).annotate(new SequenceRecord("r", "", seq));
        assertThat(a.segments()).isNotEmpty();
        for (Segment s : a.segments()) {
            double expected = 0;
            for (int t = s.start() - 1; t < s.end(); t++) {
                int b = dev.annotator.seq.BaseCode.of(seq[t]);
                double pin;
                double pout;
                if (t == 0) {
                    pin = (plus[b] + plus[4 + b] + plus[8 + b] + plus[12 + b]) / 4;
                    pout = (minus[b] + minus[4 + b] + minus[8 + b] + minus[12 + b]) / 4;
                } else {
                    int c = dev.annotator.seq.BaseCode.of(seq[t - 1]);
                    pin = plus[c * 4 + b];
                    pout = minus[c * 4 + b];
                }
                expected += Math.log(pin / pout) / Math.log(2);
            }
            assertThat(s.logOddsBits()).isCloseTo(expected, within(1e-9));
        }
    }

    private static double[] dist(SplittableRandom rng) {
        double[] d = new double[4];
        double sum = 0;
        for (int i = 0; i < 4; i++) {
            d[i] = 0.05 + rng.nextDouble();
            sum += d[i];
        }
        for (int i = 0; i < 4; i++) {
            d[i] /= sum;
        }
        return d;
    }

    @Test
    void pathSegmentsTakeTheirStatisticsFromEnumeratedPosteriors() {
        // Viterbi and posterior-Viterbi runs are fixed by the path; their confidence is still the label's
        // posterior over the run's bases, and the record's log-likelihood is ln P(x), both by enumeration here
        HmmModel model = threeStateModel();
        var p = dev.annotator.model.ModelCompiler.compile(model);
        SplittableRandom rng = new SplittableRandom(17);
        int checked = 0;
        for (int trial = 0; trial < 120; trial++) {
            byte[] seq = randomBases(rng, 1 + rng.nextInt(9));
            double[] enumerated = enumerate(p, seq);
            double likelihood = enumerated[seq.length];
            for (DecodeMethod method : new DecodeMethod[]{DecodeMethod.VITERBI, DecodeMethod.POSTERIOR_VITERBI}) {
                RecordAnnotation a = new Annotator(model, method, 0).annotate(new SequenceRecord("r", "", seq));
                assertThat(a.logLikelihood()).as(method.name()).isCloseTo(Math.log(likelihood), within(1e-12));
                for (Segment s : a.segments()) {
                    double sum = 0;
                    double min = 1;
                    for (int t = s.start() - 1; t < s.end(); t++) {
                        sum += enumerated[t];
                        min = Math.min(min, enumerated[t]);
                    }
                    assertThat(s.meanPosterior()).as(method.name()).isCloseTo(sum / s.length(), within(1e-12));
                    assertThat(s.minPosterior()).as(method.name()).isCloseTo(min, within(1e-12));
                    checked++;
                }
            }
        }
        assertThat(checked).isGreaterThan(50);
    }

    private static byte[] randomBases(SplittableRandom rng, int n) {
        byte[] s = new byte[n];
        for (int i = 0; i < n; i++) {
            s[i] = (byte) "ACGT".charAt(rng.nextInt(4));
        }
        return s;
    }

    /** P(label "rich" at t | x) by summing the joint probability of every path (states 0 and 1 are "rich"). */
    private static double[] enumerateLabelPosterior(dev.annotator.hmm.HmmParameters p, byte[] seq) {
        return java.util.Arrays.copyOf(enumerate(p, seq), seq.length);
    }

    /** As {@link #enumerateLabelPosterior}, with P(x) (the sum over all paths) appended at index n. */
    private static double[] enumerate(dev.annotator.hmm.HmmParameters p, byte[] seq) {
        int n = seq.length;
        int k = p.stateCount();
        double[] rich = new double[n + 1];
        double total = 0;
        int[] path = new int[n];
        long count = (long) Math.pow(k, n);
        for (long code = 0; code < count; code++) {
            long c = code;
            for (int t = 0; t < n; t++) {
                path[t] = (int) (c % k);
                c /= k;
            }
            double joint = p.start(path[0]);
            for (int t = 0; t < n && joint > 0; t++) {
                if (t > 0) {
                    joint *= p.transition(path[t - 1], path[t]);
                }
                int b = dev.annotator.seq.BaseCode.of(seq[t]);
                int s = path[t];
                int j = Math.min(p.order(s), t);
                int ctx = j == 0 ? 0 : dev.annotator.seq.BaseCode.of(seq[t - 1]);
                joint *= p.emission(s, j, ctx, b);
            }
            total += joint;
            for (int t = 0; t < n; t++) {
                if (path[t] < 2) {
                    rich[t] += joint;
                }
            }
        }
        for (int t = 0; t < n; t++) {
            rich[t] /= total;
        }
        rich[n] = total;
        return rich;
    }
}
