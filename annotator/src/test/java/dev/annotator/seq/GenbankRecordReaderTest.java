package dev.annotator.seq;

import dev.annotator.error.BadInputException;
import org.biojava.nbio.core.sequence.DNASequence;
import org.biojava.nbio.core.sequence.compound.DNACompoundSet;
import org.biojava.nbio.core.sequence.compound.NucleotideCompound;
import org.biojava.nbio.core.sequence.io.DNASequenceCreator;
import org.biojava.nbio.core.sequence.io.GenbankReader;
import org.biojava.nbio.core.sequence.io.GenericGenbankHeaderParser;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.FieldSource;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * The GenBank reader on the three published records of test-data/genbank (provenance and checksums in
 * test-data/README.md), checked against the files' own text and against BioJava's GenbankReader (biojava-core
 * 7.2.2), an independent parser; and on small invented records for what the published ones do not show.
 */
class GenbankRecordReaderTest {
    /** The LOCUS line's name and length, read by a regex of its own (GenBank release notes: name, length, "bp"). */
    private static final Pattern LOCUS = Pattern.compile("^LOCUS\\s+(\\S+)\\s+(\\d+) bp");

    @TempDir
    Path tmp;

    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void lengthAndBasesAreThoseOfTheFileText(String file) {
        List<SequenceRecord> records = readAll(PublishedGenbankRecords.path(file).toString());
        assertThat(records).hasSize(1);
        Matcher locus = LOCUS.matcher(PublishedGenbankRecords.rawLines(file).get(0));
        assertThat(locus.find()).isTrue();
        SequenceRecord r = records.get(0);
        assertThat(r.length()).isEqualTo(Integer.parseInt(locus.group(2)));
        // bases kept as written, lower case included, as the FASTA reader keeps them
        assertThat(new String(r.bases(), StandardCharsets.US_ASCII)).isEqualTo(PublishedGenbankRecords.rawBases(file));
    }

    /** Lengths as stated in test-data/README.md and on each file's LOCUS line. */
    @Test
    void publishedLengthsAndNames() {
        SequenceRecord ct = first(PublishedGenbankRecords.CHLAMYDIA);
        SequenceRecord plasmid = first(PublishedGenbankRecords.PLASMID);
        SequenceRecord plastid = first(PublishedGenbankRecords.CHLOROPLAST);
        assertThat(ct.length()).isEqualTo(1_042_519);
        assertThat(plasmid.length()).isEqualTo(9_609);
        assertThat(plastid.length()).isEqualTo(154_478);
        // the seqid is VERSION when there is one, else ACCESSION (ct.gbk has no VERSION line)
        assertThat(plasmid.name()).isEqualTo("NC_005816.1");
        assertThat(plastid.name()).isEqualTo("NC_000932.1");
        assertThat(ct.name()).isEqualTo("CG0037");
        assertThat(ct.description()).isEqualTo("Chlamydia trachomatis complete genome.");
        assertThat(plasmid.description())
                .isEqualTo("Yersinia pestis biovar Microtus str. 91001 plasmid pPCP1, complete sequence.");
    }

    /** BioJava's GenbankReader reads the same bases (it upper-cases them) and the same accession. */
    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void sameSequenceAsBioJava(String file) throws Exception {
        Map<String, DNASequence> theirs;
        try (InputStream in = new GZIPInputStream(Files.newInputStream(PublishedGenbankRecords.path(file)))) {
            theirs = new GenbankReader<DNASequence, NucleotideCompound>(in, new GenericGenbankHeaderParser<>(),
                    new DNASequenceCreator(DNACompoundSet.getDNACompoundSet())).process();
        }
        SequenceRecord ours = first(file);
        assertThat(theirs).hasSize(1);
        DNASequence their = theirs.values().iterator().next();
        assertThat(ours.name()).startsWith(their.getAccession().getID());
        assertThat(new String(ours.bases(), StandardCharsets.US_ASCII).toUpperCase())
                .isEqualTo(their.getSequenceAsString());
    }

    /**
     * The G+C content of the C. trachomatis D/UW-3/CX chromosome is about 41.3 % (Stephens et al. 1998, Science
     * 282:754; recalled from memory), and the file's BASE COUNT line states the counts it was written with.
     */
    @Test
    void chlamydiaGcContent() {
        SequenceRecord ct = first(PublishedGenbankRecords.CHLAMYDIA);
        long[] counts = new long[5];
        for (byte b : ct.bases()) {
            counts[BaseCode.of(b)]++;
        }
        double gc = (counts[1] + counts[2]) / (double) ct.length();
        assertThat(gc).isBetween(0.408, 0.418);
        String baseCount = PublishedGenbankRecords.rawLines(PublishedGenbankRecords.CHLAMYDIA).stream()
                .filter(l -> l.startsWith("BASE COUNT")).findFirst().orElseThrow();
        assertThat(baseCount).contains(counts[0] + " a", counts[1] + " c", counts[2] + " g", counts[3] + " t");
        assertThat(counts[4]).isZero();
    }

    @Test
    void severalRecordsInOneGzipFileAndFromStdin() throws IOException {
        String two = String.join("\n", PublishedGenbankRecords.rawLines(PublishedGenbankRecords.PLASMID)) + "\n"
                + String.join("\n", PublishedGenbankRecords.rawLines(PublishedGenbankRecords.CHLOROPLAST)) + "\n";
        Path file = tmp.resolve("two.gbk.gz");
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(file))) {
            out.write(two.getBytes(StandardCharsets.ISO_8859_1));
        }
        List<SequenceRecord> fromFile = readAll(file.toString());
        assertThat(fromFile).extracting(SequenceRecord::name).containsExactly("NC_005816.1", "NC_000932.1");
        assertThat(fromFile).extracting(SequenceRecord::length).containsExactly(9_609, 154_478);

        List<SequenceRecord> fromStdin = new ArrayList<>();
        try (GenbankRecordReader r = GenbankRecordReader.open("-",
                new ByteArrayInputStream(two.getBytes(StandardCharsets.ISO_8859_1)))) {
            SequenceRecord s;
            while ((s = r.next()) != null) {
                fromStdin.add(s);
            }
        }
        assertThat(fromStdin).extracting(SequenceRecord::name).containsExactly("NC_005816.1", "NC_000932.1");
    }

    /** Invented record: mixed case and an IUPAC N are kept; qualifiers, even one spanning lines, are not features. */
    @Test
    void inventedRecordKeepsBasesAndFeatureLocations() {
        String text = """
                LOCUS       TINY                      24 bp    DNA     linear   SYN 01-JAN-2024
                DEFINITION  An invented record
                            over two lines.
                ACCESSION   TINY
                FEATURES             Location/Qualifiers
                     source          1..24
                                     /note="a note that runs
                                     /onto a line starting with a slash"
                     CDS             join(1..6,
                                     10..21)
                                     /codon_start=1
                     gene            complement(<2..>20)
                ORIGIN
                        1 acgtACGTNn acgtacgtac gtac
                //
                """;
        GenbankEntry e;
        try (GenbankRecordReader r = GenbankRecordReader.open("-",
                new ByteArrayInputStream(text.getBytes(StandardCharsets.US_ASCII)))) {
            e = r.nextEntry();
            assertThat(r.nextEntry()).isNull();
        }
        assertThat(e.sequence().name()).isEqualTo("TINY");
        assertThat(e.sequence().description()).isEqualTo("An invented record over two lines.");
        assertThat(new String(e.sequence().bases(), StandardCharsets.US_ASCII)).isEqualTo("acgtACGTNnacgtacgtacgtac");
        assertThat(e.circular()).isFalse();
        assertThat(e.features()).containsExactly(
                new FeatureLocation("source", "1..24", 6),
                new FeatureLocation("CDS", "join(1..6,10..21)", 9),
                new FeatureLocation("gene", "complement(<2..>20)", 12));
    }

    @Test
    void emptyInputAndDuplicateSeqids() {
        assertThatThrownBy(() -> readAll("-", "\n  \n"))
                .isInstanceOf(BadInputException.class)
                .hasMessage("<stdin>: no GenBank records (empty input)");
        String one = "LOCUS       A   3 bp    DNA\nACCESSION   X\nORIGIN\n        1 acg\n//\n";
        String twice = one + one.replace("LOCUS       A", "LOCUS       B");
        assertThatThrownBy(() -> readAll("-", twice))
                .isInstanceOf(BadInputException.class)
                .hasMessage("<stdin>:6: duplicate record name 'X' (first seen at line 1)");
    }

    private static SequenceRecord first(String publishedFile) {
        return readAll(PublishedGenbankRecords.path(publishedFile).toString()).get(0);
    }

    private static List<SequenceRecord> readAll(String path) {
        return readAll(path, "");
    }

    private static List<SequenceRecord> readAll(String path, String stdin) {
        List<SequenceRecord> out = new ArrayList<>();
        try (GenbankRecordReader r = GenbankRecordReader.open(path,
                new ByteArrayInputStream(stdin.getBytes(StandardCharsets.US_ASCII)))) {
            SequenceRecord s;
            while ((s = r.next()) != null) {
                out.add(s);
            }
        }
        return out;
    }
}
