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
 * (Baum-Welch without labels, 10 iterations, transitions frozen: see below), compared with the naive ORF baseline
 * on the same record. The reference is each record's simple CDS; the chloroplast's 15 spliced CDS are not in it,
 * so predictions on their exons count as wrong for every predictor alike (one test counts their parts instead).
 * Measured figures are printed; what is asserted is what was measured to hold (see the closing notes of the
 * gene-structure work for the full table).
 *
 * <p>Why frozen transitions: on an unlabelled record Baum-Welch also refits the gene and gap lengths, and on the
 * chloroplast it shortened the expected gene from about 1.1 kb to 270 bp, so short stretches became genes. With
 * the transitions kept, only the composition moves: on the chloroplast Sn 0.977, stops 0.857 and exact 0.643
 * against 0.964, 0.814 and 0.557 with everything trained (Sp 0.779 and 0.781), and on the Chlamydia half it is
 * as good as training everything ({@link HalfGenomeAccuracyTest}).
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
        HmmModel self = GeneExperiment.selfTrain(ModelLoader.load("bacterial-genes"), dir, whole, 10,
                Freeze.TRANSITIONS);
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

    /**
     * The chloroplast again, with each part of its spliced CDS counted as a reference gene (evaluate's
     * --cds-parts), so that bases of their exons count as coding: the self-trained model still beats the baseline
     * on sensitivity, stops and exact genes; its specificity (0.900 measured) stays below the baseline's (0.935),
     * mostly from genes called inside the ribosomal RNA operons of the inverted repeats.
     */
    @Test
    void withSplicedPartsCountedSelfTrainingStillBeatsTheBaselineOnSensitivityStopsAndExactGenes() {
        RealGenomes.Genome g = RealGenomes.read("NC_000932.gb.gz", true);
        GeneExperiment.Stretch whole = GeneExperiment.whole(g);
        HmmModel self = GeneExperiment.selfTrain(ModelLoader.load("bacterial-genes"), dir, whole, 10,
                Freeze.TRANSITIONS);
        GeneAccuracy a = GeneExperiment.accuracy(whole, GeneExperiment.genes(g.seqid(), GeneExperiment.decode(self, whole)));
        GeneAccuracy baseline = GeneExperiment.baseline(whole);
        System.out.println(g.seqid() + " with spliced parts, self-trained: " + GeneExperiment.figures(a));
        System.out.println(g.seqid() + " with spliced parts, baseline:     " + GeneExperiment.figures(baseline));
        assertThat(a.truthFeatures()).isEqualTo(103); // parts once per distinct position and strand
        assertThat(a.sensitivity()).isGreaterThan(baseline.sensitivity());
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
        HmmModel self = GeneExperiment.selfTrain(shipped, dir, whole, 10, Freeze.TRANSITIONS);
        GeneAccuracy selfTrained = GeneExperiment.accuracy(whole,
                GeneExperiment.genes(g.seqid(), GeneExperiment.decode(self, whole)));
        GeneAccuracy baseline = GeneExperiment.baseline(whole);
        System.out.println(g.seqid() + " shipped model: " + GeneExperiment.figures(plain));
        System.out.println(g.seqid() + " self-trained:  " + GeneExperiment.figures(selfTrained));
        System.out.println(g.seqid() + " baseline:      " + GeneExperiment.figures(baseline));
        return new GeneAccuracy[]{selfTrained, baseline};
    }
}
