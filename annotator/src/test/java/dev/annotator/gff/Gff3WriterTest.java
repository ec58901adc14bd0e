package dev.annotator.gff;

import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.StringWriter;
import java.io.Writer;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Golden lines built by hand from the GFF3 specification v1.26 of the Sequence Ontology
 * (github.com/The-Sequence-Ontology/Specifications, gff3.md). Section names are quoted beside each check.
 */
class Gff3WriterTest {

    private static Gff3Feature feature(String seqid, String source, String type, long start, long end, Double score,
                                       char strand, List<Map.Entry<String, List<String>>> attributes) {
        return new Gff3Feature(seqid, source, type, start, end, score, strand, ".", attributes);
    }

    private static String write(IoAction action) throws IOException {
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        action.run(w);
        w.close();
        return sw.toString();
    }

    private interface IoAction {
        void run(Gff3Writer w) throws IOException;
    }

    @Test
    void headerRegionAndFeatureAreNineTabSeparatedColumns() throws IOException {
        // "Other Syntax": ##gff-version first, "##sequence-region seqid start end";
        // "Description of the Format": nine tab-separated columns; "Column 6": score is a floating point number
        String out = write(w -> {
            w.writeHeader();
            w.writeSequenceRegion("ctg123", 1497228);
            w.writeFeature(feature("ctg123", "annotator", "CpG_island", 1000, 9000, 0.98765, '+',
                    List.of(Map.entry("ID", List.of("island_1")), Map.entry("posterior_min", List.of("0.501")))));
        });
        assertThat(out).isEqualTo("##gff-version 3\n"
                + "##sequence-region ctg123 1 1497228\n"
                + "ctg123\tannotator\tCpG_island\t1000\t9000\t0.988\t+\t.\tID=island_1;posterior_min=0.501\n");
    }

    @Test
    void undefinedFieldsAreADot() throws IOException {
        // "Description of the Format": undefined fields are replaced with the "." character
        String out = write(w -> w.writeFeature(new Gff3Feature("c", "", "region", 1, 1, null, '.', null, List.of())));
        assertThat(out).isEqualTo("c\t.\tregion\t1\t1\t.\t.\t.\t.\n");
    }

    @Test
    void phaseAndAllStrandsArePrintedAsGiven() throws IOException {
        // "Column 7": + - . ?   "Column 8": 0, 1, 2
        String out = write(w -> {
            w.writeFeature(new Gff3Feature("c", "s", "CDS", 1, 3, null, '-', "2", List.of()));
            w.writeFeature(new Gff3Feature("c", "s", "CDS", 1, 3, null, '?', "0", List.of()));
        });
        assertThat(out).isEqualTo("c\ts\tCDS\t1\t3\t.\t-\t2\t.\nc\ts\tCDS\t1\t3\t.\t?\t0\t.\n");
    }

    @Test
    void scoreHasThreeDecimalsWhateverTheDefaultLocale() throws IOException {
        // a decimal comma would not be "a floating point number" ("Column 6")
        Locale saved = Locale.getDefault();
        try {
            Locale.setDefault(Locale.GERMANY);
            String out = write(w -> {
                w.writeFeature(feature("c", "s", "t", 1, 2, 1234.5, '.', List.of()));
                w.writeFeature(feature("c", "s", "t", 1, 2, 0.0005, '.', List.of()));
                w.writeFeature(feature("c", "s", "t", 1, 2, -0.0001, '.', List.of()));
            });
            assertThat(out.lines().map(l -> l.split("\t")[5]).toList())
                    .containsExactly("1234.500", "0.001", "0.000");
        } finally {
            Locale.setDefault(saved);
        }
    }

    @Test
    void column9EncodesReservedAndControlCharactersInTagsAndValues() throws IOException {
        // "Description of the Format": tab %09, newline %0A, carriage return %0D, % %25, control characters
        // %00-%1F and %7F; in column 9 also ; %3B, = %3D, & %26, , %2C. Spaces stay literal ("unescaped spaces
        // are allowed within fields"), and "no other characters may be encoded", so non-ASCII stays literal.
        String value = "a;b=c&d,e\tf%g\nh\ri\u0001j\u007Fk l\u00fc";
        String out = write(w -> w.writeFeature(feature("c", "s", "t", 1, 2, null, '.',
                List.of(Map.entry("my;tag=", List.of(value))))));
        assertThat(out.split("\t")[8]).isEqualTo(
                "my%3Btag%3D=a%3Bb%3Dc%26d%2Ce%09f%25g%0Ah%0Di%01j%7Fk l\u00fc\n");
    }

    @Test
    void severalValuesOfOneTagAreJoinedWithAPlainComma() throws IOException {
        // "Column 9": multiple values of one attribute are separated by "," as in Parent=AF2312,AB2812,abc-3
        String out = write(w -> w.writeFeature(feature("c", "s", "t", 1, 2, null, '.', List.of(
                Map.entry("Parent", List.of("AF2312", "AB2812", "abc-3")),
                Map.entry("note", List.of("x,y", "z"))))));
        assertThat(out.split("\t")[8]).isEqualTo("Parent=AF2312,AB2812,abc-3;note=x%2Cy,z\n");
    }

    @Test
    void seqidKeepsOnlyTheAllowedSetLiteral() throws IOException {
        // "Column 1: seqid": must escape any characters not in the set [a-zA-Z0-9.:^*$@!+_?-|]; no unescaped
        // whitespace, no unescaped leading ">". Non-ASCII characters are encoded byte by byte in UTF-8
        // (RFC 3986 section 2.1 and 2.5: percent-encoding of UTF-8 octets, uppercase hex as the spec shows).
        String allowed = "azAZ09.:^*$@!+_?-|";
        String out = write(w -> {
            w.writeFeature(feature(allowed, "s", "t", 1, 2, null, '.', List.of()));
            w.writeFeature(feature(">chr 1/\u00e9%;\t", "s", "t", 1, 2, null, '.', List.of()));
            w.writeFeature(feature("x\uD83E\uDDEC[", "s", "t", 1, 2, null, '.', List.of()));
        });
        List<String> seqids = out.lines().map(l -> l.split("\t")[0]).toList();
        // U+00E9 is C3 A9 in UTF-8; U+1F9EC (a surrogate pair in Java) is F0 9F A7 AC
        assertThat(seqids).containsExactly(allowed, "%3Echr%201%2F%C3%A9%25%3B%09", "x%F0%9F%A7%AC%5B");
    }

    @Test
    void sourceAndTypeEncodeOnlyLineBreakingCharactersAndPercent() throws IOException {
        // "Description of the Format": only tab, newline, CR, % and control characters outside column 9
        String out = write(w -> w.writeFeature(feature("c", "my source;%\t", "type\n=x", 1, 2, null, '.',
                List.of())));
        String[] cols = out.split("\t");
        assertThat(cols[1]).isEqualTo("my source;%25%09");
        assertThat(cols[2]).isEqualTo("type%0A=x");
    }

    @Test
    void sequenceRegionEncodesItsSeqidLikeColumn1() throws IOException {
        String out = write(w -> w.writeSequenceRegion("my contig", 42));
        assertThat(out).isEqualTo("##sequence-region my%20contig 1 42\n");
    }

    @Test
    void commentStaysOnOneLine() throws IOException {
        // "Other Syntax": comment lines begin with '#'; a line starting '##' would be a directive, hence "# "
        String out = write(w -> w.writeComment("#model: two\nlines\r"));
        assertThat(out).isEqualTo("# #model: two%0Alines%0D\n");
    }

    @Test
    void rulesOfTheSpecificationAreEnforced() {
        // "Other Syntax": the version directive must be the topmost line; only one ##sequence-region per seqid;
        // features on that seqid must lie within the region. "Columns 4 & 5": 1-based, start <= end.
        StringWriter sw = new StringWriter();
        Gff3Writer w = new Gff3Writer(sw);
        assertThatThrownBy(() -> {
            w.writeComment("x");
            w.writeHeader();
        }).isInstanceOf(IllegalStateException.class);
        assertThatThrownBy(() -> {
            w.writeSequenceRegion("a", 10);
            w.writeSequenceRegion("a", 10);
        }).isInstanceOf(IllegalArgumentException.class).hasMessageContaining("twice");
        assertThatThrownBy(() -> w.writeFeature(feature("a", "s", "t", 5, 11, null, '.', List.of())))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("outside");
        assertThatThrownBy(() -> w.writeFeature(feature("b", "s", "t", 5, 4, null, '.', List.of())))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> w.writeFeature(feature("b", "s", "t", 0, 4, null, '.', List.of())))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> w.writeFeature(feature("b", "s", "t", 1, 4, null, 'x', List.of())))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> w.writeFeature(feature("b", "s", "t", 1, 4, Double.NaN, '.', List.of())))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> w.writeFeature(new Gff3Feature("b", "s", "t", 1, 4, null, '.', "3", List.of())))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> w.writeSequenceRegion("", 10)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void closesTheWrappedWriterOnlyWhenAsked() throws IOException {
        CloseRecorder kept = new CloseRecorder();
        new Gff3Writer(kept).close();
        assertThat(kept.closed).isFalse();
        assertThat(kept.flushed).isTrue();

        CloseRecorder owned = new CloseRecorder();
        new Gff3Writer(owned, true).close();
        assertThat(owned.closed).isTrue();
    }

    private static final class CloseRecorder extends Writer {
        boolean closed;
        boolean flushed;

        @Override
        public void write(char[] cbuf, int off, int len) {
        }

        @Override
        public void flush() {
            flushed = true;
        }

        @Override
        public void close() {
            closed = true;
        }
    }
}
