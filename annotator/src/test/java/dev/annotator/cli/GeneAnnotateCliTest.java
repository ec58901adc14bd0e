package dev.annotator.cli;

import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

import static org.assertj.core.api.Assertions.assertThat;

/** The gene model through the command line: its run line counts genes, as written in the GFF3. */
class GeneAnnotateCliTest {
    @Test
    void theRunLineCountsTheGenesWritten() {
        // the published Yersinia pestis plasmid record (test-data/README.md gives its provenance)
        String plasmid = CliRun.testData("genbank", "NC_005816.gb.gz").toString();
        CliRun.Result r = CliRun.run("annotate", "-m", "bacterial-genes", plasmid);
        assertThat(r.status()).isZero();
        long genes = Arrays.stream(new String(r.stdout(), StandardCharsets.UTF_8).split("\n"))
                .filter(l -> !l.startsWith("#") && l.split("\t").length == 9 && l.split("\t")[2].equals("gene"))
                .count();
        assertThat(genes).isPositive();
        assertThat(r.errLines()).singleElement().asString()
                .startsWith("annotator: 1 record(s), 0.010 Mbp, " + genes + " gene(s) in ");
    }
}
