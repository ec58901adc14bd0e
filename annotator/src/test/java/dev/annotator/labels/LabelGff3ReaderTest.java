package dev.annotator.labels;

import dev.annotator.error.BadInputException;
import dev.annotator.gff.Gff3Feature;
import dev.annotator.gff.Gff3Writer;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ShippedModels;
import dev.annotator.testing.HtsjdkGff3;
import htsjdk.tribble.gff.Gff3Codec;
import org.junit.jupiter.api.Test;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * The labels reader against the GFF3 specification v1.26 (Sequence Ontology) and against an independent reader,
 * htsjdk's {@link Gff3Codec} (4.1.3, test scope).
 */
class LabelGff3ReaderTest {
    private static final HmmModel ISLANDS = ShippedModels.load("cpg-island").orElseThrow();

    /** Seqids with characters the specification makes us escape (column 1: outside [a-zA-Z0-9.:^*$@!_?-|]). */
    @Test
    void escapedSeqidsDecodeAsHtsjdkDecodesThem() throws IOException {
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        w.writeHeader();
        List<String> seqids = List.of("scaffold 7/\u03b1;x=1", "chr%2", "plain_id");
        long start = 10;
        for (String seqid : seqids) {
            w.writeFeature(new Gff3Feature(seqid, "invented", "CpG_island", start, start + 5, null, '.', ".",
                    List.of(Map.entry("ID", List.of("f" + start)))));
            start += 10;
        }
        w.close();
        String text = sw.toString();
        KnownLabels ours = read(text, new ArrayList<>());
        List<htsjdk.tribble.gff.Gff3Feature> theirs = HtsjdkGff3.decodeAll(text);
        assertThat(theirs).hasSize(3);
        for (htsjdk.tribble.gff.Gff3Feature f : theirs) {
            assertThat(ours.seqids()).contains(f.getContig());
            LabelledInterval i = ours.first(f.getContig());
            assertThat(i.start()).isEqualTo(f.getStart());
            assertThat(i.end()).isEqualTo(f.getEnd());
        }
        assertThat(ours.seqids()).containsExactlyInAnyOrderElementsOf(seqids);
    }

    @Test
    void typesMapToLabelsByNameOrAccessionAndOthersAreSkippedWithOneWarning() throws IOException {
        String text = """
                ##gff-version 3
                # a comment
                ##sequence-region c1 1 100
                c1\tsrc\tCpG_island\t1\t10\t.\t+\t.\tID=a
                c1\tsrc\tSO:0000307\t20\t30\t.\t.\t.\tID=b
                c1\tsrc\tgene\t5\t50\t.\t.\t.\tID=g
                c1\tsrc\tgene\t60\t70\t.\t.\t.\tID=h
                c1\tsrc\texon\t60\t65\t.\t.\t.\tID=e

                ##FASTA
                >c1
                this is sequence, not a feature
                """;
        List<String> warnings = new ArrayList<>();
        KnownLabels labels = read(text, warnings);
        byte[] perBase = labels.labelsOf("c1", 100);
        int island = ISLANDS.labelIndex("island");
        int background = ISLANDS.labelIndex("background");
        for (int t = 0; t < 100; t++) {
            boolean inside = (t >= 0 && t < 10) || (t >= 19 && t < 30);
            assertThat(perBase[t]).as("base %d", t + 1).isEqualTo((byte) (inside ? island : background));
        }
        assertThat(warnings).containsExactly("labels.gff3: skipped features of types that are no label of model "
                + "cpg-island: exon (1), gene (2)");
    }

    @Test
    void featuresOfOneLabelMayOverlap() throws IOException {
        KnownLabels labels = read("c1\ts\tCpG_island\t1\t10\t.\t.\t.\t.\nc1\ts\tCpG_island\t5\t20\t.\t.\t.\t.\n",
                List.of());
        byte[] perBase = labels.labelsOf("c1", 25);
        assertThat(perBase[19]).isEqualTo((byte) ISLANDS.labelIndex("island"));
        assertThat(perBase[20]).isEqualTo((byte) ISLANDS.labelIndex("background"));
    }

    @Test
    void malformedLinesNameTheirLine() {
        assertThatThrownBy(() -> read("c1\ts\tCpG_island\tone\t10\t.\t.\t.\t.\n", List.of()))
                .isInstanceOf(BadInputException.class).hasMessage("labels.gff3:1: start 'one' is not an integer");
        assertThatThrownBy(() -> read("# x\nc1\ts\tCpG_island\t0\t10\t.\t.\t.\t.\n", List.of()))
                .isInstanceOf(BadInputException.class)
                .hasMessage("labels.gff3:2: start 0 is not a positive position (GFF3 counts from 1)");
        assertThatThrownBy(() -> read("c%4\ts\tCpG_island\t1\t10\t.\t.\t.\t.\n", List.of()))
                .isInstanceOf(BadInputException.class)
                .hasMessage("labels.gff3:1: column 1 (seqid): '%' not followed by two hexadecimal digits");
    }

    private static KnownLabels read(String text, List<String> warnings) throws IOException {
        return new LabelGff3Reader(ISLANDS).read(new BufferedReader(new StringReader(text)), "labels.gff3",
                warnings::add);
    }
}
