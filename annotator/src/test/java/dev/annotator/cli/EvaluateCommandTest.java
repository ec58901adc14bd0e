package dev.annotator.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.annotator.error.ExitCodes;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The evaluate command as a user runs it. The files hold the invented 60-base example worked by hand in
 * GeneComparisonTest (TP 37, FP 11, FN 18, TN 54; exact 1, 3'end 2, missed 1, wrong 1 of 4 and 4), plus a
 * second record the reference has no features on.
 */
class EvaluateCommandTest {
    private static final String TRUTH = """
            ##gff-version 3
            ##sequence-region r 1 60
            ##sequence-region empty 1 40
            r\tinvented\tgene\t11\t30\t.\t+\t.\tID=g1
            r\tinvented\tCDS\t11\t30\t.\t+\t0\tID=c1;Parent=g1
            r\tinvented\tCDS\t41\t50\t.\t+\t0\tID=c2
            r\tinvented\tCDS\t5\t20\t.\t-\t0\tID=c3
            r\tinvented\tCDS\t50\t58\t.\t-\t0\tID=c4
            """;
    private static final String PREDICTED = """
            ##gff-version 3
            r\tinvented\tCDS\t11\t30\t.\t+\t0\tID=p1
            r\tinvented\tCDS\t45\t55\t.\t+\t0\tID=p2
            r\tinvented\tCDS\t5\t15\t.\t-\t0\tID=p3
            r\tinvented\tCDS\t40\t45\t.\t-\t0\tID=p4
            """;

    @TempDir
    Path dir;
    private String truth;
    private String predicted;

    @BeforeEach
    void files() throws IOException {
        truth = write("truth.gff3", TRUTH);
        predicted = write("predicted.gff3", PREDICTED);
    }

    @Test
    void tableHasARowPerRecordAndATotal() {
        CliRun.Result r = CliRun.run("evaluate", "--truth", truth, "--predicted", predicted);

        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stderr()).isEmpty();
        List<String> lines = r.out().lines().toList();
        assertThat(lines).contains("truth:      " + truth, "predicted:  " + predicted, "type:       CDS");
        // Sn 37/55, Sp 37/48, AC 7031/13728 to four places; the empty record is 80 true negatives, where only
        // the TN terms of ACP are defined (both 1), so AC is 1 (Burset and Guigo 1996 average the defined terms)
        assertThat(lines).anyMatch(l -> l.matches("r\\s+60\\s+37\\s+11\\s+18\\s+54\\s+0\\.6727\\s+0\\.7708\\s+0\\.5122"));
        assertThat(lines).anyMatch(l -> l.matches("empty\\s+40\\s+0\\s+0\\s+0\\s+80\\s+-\\s+-\\s+1\\.0000"));
        assertThat(lines).anyMatch(l -> l.matches("total\\s+100\\s+37\\s+11\\s+18\\s+134\\s+0\\.6727\\s+0\\.7708\\s+\\S+"));
        assertThat(lines).anyMatch(l -> l.matches(
                "r\\s+4\\s+4\\s+1\\s+25\\.0\\s+2\\s+50\\.0\\s+1\\s+25\\.0\\s+1\\s+25\\.0"));
        assertThat(lines).anyMatch(l -> l.matches("empty\\s+0\\s+0\\s+0\\s+-\\s+0\\s+-\\s+0\\s+-\\s+0\\s+-"));
        // columns line up: every row of a table is as wide as its header or narrower, headers right-aligned
        int header = lines.indexOf(lines.stream().filter(l -> l.startsWith("record  ")).findFirst().orElseThrow());
        assertThat(lines.get(header + 1).length()).isEqualTo(lines.get(header).length());
        assertThat(r.out()).doesNotContain("furthest feature end");
    }

    @Test
    void jsonCarriesTheSameNumbersUnderSnakeCaseNames() throws IOException {
        CliRun.Result r = CliRun.run("evaluate", "--truth", truth, "--predicted", predicted, "--format", "json");

        assertThat(r.status()).as(r.stderr()).isZero();
        JsonNode root = new ObjectMapper().readTree(r.stdout());
        assertThat(root.get("feature_type").asText()).isEqualTo("CDS");
        assertThat(root.get("truth").asText()).isEqualTo(truth);
        JsonNode rec = root.get("records").get(0);
        assertThat(rec.get("seqid").asText()).isEqualTo("r");
        assertThat(rec.get("length").asLong()).isEqualTo(60);
        assertThat(rec.get("length_from").asText()).isEqualTo("truth");
        assertThat(List.of(rec.get("tp").asLong(), rec.get("fp").asLong(), rec.get("fn").asLong(),
                rec.get("tn").asLong())).containsExactly(37L, 11L, 18L, 54L);
        assertThat(rec.get("sensitivity").asDouble()).isCloseTo(37.0 / 55, within(1e-12));
        assertThat(rec.get("specificity").asDouble()).isCloseTo(37.0 / 48, within(1e-12));
        assertThat(rec.get("approximate_correlation").asDouble()).isCloseTo(7031.0 / 13728, within(1e-12));
        assertThat(rec.get("exact").asLong()).isEqualTo(1);
        assertThat(rec.get("three_prime_percent").asDouble()).isEqualTo(50.0);
        assertThat(rec.get("missed").asLong()).isEqualTo(1);
        assertThat(rec.get("wrong_percent").asDouble()).isEqualTo(25.0);
        JsonNode empty = root.get("records").get(1);
        assertThat(empty.get("sensitivity").isNull()).isTrue();
        JsonNode total = root.get("total");
        assertThat(total.get("length").asLong()).isEqualTo(100);
        assertThat(total.get("tn").asLong()).isEqualTo(134);
        assertThat(total.get("truth_features").asLong()).isEqualTo(4);

        // every field name is snake_case and documented in the help
        String help = CliRun.run("evaluate", "--help").out();
        List<String> names = new ArrayList<>();
        collectNames(root, names);
        assertThat(names).allMatch(n -> n.matches("[a-z]+(_[a-z]+)*"));
        assertThat(names).allMatch(help::contains);
    }

    @Test
    void estimatedLengthsAreSaid() throws IOException {
        String noRegions = write("bare.gff3", TRUTH.replaceAll("##sequence-region.*\n", ""));
        CliRun.Result table = CliRun.run("evaluate", "--truth", noRegions, "--predicted", predicted);
        assertThat(table.status()).isZero();
        assertThat(table.out()).contains("58*").contains("taken as the furthest feature end");
        CliRun.Result json = CliRun.run("evaluate", "--truth", noRegions, "--predicted", predicted, "--format", "json");
        assertThat(json.out()).contains("\"length_from\" : \"furthest_feature\"");
    }

    @Test
    void outputFileAndPredictionsFromStandardInput() throws IOException {
        Path out = dir.resolve("accuracy.txt");
        CliRun.Result r = CliRun.withStdin(PREDICTED.getBytes(StandardCharsets.UTF_8),
                "evaluate", "--truth", truth, "--predicted", "-", "-o", out.toString());
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stdout()).isEmpty();
        assertThat(Files.readString(out)).contains("predicted:  <stdin>").containsPattern("r\\s+60\\s+37\\s+11");
        CliRun.Result again = CliRun.run("evaluate", "--truth", truth, "--predicted", predicted, "-o", out.toString());
        CliAssertions.assertOneLineError(again, ExitCodes.USAGE, "already exists");
    }

    @Test
    void missingFileIsExit66() {
        CliRun.Result r = CliRun.run("evaluate", "--truth", dir.resolve("nope.gff3").toString(),
                "--predicted", predicted);
        CliAssertions.assertOneLineError(r, ExitCodes.NO_INPUT, "nope.gff3: no such file");
    }

    @Test
    void badStrandIsExit65WithFileAndLine() throws IOException {
        String bad = write("bad.gff3", PREDICTED.replace("45\t55\t.\t+", "45\t55\t.\t."));
        CliRun.Result r = CliRun.run("evaluate", "--truth", truth, "--predicted", bad);
        CliAssertions.assertOneLineError(r, ExitCodes.DATA, bad + ":3: CDS feature has strand '.'");
    }

    @Test
    void unknownFormatIsExit2() {
        CliRun.Result r = CliRun.run("evaluate", "--truth", truth, "--predicted", predicted, "--format", "xml");
        CliAssertions.assertOneLineError(r, ExitCodes.USAGE, "--format");
    }

    /**
     * A published GenBank record (test-data/README.md gives its provenance) as the reference, recognised by its
     * LOCUS line: its ten CDS, typed here from its feature table as GFF3, match it exactly; one moved 3 bases is
     * no longer exact but keeps its stop.
     */
    @Test
    void genbankTruthIsReadFromItsCdsFeatures() throws IOException {
        String gbk = CliRun.testData("genbank", "NC_005816.gb.gz").toString();
        StringBuilder gff = new StringBuilder("##gff-version 3\n");
        String[] cds = {"87 1109 +", "1106 1888 +", "2925 3119 +", "3486 3857 +", "4343 4780 +", "4815 5888 -",
                "6005 6421 +", "6664 7602 +", "7789 8088 -", "8088 8360 -"};
        for (int i = 0; i < cds.length; i++) {
            String[] c = cds[i].split(" ");
            int start = Integer.parseInt(c[0]) + (i == 0 ? 3 : 0);
            gff.append("NC_005816.1\tp\tCDS\t").append(start).append('\t').append(c[1]).append("\t.\t").append(c[2])
                    .append("\t0\t.\n");
        }
        String pred = write("plasmid.gff3", gff.toString());
        CliRun.Result r = CliRun.run("evaluate", "--truth", gbk, "--predicted", pred, "--format", "json");
        assertThat(r.status()).as(r.stderr()).isZero();
        JsonNode total = new ObjectMapper().readTree(r.stdout()).get("total");
        assertThat(total.get("truth_features").asInt()).isEqualTo(10);
        assertThat(total.get("exact").asInt()).isEqualTo(9);
        assertThat(total.get("three_prime").asInt()).isEqualTo(10);
    }

    /** The chloroplast record: 70 simple CDS; with --cds-parts each part of its 15 joined CDS is added. */
    @Test
    void cdsPartsAddThePartsOfJoinedCds() throws IOException {
        String gbk = CliRun.testData("genbank", "NC_000932.gb.gz").toString();
        String none = write("none.gff3", "##gff-version 3\n");
        JsonNode simple = new ObjectMapper().readTree(CliRun.run("evaluate", "--truth", gbk, "--predicted", none,
                "--format", "json").stdout()).get("total");
        JsonNode parts = new ObjectMapper().readTree(CliRun.run("evaluate", "--truth", gbk, "--predicted", none,
                "--format", "json", "--cds-parts").stdout()).get("total");
        assertThat(simple.get("truth_features").asInt()).isEqualTo(70);
        // distinct parts of the record's joined CDS: the trans-spliced gene shares one part between two CDS, and
        // the evaluator counts a feature once per position and strand
        long partCount = joinedParts(gbk);
        assertThat(parts.get("truth_features").asLong()).isEqualTo(70 + partCount);
        assertThat(partCount).isGreaterThan(15);
    }

    /** Distinct parts of the CDS joins (interval and strand), read from the file's text. */
    private static long joinedParts(String gbk) throws IOException {
        String text;
        try (var in = new java.util.zip.GZIPInputStream(java.nio.file.Files.newInputStream(Path.of(gbk)))) {
            text = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.US_ASCII);
        }
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("\n {5}CDS {13}(\\S*join\\([^/]*?)\n {21}/")
                .matcher(text);
        java.util.Set<String> parts = new java.util.HashSet<>();
        while (m.find()) {
            String loc = m.group(1).replaceAll("\\s", "");
            boolean outer = loc.startsWith("complement(join(");
            for (String part : loc.split(",")) {
                boolean inner = part.contains("complement(");
                parts.add(part.replaceAll("[^0-9.]", "") + (outer ^ inner ? "-" : "+"));
            }
        }
        return parts.size();
    }

    private static void collectNames(JsonNode node, List<String> names) {
        if (node.isArray()) {
            node.forEach(n -> collectNames(n, names));
        } else if (node.isObject()) {
            for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
                String name = it.next();
                names.add(name);
                collectNames(node.get(name), names);
            }
        }
    }

    private String write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p.toString();
    }
}
