package dev.annotator.conformance;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.AnnotationOptions;
import dev.annotator.pipeline.AnnotationPipeline;
import dev.annotator.pipeline.SimulationRun;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The calls against a criterion from outside the project: Gardiner-Garden &amp; Frommer (1987, J Mol Biol
 * 196:261) define a CpG island as a stretch of at least 200 bp with GC fraction above 0.5 and observed/expected
 * CpG above 0.6. On sequence sampled from the shipped cpg-island model (5 records of 1 Mbp, fixed seed),
 * annotated with a minimum length of 200, most calls should meet that definition (computed here from the bases),
 * and the planted islands long enough to meet it should be found.
 */
class IslandCriteriaTest {
    private static final long SEED = 1987L;
    private static final int RECORDS = 5;
    private static final int LENGTH = 1_000_000;
    /** Gardiner-Garden &amp; Frommer (1987): an island is at least 200 bp long. */
    private static final int CRITERION_MIN_LENGTH = 200;

    @Test
    void callsMeetTheGardinerGardenFrommerCriteriaAndFindThePlantedIslands(@TempDir Path dir) throws IOException {
        HmmModel model = ModelLoader.load("cpg-island");
        Path fasta = dir.resolve("sim.fa");
        Path truthFile = dir.resolve("sim.truth.gff3");
        try (OutputStream out = Files.newOutputStream(fasta);
             Writer truth = Files.newBufferedWriter(truthFile, StandardCharsets.UTF_8)) {
            new SimulationRun(model).write("sim", LENGTH, RECORDS, SEED, out, truth);
        }
        // the planted islands come from the truth file, which must follow the specification as well
        List<ParsedFeature> planted = StrictGff3Reader.read(truthFile).features();

        Path gffFile = dir.resolve("calls.gff3");
        try (Writer w = Files.newBufferedWriter(gffFile, StandardCharsets.UTF_8)) {
            new AnnotationPipeline(model, new AnnotationOptions(DecodeMethod.POSTERIOR, CRITERION_MIN_LENGTH, 2))
                    .run(fasta.toString(), InputStream.nullInputStream(), w, "calls.gff3", s -> { }, a -> { });
        }
        List<ParsedFeature> calls = StrictGff3Reader.read(gffFile).features();
        Map<String, byte[]> bases = PlainFasta.read(fasta);

        int meeting = 0;
        for (ParsedFeature f : calls) {
            if (BaseCounts.of(bases.get(f.seqid()), f.start(), f.end()).meetsGardinerGardenFrommer(f.length())) {
                meeting++;
            }
        }

        // recall is counted over planted islands of at least the criterion's own minimum length, 200 bp: the
        // criterion does not call anything shorter an island, and the run drops shorter calls too
        int eligible = 0;
        int recalled = 0;
        for (ParsedFeature p : planted) {
            if (p.length() < CRITERION_MIN_LENGTH) {
                continue;
            }
            eligible++;
            if (calls.stream().anyMatch(f -> f.seqid().equals(p.seqid()) && f.start() <= p.end()
                    && p.start() <= f.end())) {
                recalled++;
            }
        }

        assertThat(calls).as("calls on 5 Mbp").hasSizeGreaterThan(100);
        assertThat(planted).extracting(ParsedFeature::seqid).containsOnly("sim1", "sim2", "sim3", "sim4", "sim5");
        assertThat(eligible).as("planted islands of at least 200 bp").isGreaterThan(100);
        double meetingFraction = (double) meeting / calls.size();
        double recall = (double) recalled / eligible;
        // the 0.9 bounds are the acceptance level set for this test, not a published figure
        assertThat(meetingFraction).as("fraction of calls meeting Gardiner-Garden & Frommer 1987: %.4f (%d of %d)",
                meetingFraction, meeting, calls.size()).isGreaterThanOrEqualTo(0.9);
        assertThat(recall).as("recall of planted islands >= 200 bp: %.4f (%d of %d)", recall, recalled, eligible)
                .isGreaterThanOrEqualTo(0.9);
    }
}
