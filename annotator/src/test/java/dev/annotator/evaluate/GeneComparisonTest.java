package dev.annotator.evaluate;

import dev.annotator.error.BadInputException;
import dev.annotator.labels.StrandedFeature;
import org.junit.jupiter.api.Test;
import smile.validation.metric.MatthewsCorrelation;
import smile.validation.metric.Precision;
import smile.validation.metric.Sensitivity;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

class GeneComparisonTest {
    private static final double EPS = 1e-12;

    /**
     * Invented features on one 60-base record, worked by hand:
     *
     * <pre>
     * truth      + 11..30, + 41..50, - 5..20, - 50..58
     * predicted  + 11..30, + 45..55, - 5..15, - 40..45
     *
     * + strand: truth covers 11-30, 41-50 (30); predicted 11-30, 45-55 (31); both 11-30, 45-50 (26)
     *           TP 26, FN 4 (41-44), FP 5 (51-55), TN 60-26-4-5 = 25
     * - strand: truth covers 5-20, 50-58 (25); predicted 5-15, 40-45 (17); both 5-15 (11)
     *           TP 11, FN 14 (16-20, 50-58), FP 6 (40-45), TN 60-11-14-6 = 29
     * total     TP 37, FP 11, FN 18, TN 54 (sum 120 = 2 strands x 60)
     * Sn = 37/55, Sp = 37/48
     * ACP = (37/55 + 37/48 + 54/65 + 54/72) / 4, AC = 2 (ACP - 1/2) = 7031/13728
     *
     * exact:   + 11..30 only                                         1 of 4 truth
     * 3'end:   + 11..30 (end 30), - 5..20 (start 5 = start of - 5..15)  2 of 4 truth
     * missed:  - 50..58 (the + 45..55 prediction is on the other strand)  1 of 4 truth
     * wrong:   - 40..45 (no truth on - there)                          1 of 4 predicted
     * </pre>
     */
    @Test
    void handWorkedRecordOfSixtyBases() {
        List<StrandedFeature> truth = List.of(f('+', 11, 30), f('+', 41, 50), f('-', 5, 20), f('-', 50, 58));
        List<StrandedFeature> predicted = List.of(f('+', 11, 30), f('+', 45, 55), f('-', 5, 15), f('-', 40, 45));

        GeneAccuracy a = GeneComparison.compareRecord(60, truth, predicted);

        assertThat(a.truePositives()).isEqualTo(37);
        assertThat(a.falsePositives()).isEqualTo(11);
        assertThat(a.falseNegatives()).isEqualTo(18);
        assertThat(a.trueNegatives()).isEqualTo(54);
        assertThat(a.sensitivity()).isCloseTo(37.0 / 55, within(EPS));
        assertThat(a.specificity()).isCloseTo(37.0 / 48, within(EPS));
        assertThat(a.approximateCorrelation()).isCloseTo(7031.0 / 13728, within(EPS));
        assertThat(a.truthFeatures()).isEqualTo(4);
        assertThat(a.predictedFeatures()).isEqualTo(4);
        assertThat(a.exactMatches()).isEqualTo(1);
        assertThat(a.threePrimeMatches()).isEqualTo(2);
        assertThat(a.missedFeatures()).isEqualTo(1);
        assertThat(a.wrongFeatures()).isEqualTo(1);
        assertThat(a.exactPercent()).isCloseTo(25.0, within(EPS));
        assertThat(a.threePrimePercent()).isCloseTo(50.0, within(EPS));
        assertThat(a.missedPercent()).isCloseTo(25.0, within(EPS));
        assertThat(a.wrongPercent()).isCloseTo(25.0, within(EPS));
    }

    /**
     * The base-level measures of a realistic comparison against a general-purpose library: smile-core 2.6.0
     * (test scope) computes sensitivity, precision (our Sp) and the Matthews correlation coefficient from per-base
     * labels. Burset and Guigo (1996, Genomics 34:353-367) introduce AC as an approximation of that correlation
     * coefficient CC (Matthews 1975, Biochim. Biophys. Acta 405:442-451) which stays defined when CC is not; where
     * both are defined they report them close, so AC is held within 0.05 of CC here.
     */
    @Test
    void approximateCorrelationIsCloseToTheCorrelationCoefficient() {
        // smile's MCC multiplies int counts (TP x TN), so the record stays small enough for those products
        int length = 30_000;
        Random random = new Random(20261203);
        List<StrandedFeature> truth = new ArrayList<>();
        List<StrandedFeature> predicted = new ArrayList<>();
        // invented genes of 150-450 bases, about half the bases coding on one strand or the other; predictions
        // that find most genes with ends off by up to 60 bases, put some on the wrong strand, and miss others
        for (int start = 1 + random.nextInt(100); start + 500 < length; start += 300 + random.nextInt(300)) {
            char strand = random.nextBoolean() ? '+' : '-';
            int end = start + 150 + random.nextInt(300);
            truth.add(f(strand, start, end));
            double fate = random.nextDouble();
            if (fate < 0.8) {
                predicted.add(f(strand, Math.max(1, start + random.nextInt(121) - 60), end + random.nextInt(121) - 60));
            } else if (fate < 0.9) {
                predicted.add(f(strand == '+' ? '-' : '+', start + 50, end + 50));
            }
        }
        GeneAccuracy a = GeneComparison.compareRecord(length, truth, predicted);

        int[] t = perBaseStrand(truth, length);
        int[] p = perBaseStrand(predicted, length);
        assertThat(a.sensitivity()).isCloseTo(Sensitivity.of(t, p), within(1e-9));
        assertThat(a.specificity()).isCloseTo(Precision.of(t, p), within(1e-9));
        double smileCc = MatthewsCorrelation.of(t, p);

        // CC written out as Matthews defines it, from our counts
        double tp = a.truePositives();
        double tn = a.trueNegatives();
        double fp = a.falsePositives();
        double fn = a.falseNegatives();
        double cc = (tp * tn - fn * fp) / Math.sqrt((tp + fn) * (tn + fp) * (tp + fp) * (tn + fn));
        assertThat(cc).isCloseTo(smileCc, within(1e-9));

        assertThat(a.sensitivity()).isBetween(0.5, 0.95); // the example is neither trivial nor hopeless
        assertThat(a.approximateCorrelation()).isCloseTo(cc, within(0.05));
        assertThat(a.approximateCorrelation()).isNotEqualTo(cc); // an approximation, computed on its own
    }

    /**
     * Burset and Guigo (1996) leave a term with a zero denominator out of the mean: with no prediction at all,
     * TP/(TP+FP) is undefined and ACP = (0 + TN/(TN+FP) + TN/(TN+FN)) / 3.
     */
    @Test
    void undefinedTermsAreLeftOutOfTheMean() {
        GeneAccuracy a = GeneComparison.compareRecord(10, List.of(f('+', 1, 5)), List.of());
        // + strand: FN 5, TN 5; - strand: TN 10
        assertThat(a.trueNegatives()).isEqualTo(15);
        assertThat(a.falseNegatives()).isEqualTo(5);
        assertThat(a.specificity()).isNaN();
        double acp = (0.0 + 15.0 / 15 + 15.0 / 20) / 3;
        assertThat(a.approximateCorrelation()).isCloseTo((acp - 0.5) * 2, within(EPS));
        assertThat(a.wrongPercent()).isNaN();
        assertThat(a.missedPercent()).isCloseTo(100.0, within(EPS));
    }

    @Test
    void recordsTakeTheirLengthFromTruthThenPredictionsThenFeatures() {
        FeatureSet truth = new FeatureSet("ref.gff3",
                List.of(new StrandedFeature("a", 1, 10, '+'), new StrandedFeature("b", 5, 8, '-')), Map.of("a", 100L));
        FeatureSet predicted = new FeatureSet("pred.gff3",
                List.of(new StrandedFeature("b", 5, 8, '-'), new StrandedFeature("c", 3, 7, '+')), Map.of("b", 50L));

        Evaluation e = GeneComparison.compare(truth, predicted);

        assertThat(e.records()).extracting(RecordAccuracy::seqid).containsExactly("a", "b", "c");
        assertThat(e.records()).extracting(RecordAccuracy::length).containsExactly(100L, 50L, 7L);
        assertThat(e.records()).extracting(RecordAccuracy::lengthSource)
                .containsExactly(LengthSource.TRUTH, LengthSource.PREDICTED, LengthSource.FURTHEST_FEATURE);
        assertThat(e.totalLength()).isEqualTo(157);
        assertThat(e.anyLengthEstimated()).isTrue();
        // the total pools counts: TN = 2 x 157 minus the coding positions of either file
        GeneAccuracy total = e.total();
        assertThat(total.truePositives()).isEqualTo(4);
        assertThat(total.falseNegatives()).isEqualTo(10);
        assertThat(total.falsePositives()).isEqualTo(5);
        assertThat(total.trueNegatives()).isEqualTo(2 * 157 - 19);
        assertThat(total.wrongFeatures()).isEqualTo(1);
        assertThat(total.missedFeatures()).isEqualTo(1);
    }

    @Test
    void aFeaturePastTheRecordEndOrDisagreeingLengthsAreBadInput() {
        FeatureSet truth = new FeatureSet("ref.gff3", List.of(new StrandedFeature("a", 1, 10, '+')), Map.of("a", 20L));
        FeatureSet past = new FeatureSet("pred.gff3", List.of(new StrandedFeature("a", 15, 25, '-')), Map.of());
        assertThatThrownBy(() -> GeneComparison.compare(truth, past))
                .isInstanceOf(BadInputException.class)
                .hasMessage("pred.gff3: record a: feature 15..25 (-) ends past the record's length 20 (from ref.gff3)");
        FeatureSet longer = new FeatureSet("pred.gff3", List.of(), Map.of("a", 21L));
        assertThatThrownBy(() -> GeneComparison.compare(truth, longer))
                .isInstanceOf(BadInputException.class)
                .hasMessage("pred.gff3: record a: length 21 differs from length 20 in ref.gff3");
    }

    /** A CDS part listed under two mRNAs is one feature; the parts of a spliced CDS stay apart. */
    @Test
    void repeatedPartsCountOnceAndSplicedPartsSeparately() {
        List<StrandedFeature> truth = List.of(f('+', 1, 10), f('+', 1, 10), f('+', 21, 30));
        GeneAccuracy a = GeneComparison.compareRecord(40, truth, List.of(f('+', 21, 30)));
        assertThat(a.truthFeatures()).isEqualTo(2);
        assertThat(a.exactMatches()).isEqualTo(1);
        assertThat(a.missedFeatures()).isEqualTo(1);
    }

    /** 1 for a coding base-strand position, 0 otherwise: + strand positions first, then - strand. */
    static int[] perBaseStrand(List<StrandedFeature> features, int length) {
        int[] labels = new int[2 * length];
        for (StrandedFeature x : features) {
            int offset = x.strand() == '+' ? 0 : length;
            for (long i = x.start(); i <= x.end(); i++) {
                labels[offset + (int) i - 1] = 1;
            }
        }
        return labels;
    }

    static StrandedFeature f(char strand, long start, long end) {
        return new StrandedFeature("r", start, end, strand);
    }
}
