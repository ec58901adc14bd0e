package dev.annotator.gff;

import dev.annotator.decode.GeneDetails;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.Segment;
import dev.annotator.model.Label;
import dev.annotator.testing.HtsjdkGff3;
import htsjdk.tribble.annotation.Strand;
import htsjdk.tribble.gff.Gff3Codec;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.StringWriter;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Gene segments become a {@code gene} and a {@code CDS} joined by {@code Parent}, read back by an independent
 * parser, htsjdk's {@link Gff3Codec} (4.1.3, test scope). GFF3 specification v1.26: Parent names the parent
 * feature's ID (Column 9), and the phase (Column 8) is required for CDS features.
 */
class GeneFeaturesTest {
    // CDS is SO:0000316 (recalled from memory); the writer copies whatever the label says
    private static final List<Label> LABELS = List.of(
            new Label("cds_forward", "CDS", "SO:0000316", false, false, '+'),
            new Label("cds_reverse", "CDS", "SO:0000316", false, false, '-'),
            new Label("noncoding", null, null, true, false));

    private static final RecordAnnotation RECORD = new RecordAnnotation("chrA", 5000, -1.0, List.of(
            new Segment("cds_forward", 1, 299, 0.81, 0.4, 12.345, null, new GeneDetails('+', true, false, 2, null)),
            new Segment("cds_reverse", 400, 1200, 0.97, 0.9, 80.0, null, new GeneDetails('-', false, false, 0, "ATG")),
            new Segment("cds_forward", 1500, 2100, 0.99, 0.95, 60.0, null, new GeneDetails('+', false, false, 0, "GTG")),
            new Segment("cds_reverse", 4600, 5000, 0.7, 0.3, 5.0, null, new GeneDetails('-', true, false, 1, null)),
            new Segment("cds_forward", 4700, 5000, 0.6, 0.2, 1.0, null, new GeneDetails('+', false, true, 0, "TTG"))));

    @Test
    void eachGeneIsAGeneWithOneCdsChild() {
        List<Gff3Feature> out = new SegmentFeatures(LABELS).called(RECORD, new FeatureIdAllocator());
        assertThat(out).hasSize(10);
        Gff3Feature gene = out.get(2);
        Gff3Feature cds = out.get(3);
        assertThat(gene).isEqualTo(new Gff3Feature("chrA", "annotator", "gene", 400, 1200, 0.97, '-', ".",
                List.of(Map.entry("ID", List.of("gene_2")))));
        assertThat(cds).isEqualTo(new Gff3Feature("chrA", "annotator", "CDS", 400, 1200, 0.97, '-', "0",
                List.of(Map.entry("ID", List.of("cds_2")), Map.entry("Parent", List.of("gene_2")),
                        Map.entry("posterior_min", List.of("0.900")), Map.entry("log_odds", List.of("80.00")),
                        Map.entry("start_codon", List.of("ATG")))));
        // the 5'-partial gene: no start codon, its phase, partial on both features
        assertThat(out.get(1).phase()).isEqualTo("2");
        assertThat(out.get(1).attributes()).extracting(Map.Entry::getKey)
                .containsExactly("ID", "Parent", "posterior_min", "log_odds", "partial");
        assertThat(out.get(0).attributes()).contains(Map.entry("partial", List.of("5'")));
    }

    @Test
    void htsjdkReadsTheCdsAsChildOfItsGene() throws IOException {
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        w.writeHeader();
        w.writeSequenceRegion("chrA", 5000);
        for (Gff3Feature f : new SegmentFeatures(LABELS).called(RECORD, new FeatureIdAllocator())) {
            w.writeFeature(f);
        }
        w.close();

        // the codec hands out each feature once, linked to its parents and children
        List<htsjdk.tribble.gff.Gff3Feature> all = HtsjdkGff3.decodeAll(sw.toString());
        List<htsjdk.tribble.gff.Gff3Feature> genes = all.stream().filter(f -> f.getType().equals("gene")).toList();
        List<htsjdk.tribble.gff.Gff3Feature> cds = all.stream().filter(f -> f.getType().equals("CDS")).toList();
        assertThat(genes).hasSize(5);
        assertThat(cds).hasSize(5);
        for (htsjdk.tribble.gff.Gff3Feature g : genes) {
            assertThat(g.isTopLevelFeature()).isTrue();
            assertThat(g.getChildren()).hasSize(1);
            htsjdk.tribble.gff.Gff3Feature child = g.getChildren().iterator().next();
            assertThat(child.getType()).isEqualTo("CDS");
            assertThat(child.getParents()).hasSize(1);
            assertThat(child.getParents().iterator().next()).isSameAs(g);
            assertThat(child.getAttribute("Parent")).containsExactly(g.getID());
            assertThat(child.getStart()).isEqualTo(g.getStart());
            assertThat(child.getEnd()).isEqualTo(g.getEnd());
            assertThat(child.getStrand()).isEqualTo(g.getStrand()).isNotEqualTo(Strand.NONE);
            // every CDS has a phase 0..2 (the specification requires it for CDS)
            assertThat(child.getPhase()).isBetween(0, 2);
        }
        htsjdk.tribble.gff.Gff3Feature partial5 = byStart(cds, 1);
        assertThat(partial5.getPhase()).isEqualTo(2);
        assertThat(partial5.getAttribute("partial")).containsExactly("5'");
        assertThat(partial5.getAttributes()).doesNotContainKey("start_codon");
        htsjdk.tribble.gff.Gff3Feature reverse = byStart(cds, 400);
        assertThat(reverse.getStrand()).isEqualTo(Strand.NEGATIVE);
        assertThat(reverse.getAttribute("start_codon")).containsExactly("ATG");
        assertThat(reverse.getAttributes()).doesNotContainKey("partial");
        htsjdk.tribble.gff.Gff3Feature reversePartial = byStart(cds, 4600);
        assertThat(reversePartial.getPhase()).isEqualTo(1);
        assertThat(reversePartial.getAttribute("partial")).containsExactly("5'");
        htsjdk.tribble.gff.Gff3Feature partial3 = byStart(cds, 4700);
        assertThat(partial3.getStrand()).isEqualTo(Strand.POSITIVE);
        assertThat(partial3.getAttribute("partial")).containsExactly("3'");
        assertThat(partial3.getAttribute("start_codon")).containsExactly("TTG");
        assertThat(byStart(genes, 4700).getAttribute("partial")).containsExactly("3'");
    }

    @Test
    void aGeneOpenAtBothEndsListsBothPartialEnds() throws IOException {
        RecordAnnotation rec = new RecordAnnotation("c", 90, -1, List.of(
                new Segment("cds_reverse", 1, 90, 0.9, 0.8, 2.0, null, new GeneDetails('-', true, true, 0, null))));
        List<Gff3Feature> out = new SegmentFeatures(LABELS).called(rec, new FeatureIdAllocator());
        assertThat(out.get(1).attributes()).contains(Map.entry("partial", List.of("5'", "3'")));
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        w.writeFeature(out.get(1));
        w.close();
        // several values of one tag are separated by commas (specification, Column 9)
        assertThat(sw.toString()).contains("partial=5',3'");
    }

    private static htsjdk.tribble.gff.Gff3Feature byStart(List<htsjdk.tribble.gff.Gff3Feature> features, int start) {
        return features.stream().filter(f -> f.getStart() == start).findFirst().orElseThrow();
    }
}
