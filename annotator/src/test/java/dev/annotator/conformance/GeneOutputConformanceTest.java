package dev.annotator.conformance;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.AnnotationOptions;
import dev.annotator.pipeline.AnnotationPipeline;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.InputStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Genes as the pipeline writes them, on a real genome (test-data/genbank/ct.gbk.gz, read as GenBank input), read
 * with the strict reading of the GFF3 specification v1.26: every CDS has a phase (Column 8, required for CDS)
 * and one Parent that is a gene of the same span and strand (Column 9, Parent), the gene comes first, partial ends
 * are marked where a gene touches the record's ends.
 */
class GeneOutputConformanceTest {
    @TempDir
    Path dir;

    private Path annotate(int threads) throws IOException {
        HmmModel model = ModelLoader.load("bacterial-genes");
        Path out = dir.resolve("genes-" + threads + ".gff3");
        List<String> warnings = new ArrayList<>();
        try (Writer w = Files.newBufferedWriter(out, StandardCharsets.UTF_8)) {
            new AnnotationPipeline(model, new AnnotationOptions(DecodeMethod.defaultFor(model), 0, threads))
                    .run(Path.of("..", "test-data", "genbank", "ct.gbk.gz").toString(), InputStream.nullInputStream(),
                            w, "genes.gff3", warnings::add, a -> { });
        }
        assertThat(warnings).isEmpty();
        return out;
    }

    /** The strand views run at once on two threads; what they write must not depend on it. */
    @Test
    void outputDoesNotDependOnTheThreadCount() throws IOException {
        assertThat(Files.readAllBytes(annotate(2))).isEqualTo(Files.readAllBytes(annotate(1)));
    }

    @Test
    void genesAndTheirCdsFollowTheSpecification() throws IOException {
        Path out = annotate(2);
        ParsedGff3 gff = StrictGff3Reader.read(out);
        assertThat(gff.regions()).containsKey("CG0037");
        long length = gff.regions().get("CG0037").end();
        assertThat(length).isEqualTo(1_042_519);

        Map<String, ParsedFeature> genes = new HashMap<>();
        int cds = 0;
        for (ParsedFeature f : gff.features()) {
            String where = "line " + f.line();
            assertThat(f.strand()).as(where).isIn('+', '-');
            assertThat(f.score()).as(where).isBetween(0.0, 1.0);
            if (f.type().equals("gene")) {
                assertThat(f.phase()).as(where).isEqualTo(".");
                genes.put(f.attribute("ID"), f);
                continue;
            }
            cds++;
            assertThat(f.type()).as(where).isEqualTo("CDS");
            ParsedFeature gene = genes.get(f.attribute("Parent"));
            assertThat(gene).as(where + ": the parent gene comes before its CDS").isNotNull();
            assertThat(gene.start()).as(where).isEqualTo(f.start());
            assertThat(gene.end()).as(where).isEqualTo(f.end());
            assertThat(gene.strand()).as(where).isEqualTo(f.strand());
            assertThat(f.phase()).as(where).isIn("0", "1", "2");
            boolean touches5 = f.strand() == '+' ? f.start() == 1 : f.end() == length;
            boolean touches3 = f.strand() == '+' ? f.end() == length : f.start() == 1;
            List<String> partial = f.attributes().getOrDefault("partial", List.of());
            assertThat(partial.contains("5'")).as(where).isEqualTo(touches5);
            assertThat(partial.contains("3'")).as(where).isEqualTo(touches3);
            if (!touches5) {
                assertThat(f.phase()).as(where).isEqualTo("0");
                assertThat(f.attribute("start_codon")).as(where).isIn("ATG", "GTG", "TTG");
            }
            assertThat(Double.parseDouble(f.attribute("posterior_min"))).as(where).isBetween(0.0, f.score() + 5e-4);
            assertThat(f.attribute("log_odds")).as(where).isNotNull();
        }
        assertThat(cds).isEqualTo(genes.size()).isGreaterThan(850);
    }
}
