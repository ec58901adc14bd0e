package dev.annotator.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static dev.annotator.cli.CliAssertions.assertOneLineError;
import static org.assertj.core.api.Assertions.assertThat;

/**
 * Inputs a user can get wrong when training. Each must end with the documented exit status (the README's table;
 * 65, 66 are EX_DATAERR and EX_NOINPUT of BSD sysexits(3), recalled from memory; 2 for a bad command line is
 * common practice), one line on standard error naming the file (and line or record) and what is wrong, and no
 * output file, final or temporary. Labels files are invented here; the FASTA fixture is
 * test-data/fasta/two-records.fa (demoA: 32 bases, demoB: 13 bases).
 */
class TrainBadInputTest {
    private static final int USAGE = 2;
    private static final int DATA = 65;
    private static final int NO_INPUT = 66;

    /** An invented model with two reported labels that never follow each other directly. */
    private static final String THREE_LABELS = """
            {
              "format": "annotator-hmm/1",
              "name": "three-labels",
              "description": "invented for tests",
              "provenance": {"source": "invented for tests"},
              "labels": [
                {"name": "island", "feature_type": "CpG_island"},
                {"name": "repeat", "feature_type": "repeat_region", "so_accession": "SO:0000657"},
                {"name": "background", "background": true}
              ],
              "states": [
                {"name": "island", "label": "island", "order": 0, "emissions": {"": [0.1, 0.4, 0.4, 0.1]}},
                {"name": "repeat", "label": "repeat", "order": 0, "emissions": {"": [0.4, 0.1, 0.1, 0.4]}},
                {"name": "background", "label": "background", "order": 0, "emissions": {"": [0.25, 0.25, 0.25, 0.25]}}
              ],
              "start": {"background": 1},
              "transitions": [
                {"from": "island", "to": "island", "p": 0.9}, {"from": "island", "to": "background", "p": 0.1},
                {"from": "repeat", "to": "repeat", "p": 0.9}, {"from": "repeat", "to": "background", "p": 0.1},
                {"from": "background", "to": "background", "p": 0.8},
                {"from": "background", "to": "island", "p": 0.1}, {"from": "background", "to": "repeat", "p": 0.1}
              ]
            }
            """;

    @TempDir
    Path tmp;

    private final Path fasta = CliRun.testData("fasta", "two-records.fa");

    @Test
    void labelsNamingASeqidNotInTheFasta() throws IOException {
        Path labels = gff("unknown-seqid.gff3", "demoA\tinvented\tCpG_island\t3\t10\t.\t.\t.\tID=a",
                "demoC\tinvented\tCpG_island\t1\t5\t.\t.\t.\tID=b");
        for (String method : List.of("counting", "baum-welch")) {
            assertFails(DATA, labels + ":3: seqid demoC is not a record of " + fasta, "-m", "cpg-island",
                    "--method", method, "--labels", labels.toString());
        }
    }

    @Test
    void featureOutsideItsRecord() throws IOException {
        Path labels = gff("outside.gff3", "demoB\tinvented\tCpG_island\t5\t20\t.\t.\t.\tID=b");
        assertFails(DATA, labels + ":2: feature 5..20 lies outside record demoB (13 bases)", "-m", "cpg-island",
                "--method", "counting", "--labels", labels.toString());
        // a shard's E-step may get labels of other shards' records, but not features beyond its own records
        assertFails(DATA, labels + ":2: feature 5..20 lies outside record demoB (13 bases)", "-m", "cpg-island",
                "--method", "baum-welch", "--labels", labels.toString(), "--emit-counts", "SHARD");
    }

    @Test
    void overlappingFeaturesOfDifferentLabels() throws IOException {
        Path model = Files.writeString(tmp.resolve("three-labels.json"), THREE_LABELS);
        // the second feature is of the same label and may overlap the first; the third may not
        Path labels = gff("overlap.gff3", "demoA\tinvented\tCpG_island\t1\t10\t.\t.\t.\tID=a",
                "demoA\tinvented\tCpG_island\t8\t12\t.\t.\t.\tID=b",
                "demoA\tinvented\trepeat_region\t12\t20\t.\t.\t.\tID=c");
        assertFails(DATA, labels + ":4: feature 12..20 on demoA (label repeat) overlaps the feature at line 3 (label "
                + "island)", "-m", model.toString(), "--method", "counting", "--labels", labels.toString());
    }

    @Test
    void labelsTheModelCannotFollow() throws IOException {
        Path model = Files.writeString(tmp.resolve("three-labels.json"), THREE_LABELS);
        // an island directly followed by a repeat (by its accession): the model has no such transition
        Path labels = gff("adjacent.gff3", "demoB\tinvented\tCpG_island\t3\t5\t.\t.\t.\tID=a",
                "demoB\tinvented\tSO:0000657\t6\t9\t.\t.\t.\tID=b");
        assertFails(DATA, fasta + ": record demoB: model three-labels cannot emit this sequence with its labels "
                + "(probability 0 at base 6", "-m", model.toString(), "--method", "counting", "--labels",
                labels.toString());
    }

    @Test
    void malformedLabelsLine() throws IOException {
        Path labels = gff("short.gff3", "demoA\tinvented\tCpG_island\t3\t10\t.\t.\tID=a");
        assertFails(DATA, labels + ":2: expected 9 tab-separated columns, found 8", "-m", "cpg-island",
                "--method", "counting", "--labels", labels.toString());
        Path backwards = gff("backwards.gff3", "demoA\tinvented\tCpG_island\t10\t3\t.\t.\t.\tID=a");
        assertFails(DATA, backwards + ":2: end 3 is before start 10", "-m", "cpg-island", "--method", "counting",
                "--labels", backwards.toString());
    }

    @Test
    void startModelThatFailsValidation() throws IOException {
        Path model = CliRun.testData("bad", "model-row-not-summing.json");
        assertFails(DATA, model + ": state \"hot\": emissions[\"C\"] values sum to 1.1, expected 1", "-m",
                model.toString(), "--method", "baum-welch");
    }

    @Test
    void countingNeedsOneStatePerLabel() throws IOException {
        Path model = Files.writeString(tmp.resolve("two-state-label.json"), THREE_LABELS
                .replace("\"name\": \"repeat\", \"label\": \"repeat\"", "\"name\": \"repeat\", \"label\": \"island\"")
                .replace("{\"name\": \"repeat\", \"feature_type\": \"repeat_region\", \"so_accession\": \"SO:0000657\"},",
                        ""));
        Path labels = gff("fine.gff3", "demoA\tinvented\tCpG_island\t3\t10\t.\t.\t.\tID=a");
        assertFails(DATA, model + ": label \"island\" has 2 states (island, repeat); counting needs one state per "
                + "label", "-m", model.toString(), "--method", "counting", "--labels", labels.toString());
    }

    @Test
    void missingFiles() throws IOException {
        Path labels = tmp.resolve("no-such.gff3");
        assertFails(NO_INPUT, labels + ": no such file", "-m", "cpg-island", "--method", "counting", "--labels",
                labels.toString());
        Path outDir = Files.createTempDirectory(tmp, "out");
        Path input = tmp.resolve("no-such.fa");
        CliRun.Result r = CliRun.run("train", "-m", "cpg-island", "--method", "baum-welch", "-o",
                outDir.resolve("m.json").toString(), input.toString());
        assertOneLineError(r, NO_INPUT, input + ": no such file");
        assertEmpty(outDir);
    }

    @Test
    void badShardCountFiles() throws IOException {
        Path notCounts = Files.writeString(tmp.resolve("model-not-counts.json"), THREE_LABELS);
        Path outDir = Files.createTempDirectory(tmp, "out");
        CliRun.Result r = CliRun.run("train", "-m", "cpg-island", "--merge-counts", notCounts.toString(), "-o",
                outDir.resolve("m.json").toString());
        assertOneLineError(r, DATA, notCounts + ": not a counts file (format \"annotator-hmm/1\"");
        assertEmpty(outDir);
    }

    @Test
    void badCommandLines() throws IOException {
        Path labels = gff("fine.gff3", "demoA\tinvented\tCpG_island\t3\t10\t.\t.\t.\tID=a");
        Path outDir = Files.createTempDirectory(tmp, "out");
        String out = outDir.resolve("m.json").toString();
        String[][] lines = {
                {"train", "-m", "cpg-island", "--method", "counting", "-o", out, fasta.toString()},
                {"train", "-m", "cpg-island", "--method", "baum-welch", "-o", out, "-"},
                {"train", "-m", "cpg-island", "--method", "viterbi", "-o", out, fasta.toString()},
                {"train", "-m", "cpg-island", "-o", out, fasta.toString()},
                {"train", "-m", "cpg-island", "--method", "baum-welch", "-o", out, "--emit-counts", out,
                        fasta.toString()},
                {"train", "-m", "cpg-island", "--merge-counts", out, "-o", out, "--labels", labels.toString()},
                {"train", "-m", "cpg-island", "--method", "baum-welch", "--pseudocount", "-1", "-o", out,
                        fasta.toString()},
                {"train", "-m", "cpg-island", "--method", "baum-welch", "--freeze", "states", "-o", out,
                        fasta.toString()},
        };
        String[] mentions = {"--method counting needs --labels", "not standard input", "expected counting or "
                + "baum-welch, got 'viterbi'", "--method is required", "-o and --emit-counts exclude each other",
                "--labels does not apply to --merge-counts", "--pseudocount must be a finite number of at least 0",
                "expected transitions or emissions, got 'states'"};
        for (int i = 0; i < lines.length; i++) {
            CliRun.Result r = CliRun.run(lines[i]);
            assertOneLineError(r, USAGE, mentions[i]);
            assertEmpty(outDir);
        }
    }

    /** Runs train on the FASTA fixture into a fresh directory (or as a shard when the args say --emit-counts). */
    private void assertFails(int status, String mention, String... args) throws IOException {
        Path outDir = Files.createTempDirectory(tmp, "out");
        List<String> line = new ArrayList<>(List.of("train"));
        for (String a : args) {
            line.add(a.equals("SHARD") ? outDir.resolve("shard.counts.json").toString() : a);
        }
        if (!line.contains("--emit-counts")) {
            line.addAll(List.of("-o", outDir.resolve("trained.json").toString()));
        }
        line.add(fasta.toString());
        CliRun.Result r = CliRun.run(line.toArray(String[]::new));
        assertOneLineError(r, status, mention);
        assertEmpty(outDir);
    }

    private Path gff(String name, String... features) throws IOException {
        List<String> lines = new ArrayList<>(List.of("##gff-version 3"));
        lines.addAll(List.of(features));
        return Files.write(tmp.resolve(name), lines);
    }

    private static void assertEmpty(Path dir) throws IOException {
        try (Stream<Path> left = Files.list(dir)) {
            assertThat(left.map(p -> p.getFileName().toString())).isEmpty();
        }
    }
}
