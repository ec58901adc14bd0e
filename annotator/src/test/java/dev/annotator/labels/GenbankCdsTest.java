package dev.annotator.labels;

import dev.annotator.seq.GenbankRecordReader;
import dev.annotator.seq.PublishedGenbankRecords;
import dev.annotator.seq.SequenceRecord;
import htsjdk.samtools.util.SequenceUtil;
import org.biojava.nbio.core.sequence.DNASequence;
import org.biojava.nbio.core.sequence.Strand;
import org.biojava.nbio.core.sequence.compound.DNACompoundSet;
import org.biojava.nbio.core.sequence.compound.NucleotideCompound;
import org.biojava.nbio.core.sequence.features.FeatureInterface;
import org.biojava.nbio.core.sequence.io.DNASequenceCreator;
import org.biojava.nbio.core.sequence.io.GenbankReader;
import org.biojava.nbio.core.sequence.io.GenericGenbankHeaderParser;
import org.biojava.nbio.core.sequence.location.template.AbstractLocation;
import org.biojava.nbio.core.sequence.location.template.Location;
import org.biojava.nbio.core.sequence.template.AbstractSequence;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.FieldSource;

import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.zip.GZIPInputStream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * CDS features of the three published GenBank records (test-data/genbank, provenance in test-data/README.md),
 * checked against the files' own text (a regex of its own over the feature lines), against BioJava's GenbankReader
 * (biojava-core 7.2.2) as an independent location parser, and against the genetic code: NCBI translation table 11
 * (bacteria, archaea and plant plastids) has the stops TAA, TAG, TGA and, as its most used starts, ATG, GTG, TTG
 * (recalled from memory).
 */
class GenbankCdsTest {
    /** Every CDS key line of the feature table (INSDC layout: key from column 6, location from column 22). */
    private static final Pattern CDS_LINE = Pattern.compile("^ {5}CDS {13}(\\S+)$");
    /** A simple CDS location on one line: a..b or complement(a..b). */
    private static final Pattern SIMPLE = Pattern.compile("(complement\\()?(\\d+)\\.\\.(\\d+)\\)?");
    private static final Set<String> STARTS = Set.of("ATG", "GTG", "TTG");
    private static final Set<String> STOPS = Set.of("TAA", "TAG", "TGA");

    /**
     * ct.gbk: 895 CDS (README provenance row and the task statement), of which 892 are single intervals (an
     * independent count given in the task); the other three are the two partial genes at the ends of the
     * linearised circular genome and one frameshifted gene written as a join.
     */
    @Test
    void chlamydiaCounts() {
        GenbankCds cds = read(PublishedGenbankRecords.CHLAMYDIA);
        assertThat(cds.recordLengths()).containsExactly(java.util.Map.entry("CG0037", 1_042_519));
        assertThat(cds.total()).isEqualTo(895).isEqualTo(rawCdsLines(PublishedGenbankRecords.CHLAMYDIA).size());
        assertThat(cds.simple()).hasSize(892);
        assertThat(cds.partial()).isEqualTo(2);
        assertThat(cds.joined()).isEqualTo(1);
        assertThat(cds.other()).isZero();
        // complement(join(535378..536418,536417..536485)), marked /exception="natural UGA frame-shift" in the file:
        // on the minus strand the mRNA reads 536485 down to 536417 first, then 536418 down to 535378
        assertThat(cds.multiPart().get(0)).containsExactly(
                new StrandedFeature("CG0037", 536_417, 536_485, '-'),
                new StrandedFeature("CG0037", 535_378, 536_418, '-'));
    }

    /** pPCP1: 10 CDS (README), all single intervals. */
    @Test
    void plasmidCounts() {
        GenbankCds cds = read(PublishedGenbankRecords.PLASMID);
        assertThat(cds.recordLengths()).containsExactly(java.util.Map.entry("NC_005816.1", 9_609));
        assertThat(cds.total()).isEqualTo(10);
        assertThat(cds.simple()).hasSize(10);
        assertThat(cds.joined() + cds.partial() + cds.other()).isZero();
    }

    /**
     * Chloroplast: 85 CDS (README); the spliced ones are every CDS line of the file written with join(...), counted
     * here from the text; rps12 is trans-spliced: its first exon on the minus strand, the others on the plus strand.
     */
    @Test
    void chloroplastCountsAndSplicedGenes() {
        GenbankCds cds = read(PublishedGenbankRecords.CHLOROPLAST);
        List<String> raw = rawCdsLines(PublishedGenbankRecords.CHLOROPLAST);
        long joins = raw.stream().filter(l -> l.contains("join(")).count();
        assertThat(cds.recordLengths()).containsExactly(java.util.Map.entry("NC_000932.1", 154_478));
        assertThat(cds.total()).isEqualTo(85).isEqualTo(raw.size());
        assertThat(joins).isGreaterThan(0);
        assertThat(cds.joined()).isEqualTo((int) joins);
        assertThat(cds.simple()).hasSize(85 - (int) joins);
        assertThat(cds.partial() + cds.other()).isZero();
        // join(complement(69611..69724),139856..140087,140625..140650)
        assertThat(cds.multiPart()).contains(List.of(
                new StrandedFeature("NC_000932.1", 69_611, 69_724, '-'),
                new StrandedFeature("NC_000932.1", 139_856, 140_087, '+'),
                new StrandedFeature("NC_000932.1", 140_625, 140_650, '+')));
        for (List<StrandedFeature> gene : cds.multiPart()) {
            assertThat(gene.stream().mapToLong(StrandedFeature::length).sum() % 3).as("%s", gene).isZero();
        }
    }

    /** The simple CDS are exactly the one-line a..b / complement(a..b) locations of the file's text. */
    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void simpleCdsAreTheSimpleLocationsOfTheText(String file) {
        GenbankCds cds = read(file);
        String seqid = cds.recordLengths().keySet().iterator().next();
        List<StrandedFeature> fromText = new ArrayList<>();
        for (String location : rawCdsLines(file)) {
            Matcher m = SIMPLE.matcher(location);
            if (m.matches()) {
                fromText.add(new StrandedFeature(seqid, Long.parseLong(m.group(2)), Long.parseLong(m.group(3)),
                        m.group(1) == null ? '+' : '-'));
            }
        }
        assertThat(cds.simple()).containsExactlyElementsOf(fromText);
    }

    /** BioJava's location parser places every simple CDS at the same bounds and strand. */
    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void simpleCdsAgreeWithBioJava(String file) throws Exception {
        GenbankCds cds = read(file);
        String seqid = cds.recordLengths().keySet().iterator().next();
        DNASequence theirs;
        try (InputStream in = new GZIPInputStream(Files.newInputStream(PublishedGenbankRecords.path(file)))) {
            theirs = new GenbankReader<DNASequence, NucleotideCompound>(in, new GenericGenbankHeaderParser<>(),
                    new DNASequenceCreator(DNACompoundSet.getDNACompoundSet())).process().values().iterator().next();
        }
        Set<StrandedFeature> theirSimple = new HashSet<>();
        int theirTotal = 0;
        for (FeatureInterface<AbstractSequence<NucleotideCompound>, NucleotideCompound> f
                : theirs.getFeaturesByType("CDS")) {
            theirTotal++;
            Location l = f.getLocations();
            if (!l.isComplex() && !((AbstractLocation) l).isPartial()) {
                theirSimple.add(new StrandedFeature(seqid, l.getStart().getPosition(), l.getEnd().getPosition(),
                        l.getStrand() == Strand.NEGATIVE ? '-' : '+'));
            }
        }
        assertThat(cds.total()).isEqualTo(theirTotal);
        assertThat(new HashSet<>(cds.simple())).isEqualTo(theirSimple);
    }

    /**
     * Every simple CDS is whole codons, from a start to a stop codon of table 11 on its own strand (reverse
     * complement by htsjdk's SequenceUtil for the minus strand). Found: ct.gbk 892 of 892 and pPCP1 10 of 10 with no
     * exception; the chloroplast 70 with one: ndhD starts with ACG, which the file marks /exception="RNA editing"
     * (the ACG is edited to AUG in the mRNA).
     */
    @ParameterizedTest
    @FieldSource("dev.annotator.seq.PublishedGenbankRecords#ALL")
    void simpleCdsAreWholeCodonsFromStartToStop(String file) {
        GenbankCds cds = read(file);
        String bases;
        try (GenbankRecordReader r = GenbankRecordReader.open(PublishedGenbankRecords.path(file).toString(),
                InputStream.nullInputStream())) {
            SequenceRecord record = r.next();
            bases = new String(record.bases(), StandardCharsets.US_ASCII).toUpperCase();
        }
        List<String> badStarts = new ArrayList<>();
        int badStops = 0;
        for (StrandedFeature f : cds.simple()) {
            String s = bases.substring((int) f.start() - 1, (int) f.end());
            if (f.strand() == '-') {
                s = SequenceUtil.reverseComplement(s);
            }
            assertThat(s.length() % 3).as("%s", f).isZero();
            if (!STARTS.contains(s.substring(0, 3))) {
                badStarts.add(f.start() + ".." + f.end() + f.strand() + ":" + s.substring(0, 3));
            }
            if (!STOPS.contains(s.substring(s.length() - 3))) {
                badStops++;
            }
        }
        assertThat(badStops).isZero();
        if (file.equals(PublishedGenbankRecords.CHLOROPLAST)) {
            assertThat(badStarts).containsExactly("115665..117167-:ACG");
        } else {
            assertThat(badStarts).isEmpty();
        }
    }

    private static GenbankCds read(String file) {
        return GenbankCds.read(PublishedGenbankRecords.path(file).toString(), InputStream.nullInputStream());
    }

    /** The location text of every CDS key line, continuation lines joined. */
    private static List<String> rawCdsLines(String file) {
        List<String> lines = PublishedGenbankRecords.rawLines(file);
        List<String> locations = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            Matcher m = CDS_LINE.matcher(lines.get(i).stripTrailing());
            if (m.matches()) {
                StringBuilder loc = new StringBuilder(m.group(1));
                while (loc.toString().endsWith(",")) {
                    loc.append(lines.get(++i).strip());
                }
                locations.add(loc.toString());
            }
        }
        return locations;
    }
}
