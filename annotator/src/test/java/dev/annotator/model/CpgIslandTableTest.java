package dev.annotator.model;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * External check of the shipped CpG island tables against a second table of the same source:
 * Durbin, Eddy, Krogh &amp; Mitchison, Biological Sequence Analysis (1998), the log-likelihood ratio table in
 * bits printed right after Table 3.1, beta(a,b) = log2(a+(a,b) / a-(a,b)). The book computes it from the
 * unrounded counts, so the ratios of the rounded, renormalised shipped rows must agree to about 0.01 bit only.
 * The printed values below are recalled from memory.
 */
class CpgIslandTableTest {
    private static final String BASES = "ACGT";

    // rows: preceding base A, C, G, T; columns: next base A, C, G, T
    private static final double[][] PRINTED_BITS = {
            {-0.740, 0.419, 0.580, -0.803},
            {-0.913, 0.302, 1.812, -0.685},
            {-0.624, 0.461, 0.331, -0.730},
            {-1.169, 0.573, 0.393, -0.679},
    };

    @Test
    void logOddsOfShippedTablesMatchThePrintedTable() {
        HmmModel m = ShippedModels.load("cpg-island").orElseThrow();
        State plus = m.states().get(m.stateIndex("island"));
        State minus = m.states().get(m.stateIndex("background"));
        for (int a = 0; a < 4; a++) {
            for (int b = 0; b < 4; b++) {
                double bits = Math.log(plus.emission(a, b) / minus.emission(a, b)) / Math.log(2);
                assertThat(bits).as("%c -> %c", BASES.charAt(a), BASES.charAt(b))
                        .isCloseTo(PRINTED_BITS[a][b], within(0.01));
            }
        }
    }
}
