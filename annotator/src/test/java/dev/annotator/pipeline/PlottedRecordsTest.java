package dev.annotator.pipeline;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.decode.ProfileOptions;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.seq.FastaWriter;
import dev.annotator.seq.SequenceRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * A report draws the first records only, so only they get plot bins: the records after them (in input order,
 * whatever the thread count) get the same segments, composition and log-odds as with a plot for every record,
 * and no plot.
 */
class PlottedRecordsTest {
    @TempDir
    Path dir;

    @Test
    void recordsPastThePlottedOnesGetEverythingButThePlot() throws IOException {
        HmmModel model = ModelLoader.load("cpg-island");
        List<SequenceRecord> records = new ArrayList<>();
        for (var s : new SimulationRun(model).sample(List.of("a", "b", "c", "d", "e", "f"),
                new int[]{30_000, 400, 25_000, 9_000, 60_000, 700}, 3L)) {
            records.add(s.record());
        }
        Path fasta = dir.resolve("in.fa");
        try (OutputStream out = Files.newOutputStream(fasta)) {
            FastaWriter w = new FastaWriter(out);
            for (SequenceRecord r : records) {
                w.write(r);
            }
            w.flush();
        }
        List<RecordAnnotation> limited = run(model, fasta, 2);
        List<RecordAnnotation> all = run(model, fasta, Integer.MAX_VALUE);

        assertThat(limited).extracting(RecordAnnotation::seqid).containsExactly("a", "b", "c", "d", "e", "f");
        IntStream.range(0, 6).forEach(i -> {
            RecordAnnotation a = limited.get(i);
            RecordAnnotation b = all.get(i);
            assertThat(b.profile().plot()).isNotNull();
            if (i < 2) {
                assertThat(a.profile().plot()).isNotNull();
                assertThat(a.profile().plot().max()).containsExactly(b.profile().plot().max());
            } else {
                assertThat(a.profile().plot()).as("record %d", i).isNull();
            }
            assertThat(a.segments()).isEqualTo(b.segments());
            assertThat(a.profile().composition()).isEqualTo(b.profile().composition());
            assertThat(a.profile().logOddsBitsPerBase()).isEqualTo(b.profile().logOddsBitsPerBase());
            assertThat(a.profile().longestAmbiguousRun()).isEqualTo(b.profile().longestAmbiguousRun());
        });
    }

    private static List<RecordAnnotation> run(HmmModel model, Path fasta, int plotted) {
        ProfileOptions profile = new ProfileOptions(null, 1, false, true, 100, true, plotted);
        AnnotationPipeline pipeline = new AnnotationPipeline(model,
                new AnnotationOptions(DecodeMethod.POSTERIOR, 0, 2, "", profile));
        List<RecordAnnotation> seen = new ArrayList<>();
        pipeline.run(fasta.toString(), new ByteArrayInputStream(new byte[0]), new StringWriter(), "out.gff3",
                w -> { }, seen::add);
        return seen;
    }
}
