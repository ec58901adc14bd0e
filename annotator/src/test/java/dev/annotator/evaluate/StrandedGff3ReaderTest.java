package dev.annotator.evaluate;

import dev.annotator.error.BadInputException;
import dev.annotator.labels.StrandedFeature;
import htsjdk.tribble.annotation.Strand;
import htsjdk.tribble.gff.Gff3Codec;
import htsjdk.tribble.gff.Gff3Feature;
import htsjdk.tribble.gff.SequenceRegion;
import htsjdk.tribble.readers.LineIterator;
import htsjdk.tribble.readers.LineIteratorImpl;
import htsjdk.tribble.readers.SynchronousLineReader;
import org.junit.jupiter.api.Test;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * The reader against the GFF3 specification v1.26 (Sequence Ontology) and against an independent reader of it,
 * htsjdk's {@link Gff3Codec} (4.1.3, test scope).
 */
class StrandedGff3ReaderTest {
    /**
     * An invented file with a gene whose CDS is split over two lines that share an ID (the specification's way
     * of writing a spliced CDS), a seqid with escaped characters (the specification escapes column 1 outside
     * [a-zA-Z0-9.:^*$@!+_?-|]), a sequence-region directive per record, and a FASTA section at the end.
     */
    private static final String FILE = """
            ##gff-version 3
            ##sequence-region chr1 1 5000
            ##sequence-region scaffold%207%3Bx 1 900
            chr1\tinvented\tgene\t100\t900\t.\t+\t.\tID=g1
            chr1\tinvented\tmRNA\t100\t900\t.\t+\t.\tID=m1;Parent=g1
            chr1\tinvented\tCDS\t100\t300\t.\t+\t0\tID=c1;Parent=m1
            chr1\tinvented\tCDS\t500\t900\t.\t+\t1\tID=c1;Parent=m1
            chr1\tinvented\tCDS\t1200\t1800\t.\t-\t0\tID=c2
            scaffold%207%3Bx\tinvented\tCDS\t10\t99\t.\t-\t0\tID=c3
            ###
            ##FASTA
            >chr1
            ACGT
            """;

    @Test
    void featuresOfTheTypeAndRegionLengthsAsHtsjdkReadsThem() throws IOException {
        FeatureSet ours = read(FILE, "CDS");

        Gff3Codec codec = new Gff3Codec(Gff3Codec.DecodeDepth.SHALLOW);
        List<StrandedFeature> theirs = new ArrayList<>();
        LineIterator lines = new LineIteratorImpl(new SynchronousLineReader(new StringReader(FILE)));
        while (!codec.isDone(lines)) {
            Gff3Feature f = codec.decode(lines);
            if (f != null && f.getType().equals("CDS")) {
                theirs.add(new StrandedFeature(f.getContig(), f.getStart(), f.getEnd(),
                        f.getStrand() == Strand.POSITIVE ? '+' : '-'));
            }
        }
        Map<String, Long> theirLengths = new LinkedHashMap<>();
        for (SequenceRegion r : codec.getSequenceRegions()) {
            theirLengths.put(r.getContig(), (long) r.getEnd());
        }

        assertThat(theirs).hasSize(4);
        // each line of the spliced CDS c1 is its own feature
        assertThat(ours.features()).containsExactlyElementsOf(theirs);
        assertThat(ours.features()).extracting(StrandedFeature::seqid).contains("scaffold 7;x");
        assertThat(ours.recordLengths()).containsExactlyInAnyOrderEntriesOf(theirLengths);
        assertThat(ours.recordLengths()).containsEntry("chr1", 5000L);
        assertThat(ours.name()).isEqualTo("test.gff3");
    }

    @Test
    void theTypeIsChosen() throws IOException {
        assertThat(read(FILE, "mRNA").features()).containsExactly(new StrandedFeature("chr1", 100, 900, '+'));
        assertThat(read(FILE, "exon").features()).isEmpty();
    }

    /** Column 7 of GFF3 v1.26: + - for stranded, . for unstranded, ? for unknown. */
    @Test
    void unstrandedFeaturesOfTheTypeAreRefusedWithFileAndLine() {
        String text = "##gff-version 3\nc\ts\tgene\t1\t9\t.\t.\t.\tID=g\nc\ts\tCDS\t1\t9\t.\t?\t0\tID=c\n";
        assertThatThrownBy(() -> read(text, "CDS"))
                .isInstanceOf(BadInputException.class)
                .hasMessage("test.gff3:3: CDS feature has strand '?'; comparing needs + or - on every CDS");
        assertThatThrownBy(() -> read("c\ts\tCDS\t1\t9\t.\tx\t0\tID=c\n", "CDS"))
                .isInstanceOf(BadInputException.class)
                .hasMessage("test.gff3:1: strand 'x' is not one of + - . ?");
    }

    @Test
    void malformedLinesAndDirectivesNameFileAndLine() {
        assertThatThrownBy(() -> read("c\ts\tCDS\t1\t9\t.\t+\n", "CDS"))
                .hasMessage("test.gff3:1: expected 9 tab-separated columns, found 7");
        assertThatThrownBy(() -> read("#x\nc\ts\tCDS\t0\t9\t.\t+\t0\t.\n", "CDS"))
                .hasMessage("test.gff3:2: start 0 is not a positive position (GFF3 counts from 1)");
        assertThatThrownBy(() -> read("c\ts\tCDS\t9\t8\t.\t+\t0\t.\n", "CDS"))
                .hasMessage("test.gff3:1: end 8 is before start 9");
        assertThatThrownBy(() -> read("##sequence-region c 1\n", "CDS"))
                .hasMessage("test.gff3:1: ##sequence-region needs a seqid, a start and an end");
        assertThatThrownBy(() -> read("##sequence-region c 1 10\n##sequence-region c 1 11\n", "CDS"))
                .hasMessage("test.gff3:2: ##sequence-region gives record c a second, different end 11 (was 10)");
        assertThatThrownBy(() -> read("c%zz\ts\tCDS\t1\t9\t.\t+\t0\t.\n", "CDS"))
                .isInstanceOf(BadInputException.class)
                .hasMessageStartingWith("test.gff3:1: column 1 (seqid)");
    }

    private static FeatureSet read(String text, String type) throws IOException {
        return StrandedGff3Reader.read(new BufferedReader(new StringReader(text)), "test.gff3", type);
    }
}
