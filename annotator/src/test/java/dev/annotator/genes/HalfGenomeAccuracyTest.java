package dev.annotator.genes;

import dev.annotator.evaluate.GeneAccuracy;
import dev.annotator.labels.StrandedFeature;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import dev.annotator.train.Freeze;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import java.nio.file.Path;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The gene model against real annotation (the Chlamydia trachomatis genome, test-data/genbank/ct.gbk.gz): trained
 * by counting on the first half of the genes (by coordinate), it predicts the second half, and must beat the naive
 * ORF baseline measured on the same half on all four figures the gene-structure issue names. The baseline's own
 * figures on the whole genome are checked against an independent measurement in {@link BaselineFiguresTest}.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class HalfGenomeAccuracyTest {
    private GeneExperiment.Stretch second;
    private GeneAccuracy counted;
    private GeneAccuracy baseline;

    @BeforeAll
    void trainOnTheFirstHalf(@TempDir Path dir) {
        GeneExperiment.Stretch[] halves = GeneExperiment.halves(RealGenomes.chlamydia());
        second = halves[1];
        HmmModel start = GeneTopology.build("bacterial-genes", GeneticCode.TABLE_11, 4, 4, GeneTopology.DEFAULT_UPSTREAM);
        HmmModel model = GeneExperiment.count(start, dir, halves[0]);
        counted = GeneExperiment.accuracy(second,
                GeneExperiment.genes(second.seqid(), GeneExperiment.decode(model, second)));
        baseline = GeneExperiment.baseline(second);
        System.out.println("second half, counted on the first: " + GeneExperiment.figures(counted));
        System.out.println("second half, naive ORF baseline:   " + GeneExperiment.figures(baseline));
    }

    @Test
    void countingOnTheFirstHalfBeatsTheBaselineOnTheSecondOnEveryFigure() {
        assertThat(second.genes()).hasSize(446);
        assertThat(counted.sensitivity()).isGreaterThan(baseline.sensitivity());
        assertThat(counted.specificity()).isGreaterThan(baseline.specificity());
        assertThat(counted.threePrimePercent()).isGreaterThan(baseline.threePrimePercent());
        assertThat(counted.exactPercent()).isGreaterThan(baseline.exactPercent());
    }

    /**
     * Self-training: Baum-Welch without labels on the second half, starting from the shipped model, stays within
     * 0.02 of the counting result on every figure (the check), whether everything is trained or the
     * transitions are kept (the way the README recommends for a new genome).
     */
    @ParameterizedTest
    @EnumSource(value = Freeze.class, names = {"NONE", "TRANSITIONS"})
    void selfTrainingFromTheShippedModelStaysNearTheCountingResult(Freeze freeze, @TempDir Path dir) {
        HmmModel shipped = ModelLoader.load("bacterial-genes");
        HmmModel self = GeneExperiment.selfTrain(shipped, dir, second, 10, freeze);
        GeneAccuracy a = GeneExperiment.accuracy(second,
                GeneExperiment.genes(second.seqid(), GeneExperiment.decode(self, second)));
        System.out.println("second half, self-trained (freeze " + freeze + "): " + GeneExperiment.figures(a));
        assertThat(a.sensitivity()).isCloseTo(counted.sensitivity(), within(0.02));
        assertThat(a.specificity()).isCloseTo(counted.specificity(), within(0.02));
        assertThat(a.threePrimePercent() / 100).isCloseTo(counted.threePrimePercent() / 100, within(0.02));
        assertThat(a.exactPercent() / 100).isCloseTo(counted.exactPercent() / 100, within(0.02));
    }

    @Test
    void figuresAreThoseOfTheSecondHalfOnly() {
        List<StrandedFeature> genes = second.genes();
        assertThat(genes).allSatisfy(g -> assertThat(g.end()).isLessThanOrEqualTo(second.sequence().length()));
        assertThat(counted.truthFeatures()).isEqualTo(genes.size());
    }
}
