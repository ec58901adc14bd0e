package dev.annotator.labels;

import dev.annotator.error.BadInputException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ShippedModels;
import dev.annotator.seq.PublishedGenbankRecords;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import dev.annotator.topology.NcbiTables;
import org.junit.jupiter.api.Test;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

/**
 * Labels for a model with a label per strand: GFF3 column 7 (strand: '+', '-', '.' unstranded, '?' unknown, per
 * the GFF3 specification v1.26) picks the label of a CDS; GenBank CDS take theirs from {@code complement(...)}.
 */
class StrandedLabelsTest {
    private static final HmmModel GENES = GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 0, 0);
    private static final int FWD = GENES.labelIndex(GeneTopology.FORWARD_LABEL);
    private static final int REV = GENES.labelIndex(GeneTopology.REVERSE_LABEL);

    private static LabelledFeatures read(String text, List<String> warnings) throws IOException {
        return new LabelGff3Reader(GENES).readFeatures(new BufferedReader(new StringReader(text)), "labels.gff3",
                warnings::add);
    }

    @Test
    void cdsStrandPicksTheLabel() throws IOException {
        List<String> warnings = new ArrayList<>();
        LabelledFeatures f = read("""
                ##gff-version 3
                c1\tsrc\tCDS\t10\t99\t.\t+\t0\tID=a
                c1\tsrc\tCDS\t200\t298\t.\t-\t0\tID=b
                c1\tsrc\tSO:0000316\t400\t402\t.\t-\t0\tID=c
                c1\tsrc\tgene\t10\t99\t.\t+\t.\tID=g
                """, warnings);
        assertThat(f.of("c1")).containsExactly(
                new LabelledInterval("c1", 10, 99, FWD, 2),
                new LabelledInterval("c1", 200, 298, REV, 3),
                new LabelledInterval("c1", 400, 402, REV, 4));
        assertThat(warnings).containsExactly(
                "labels.gff3: skipped features of types that are no label of model genes: gene (1)");
    }

    @Test
    void cdsWithoutStrandIsAnErrorNamingTheLine() {
        for (String strand : List.of(".", "?")) {
            BadInputException e = catchThrowableOfType(BadInputException.class, () -> read(
                    "##gff-version 3\nc1\tsrc\tCDS\t10\t99\t.\t+\t0\t.\nc1\tsrc\tCDS\t200\t298\t.\t" + strand
                            + "\t0\t.\n", List.of()));
            assertThat(e).as(strand).isNotNull();
            assertThat(e.getMessage()).startsWith("labels.gff3:3: ").doesNotContain("\n")
                    .isEqualTo("labels.gff3:3: feature of type CDS needs strand + or - (column 7 is '" + strand
                            + "'): model genes has a label for each strand");
            assertThat(e.exitCode()).isEqualTo(65);
        }
    }

    @Test
    void unstrandedModelsStillIgnoreTheStrandColumn() throws IOException {
        HmmModel islands = ShippedModels.load("cpg-island").orElseThrow();
        LabelledFeatures f = new LabelGff3Reader(islands).readFeatures(new BufferedReader(new StringReader(
                "c1\ts\tCpG_island\t1\t10\t.\t.\t.\t.\nc1\ts\tCpG_island\t20\t30\t.\t-\t.\t.\n")), "x.gff3", w -> { });
        assertThat(f.of("c1")).extracting(LabelledInterval::label).containsOnly(islands.labelIndex("island"));
    }

    /** The CDS of pPCP1 by the text of its feature table: location a..b or complement(a..b). */
    @Test
    void genbankCdsGetTheLabelOfTheirStrand() {
        String file = PublishedGenbankRecords.PLASMID;
        List<String> warnings = new ArrayList<>();
        LabelledFeatures f = GenbankLabels.read(GENES, PublishedGenbankRecords.path(file).toString(), warnings::add);
        assertThat(warnings).isEmpty();
        assertThat(f.size()).isEqualTo(10); // 10 CDS, all single intervals (test-data README)

        Pattern cds = Pattern.compile("^ {5}CDS {13}(complement\\()?(\\d+)\\.\\.(\\d+)\\)?$");
        List<long[]> fromText = new ArrayList<>();
        for (String line : PublishedGenbankRecords.rawLines(file)) {
            Matcher m = cds.matcher(line.stripTrailing());
            if (m.matches()) {
                fromText.add(new long[]{Long.parseLong(m.group(2)), Long.parseLong(m.group(3)),
                        m.group(1) == null ? FWD : REV});
            }
        }
        assertThat(fromText).hasSize(10);
        String seqid = f.bySeqid().keySet().iterator().next();
        assertThat(f.of(seqid)).extracting(i -> List.of(i.start(), i.end(), (long) i.label()))
                .containsExactlyInAnyOrderElementsOf(fromText.stream().map(a -> List.of(a[0], a[1], a[2])).toList());
        assertThat(f.of(seqid)).filteredOn(i -> i.label() == REV).extracting(LabelledInterval::start)
                .containsExactlyInAnyOrder(4815L, 7789L, 8088L);

        // each label's strand matches the bases: a stop codon of NCBI table 11 (BioJava's copy) closes every CDS
        // when read on its label's strand
        String bases = PublishedGenbankRecords.rawBases(file).toUpperCase(java.util.Locale.ROOT);
        for (LabelledInterval i : f.of(seqid)) {
            String gene = bases.substring((int) i.start() - 1, (int) i.end());
            if (i.label() == REV) {
                gene = NcbiTables.reverseComplement(gene);
            }
            assertThat(NcbiTables.stops(11)).as("%d..%d", i.start(), i.end())
                    .contains(gene.substring(gene.length() - 3));
        }
    }

    @Test
    void genbankNeedsACdsLabel() {
        HmmModel islands = ShippedModels.load("cpg-island").orElseThrow();
        String path = PublishedGenbankRecords.path(PublishedGenbankRecords.PLASMID).toString();
        BadInputException e = catchThrowableOfType(BadInputException.class,
                () -> GenbankLabels.read(islands, path, w -> { }));
        assertThat(e).isNotNull();
        assertThat(e.getMessage()).doesNotContain("\n").contains("has no label for CDS features on the forward strand");
    }
}
