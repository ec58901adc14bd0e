package dev.annotator.conformance;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.tuple;

/**
 * Checks the checker: every rule of {@link StrictGff3Reader} is shown to fail on a line that breaks it, and text
 * that follows the GFF3 specification v1.26 (Sequence Ontology) is read and decoded. The cases are invented, in
 * the shape of the specification's own examples (The Canonical Gene, Circular Genomes, The Gap Attribute).
 */
class StrictGff3ReaderTest {

    private static final String HEADER = "##gff-version 3";

    /** A feature line from its nine columns. */
    private static String row(String... columns) {
        assertThat(columns).hasSize(9);
        return String.join("\t", columns);
    }

    private static String file(String... lines) {
        return String.join("\n", lines) + "\n";
    }

    private static String gene(String attributes) {
        return row("ctg1", "src", "gene", "1000", "9000", ".", "+", ".", attributes);
    }

    @Test
    void readsAndDecodesAValidFile() {
        String text = file(HEADER,
                "##sequence-region ctg%201%3Bx%3Dy 1 20000",
                "# a comment; ignored",
                "",
                row("ctg%201%3Bx%3Dy", "my source", "gene", "1000", "9000", ".", "+", ".",
                        "ID=gene1;Name=EDEN;note=a%3Bb%3Dc%26d%2Ce%25 f \u00fc"),
                row("ctg%201%3Bx%3Dy", "my source", "mRNA", "1050", "9000", "0.5", "?", ".",
                        "ID=mrna1;Parent=gene1;Alias=x,y z"),
                row("ctg%201%3Bx%3Dy", "my source", "CDS", "1201", "1500", "1e-5", "-", "2",
                        "ID=cds1;Parent=mrna1,gene1"),
                row("ctg%201%3Bx%3Dy", ".", "SO:0000316", "3000", "3902", "-3.25E+2", ".", "0", "Parent=mrna1;"),
                row("chr%C3%BC", "src", "match", "1", "23", ".", "+", ".",
                        "ID=m1;Target=EST%2023 1 21 +;Gap=M8 D3 M6 I1 M6"),
                "###",
                row("ctg%201%3Bx%3Dy", "src", "region", "1", "20000", ".", ".", ".", "."));

        ParsedGff3 gff = StrictGff3Reader.read(text);

        assertThat(gff.version()).isEqualTo("3");
        assertThat(gff.regions()).containsOnlyKeys("ctg 1;x=y");
        assertThat(gff.features()).extracting(ParsedFeature::line, ParsedFeature::seqid, ParsedFeature::source,
                        ParsedFeature::type, ParsedFeature::start, ParsedFeature::end, ParsedFeature::score,
                        ParsedFeature::strand, ParsedFeature::phase)
                .containsExactly(
                        tuple(5, "ctg 1;x=y", "my source", "gene", 1000L, 9000L, null, '+', "."),
                        tuple(6, "ctg 1;x=y", "my source", "mRNA", 1050L, 9000L, 0.5, '?', "."),
                        tuple(7, "ctg 1;x=y", "my source", "CDS", 1201L, 1500L, 1e-5, '-', "2"),
                        tuple(8, "ctg 1;x=y", ".", "SO:0000316", 3000L, 3902L, -325.0, '.', "0"),
                        tuple(9, "chr\u00fc", "src", "match", 1L, 23L, null, '+', "."),
                        tuple(11, "ctg 1;x=y", "src", "region", 1L, 20000L, null, '.', "."));
        assertThat(gff.features().get(0).attribute("note")).isEqualTo("a;b=c&d,e% f \u00fc");
        assertThat(gff.features().get(1).attributes().get("Alias")).containsExactly("x", "y z");
        assertThat(gff.features().get(2).attributes().get("Parent")).containsExactly("mrna1", "gene1");
        assertThat(gff.features().get(4).attribute("Target")).isEqualTo("EST 23 1 21 +");
        assertThat(gff.features().get(5).attributes()).isEmpty();
    }

    @Test
    void acceptsVersionNumbersWithRevisions() {
        // Other Syntax: "The version number always begins with 3, the second and third numbers are optional"
        assertThat(StrictGff3Reader.read(file("##gff-version 3.2.1")).version()).isEqualTo("3.2.1");
        assertThat(StrictGff3Reader.read(file("##gff-version 3.1")).version()).isEqualTo("3.1");
    }

    @Test
    void aCircularLandmarkLetsFeaturesCrossTheOrigin() {
        // Circular Genomes: the specification's bacteriophage example, gene II ends at 6407 + 831 = 7238
        String text = file(HEADER,
                "##sequence-region J02448 1 6407",
                row("J02448", "src", "region", "1", "6407", ".", "+", ".", "ID=J02448;Is_circular=true;"),
                row("J02448", "src", "CDS", "6006", "7238", ".", "+", "0", "ID=geneII;Note=protein II;"));
        assertThat(StrictGff3Reader.read(text).features()).hasSize(2);
    }

    @Test
    void aFastaSectionEndsTheAnnotation() {
        String text = file(HEADER, gene("ID=g1"), "##FASTA", ">ctg1 description", "acgtNNRY", "ACGT*-");
        assertThat(StrictGff3Reader.read(text).features()).hasSize(1);
        // Other Syntax, ##FASTA: a line that begins with '>' implies the directive
        assertThat(StrictGff3Reader.read(file(HEADER, gene("ID=g1"), ">ctg1", "ACGT")).features()).hasSize(1);
    }

    @Test
    void readsFilesAsUtf8AndRejectsOtherBytes(@TempDir Path dir) throws IOException {
        Path good = dir.resolve("good.gff3");
        Files.writeString(good, file(HEADER, gene("ID=g1;note=\u65e5\u672c")), StandardCharsets.UTF_8);
        assertThat(StrictGff3Reader.read(good).features().get(0).attribute("note")).isEqualTo("\u65e5\u672c");

        Path latin1 = dir.resolve("latin1.gff3");
        Files.write(latin1, file(HEADER, gene("ID=g1"), gene("ID=g2;note=M\u00fcller"))
                .getBytes(StandardCharsets.ISO_8859_1));
        assertThatThrownBy(() -> StrictGff3Reader.read(latin1))
                .isInstanceOf(Gff3Violation.class).hasMessageStartingWith("line 3: ").hasMessageContaining("UTF-8");

        Path empty = dir.resolve("empty.gff3");
        Files.write(empty, new byte[0]);
        assertThatThrownBy(() -> StrictGff3Reader.read(empty)).isInstanceOf(Gff3Violation.class)
                .hasMessageStartingWith("line 1: ");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("violations")
    void rejects(String rule, String text, int line, String messagePart) {
        assertThatThrownBy(() -> StrictGff3Reader.read(text))
                .isInstanceOf(Gff3Violation.class)
                .hasMessageStartingWith("line " + line + ": ")
                .hasMessageContaining(messagePart)
                .satisfies(e -> assertThat(((Gff3Violation) e).line()).isEqualTo(line));
    }

    static Stream<Arguments> violations() {
        String ok = gene("ID=g1");
        return Stream.of(
                // Other Syntax, ##gff-version
                bad("no version line", file(ok), 1, "first line"),
                bad("version 2", file("##gff-version 2", ok), 1, "first line"),
                bad("version with trailing text", file("##gff-version 3 ", ok), 1, "first line"),
                bad("version 3 without revision digits", file("##gff-version 3.", ok), 1, "first line"),
                bad("comment above the version", file("# hello", HEADER, ok), 1, "first line"),
                bad("empty text", "", 1, "first line"),
                bad("second version line", file(HEADER, ok, "##gff-version 3"), 3, "second ##gff-version"),

                // Description of the Format: nine columns, '.' for undefined
                bad("eight columns", file(HEADER, "ctg1\tsrc\tgene\t1\t2\t.\t+\t."), 2, "found 8"),
                bad("literal tab in column 9", file(HEADER, gene("ID=g1;note=a\tb")), 2, "found 10"),
                bad("spaces instead of tabs", file(HEADER, "ctg1 src gene 1 2 . + . ID=g1"), 2, "found 1"),
                bad("empty column", file(HEADER, row("ctg1", "", "gene", "1", "2", ".", "+", ".", "ID=g1")), 2,
                        "column 2 is empty"),
                bad("empty column 9", file(HEADER, row("ctg1", "s", "gene", "1", "2", ".", "+", ".", "")), 2,
                        "column 9 is empty"),
                bad("carriage return line ends", HEADER + "\n" + ok + "\r\n", 2, "U+000D"),
                bad("control character in a comment", file(HEADER, "# bell \u0007"), 2, "U+0007"),
                bad("tab in a directive", file(HEADER, "##sequence-region\tctg1 1 10"), 2, "U+0009"),

                // percent-escapes (Description of the Format, RFC 3986 2.1)
                bad("escape with one hex digit", file(HEADER, row("ctg%4", "s", "gene", "1", "2", ".", "+", ".",
                        "ID=g1")), 2, "two hex digits"),
                bad("escape with a non-hex digit", file(HEADER, gene("ID=g%G1")), 2, "two hex digits"),
                bad("'%' at the end of a value", file(HEADER, gene("ID=g1;note=100%")), 2, "two hex digits"),
                bad("escapes that are not UTF-8", file(HEADER, row("chr%C3", "s", "gene", "1", "2", ".", "+", ".",
                        "ID=g1")), 2, "not valid UTF-8"),
                bad("escaped 0xFF", file(HEADER, gene("ID=g1;note=%FF")), 2, "not valid UTF-8"),
                bad("literal control character in the source", file(HEADER, row("ctg1", "s\u0001", "gene", "1",
                        "2", ".", "+", ".", "ID=g1")), 2, "U+0001 must be percent-encoded"),
                bad("escaped letter in the source", file(HEADER, row("ctg1", "%41b", "gene", "1", "2", ".", "+",
                        ".", "ID=g1")), 2, "must not be"),
                bad("escaped non-ASCII in a value", file(HEADER, gene("ID=g1;note=%C3%BC")), 2, "must not be"),

                // Column 1: seqid
                bad("space in the seqid", file(HEADER, row("ctg 1", "s", "gene", "1", "2", ".", "+", ".", "ID=g")),
                        2, "U+0020 must be percent-encoded"),
                bad("';' in the seqid", file(HEADER, row("ctg;1", "s", "gene", "1", "2", ".", "+", ".", "ID=g")),
                        2, "';' must be percent-encoded"),
                bad("'>' inside the seqid", file(HEADER, "#x", row("a>b", "s", "gene", "1", "2", ".", "+", ".",
                        "ID=g")), 3, "'>' must be percent-encoded"),
                bad("'[' in the seqid", file(HEADER, row("ctg[1]", "s", "gene", "1", "2", ".", "+", ".", "ID=g")),
                        2, "'[' must be percent-encoded"),
                bad("literal non-ASCII seqid", file(HEADER, row("chr\u00fc", "s", "gene", "1", "2", ".", "+", ".",
                        "ID=g")), 2, "must be percent-encoded"),
                bad("escaped plain seqid character", file(HEADER, row("ctg%31", "s", "gene", "1", "2", ".", "+",
                        ".", "ID=g")), 2, "'1' is percent-encoded"),

                // Column 3: type
                bad("undefined type", file(HEADER, row("ctg1", "s", ".", "1", "2", ".", "+", ".", "ID=g")), 2,
                        "type) is undefined"),
                bad("short accession", file(HEADER, row("ctg1", "s", "SO:000704", "1", "2", ".", "+", ".",
                        "ID=g")), 2, "SO:0000000"),

                // Columns 4 & 5
                bad("start 0", file(HEADER, row("ctg1", "s", "gene", "0", "2", ".", "+", ".", "ID=g")), 2,
                        "not a positive integer"),
                bad("negative end", file(HEADER, row("ctg1", "s", "gene", "1", "-2", ".", "+", ".", "ID=g")), 2,
                        "not a positive integer"),
                bad("leading zero", file(HEADER, row("ctg1", "s", "gene", "01", "2", ".", "+", ".", "ID=g")), 2,
                        "not a positive integer"),
                bad("decimal coordinate", file(HEADER, row("ctg1", "s", "gene", "1", "2.0", ".", "+", ".",
                        "ID=g")), 2, "not a positive integer"),
                bad("coordinate beyond long", file(HEADER, row("ctg1", "s", "gene", "1", "99999999999999999999",
                        ".", "+", ".", "ID=g")), 2, "too large"),
                bad("start after end", file(HEADER, row("ctg1", "s", "gene", "5", "4", ".", "+", ".", "ID=g")), 2,
                        "greater than end"),

                // Column 6: score
                bad("word as score", file(HEADER, row("ctg1", "s", "gene", "1", "2", "high", "+", ".", "ID=g")),
                        2, "floating point"),
                bad("NaN score", file(HEADER, row("ctg1", "s", "gene", "1", "2", "NaN", "+", ".", "ID=g")), 2,
                        "floating point"),
                bad("overflowing score", file(HEADER, row("ctg1", "s", "gene", "1", "2", "1e999", "+", ".",
                        "ID=g")), 2, "floating point"),
                bad("Java float suffix", file(HEADER, row("ctg1", "s", "gene", "1", "2", "1.5f", "+", ".", "ID=g")),
                        2, "floating point"),
                bad("decimal comma", file(HEADER, row("ctg1", "s", "gene", "1", "2", "0,5", "+", ".", "ID=g")), 2,
                        "floating point"),

                // Column 7: strand
                bad("strand letter", file(HEADER, row("ctg1", "s", "gene", "1", "2", ".", "F", ".", "ID=g")), 2,
                        "strand"),
                bad("two strand signs", file(HEADER, row("ctg1", "s", "gene", "1", "2", ".", "++", ".", "ID=g")),
                        2, "strand"),

                // Column 8: phase, NOTE 4
                bad("CDS without phase", file(HEADER, row("ctg1", "s", "CDS", "1", "2", ".", "+", ".", "ID=c")), 2,
                        "which a CDS requires"),
                bad("CDS by accession without phase", file(HEADER, row("ctg1", "s", "SO:0000316", "1", "2", ".",
                        "+", ".", "ID=c")), 2, "which a CDS requires"),
                bad("phase 3", file(HEADER, row("ctg1", "s", "gene", "1", "2", ".", "+", "3", "ID=g")), 2,
                        "phase"),

                // Column 9: syntax
                bad("pair without '='", file(HEADER, gene("ID=g1;flag")), 2, "not tag=value"),
                bad("empty pair", file(HEADER, gene("ID=g1;;note=x")), 2, "empty tag=value pair"),
                bad("empty tag", file(HEADER, gene("ID=g1;=x")), 2, "empty tag"),
                bad("empty value", file(HEADER, gene("ID=g1;note=")), 2, "empty value"),
                bad("empty value in a list", file(HEADER, gene("ID=g1;Alias=a,,b")), 2, "empty value"),
                bad("literal '=' in a value", file(HEADER, gene("ID=g1;note=a=b")), 2, "'=' must be percent"),
                bad("literal '&' in a value", file(HEADER, gene("ID=g1;note=a&b")), 2, "'&' must be percent"),
                bad("literal '&' in a tag", file(HEADER, gene("ID=g1;a&b=x")), 2, "'&' must be percent"),
                bad("control character in a value", file(HEADER, gene("ID=g1;note=a\u001fb")), 2, "U+001F"),
                bad("escaped letter in a value", file(HEADER, gene("ID=g1;note=%61")), 2, "must not be"),
                bad("escaped space outside Target", file(HEADER, gene("ID=g1;note=a%20b")), 2, "must not be"),
                // Column 9: reserved tags and their values
                bad("unknown uppercase tag", file(HEADER, gene("ID=g1;Score=5")), 2, "reserved"),
                bad("misspelt reserved tag", file(HEADER, gene("ID=g1;Is_Circular=true")), 2, "reserved"),
                bad("two IDs on one line", file(HEADER, gene("ID=g1,g2")), 2, "only Parent"),
                bad("two Names", file(HEADER, gene("ID=g1;Name=a,b")), 2, "only Parent"),
                bad("repeated tag", file(HEADER, gene("ID=g1;note=a;note=b")), 2, "appears twice"),
                bad("Target without coordinates", file(HEADER, gene("ID=g1;Target=EST23")), 2, "target_id start end"),
                bad("Target with a bad strand", file(HEADER, gene("ID=g1;Target=EST23 1 21 x")), 2, "Target strand"),
                bad("Target with reversed coordinates", file(HEADER, gene("ID=g1;Target=EST23 21 1")), 2,
                        "Target start"),
                bad("Gap with an unknown operation", file(HEADER, gene("ID=g1;Gap=M8 X3")), 2, "Gap"),

                // Column 9: ID and Parent
                bad("ID used twice", file(HEADER, gene("ID=g1"), gene("ID=g1")), 3, "already used on line 2"),
                // the specification lets the lines of one discontinuous feature share an ID (its canonical gene
                // repeats ID=cds00001 over four CDS lines); this reader rejects that on purpose, because our
                // writer never writes multi-line features and a repeat in its output would be a collision
                bad("discontinuous CDS sharing an ID", file(HEADER,
                        row("ctg123", ".", "CDS", "1201", "1500", ".", "+", "0", "ID=cds00001"),
                        row("ctg123", ".", "CDS", "3000", "3902", ".", "+", "0", "ID=cds00001")), 3, "already used"),
                bad("Parent never defined", file(HEADER, gene("ID=g1"), gene("ID=g2;Parent=g1,g9")), 3,
                        "Parent \"g9\""),
                bad("Parent defined only after ###", file(HEADER, gene("ID=g2;Parent=g1"), "###", gene("ID=g1")),
                        2, "Parent \"g1\""),

                // Other Syntax, ##sequence-region
                bad("region without end", file(HEADER, "##sequence-region ctg1 1"), 2, "seqid start end"),
                bad("region with a bad seqid", file(HEADER, "##sequence-region ctg;1 1 10"), 2, "percent-encoded"),
                bad("region start 0", file(HEADER, "##sequence-region ctg1 0 10"), 2, "positive integer"),
                bad("region start after end", file(HEADER, "##sequence-region ctg1 10 5"), 2, "greater than end"),
                bad("two regions for one seqid", file(HEADER, "##sequence-region ctg1 1 10000",
                        "##sequence-region ctg1 1 20000"), 3, "second ##sequence-region"),
                bad("feature past the region's end", file(HEADER, "##sequence-region ctg1 1 8999", ok), 3,
                        "outside its ##sequence-region"),
                bad("feature before the region's start", file(HEADER, "##sequence-region ctg1 1001 20000", ok), 3,
                        "outside its ##sequence-region"),
                bad("region given after the feature", file(HEADER, ok, "##sequence-region ctg1 1 5000"), 2,
                        "outside its ##sequence-region"),
                bad("circular landmark does not move the start", file(HEADER, "##sequence-region ctg1 2000 9000",
                        gene("ID=g1;Is_circular=true")), 3, "outside its ##sequence-region"),

                // Other Syntax, ##FASTA
                bad("feature after ##FASTA", file(HEADER, ok, "##FASTA", ">ctg1", "ACGT", gene("ID=g2")), 6,
                        "only FASTA"),
                bad("nameless FASTA header", file(HEADER, ok, "##FASTA", "> x", "ACGT"), 4, "without a name"),
                bad("##FASTA with arguments", file(HEADER, ok, "##FASTA now"), 3, "no arguments"));
    }

    private static Arguments bad(String rule, String text, int line, String messagePart) {
        return Arguments.of(rule, text, line, messagePart);
    }

    @Test
    void everyViolationCaseIsNamedOnce() {
        List<Object> names = violations().map(a -> a.get()[0]).toList();
        assertThat(names).doesNotHaveDuplicates().hasSizeGreaterThan(70);
    }
}
