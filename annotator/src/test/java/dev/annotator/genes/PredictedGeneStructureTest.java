package dev.annotator.genes;

import dev.annotator.decode.Segment;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Locale;
import java.util.Set;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Every gene the shipped model predicts in a real genome is a well-formed coding sequence under NCBI translation
 * table 11: a complete gene starts with ATG, GTG or TTG, ends with TAA, TAG or TGA, is a whole number of codons,
 * and has no stop codon in frame before its end; a partial gene has no in-frame stop inside its whole codons.
 * Checked with our own reading of the bases, independent of the model's tables.
 */
class PredictedGeneStructureTest {
    private static final Set<String> STARTS = Set.of("ATG", "GTG", "TTG");
    private static final Set<String> STOPS = Set.of("TAA", "TAG", "TGA");

    @Test
    void everyPredictedGeneInTheChlamydiaGenomeIsAWellFormedCodingSequence() {
        checkAll(RealGenomes.chlamydia(), 850);
    }

    @Test
    void everyPredictedGeneInTheChloroplastIsAWellFormedCodingSequence() {
        checkAll(RealGenomes.chloroplast(), 50);
    }

    private static void checkAll(RealGenomes.Genome g, int atLeast) {
        HmmModel shipped = ModelLoader.load("bacterial-genes");
        GeneExperiment.Stretch whole = GeneExperiment.whole(g);
        List<Segment> genes = GeneExperiment.decode(shipped, whole);
        assertThat(genes).hasSizeGreaterThanOrEqualTo(atLeast);
        String seq = g.sequence().toUpperCase(Locale.ROOT);
        int complete = 0;
        for (Segment s : genes) {
            String cds = s.gene().strand() == '+' ? seq.substring(s.start() - 1, s.end())
                    : NaiveOrfBaseline.reverseComplement(seq.substring(s.start() - 1, s.end()));
            String where = s.gene().strand() + " " + s.start() + ".." + s.end();
            int phase = s.gene().phase();
            boolean partial = s.gene().partial5() || s.gene().partial3();
            for (int i = phase; i + 3 <= cds.length() - (partial ? 0 : 3); i += 3) {
                assertThat(STOPS).as(where + " codon at " + i).doesNotContain(cds.substring(i, i + 3));
            }
            if (!partial) {
                complete++;
                assertThat(cds.length() % 3).as(where).isZero();
                assertThat(phase).as(where).isZero();
                assertThat(STARTS).as(where).contains(cds.substring(0, 3));
                assertThat(s.gene().startCodon()).as(where).isEqualTo(cds.substring(0, 3));
                assertThat(STOPS).as(where).contains(cds.substring(cds.length() - 3));
            }
        }
        assertThat(complete).isGreaterThan(atLeast - 5);
    }
}
