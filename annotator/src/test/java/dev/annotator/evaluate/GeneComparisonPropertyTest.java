package dev.annotator.evaluate;

import dev.annotator.labels.StrandedFeature;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The sweep over merged runs against the definition applied base by base (Burset and Guigo 1996: TP, FP, FN, TN
 * count positions; here each base once per strand), and the feature-level counts against their definitions
 * applied pair by pair.
 */
class GeneComparisonPropertyTest {
    private static final int LENGTH = 200;

    @Property(tries = 1000, seed = "20261203")
    void countsEqualABaseByBaseAndPairByPairCount(@ForAll("features") List<StrandedFeature> truth,
                                                  @ForAll("features") List<StrandedFeature> predicted) {
        GeneAccuracy a = GeneComparison.compareRecord(LENGTH, truth, predicted);

        int[] t = GeneComparisonTest.perBaseStrand(truth, LENGTH);
        int[] p = GeneComparisonTest.perBaseStrand(predicted, LENGTH);
        long tp = 0, fp = 0, fn = 0, tn = 0;
        for (int i = 0; i < t.length; i++) {
            tp += t[i] == 1 && p[i] == 1 ? 1 : 0;
            fp += t[i] == 0 && p[i] == 1 ? 1 : 0;
            fn += t[i] == 1 && p[i] == 0 ? 1 : 0;
            tn += t[i] == 0 && p[i] == 0 ? 1 : 0;
        }
        assertThat(List.of(a.truePositives(), a.falsePositives(), a.falseNegatives(), a.trueNegatives()))
                .containsExactly(tp, fp, fn, tn);

        Set<StrandedFeature> ts = new LinkedHashSet<>(truth);
        Set<StrandedFeature> ps = new LinkedHashSet<>(predicted);
        long exact = ts.stream().filter(ps::contains).count();
        long threePrime = ts.stream().filter(x -> ps.stream().anyMatch(y -> y.strand() == x.strand()
                && (x.strand() == '+' ? y.end() == x.end() : y.start() == x.start()))).count();
        long missed = ts.stream().filter(x -> ps.stream().noneMatch(y -> overlapOnStrand(x, y))).count();
        long wrong = ps.stream().filter(y -> ts.stream().noneMatch(x -> overlapOnStrand(x, y))).count();
        assertThat(List.of(a.truthFeatures(), a.predictedFeatures(), a.exactMatches(), a.threePrimeMatches(),
                a.missedFeatures(), a.wrongFeatures()))
                .containsExactly((long) ts.size(), (long) ps.size(), exact, threePrime, missed, wrong);
    }

    @Property(tries = 500, seed = "20261204")
    void predictingTheTruthScoresOne(@ForAll("features") List<StrandedFeature> truth,
                                     @ForAll @IntRange(min = 0, max = 5) int extraLength) {
        if (truth.isEmpty()) {
            return; // nothing coding: Sn and Sp are undefined
        }
        GeneAccuracy a = GeneComparison.compareRecord(LENGTH + extraLength, truth, List.copyOf(truth));
        assertThat(a.sensitivity()).isEqualTo(1.0);
        assertThat(a.specificity()).isEqualTo(1.0);
        assertThat(a.approximateCorrelation()).isEqualTo(1.0);
        assertThat(a.exactPercent()).isEqualTo(100.0);
        assertThat(a.threePrimePercent()).isEqualTo(100.0);
        assertThat(a.missedFeatures()).isZero();
        assertThat(a.wrongFeatures()).isZero();
    }

    private static boolean overlapOnStrand(StrandedFeature x, StrandedFeature y) {
        return x.strand() == y.strand() && x.start() <= y.end() && y.start() <= x.end();
    }

    @Provide
    Arbitrary<List<StrandedFeature>> features() {
        Arbitrary<StrandedFeature> one = Combinators.combine(
                Arbitraries.integers().between(1, LENGTH),
                Arbitraries.integers().between(0, 40),
                Arbitraries.of('+', '-'))
                .as((start, span, strand) -> new StrandedFeature("r", start, Math.min(LENGTH, start + span), strand));
        return one.list().ofMaxSize(12);
    }
}
