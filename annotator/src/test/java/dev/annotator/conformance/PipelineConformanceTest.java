package dev.annotator.conformance;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.model.State;
import dev.annotator.pipeline.AnnotationOptions;
import dev.annotator.pipeline.AnnotationPipeline;
import dev.annotator.pipeline.SimulationRun;
import dev.annotator.seq.FastaWriter;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.simulate.PlantedSegment;
import dev.annotator.simulate.SimulatedRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The whole annotation path on awkward but legal input, checked against the GFF3 specification v1.26 (through
 * {@link StrictGff3Reader}) and against composition recounted here from the FASTA file.
 *
 * <p>Input: two 500 kb records sampled from the shipped cpg-island model (fixed seed), then given an assembly
 * gap of 5 kb of N from the middle of a planted island on, N runs at the very start and end of a record,
 * scattered single N and other IUPAC ambiguity codes, soft-masked (lowercase) stretches, and one record name full
 * of characters GFF3 must percent-encode in a seqid (a FASTA name ends at white space, so it carries no space).
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class PipelineConformanceTest {
    private static final long SEED = 20240611L;
    private static final int LENGTH = 500_000;
    /**
     * GFF3 v1.26, Column 1: everything outside [a-zA-Z0-9.:^*$@!+_?-|] is escaped: here '#' (which would otherwise
     * open a comment line), the column 9 separators, a literal "%41" (which must not decode to 'A'), non-ASCII
     * (two and four UTF-8 bytes), DEL, and punctuation in and around the range a regex reading of "?-|" would form.
     */
    private static final String AWKWARD_NAME = "#chr1;x=y&z,w%41\u00e9[2]|+\uD83D\uDE00\u007F~`{}\\";
    private static final String PLAIN_NAME = "contig_2";
    private static final int GAP = 5_000;

    private Path dir;
    private HmmModel model;
    private Map<String, byte[]> fastaBases;
    private Path mixedCase;
    private Path upperCase;
    private int gapStart; // 1-based first base of the 5 kb gap in the first record
    private PlantedSegment cutIsland; // the planted island whose second half the gap replaces
    private final List<int[]> softMasked = new ArrayList<>(); // record index, 0-based start, end exclusive
    private final Map<String, Path> annotated = new HashMap<>();

    @BeforeAll
    void writeInput(@TempDir Path tempDir) throws IOException {
        dir = tempDir;
        model = ModelLoader.load("cpg-island");
        List<SimulatedRecord> sampled = new SimulationRun(model)
                .sample(List.of(AWKWARD_NAME, PLAIN_NAME), new int[]{LENGTH, LENGTH}, SEED);
        SplittableRandom rng = new SplittableRandom(SEED + 1);
        List<SequenceRecord> mixed = new ArrayList<>();
        List<SequenceRecord> upper = new ArrayList<>();
        for (int r = 0; r < sampled.size(); r++) {
            SimulatedRecord sim = sampled.get(r);
            byte[] bases = sim.record().bases().clone();
            if (r == 0) {
                cutIsland = islandToCut(sim.planted());
                gapStart = (cutIsland.start() + cutIsland.end()) / 2;
                fill(bases, gapStart - 1, gapStart - 1 + GAP, (byte) 'N');
            } else {
                fill(bases, 0, 120, (byte) 'N');
                fill(bases, LENGTH - 75, LENGTH, (byte) 'n');
            }
            byte[] ambiguity = "NNNNNnRYSWKMBDHV".getBytes(StandardCharsets.US_ASCII);
            for (int k = 0; k < 500; k++) {
                bases[rng.nextInt(LENGTH)] = ambiguity[rng.nextInt(ambiguity.length)];
            }
            // soft-masking: lowercase stretches, one of them over a whole planted island
            PlantedSegment island = sim.planted().get(sim.planted().size() / 2);
            lowercase(bases, island.start() - 1 - 300, island.end() + 300, r);
            for (int k = 0; k < 25; k++) {
                int from = rng.nextInt(LENGTH - 10_000);
                lowercase(bases, from, from + 50 + rng.nextInt(8_000), r);
            }
            mixed.add(new SequenceRecord(sim.record().name(), "", bases));
            upper.add(new SequenceRecord(sim.record().name(), "", new String(bases, StandardCharsets.US_ASCII)
                    .toUpperCase(Locale.ROOT).getBytes(StandardCharsets.US_ASCII)));
        }
        mixedCase = writeFasta("mixed.fa", mixed);
        upperCase = writeFasta("upper.fa", upper);
        fastaBases = PlainFasta.read(mixedCase);
    }

    @ParameterizedTest
    @EnumSource(DecodeMethod.class)
    void outputFollowsTheSpecificationAndTheDocumentedAttributes(DecodeMethod method) throws IOException {
        Path gffFile = annotate(mixedCase, method);
        ParsedGff3 gff = StrictGff3Reader.read(gffFile);

        // the seqid survives percent-encoding (GFF3 v1.26, Column 1) and each record gets its sequence-region
        assertThat(gff.regions().keySet()).containsExactly(AWKWARD_NAME, PLAIN_NAME);
        for (ParsedGff3.Region region : gff.regions().values()) {
            assertThat(region.start()).isEqualTo(1);
            assertThat(region.end()).isEqualTo(fastaBases.get(region.seqid()).length);
        }
        assertThat(Files.readString(gffFile)).contains(
                "##sequence-region %23chr1%3Bx%3Dy%26z%2Cw%2541%C3%A9%5B2%5D|+%F0%9F%98%80%7F%7E%60%7B%7D%5C 1 ");

        TwoChainLogOdds chains = new TwoChainLogOdds(state("island"), state("background"));
        int withAmbiguousBases = 0;
        int softMaskedCalls = 0;
        ParsedFeature previous = null;
        for (ParsedFeature f : gff.features()) {
            String where = "line " + f.line() + " " + f.seqid() + ":" + f.start() + ".." + f.end();
            if (previous != null && previous.seqid().equals(f.seqid())) {
                // README, Output: segments by start; Decoding: maximal runs, so two calls never touch
                assertThat(f.start()).as("%s follows a call ending at %d", where, previous.end())
                        .isGreaterThan(previous.end() + 1);
            } else if (previous != null) {
                // README, Output: records in input order
                assertThat(f.seqid()).isEqualTo(PLAIN_NAME);
            }
            previous = f;
            assertThat(f.source()).isEqualTo("annotator");
            assertThat(f.type()).isEqualTo("CpG_island");
            assertThat(f.attribute("ID")).as("%s", where).isNotNull();

            // README, Output: score = mean posterior of the label over the segment, 0 to 1;
            // posterior_min = the lowest posterior inside it, hence never above the mean
            assertThat(f.score()).as("%s", where).isNotNull().isBetween(0.0, 1.0);
            double posteriorMin = Double.parseDouble(f.attribute("posterior_min"));
            assertThat(posteriorMin).as("%s", where).isBetween(0.0, 1.0).isLessThanOrEqualTo(f.score());
            if (method == DecodeMethod.POSTERIOR) {
                // README, Decoding: posterior calls are runs where the posterior exceeds 0.5
                assertThat(posteriorMin).as("%s", where).isGreaterThanOrEqualTo(0.5);
            }

            // composition recounted from the FASTA file (Gardiner-Garden & Frommer 1987 measures, ambiguity
            // codes left out as the contributor guide defines them)
            BaseCounts counts = BaseCounts.of(fastaBases.get(f.seqid()), f.start(), f.end());
            assertThat(counts.unambiguous()).as("%s: a call made of ambiguity codes only", where).isPositive();
            assertThat(f.attribute("gc")).as("%s: gc against recounted %.6f", where, counts.gc())
                    .matches(counts::gcPrintedAs, "is (C+G)/L to 3 decimals");
            if (counts.hasObservedExpected()) {
                assertThat(f.attribute("cpg_oe")).as("%s: cpg_oe against recounted %.6f",
                        where, counts.cpgObservedExpected()).matches(counts::cpgObservedExpectedPrintedAs,
                        "is n(CG) x L / (n(C) x n(G)) to 3 decimals");
            } else {
                assertThat(f.attributes()).as("%s: no C or no G, so no ratio", where).doesNotContainKey("cpg_oe");
            }
            // README, Output: log_odds is the log2 likelihood ratio of the segment's bases, label states against
            // the others, with 2 decimals
            double bits = chains.bits(fastaBases.get(f.seqid()), f.start(), f.end());
            assertThat(f.attribute("log_odds")).as("%s: log_odds", where).matches("-?[0-9]+\\.[0-9]{2}");
            assertThat(Double.parseDouble(f.attribute("log_odds"))).as("%s: log_odds against recounted %.6f", where,
                    bits).isCloseTo(bits, within(0.005 + 1e-6));
            if (counts.ambiguous() > 0) {
                withAmbiguousBases++;
            }
            if (overlapsSoftMasked(f)) {
                softMaskedCalls++;
            }
        }
        // the checks above must have had something to bite on
        assertThat(gff.features()).extracting(ParsedFeature::seqid).contains(AWKWARD_NAME, PLAIN_NAME);
        assertThat(gff.features()).hasSizeGreaterThan(20);
        assertThat(withAmbiguousBases).as("calls containing ambiguity codes").isPositive();
        assertThat(softMaskedCalls).as("calls overlapping soft-masked bases").isPositive();
    }

    @ParameterizedTest
    @EnumSource(DecodeMethod.class)
    void softMaskingDoesNotChangeTheCalls(DecodeMethod method) throws IOException {
        // README, Input: "soft-masked lowercase is an ordinary base"
        String mixed = Files.readString(annotate(mixedCase, method));
        String upper = Files.readString(annotate(upperCase, method));
        assertThat(upper).isEqualTo(mixed);
        assertThat(Files.readString(mixedCase)).as("the input really is soft-masked").containsPattern("[acgt]{50}");
    }

    @Test
    void anIslandCutByAGapKeepsItsCallAndNoCallLiesInsideTheGap() throws IOException {
        ParsedGff3 gff = StrictGff3Reader.read(annotate(mixedCase, DecodeMethod.POSTERIOR));
        boolean firstHalfCalled = gff.features().stream().anyMatch(f -> f.seqid().equals(AWKWARD_NAME)
                && f.start() < gapStart && f.end() >= cutIsland.start());
        assertThat(firstHalfCalled).as("a call over %d..%d, the part of planted island %d..%d before the gap",
                cutIsland.start(), gapStart - 1, cutIsland.start(), cutIsland.end()).isTrue();
        // scattered codes and soft-masking may have landed in the gap, but it holds no unambiguous base
        assertThat(BaseCounts.of(fastaBases.get(AWKWARD_NAME), gapStart, gapStart + GAP - 1).unambiguous()).isZero();
        for (ParsedFeature f : gff.features()) {
            if (f.seqid().equals(AWKWARD_NAME)) {
                boolean inside = f.start() >= gapStart && f.end() < gapStart + GAP;
                assertThat(inside).as("call %d..%d inside the gap %d..%d", f.start(), f.end(), gapStart,
                        gapStart + GAP - 1).isFalse();
            }
        }
    }

    private State state(String name) {
        return model.states().get(model.stateIndex(name));
    }

    /** Runs the pipeline once per input and method; the tests share the output. */
    private Path annotate(Path fasta, DecodeMethod method) throws IOException {
        String outName = fasta.getFileName() + "." + method + ".gff3";
        Path done = annotated.get(outName);
        if (done != null) {
            return done;
        }
        Path out = dir.resolve(outName);
        List<String> warnings = new ArrayList<>();
        try (Writer w = Files.newBufferedWriter(out, StandardCharsets.UTF_8)) {
            new AnnotationPipeline(model, new AnnotationOptions(method, 0, 2))
                    .run(fasta.toString(), InputStream.nullInputStream(), w, outName, warnings::add, a -> { });
        }
        assertThat(warnings).isEmpty();
        annotated.put(outName, out);
        return out;
    }

    /** The first planted island of at least 1 kb far enough from the record's end for a gap from its middle. */
    private static PlantedSegment islandToCut(List<PlantedSegment> planted) {
        for (PlantedSegment p : planted) {
            if (p.length() >= 1_000 && p.start() > 1_000 && p.end() + GAP < LENGTH - 1_000) {
                return p;
            }
        }
        throw new IllegalStateException("no planted island of 1 kb; change the seed");
    }

    private static void fill(byte[] bases, int from, int to, byte b) {
        for (int i = Math.max(0, from); i < Math.min(bases.length, to); i++) {
            bases[i] = b;
        }
    }

    private void lowercase(byte[] bases, int from, int to, int record) {
        int lo = Math.max(0, from);
        int hi = Math.min(bases.length, to);
        for (int i = lo; i < hi; i++) {
            bases[i] = (byte) Character.toLowerCase((char) bases[i]);
        }
        softMasked.add(new int[]{record, lo, hi});
    }

    private boolean overlapsSoftMasked(ParsedFeature f) {
        int record = f.seqid().equals(AWKWARD_NAME) ? 0 : 1;
        for (int[] m : softMasked) {
            if (m[0] == record && f.start() - 1 < m[2] && m[1] < f.end()) {
                return true;
            }
        }
        return false;
    }

    private Path writeFasta(String name, List<SequenceRecord> records) throws IOException {
        Path path = dir.resolve(name);
        try (OutputStream out = Files.newOutputStream(path)) {
            FastaWriter writer = new FastaWriter(out);
            for (SequenceRecord r : records) {
                writer.write(r);
            }
            writer.flush();
        }
        return path;
    }
}
