package dev.annotator.decode;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.nio.charset.StandardCharsets;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Partial flags, phase and start codon of decoded genes. Phase as the GFF3 specification v1.26 defines it for CDS
 * (column 8): the number of bases to remove from the beginning of the feature to reach the first base of the next
 * codon, the beginning being the 5' end on the feature's strand.
 */
class GeneDetailsTest {
    // invented record, 29 bases: a forward ATG at 0-based 3..5, lowercase on purpose; CAT at 0-based 23..25
    private static final byte[] BASES = "GCAatgAAACCCGGGTTTAAAGCCATTCG".getBytes(StandardCharsets.US_ASCII);

    @Test
    void geneInsideTheRecordIsComplete() {
        GeneDetails fwd = GeneDetails.of('+', BASES, 3, 21, 1);
        assertThat(fwd).isEqualTo(new GeneDetails('+', false, false, 0, "ATG"));
        // the reverse gene's 5' end is its right end: CAT read backwards and complemented is ATG
        GeneDetails rev = GeneDetails.of('-', BASES, 6, 26, 3);
        assertThat(new String(BASES, 23, 3, StandardCharsets.US_ASCII)).isEqualTo("CAT");
        assertThat(rev).isEqualTo(new GeneDetails('-', false, false, 0, "ATG"));
    }

    @Test
    void partialFlagsFollowTheStrand() {
        int n = BASES.length;
        // forward: the record's first base is the gene's 5' side, its last base the 3' side
        assertThat(GeneDetails.of('+', BASES, 0, 12, 1)).extracting(GeneDetails::partial5, GeneDetails::partial3)
                .containsExactly(true, false);
        assertThat(GeneDetails.of('+', BASES, 3, n, 1)).extracting(GeneDetails::partial5, GeneDetails::partial3)
                .containsExactly(false, true);
        // reverse: the other way round
        assertThat(GeneDetails.of('-', BASES, 0, 12, 1)).extracting(GeneDetails::partial5, GeneDetails::partial3)
                .containsExactly(false, true);
        assertThat(GeneDetails.of('-', BASES, 3, n, 1)).extracting(GeneDetails::partial5, GeneDetails::partial3)
                .containsExactly(true, false);
        assertThat(GeneDetails.of('-', BASES, 0, n, 2)).extracting(GeneDetails::partial5, GeneDetails::partial3)
                .containsExactly(true, true);
    }

    @Test
    void startCodonOnlyWhenTheFivePrimeEndIsInTheRecord() {
        int n = BASES.length;
        // 3'-partial: the start is there
        assertThat(GeneDetails.of('+', BASES, 3, n, 1).startCodon()).isEqualTo("ATG");
        // reverse gene 3'-partial at the left end, start at its right end: bases 9..11 are CCC, so GGG
        assertThat(GeneDetails.of('-', BASES, 0, 12, 1).startCodon()).isEqualTo("GGG");
        // 5'-partial: no start codon
        assertThat(GeneDetails.of('+', BASES, 0, 12, 1).startCodon()).isNull();
        assertThat(GeneDetails.of('-', BASES, 9, n, 1).startCodon()).isNull();
    }

    /** A 5'-partial gene whose 5'-most base sits at codon position p: bases to skip until position 1 comes round. */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3})
    void phaseOfAFivePrimePartialGeneFromTheCodonPosition(int position) {
        int skip = 0;
        for (int p = position; p != 1; p = p % 3 + 1) {
            skip++;
        }
        // forward gene from the record's first base; reverse gene up to its last
        assertThat(GeneDetails.of('+', BASES, 0, 20, position).phase()).isEqualTo(skip);
        assertThat(GeneDetails.of('-', BASES, 10, BASES.length, position).phase()).isEqualTo(skip);
        // whole genes always have phase 0, whatever the path says
        assertThat(GeneDetails.of('+', BASES, 1, 20, position).phase()).isZero();
    }

    /**
     * Posterior decoding knows no codon position; when the 3' end is complete the gene ends on a whole codon, so
     * the bases beyond whole codons are at the 5' end: phase = length mod 3.
     */
    @ParameterizedTest
    @ValueSource(ints = {15, 16, 17})
    void phaseOfAFivePrimePartialGeneFromItsLength(int length) {
        GeneDetails fwd = GeneDetails.of('+', BASES, 0, length, 0);
        GeneDetails rev = GeneDetails.of('-', BASES, BASES.length - length, BASES.length, 0);
        for (GeneDetails g : new GeneDetails[]{fwd, rev}) {
            assertThat(g.partial5()).isTrue();
            assertThat(g.partial3()).isFalse();
            // after removing `phase` bases the rest is whole codons
            assertThat((length - g.phase()) % 3).isZero();
            assertThat(g.phase()).isBetween(0, 2);
        }
        assertThat(fwd.phase()).isEqualTo(length % 3);
    }

    @Test
    void bothEndsOpenAndNoPositionMeansPhaseZero() {
        assertThat(GeneDetails.of('+', BASES, 0, BASES.length, 0).phase()).isZero();
    }
}
