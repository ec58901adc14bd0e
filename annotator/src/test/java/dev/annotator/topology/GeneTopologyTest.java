package dev.annotator.topology;

import dev.annotator.hmm.BaumWelchKernel;
import dev.annotator.hmm.ImpossibleSequenceException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelCompiler;
import dev.annotator.model.ModelValidator;
import dev.annotator.model.State;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatCode;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * The gene topology's structural zeros against the NCBI genetic codes as BioJava ships them ({@link NcbiTables}):
 * which triplets each run of three codon states can emit, and whether labelled genes can be emitted at all.
 */
class GeneTopologyTest {

    @ParameterizedTest
    @CsvSource({"2, 0, 0", "4, 4, 12", "3, 1, 60", "8, 2, 1"})
    void buildsAValidModel(int codingOrder, int noncodingOrder, int upstream) {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, codingOrder, noncodingOrder, upstream);
        assertThatCode(() -> ModelValidator.validate(m, "x")).doesNotThrowAnyException();
        assertThat(m.stateCount()).isEqualTo(1 + 2 * upstream + 18);
    }

    @Test
    void statesComeInTheDocumentedOrderWithTheirStrandAndCodonPosition() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 2);
        List<String> expected = new ArrayList<>(List.of("noncoding"));
        for (int j = 12; j >= 1; j--) {
            expected.add("upstream+" + j);
        }
        for (int j = 1; j <= 12; j++) {
            expected.add("upstream-" + j);
        }
        for (String kind : List.of("start", "codon", "stop")) {
            for (int q = 1; q <= 3; q++) {
                expected.add(kind + "+" + q);
            }
        }
        for (String kind : List.of("stop", "codon", "start")) {
            for (int q = 3; q >= 1; q--) {
                expected.add(kind + "-" + q);
            }
        }
        assertThat(m.states()).extracting(State::name).containsExactlyElementsOf(expected);
        for (State s : m.states()) {
            Label l = m.labels().get(m.labelIndex(s.label()));
            if (s.name().matches("(start|codon|stop)[+-][123]")) {
                // the number in the name is the codon position on the gene's own strand
                assertThat(s.codonPosition()).as(s.name()).isEqualTo(s.name().charAt(s.name().length() - 1) - '0');
                assertThat(l.strand()).as(s.name()).isEqualTo(s.name().charAt(s.name().length() - 2));
            } else {
                assertThat(s.codonPosition()).as(s.name()).isZero();
                assertThat(l.background()).as(s.name()).isTrue();
            }
        }
        // CDS is SO:0000316 in the Sequence Ontology (recalled from memory)
        assertThat(m.reportedLabels()).extracting(Label::featureType, Label::soAccession, Label::strand)
                .containsExactly(org.assertj.core.groups.Tuple.tuple("CDS", "SO:0000316", '+'),
                        org.assertj.core.groups.Tuple.tuple("CDS", "SO:0000316", '-'));
    }

    @Test
    void biojavaTablesAgreeWithWhatTheTestsAssume() {
        // NCBI "The Genetic Codes", table 11 (Bacterial, Archaeal and Plant Plastid): stops TAA, TAG, TGA; table 4
        // (Mold, Protozoan, ... Mitochondrial; Mycoplasma/Spiroplasma): TGA is tryptophan (recalled from memory,
        // and here read from BioJava's copy of the tables)
        assertThat(NcbiTables.stops(11)).containsExactlyInAnyOrder("TAA", "TAG", "TGA");
        assertThat(NcbiTables.stops(4)).containsExactlyInAnyOrder("TAA", "TAG");
        assertThat(NcbiTables.translation(4).get("TGA")).isEqualTo('W');
        assertThat(NcbiTables.translation(11)).hasSize(64);
        // the topology's three starts are among the initiators table 11 lists
        assertThat(NcbiTables.starts(11)).containsAll(GeneticCode.TABLE_11.starts());
        assertThat(GeneticCode.TABLE_11.stops()).containsExactlyInAnyOrderElementsOf(NcbiTables.stops(11));
    }

    @ParameterizedTest
    @ValueSource(ints = {2, 4})
    void forwardCodonStatesEmitEveryCodonButTheStops(int codingOrder) {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, codingOrder, 0);
        Set<String> emitted = TripletEmissions.emitted(m, "codon+1", "codon+2", "codon+3");
        Set<String> expected = new TreeSet<>(NcbiTables.allCodons());
        expected.removeAll(NcbiTables.stops(11));
        assertThat(emitted).hasSize(61).isEqualTo(expected);
    }

    @ParameterizedTest
    @ValueSource(ints = {2, 4})
    void reverseCodonStatesEmitTheReverseComplementOfEveryCodonButTheStops(int codingOrder) {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, codingOrder, 0);
        // read forwards, a reverse-strand codon passes codon position 3 first
        Set<String> emitted = TripletEmissions.emitted(m, "codon-3", "codon-2", "codon-1");
        Set<String> expected = new TreeSet<>();
        for (String c : NcbiTables.allCodons()) {
            if (!NcbiTables.stops(11).contains(c)) {
                expected.add(NcbiTables.reverseComplement(c));
            }
        }
        assertThat(emitted).hasSize(61).isEqualTo(expected);
        assertThat(emitted).doesNotContain("TTA", "CTA", "TCA");
    }

    @Test
    void startStatesEmitExactlyTheThreeStarts() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 0);
        assertThat(TripletEmissions.emitted(m, "start+1", "start+2", "start+3")).containsExactlyInAnyOrder("ATG", "GTG", "TTG");
        assertThat(TripletEmissions.emitted(m, "start-3", "start-2", "start-1")).containsExactlyInAnyOrder("CAT", "CAC", "CAA")
                .isEqualTo(reverseComplements(List.of("ATG", "GTG", "TTG")));
    }

    @Test
    void stopStatesEmitExactlyTheStops() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 0);
        assertThat(TripletEmissions.emitted(m, "stop+1", "stop+2", "stop+3")).isEqualTo(NcbiTables.stops(11));
        assertThat(TripletEmissions.emitted(m, "stop-3", "stop-2", "stop-1")).isEqualTo(reverseComplements(NcbiTables.stops(11)))
                .containsExactlyInAnyOrder("TTA", "CTA", "TCA");
    }

    // ---- whole genes through the label-restricted forward pass ----

    private static final String LEFT = "GATCCGTTAGCAAGTCCGATGGTAC"; // invented flanks
    private static final String RIGHT = "TTGACCGGATCAAGCTTAGGCATCG";
    private static final List<String> SENSE = List.of("GCT", "GAA", "AAA", "CTG", "GGC", "TGG", "CGT", "TTC", "AGC",
            "CAG", "ATC", "GAT", "ACC", "TAC", "GTT", "CCA");

    private static String gene(String start, List<String> inner, String stop) {
        return start + String.join("", inner) + stop;
    }

    private static List<String> withCodonAt(int i, String codon) {
        List<String> out = new ArrayList<>(SENSE);
        out.set(i, codon);
        return out;
    }

    @Test
    void aForwardGeneWithAnInFrameStopCannotBeEmitted() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 2);
        for (String stop : NcbiTables.stops(11)) {
            assertThat(emittable(m, gene("ATG", SENSE, stop), '+')).as("ATG...%s", stop).isTrue();
            for (String inner : NcbiTables.stops(11)) {
                assertThat(emittable(m, gene("ATG", withCodonAt(7, inner), stop), '+'))
                        .as("%s inside, ending %s", inner, stop).isFalse();
            }
        }
        // a stop out of frame is no stop: TGA across two codons (GCT GAA) at offset 5, not a codon boundary
        assertThat(gene("ATG", SENSE, "TAA").indexOf("TGA")).isEqualTo(5);
        assertThat(emittable(m, gene("GTG", SENSE, "TAA"), '+')).isTrue();
    }

    @Test
    void aReverseGeneWithAnInFrameStopCannotBeEmitted() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 2);
        String good = NcbiTables.reverseComplement(gene("TTG", SENSE, "TAG"));
        String bad = NcbiTables.reverseComplement(gene("TTG", withCodonAt(3, "TGA"), "TAG"));
        assertThat(emittable(m, good, '-')).isTrue();
        assertThat(emittable(m, bad, '-')).isFalse();
        // and neither reads as a forward gene: the forward start and stop states see CTA ... CAA
        assertThat(emittable(m, good, '+')).isFalse();
    }

    @Test
    void genesMustStartWithAStartAndEndWithAStopAndBeWholeCodons() {
        HmmModel m = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 2);
        // CTG is an initiator in table 11 but not one of the topology's three
        assertThat(emittable(m, gene("CTG", SENSE, "TAA"), '+')).isFalse();
        assertThat(emittable(m, gene("ATG", SENSE, "TGG"), '+')).isFalse();
        assertThat(emittable(m, gene("ATG", SENSE, "TAA") + "A", '+')).isFalse();
    }

    @Test
    void withTgaReadAsTryptophanAGeneMayCarryTga() {
        // NCBI table 4 stops are TAA and TAG only (recalled from memory; checked against BioJava above)
        GeneticCode table4 = new GeneticCode("NCBI translation table 4", GeneticCode.TABLE_11.starts(),
                List.of("TAA", "TAG"));
        HmmModel m = GeneTopology.build("genes", table4, 4, 2);
        ModelValidator.validate(m, "x");
        String withTga = gene("ATG", withCodonAt(5, "TGA"), "TAA");
        assertThat(emittable(m, withTga, '+')).isTrue();
        assertThat(emittable(m, NcbiTables.reverseComplement(withTga), '-')).isTrue();
        assertThat(emittable(m, gene("ATG", SENSE, "TGA"), '+')).as("TGA no longer ends a gene").isFalse();
        assertThat(TripletEmissions.emitted(m, "codon+1", "codon+2", "codon+3")).contains("TGA").doesNotContain("TAA", "TAG");
        // the same gene under table 11 is not emittable
        HmmModel t11 = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 2);
        assertThat(emittable(t11, withTga, '+')).isFalse();
    }

    @Test
    void codesThatMakeNoSenseAreRefused() {
        assertThatThrownBy(() -> new GeneticCode("x", List.of("ATG"), List.of("TAA", "XYZ")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("XYZ");
        assertThatThrownBy(() -> new GeneticCode("x", List.of("ATG"), List.of("ATG")))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> GeneTopology.build("g", GeneticCode.TABLE_11, 1, 0))
                .isInstanceOf(IllegalArgumentException.class);
        assertThat(new GeneticCode("x", List.of(" atg "), List.of("taa")).starts()).containsExactly("ATG");
    }

    @Test
    void reverseComplementMatchesTheIndependentOne() {
        for (String c : NcbiTables.allCodons()) {
            assertThat(GeneticCode.reverseComplement(c)).isEqualTo(NcbiTables.reverseComplement(c));
        }
    }

    // ---- helpers ----

    private static Set<String> reverseComplements(java.util.Collection<String> codons) {
        return codons.stream().map(NcbiTables::reverseComplement).collect(Collectors.toCollection(TreeSet::new));
    }

    /** Whether the model can emit {@code gene}, labelled as a gene on {@code strand}, between non-coding flanks. */
    static boolean emittable(HmmModel m, String gene, char strand) {
        String text = LEFT + gene + RIGHT;
        byte[] bases = text.getBytes(StandardCharsets.US_ASCII);
        byte[] classes = new byte[bases.length];
        Arrays.fill(classes, (byte) m.labelIndex(GeneTopology.NONCODING));
        int label = m.labelIndex(strand == '+' ? GeneTopology.FORWARD_LABEL : GeneTopology.REVERSE_LABEL);
        Arrays.fill(classes, LEFT.length(), LEFT.length() + gene.length(), (byte) label);
        BaumWelchKernel kernel = new BaumWelchKernel(ModelCompiler.compile(m), m.stateLabels(),
                BaumWelchKernel.DEFAULT_BLOCK, Integer.MAX_VALUE);
        try {
            return kernel.logLikelihood(bases, classes) > Double.NEGATIVE_INFINITY;
        } catch (ImpossibleSequenceException e) {
            return false;
        }
    }
}
