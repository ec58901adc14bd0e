package dev.annotator.gff;

import dev.annotator.testing.HtsjdkGff3;
import htsjdk.tribble.TribbleException;
import htsjdk.tribble.annotation.Strand;
import htsjdk.tribble.gff.Gff3Codec;
import htsjdk.tribble.gff.SequenceRegion;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Reads our GFF3 back with an independent parser, htsjdk's {@link Gff3Codec} (4.1.3, test scope).
 *
 * <p>How that codec decodes, as observed here: it splits a line on tabs, then runs {@link java.net.URLDecoder}
 * (UTF-8) over seqid, source, type, tags and values, and {@code trim()}s tags and values. URLDecoder turns a
 * literal '+' into a space, which the GFF3 specification v1.26 ("Description of the Format") says is no longer
 * allowed, so the round trip below avoids '+' and leading/trailing spaces; {@link #htsjdkDeviations()} pins
 * both behaviours. A missing score "." comes back as -1, and strand '?' as {@link Strand#NONE}.
 * Lines are read here through a UTF-8 {@link java.io.Reader}: htsjdk's own AsciiLineReader decodes bytes as
 * Latin-1 and would garble non-ASCII attribute values, which the specification leaves unencoded.
 */
class Gff3HtsjdkReadBackTest {

    private static final String SEQ1 = "scaffold 7/\u03b1%&,;=\tend";
    private static final String SEQ2 = "chr\u00dc=2,b&c";
    private static final String TRICKY = "x;y=z&w,v\tq%r \u00fc\u00df \u65e5 end";

    private record Expected(String seqid, String type, int start, int end, double score, Strand strand,
                            Map<String, List<String>> attributes) {
    }

    @Test
    void featuresSurviveARoundTripThroughHtsjdk() throws IOException {
        List<Gff3Feature> written = List.of(
                feature(SEQ1, "CpG_island", 1, 500, 0.912, '+', List.of(
                        Map.entry("ID", List.of("island_1")),
                        Map.entry("note", List.of(TRICKY)),
                        Map.entry("tag;with=odd&chars,", List.of("a,b", "c;d", "e")))),
                feature(SEQ1, "region", 600, 1000, null, '-', List.of(Map.entry("ID", List.of("region_1")))),
                feature(SEQ2, "CpG_island", 3, 30, 0.0004, '.', List.of(
                        Map.entry("ID", List.of("island_2")),
                        Map.entry("gc", List.of("0.660")))));

        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        w.writeHeader();
        w.writeComment("two records, each with its own sequence-region");
        w.writeSequenceRegion(SEQ1, 1000);
        w.writeFeature(written.get(0));
        w.writeFeature(written.get(1));
        // a second ##sequence-region in the middle of the file, after features: the spec ("Other Syntax") allows
        // several, one per seqid, and places no constraint on where they appear
        w.writeSequenceRegion(SEQ2, 30);
        w.writeFeature(written.get(2));
        w.close();

        Gff3Codec codec = new Gff3Codec();
        List<htsjdk.tribble.gff.Gff3Feature> read = HtsjdkGff3.decodeAll(codec, sw.toString());

        List<Expected> expected = List.of(
                new Expected(SEQ1, "CpG_island", 1, 500, 0.912, Strand.POSITIVE, attrs(
                        "ID", List.of("island_1"), "note", List.of(TRICKY),
                        "tag;with=odd&chars,", List.of("a,b", "c;d", "e"))),
                // htsjdk's stand-in for the spec's "." score is -1
                new Expected(SEQ1, "region", 600, 1000, -1, Strand.NEGATIVE, attrs("ID", List.of("region_1"))),
                // 0.0004 is printed with 3 decimals as 0.000
                new Expected(SEQ2, "CpG_island", 3, 30, 0.0, Strand.NONE,
                        attrs("ID", List.of("island_2"), "gc", List.of("0.660"))));
        List<Expected> actual = new ArrayList<>();
        for (htsjdk.tribble.gff.Gff3Feature f : read) {
            assertThat(f.getSource()).isEqualTo(SegmentFeatures.SOURCE);
            assertThat(f.hasCoFeatures()).as("IDs are unique").isFalse();
            actual.add(new Expected(f.getContig(), f.getType(), f.getStart(), f.getEnd(), f.getScore(), f.getStrand(),
                    f.getAttributes()));
        }
        assertThat(actual).containsExactlyElementsOf(expected);
        // attribute order is kept (htsjdk stores them in a LinkedHashMap)
        assertThat(read.get(0).getAttributes().keySet()).containsExactly("ID", "note", "tag;with=odd&chars,");

        // both directives are registered, including the one that follows features
        assertThat(codec.getSequenceRegions()).extracting(SequenceRegion::getContig, SequenceRegion::getStart,
                SequenceRegion::getEnd).containsExactly(
                org.assertj.core.groups.Tuple.tuple(SEQ1, 1, 1000),
                org.assertj.core.groups.Tuple.tuple(SEQ2, 1, 30));
        assertThat(codec.getCommentTexts()).containsExactly(" two records, each with its own sequence-region");
    }

    @Test
    void htsjdkDeviations() throws IOException {
        // The spec lists '+' among the seqid characters that need no escape and deprecates '+' for space;
        // we write it literally, and htsjdk reads it as a space. Leading/trailing spaces of values are
        // trimmed by htsjdk although the spec allows spaces in fields.
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        w.writeHeader();
        w.writeFeature(feature("chr+1", "CpG_island", 1, 2, null, '?', List.of(
                Map.entry("ID", List.of("a+b")), Map.entry("note", List.of("  padded  ")))));
        w.close();
        assertThat(sw.toString()).endsWith("chr+1\tannotator\tCpG_island\t1\t2\t.\t?\t.\tID=a+b;note=  padded  \n");

        htsjdk.tribble.gff.Gff3Feature f = HtsjdkGff3.decodeAll(new Gff3Codec(), sw.toString()).get(0);
        assertThat(f.getContig()).isEqualTo("chr 1");
        assertThat(f.getID()).isEqualTo("a b");
        assertThat(f.getAttribute("note")).containsExactly("padded");
        assertThat(f.getStrand()).isEqualTo(Strand.NONE);
    }

    @Test
    void htsjdkRejectsWhatOurWriterAlsoRefuses() {
        // the spec's rule "only one ##sequence-region directive may be given for any given seqid" is enforced by
        // htsjdk as well; our writer refuses to produce such a file (Gff3WriterTest)
        String twice = "##gff-version 3\n##sequence-region a 1 10\n##sequence-region a 1 10\n";
        assertThatThrownBy(() -> HtsjdkGff3.decodeAll(new Gff3Codec(), twice)).isInstanceOf(TribbleException.class);
    }

    private static Gff3Feature feature(String seqid, String type, long start, long end, Double score, char strand,
                                       List<Map.Entry<String, List<String>>> attributes) {
        return new Gff3Feature(seqid, SegmentFeatures.SOURCE, type, start, end, score, strand, ".", attributes);
    }

    private static Map<String, List<String>> attrs(Object... tagValues) {
        Map<String, List<String>> m = new LinkedHashMap<>();
        for (int i = 0; i < tagValues.length; i += 2) {
            @SuppressWarnings("unchecked")
            List<String> values = (List<String>) tagValues[i + 1];
            m.put((String) tagValues[i], values);
        }
        return m;
    }
}
