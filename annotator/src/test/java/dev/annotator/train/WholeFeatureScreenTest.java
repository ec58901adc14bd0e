package dev.annotator.train;

import dev.annotator.labels.KnownLabels;
import dev.annotator.labels.LabelledFeatures;
import dev.annotator.labels.LabelledInterval;
import dev.annotator.model.HmmModel;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import dev.annotator.topology.NcbiTables;
import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Which hand-placed genes of an invented record the gene screen keeps, and the pieces of the record left for
 * training. Whether an invented gene has a stop inside is checked against NCBI table 11 as BioJava ships it.
 */
class WholeFeatureScreenTest {
    private static final HmmModel MODEL = GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 1, 4);
    private static final int FWD = MODEL.labelIndex(GeneTopology.FORWARD_LABEL);
    private static final int REV = MODEL.labelIndex(GeneTopology.REVERSE_LABEL);

    /** An invented record built base by base; genes are placed at the current end. */
    private static final class Record {
        private final StringBuilder bases = new StringBuilder();
        private final Random random = new Random(7);
        private final List<LabelledInterval> features = new ArrayList<>();

        Record noncoding(int n) {
            for (int i = 0; i < n; i++) {
                bases.append("ACGT".charAt(random.nextInt(4)));
            }
            return this;
        }

        /** Places text (as read on the forward strand) labelled as a gene; returns the feature. */
        LabelledInterval place(String forwardText, int label) {
            long start = bases.length() + 1;
            bases.append(forwardText);
            LabelledInterval f = new LabelledInterval("r", start, bases.length(), label, features.size() + 1);
            features.add(f);
            return f;
        }

        /** Places a gene whose first {@code shared} bases are the last bases placed (the genes overlap). */
        LabelledInterval overlapping(String forwardText, int shared, int label) {
            assertThat(bases.substring(bases.length() - shared)).isEqualTo(forwardText.substring(0, shared));
            long start = bases.length() - shared + 1;
            bases.append(forwardText.substring(shared));
            LabelledInterval f = new LabelledInterval("r", start, bases.length(), label, features.size() + 1);
            features.add(f);
            return f;
        }

        byte[] bytes() {
            return bases.toString().getBytes(StandardCharsets.US_ASCII);
        }
    }

    /** A gene of {@code codons} sense codons drawn at random, with the given start and stop. */
    private static String gene(Random random, String start, int codons, String stop) {
        List<String> sense = new ArrayList<>(NcbiTables.allCodons());
        sense.removeAll(NcbiTables.stops(11));
        StringBuilder b = new StringBuilder(start);
        for (int i = 0; i < codons; i++) {
            b.append(sense.get(random.nextInt(sense.size())));
        }
        return b.append(stop).toString();
    }

    private static boolean hasInFrameStop(String gene) {
        for (int i = 3; i + 3 < gene.length(); i += 3) {
            if (NcbiTables.translation(11).get(gene.substring(i, i + 3)) == '*') {
                return true;
            }
        }
        return false;
    }

    @Test
    void keepsWholeGenesAndDropsTheRest() {
        Random random = new Random(11);
        Record r = new Record();
        r.noncoding(40);
        String good = gene(random, "ATG", 30, "TAA");
        assertThat(hasInFrameStop(good)).isFalse();
        LabelledInterval keptForward = r.place(good, FWD);
        r.noncoding(30);
        LabelledInterval keptReverse = r.place(NcbiTables.reverseComplement(gene(random, "GTG", 25, "TGA")), REV);
        r.noncoding(30);
        String stopInside = gene(random, "ATG", 10, "TAG") + gene(random, "ATG", 10, "TAA").substring(3);
        assertThat(hasInFrameStop(stopInside)).as("TAG in frame inside").isTrue();
        LabelledInterval withStop = r.place(stopInside, FWD);
        r.noncoding(30);
        // AAA translates to lysine and is no initiator of table 11
        assertThat(NcbiTables.starts(11)).doesNotContain("AAA");
        LabelledInterval noStart = r.place(gene(random, "AAA", 20, "TAA"), FWD);
        r.noncoding(30);
        String whole = gene(random, "TTG", 20, "TAG");
        LabelledInterval notWholeCodons = r.place(whole + "C", FWD);
        assertThat(notWholeCodons.end() - notWholeCodons.start() + 1).isEqualTo(3 * 22 + 1);
        r.noncoding(30);
        // two emittable genes in different frames sharing 4 bases: ...GCA TGA and ATG AAA...
        LabelledInterval a = r.place(gene(random, "ATG", 20, "") + "GCATGA", FWD);
        LabelledInterval b = r.overlapping("ATGAAA" + gene(random, "", 20, "TAA"), 4, FWD);
        assertThat(b.start()).isEqualTo(a.end() - 3);
        r.noncoding(30);
        // two that touch, on opposite strands: the second begins on the base after the first ends
        LabelledInterval c = r.place(gene(random, "ATG", 15, "TGA"), FWD);
        LabelledInterval d = r.place(NcbiTables.reverseComplement(gene(random, "GTG", 15, "TAA")), REV);
        assertThat(d.start()).isEqualTo(c.end() + 1);
        r.noncoding(40);

        // the overlapping genes are each emittable on their own
        WholeFeatureScreen screen = new WholeFeatureScreen(MODEL);
        for (LabelledInterval alone : List.of(a, b, c, d, keptForward, keptReverse)) {
            assertThat(screen.screen(r.bytes(), List.of(alone)).kept()).as("%s alone", alone).containsExactly(alone);
        }

        List<LabelledInterval> shuffled = new ArrayList<>(r.features);
        java.util.Collections.reverse(shuffled); // the screen sorts by itself
        WholeFeatureScreen.Outcome o = screen.screen(r.bytes(), shuffled);
        assertThat(o.kept()).containsExactlyInAnyOrder(keptForward, keptReverse);
        assertThat(o.stranded()).isEqualTo(9);
        assertThat(o.notEmittable()).isEqualTo(3);
        assertThat(o.overlapping()).isEqualTo(4);
        assertThat(o.excluded()).containsExactly(
                span(withStop), span(noStart), span(notWholeCodons),
                new LabelledInterval("r", a.start(), b.end(), -1, a.line()),
                new LabelledInterval("r", c.start(), d.end(), -1, c.line()));

        // what is left for training: the record minus the excluded spans, as 0-based half-open pieces
        int length = r.bases.length();
        KnownLabels known = new LabelledFeatures("labels.gff3", Map.of("r", r.features))
                .with(Map.of("r", o.kept()), Map.of("r", o.excluded())).known(MODEL);
        List<int[]> pieces = known.pieces("r", length);
        boolean[] trained = new boolean[length];
        for (int[] p : pieces) {
            for (int i = p[0]; i < p[1]; i++) {
                trained[i] = true;
            }
        }
        for (int i = 0; i < length; i++) {
            long pos = i + 1;
            boolean inExcluded = o.excluded().stream().anyMatch(x -> x.start() <= pos && pos <= x.end());
            assertThat(trained[i]).as("base %d", pos).isEqualTo(!inExcluded);
        }
        assertThat(pieces).hasSize(6);
        assertThat(pieces.get(0)).containsExactly(0, (int) withStop.start() - 1);
        assertThat(pieces.get(5)).containsExactly((int) d.end(), length);
        // the kept genes keep their labels
        byte[] labels = known.labelsOf("r", length);
        assertThat(labels[(int) keptForward.start() - 1]).isEqualTo((byte) FWD);
        assertThat(labels[(int) keptReverse.end() - 1]).isEqualTo((byte) REV);
        assertThat(labels[(int) withStop.start() - 1]).isEqualTo((byte) MODEL.labelIndex(GeneTopology.NONCODING));
    }

    @Test
    void piecesAtTheRecordEnds() {
        Map<String, List<LabelledInterval>> none = Map.of();
        LabelledFeatures features = new LabelledFeatures("labels.gff3", none);
        // nothing excluded: the whole record
        assertThat(features.known(MODEL).pieces("r", 100)).singleElement()
                .satisfies(p -> assertThat(p).containsExactly(0, 100));
        // spans at both ends leave only the middle, no empty pieces
        KnownLabels ends = features.with(none, Map.of("r", List.of(new LabelledInterval("r", 1, 10, -1, 1),
                new LabelledInterval("r", 91, 100, -1, 2)))).known(MODEL);
        assertThat(ends.pieces("r", 100)).singleElement().satisfies(p -> assertThat(p).containsExactly(10, 90));
        // another record is untouched
        assertThat(ends.pieces("other", 50)).singleElement().satisfies(p -> assertThat(p).containsExactly(0, 50));
        // all excluded: nothing to train on
        KnownLabels all = features.with(none, Map.of("r", List.of(new LabelledInterval("r", 1, 100, -1, 1))))
                .known(MODEL);
        assertThat(all.pieces("r", 100)).allSatisfy(p -> assertThat(p[1] - p[0]).isZero());
    }

    private static LabelledInterval span(LabelledInterval f) {
        return new LabelledInterval(f.seqid(), f.start(), f.end(), -1, f.line());
    }
}
