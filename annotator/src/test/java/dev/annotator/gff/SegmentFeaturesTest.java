package dev.annotator.gff;

import dev.annotator.decode.Composition;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.Segment;
import dev.annotator.model.Label;
import htsjdk.tribble.gff.Gff3Codec;
import htsjdk.tribble.readers.LineIterator;
import htsjdk.tribble.readers.LineIteratorImpl;
import htsjdk.tribble.readers.SynchronousLineReader;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class SegmentFeaturesTest {
    // SO term names and accessions recalled from memory (CpG_island SO:0000307, region SO:0000001); the code
    // copies whatever the model says, so they only need to be plausible here
    private static final List<Label> LABELS = List.of(
            new Label("background", "region", "SO:0000001", true, false),
            new Label("island", "CpG_island", "SO:0000307", false, true),
            new Label("repeat", "repeat_region", "SO:0000657", false, false));

    private final SegmentFeatures features = new SegmentFeatures(LABELS);

    @Test
    void calledSegmentBecomesAFeatureWithScoreAndAttributesInOrder() {
        RecordAnnotation rec = new RecordAnnotation("chr1", 5000, -1234.5, List.of(
                new Segment("island", 101, 900, 0.98765, 0.51249, 37.456, new Composition(0.6789, 0.81234)),
                new Segment("repeat", 1000, 1200, 0.7, 0.2, -3.001, null)));
        List<Gff3Feature> out = features.called(rec, new FeatureIdAllocator());

        assertThat(out.get(0)).isEqualTo(new Gff3Feature("chr1", "annotator", "CpG_island", 101, 900, 0.98765, '.',
                ".", List.of(Map.entry("ID", List.of("island_1")), Map.entry("posterior_min", List.of("0.512")),
                Map.entry("log_odds", List.of("37.46")), Map.entry("gc", List.of("0.679")),
                Map.entry("cpg_oe", List.of("0.812")))));
        // no composition -> no gc/cpg_oe
        assertThat(out.get(1)).isEqualTo(new Gff3Feature("chr1", "annotator", "repeat_region", 1000, 1200, 0.7, '.',
                ".", List.of(Map.entry("ID", List.of("repeat_1")), Map.entry("posterior_min", List.of("0.200")),
                Map.entry("log_odds", List.of("-3.00")))));
    }

    @Test
    void cpgObservedExpectedIsLeftOutWhenUndefined() {
        // Composition: NaN when the segment has no C or no G (Gardiner-Garden & Frommer's ratio divides by nC*nG)
        RecordAnnotation rec = new RecordAnnotation("c", 100, -1, List.of(
                new Segment("island", 1, 10, 0.9, 0.8, 2.0, new Composition(0.5, Double.NaN))));
        Gff3Feature f = features.called(rec, new FeatureIdAllocator()).get(0);
        assertThat(f.attributes()).extracting(Map.Entry::getKey)
                .containsExactly("ID", "posterior_min", "log_odds", "gc");
    }

    @Test
    void idsCountUpPerLabelAcrossRecordsOfOneFile() {
        FeatureIdAllocator ids = new FeatureIdAllocator();
        List<Gff3Feature> all = new ArrayList<>();
        all.addAll(features.called(new RecordAnnotation("a", 100, -1, List.of(
                new Segment("island", 1, 10, 0.9, 0.8, 2.0, null),
                new Segment("repeat", 20, 30, 0.9, 0.8, 2.0, null),
                new Segment("island", 40, 50, 0.9, 0.8, 2.0, null))), ids));
        all.addAll(features.called(new RecordAnnotation("b", 100, -1, List.of(
                new Segment("island", 5, 10, 0.9, 0.8, 2.0, null))), ids));
        all.add(features.truth("b", "repeat", 60, 70, ids));
        assertThat(all).extracting(f -> f.attributes().get(0).getValue().get(0))
                .containsExactly("island_1", "repeat_1", "island_2", "island_3", "repeat_2");
    }

    @Test
    void truthFeatureHasNoScoreAndOnlyAnId() {
        Gff3Feature f = features.truth("chr2", "island", 7, 99, new FeatureIdAllocator());
        assertThat(f).isEqualTo(new Gff3Feature("chr2", "annotator", "CpG_island", 7, 99, null, '.', ".",
                List.of(Map.entry("ID", List.of("island_1")))));
    }

    @Test
    void unknownAndBackgroundLabelsAreRejected() {
        FeatureIdAllocator ids = new FeatureIdAllocator();
        assertThatThrownBy(() -> features.truth("c", "nope", 1, 2, ids)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> features.truth("c", "background", 1, 2, ids))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void writtenIdsAreUniqueForAnIndependentReader() throws IOException {
        // GFF3 v1.26 "Column 9", ID: unique within the scope of the file; htsjdk links lines sharing an ID as
        // co-features of one discontinuous feature, so a repeated ID would show up as hasCoFeatures()
        FeatureIdAllocator ids = new FeatureIdAllocator();
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        w.writeHeader();
        for (String seqid : List.of("a", "b", "c")) {
            w.writeSequenceRegion(seqid, 1000);
            List<Segment> segs = new ArrayList<>();
            for (int i = 0; i < 5; i++) {
                segs.add(new Segment(i % 2 == 0 ? "island" : "repeat", 1 + 100 * i, 50 + 100 * i, 0.9, 0.5, 1.0,
                        null));
            }
            for (Gff3Feature f : features.called(new RecordAnnotation(seqid, 1000, -1, segs), ids)) {
                w.writeFeature(f);
            }
        }
        w.close();

        Gff3Codec codec = new Gff3Codec();
        LineIterator lines = new LineIteratorImpl(new SynchronousLineReader(new StringReader(sw.toString())));
        int n = 0;
        while (!codec.isDone(lines)) {
            htsjdk.tribble.gff.Gff3Feature f = codec.decode(lines);
            if (f != null) {
                n++;
                assertThat(f.hasCoFeatures()).as(f.getID()).isFalse();
                assertThat(f.getScore()).isEqualTo(0.9);
            }
        }
        assertThat(n).isEqualTo(15);
    }
}
