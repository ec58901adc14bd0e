package dev.annotator.genes;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.model.State;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import dev.annotator.train.Freeze;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;
import dev.annotator.pipeline.TrainingPipeline;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The shipped gene model is what its provenance says: counting along the published record's genes, from the
 * topology the gene-topology command writes with its defaults, with pseudocount 1, reproduces every number.
 */
class ShippedGeneModelTest {

    @Test
    void retrainingFromThePublishedRecordReproducesTheShippedModel() {
        HmmModel shipped = ModelLoader.load("bacterial-genes");
        String ct = RealGenomes.FOLDER.resolve("ct.gbk.gz").toString();
        HmmModel start = GeneTopology.build("bacterial-genes", GeneticCode.TABLE_11, 4, 4, GeneTopology.DEFAULT_UPSTREAM);
        TrainingOptions counting = new TrainingOptions(TrainingMethod.COUNTING, 1, 1, 0, 0, 1, Freeze.NONE);
        HmmModel again = new TrainingPipeline(start, start.name(), List.of(ct), ct, counting, 2, w -> { })
                .train((r, rs, i, ll, g, n, t) -> { }, GeneExperiment.STAMP);
        assertThat(again.states()).isEqualTo(shipped.states());
        assertThat(again.start()).isEqualTo(shipped.start());
        assertThat(again.transitions()).isEqualTo(shipped.transitions());
        assertThat(again.labels()).isEqualTo(shipped.labels());
        // the provenance names the record by its checksum (test-data/README.md)
        assertThat(shipped.provenance().training().inputs().get(0).sha256())
                .isEqualTo("0a80287df42fb51b41d4d21c733239d4a18c415b540891a641259129b6d0b4c3");
    }

    @Test
    void stopCodonsCannotBeEmittedInsideAGeneOfTheShippedModel() {
        HmmModel shipped = ModelLoader.load("bacterial-genes");
        State third = shipped.states().get(shipped.stateIndex("codon+3"));
        // context rows ending in TA and TG: TAA, TAG and TGA are stops in NCBI translation table 11, TGG is not
        int ta = 0b0000_1100;
        int tg = 0b0000_1110;
        assertThat(third.emission(ta, 0)).isZero();
        assertThat(third.emission(ta, 2)).isZero();
        assertThat(third.emission(tg, 0)).isZero();
        assertThat(third.emission(tg, 2)).isPositive();
    }
}
