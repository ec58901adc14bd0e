package dev.annotator.pipeline;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelValidator;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import dev.annotator.topology.NcbiTables;
import dev.annotator.topology.TripletEmissions;
import dev.annotator.train.Freeze;
import dev.annotator.train.RunStamp;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeSet;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Training a gene topology keeps its structural zeros: with pseudocount 1 every parameter that is 0 in the start
 * model stays exactly 0 and every other one stays above 0, so the trained model still cannot put a stop codon of
 * NCBI table 11 (as BioJava ships it) inside a gene.
 */
class GeneTrainingZerosTest {
    private static final RunStamp STAMP = new RunStamp("annotator test", "annotator train", "2026-12-02T00:00:00Z");

    @TempDir
    Path dir;

    /** An invented record of genes on both strands between random non-coding stretches. */
    private record Genome(String bases, List<String> gff3Lines) {
    }

    private static Genome invent(long seed, int genes) {
        Random random = new Random(seed);
        List<String> sense = new ArrayList<>(NcbiTables.allCodons());
        sense.removeAll(NcbiTables.stops(11));
        List<String> stops = new ArrayList<>(NcbiTables.stops(11));
        List<String> starts = GeneticCode.TABLE_11.starts();
        StringBuilder b = new StringBuilder();
        List<String> lines = new ArrayList<>();
        for (int g = 0; g < genes; g++) {
            randomBases(random, b, 40 + random.nextInt(80));
            StringBuilder gene = new StringBuilder(starts.get(random.nextInt(starts.size())));
            int codons = 30 + random.nextInt(60);
            for (int i = 0; i < codons; i++) {
                gene.append(sense.get(random.nextInt(sense.size())));
            }
            gene.append(stops.get(random.nextInt(stops.size())));
            boolean reverse = random.nextBoolean();
            int start = b.length() + 1;
            b.append(reverse ? NcbiTables.reverseComplement(gene.toString()) : gene);
            lines.add("chrA\tinvented\tCDS\t" + start + "\t" + b.length() + "\t.\t" + (reverse ? '-' : '+') + "\t0\t.");
        }
        randomBases(random, b, 60);
        return new Genome(b.toString(), lines);
    }

    private static void randomBases(Random random, StringBuilder b, int n) {
        for (int i = 0; i < n; i++) {
            b.append("ACGT".charAt(random.nextInt(4)));
        }
    }

    private List<String> write(Genome g) throws IOException {
        Path fasta = dir.resolve("genome.fa");
        StringBuilder f = new StringBuilder(">chrA invented\n");
        for (int i = 0; i < g.bases().length(); i += 70) {
            f.append(g.bases(), i, Math.min(g.bases().length(), i + 70)).append('\n');
        }
        Files.writeString(fasta, f);
        Path gff = dir.resolve("genes.gff3");
        Files.writeString(gff, "##gff-version 3\n" + String.join("\n", g.gff3Lines()) + "\n");
        return List.of(fasta.toString(), gff.toString());
    }

    private static HmmModel train(HmmModel start, List<String> files, TrainingOptions options, boolean labels) {
        List<String> warnings = new ArrayList<>();
        HmmModel trained = new TrainingPipeline(start, start.name(), List.of(files.get(0)),
                labels ? files.get(1) : null, options, 1, warnings::add)
                .train((r, rs, i, ll, g, n, t) -> { }, STAMP);
        // every invented gene is whole and apart from the others, so none is left out
        assertThat(warnings).isEmpty();
        return trained;
    }

    @Test
    void countingAlongGenesKeepsTheZeros() throws IOException {
        HmmModel start = GeneTopology.build("genes", GeneticCode.TABLE_11, 4, 2);
        List<String> files = write(invent(5, 12));
        HmmModel trained = train(start, files,
                new TrainingOptions(TrainingMethod.COUNTING, 1, 1, 0, 0, 1, Freeze.NONE), true);
        ModelValidator.validate(trained, "trained");
        assertSameZeros(start, trained);
        assertStillTable11(trained);
    }

    @Test
    void baumWelchFromTheTopologyKeepsTheZeros() throws IOException {
        HmmModel start = GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 1, 4);
        List<String> files = write(invent(9, 8));
        HmmModel trained = train(start, files,
                new TrainingOptions(TrainingMethod.BAUM_WELCH, 1, 3, 0, 0, 1, Freeze.NONE), false);
        ModelValidator.validate(trained, "trained");
        assertThat(trained.provenance().training().iterations()).isEqualTo(3);
        assertSameZeros(start, trained);
        assertStillTable11(trained);
        // and with the genes as labels (the E-step restricted to the labels' states)
        HmmModel labelled = train(start, files,
                new TrainingOptions(TrainingMethod.BAUM_WELCH, 1, 2, 0, 0, 1, Freeze.NONE), true);
        assertSameZeros(start, labelled);
        assertStillTable11(labelled);
    }

    private static void assertSameZeros(HmmModel start, HmmModel trained) {
        assertThat(trained.states()).extracting(State::name)
                .containsExactlyElementsOf(start.states().stream().map(State::name).toList());
        int changed = 0;
        for (int s = 0; s < start.stateCount(); s++) {
            double[] before = start.states().get(s).emissions();
            double[] after = trained.states().get(s).emissions();
            assertThat(after).hasSameSizeAs(before);
            for (int i = 0; i < before.length; i++) {
                String where = start.states().get(s).name() + " entry " + i;
                if (before[i] == 0) {
                    assertThat(after[i]).as(where).isEqualTo(0.0);
                } else {
                    assertThat(after[i]).as(where).isGreaterThan(0.0);
                }
                if (after[i] != before[i]) {
                    changed++;
                }
            }
        }
        // training did something: the uniform placeholders moved
        assertThat(changed).isPositive();

        double[] s0 = start.start();
        double[] s1 = trained.start();
        for (int s = 0; s < s0.length; s++) {
            assertThat(s1[s] == 0).as("start of %s", start.states().get(s).name()).isEqualTo(s0[s] == 0);
        }
        Map<String, Double> before = transitions(start);
        Map<String, Double> after = transitions(trained);
        for (Map.Entry<String, Double> e : after.entrySet()) {
            assertThat(before).as("a transition the start model forbids: %s", e.getKey()).containsKey(e.getKey());
        }
        for (Map.Entry<String, Double> e : before.entrySet()) {
            assertThat(after.getOrDefault(e.getKey(), 0.0) > 0).as(e.getKey()).isEqualTo(e.getValue() > 0);
        }
    }

    private static Map<String, Double> transitions(HmmModel m) {
        Map<String, Double> out = new HashMap<>();
        for (Transition t : m.transitions()) {
            if (t.probability() > 0) {
                out.put(t.from() + " -> " + t.to(), t.probability());
            }
        }
        return out;
    }

    private static void assertStillTable11(HmmModel m) {
        Set<String> sense = new TreeSet<>(NcbiTables.allCodons());
        sense.removeAll(NcbiTables.stops(11));
        assertThat(TripletEmissions.emitted(m, "codon+1", "codon+2", "codon+3")).isEqualTo(sense);
        assertThat(TripletEmissions.emitted(m, "stop+1", "stop+2", "stop+3")).isEqualTo(NcbiTables.stops(11));
        assertThat(TripletEmissions.emitted(m, "start-3", "start-2", "start-1"))
                .containsExactlyInAnyOrder("CAT", "CAC", "CAA");
    }
}
