package dev.annotator.conformance;

import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The recount used by the conformance tests, on invented sequences worked out by hand from the definitions of
 * Gardiner-Garden &amp; Frommer (1987, J Mol Biol 196:261).
 */
class BaseCountsTest {

    private static byte[] bases(String s) {
        return s.getBytes(StandardCharsets.US_ASCII);
    }

    @Test
    void countsUnambiguousBasesAndCpgAcrossCaseButNotAcrossAmbiguityCodes() {
        // C G C G A A T T N N c g : C and G three times each, CpG at 1-2, 3-4 and 11-12 (G-C at 2-3 is not one)
        BaseCounts all = BaseCounts.of(bases("CGCGAATTNNcg"), 1, 12);
        assertThat(all).isEqualTo(new BaseCounts(2, 3, 3, 2, 10, 2, 3));
        assertThat(all.gc()).isEqualTo(0.6);
        // 3 x 10 / (3 x 3)
        assertThat(all.cpgObservedExpected()).isEqualTo(30.0 / 9);
        // a C and a G with an ambiguity code between them are no CpG; U counts as T
        assertThat(BaseCounts.of(bases("CNGuU"), 1, 5)).isEqualTo(new BaseCounts(0, 1, 1, 2, 4, 1, 0));
        // coordinates are 1-based and closed: bases 3..4 of "AACGTT" are "CG"
        assertThat(BaseCounts.of(bases("AACGTT"), 3, 4)).isEqualTo(new BaseCounts(0, 1, 1, 0, 2, 0, 1));
        assertThat(BaseCounts.of(bases("AACGTT"), 4, 5).cpg()).isZero();
    }

    @Test
    void printedThreeDecimalsMustBeTheRoundedValue() {
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.333", 1, 3)).isTrue();
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.334", 1, 3)).isFalse();
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.667", 2, 3)).isTrue();
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.666", 2, 3)).isFalse();
        // exactly halfway (0.6125): either neighbour is accepted, nothing further away
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.613", 49, 80)).isTrue();
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.612", 49, 80)).isTrue();
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.611", 49, 80)).isFalse();
        // the form is exactly three decimals
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.33", 1, 3)).isFalse();
        assertThat(BaseCounts.isRoundedToThreeDecimals("0.3333", 1, 3)).isFalse();
        assertThat(BaseCounts.isRoundedToThreeDecimals("1.250", 5, 4)).isTrue();
        assertThat(BaseCounts.isRoundedToThreeDecimals("NaN", 1, 0)).isFalse();
    }

    @Test
    void gardinerGardenFrommerThresholdsAreStrict() {
        // 200 bases, GC 0.51, o/e = 30 x 200 / (51 x 51) = 2.31: an island
        BaseCounts island = new BaseCounts(49, 51, 51, 49, 200, 0, 30);
        assertThat(island.meetsGardinerGardenFrommer(200)).isTrue();
        // length 199 is below the criterion's minimum
        assertThat(island.meetsGardinerGardenFrommer(199)).isFalse();
        // GC exactly 0.5 is not above 0.5
        assertThat(new BaseCounts(50, 50, 50, 50, 200, 0, 30).meetsGardinerGardenFrommer(200)).isFalse();
        // o/e exactly 0.6: 12 x 200 / (50 x 80); GC is 130 / 200 = 0.65
        assertThat(new BaseCounts(35, 50, 80, 35, 200, 0, 12).meetsGardinerGardenFrommer(200)).isFalse();
        assertThat(new BaseCounts(35, 50, 80, 35, 200, 0, 13).meetsGardinerGardenFrommer(200)).isTrue();
        // no G at all: no ratio, no island
        assertThat(new BaseCounts(50, 100, 0, 50, 200, 0, 0).meetsGardinerGardenFrommer(200)).isFalse();
    }
}
