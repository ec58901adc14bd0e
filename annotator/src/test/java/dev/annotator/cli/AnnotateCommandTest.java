package dev.annotator.cli;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * {@code annotate} as a user runs it, on records made by {@code simulate} (3 x 50 kb, fixed seed, with the
 * planted truth). Output is read back with htsjdk's GFF3 codec (see {@link GffCalls}).
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class AnnotateCommandTest {
    private static final int RECORDS = 3;
    private static final int LENGTH = 50_000;

    private Path dir;
    private Path fasta;
    private Path truth;
    private byte[] posterior;

    @BeforeAll
    void simulateInput(@TempDir Path tmp) {
        dir = tmp;
        fasta = dir.resolve("sim.fa");
        truth = dir.resolve("sim.truth.gff3");
        CliRun.Result sim = CliRun.run("simulate", "-m", "cpg-island", "--length", String.valueOf(LENGTH),
                "--records", String.valueOf(RECORDS), "--seed", "7", "-o", fasta.toString(), "--truth", truth.toString());
        assertThat(sim.status()).as(sim.stderr()).isZero();
        posterior = annotate("--threads", "1", fasta.toString());
    }

    @Test
    void stdoutAndOutputFileHoldTheSameBytes() throws IOException {
        Path out = dir.resolve("to-file.gff3");
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", "-o", out.toString(), fasta.toString());
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stdout()).isEmpty();
        assertThat(Files.readAllBytes(out)).isEqualTo(posterior);
        // the temporary file was renamed, not left beside the output
        try (var files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".partial"));
        }
    }

    @Test
    void outputIsValidGff3CoveringEveryRecordInInputOrder() {
        String text = new String(posterior, StandardCharsets.UTF_8);
        // GFF3 specification v1.26: the first line is the version directive
        assertThat(text).startsWith("##gff-version 3\n");
        assertThat(sequenceRegionLines(text)).containsExactly(
                "##sequence-region sim1 1 50000", "##sequence-region sim2 1 50000", "##sequence-region sim3 1 50000");
        GffCalls gff = GffCalls.parse(posterior);
        assertThat(gff.calls()).isNotEmpty();
        assertValidSegments(gff);
    }

    @Test
    void progressLineCountsRecordsAndSegmentsAndQuietSilencesIt() {
        CliRun.Result r = CliRun.run("annotate", "-m", "cpg-island", fasta.toString());
        assertThat(r.status()).isZero();
        int segments = GffCalls.parse(posterior).calls().size();
        assertThat(r.errLines()).singleElement().asString()
                .startsWith("annotator: " + RECORDS + " record(s), 0.150 Mbp, " + segments + " segment(s) in ");
        CliRun.Result quiet = CliRun.run("annotate", "-q", "-m", "cpg-island", fasta.toString());
        assertThat(quiet.stderr()).isEmpty();
        assertThat(quiet.stdout()).isEqualTo(posterior);
    }

    @Test
    void gzippedInputGivesTheSameOutputAsPlain() throws IOException {
        Path gz = Files.write(dir.resolve("sim.fa.gz"), TestInputs.gzip(Files.readAllBytes(fasta)));
        assertThat(annotate(gz.toString())).isEqualTo(posterior);
    }

    @Test
    void dashReadsStandardInputPlainOrGzipped() throws IOException {
        byte[] plain = Files.readAllBytes(fasta);
        for (byte[] stdin : List.of(plain, TestInputs.gzip(plain))) {
            CliRun.Result r = CliRun.withStdin(stdin, "annotate", "-q", "-m", "cpg-island", "-");
            assertThat(r.status()).as(r.stderr()).isZero();
            assertThat(r.stdout()).isEqualTo(posterior);
        }
    }

    @Test
    void threadCountAndRepetitionDoNotChangeABit() {
        // README: "output is byte-identical for any --threads"
        for (String threads : List.of("1", "2", "8")) {
            assertThat(annotate("--threads", threads, fasta.toString())).as("--threads %s", threads)
                    .isEqualTo(posterior);
        }
        assertThat(annotate("--threads", "2", fasta.toString())).isEqualTo(annotate("--threads", "2", fasta.toString()));
    }

    @Test
    void unevenRecordsAndViterbiDoNotDependOnThreadsEither() throws IOException {
        // Many records of very different lengths finish out of order on several threads: tiny ones, empty ones
        // (skipped), long N runs, soft-masked stretches, and a few long enough to weigh on the memory budget.
        for (long seed = 1; seed <= 4; seed++) {
            Path input = Files.writeString(dir.resolve("uneven-" + seed + ".fa"), unevenFasta(seed));
            for (String method : List.of("posterior", "viterbi")) {
                CliRun.Result one = CliRun.run("annotate", "-q", "-m", "cpg-island", "--decode", method, "--threads",
                        "1", input.toString());
                assertThat(one.status()).as(one.stderr()).isZero();
                assertThat(one.out()).contains("\tCpG_island\t");
                // the empty records are warned about, in input order, whatever the threads
                assertThat(one.errLines()).isNotEmpty().allMatch(l -> l.startsWith("annotator: warning: "));
                for (String threads : List.of("2", "8", "8")) {
                    CliRun.Result r = CliRun.run("annotate", "-q", "-m", "cpg-island", "--decode", method,
                            "--threads", threads, input.toString());
                    assertThat(r.stdout()).as("seed %d, %s, --threads %s", seed, method, threads)
                            .isEqualTo(one.stdout());
                    assertThat(r.stderr()).isEqualTo(one.stderr());
                }
            }
        }
    }

    /** Invented: 40 records, lengths from 0 to 60 kb, with N runs and lowercase stretches. */
    private static String unevenFasta(long seed) {
        java.util.SplittableRandom rng = new java.util.SplittableRandom(seed);
        StringBuilder sb = new StringBuilder();
        for (int r = 1; r <= 40; r++) {
            sb.append(">u").append(r).append('\n');
            int length = switch (rng.nextInt(4)) {
                case 0 -> rng.nextInt(3); // 0, 1 or 2 bases
                case 1 -> rng.nextInt(200);
                case 2 -> rng.nextInt(5_000);
                default -> 20_000 + rng.nextInt(40_000);
            };
            // islands of C and G, so that both decodings call segments
            boolean island = false;
            for (int i = 0; i < length; i++) {
                if (rng.nextInt(400) == 0) {
                    island = !island;
                }
                char c = rng.nextInt(1000) < 3 ? 'N' : island ? "CGCGCGAT".charAt(rng.nextInt(8)) : "ACGTAT".charAt(rng.nextInt(6));
                sb.append(i / 700 % 5 == 4 ? Character.toLowerCase(c) : c);
                if (i % 60 == 59 || i == length - 1) {
                    sb.append('\n');
                }
            }
        }
        return sb.toString();
    }

    @Test
    void viterbiAndPosteriorAgreeOnStronglyMarkedIslands() throws IOException {
        byte[] viterbiBytes = annotate("--decode", "viterbi", fasta.toString());
        // the option is not ignored: the two decodings differ somewhere (boundaries, at least)
        assertThat(viterbiBytes).isNotEqualTo(posterior);
        GffCalls viterbi = GffCalls.parse(viterbiBytes);
        GffCalls post = GffCalls.parse(posterior);
        assertValidSegments(viterbi);
        assertValidSegments(post);

        // score = mean posterior of the label over the segment (README); a mean above 0.5 needs a base above
        // 0.5, and every such base lies in a posterior segment, so these Viterbi segments must overlap one
        for (GffCalls.Call v : viterbi.calls()) {
            if (v.score() > 0.5) {
                assertThat(post.calls()).as("posterior segment overlapping Viterbi %s", v).anyMatch(v::overlaps);
            }
        }

        // Planted islands that are long and pass the Gardiner-Garden & Frommer (1987) composition criteria
        // (GC fraction > 0.5, observed/expected CpG > 0.6) are found by both decodings.
        Map<String, String> sequences = readFasta(fasta);
        List<GffCalls.Call> strong = new ArrayList<>();
        for (GffCalls.Call planted : GffCalls.parse(Files.readAllBytes(truth)).calls()) {
            String s = sequences.get(planted.seqid()).substring(planted.start() - 1, planted.end());
            if (planted.length() >= 300 && gcFraction(s) > 0.5 && cpgObservedOverExpected(s) > 0.6) {
                strong.add(planted);
            }
        }
        assertThat(strong).as("strongly marked planted islands in the simulation").hasSizeGreaterThanOrEqualTo(3);
        for (GffCalls.Call planted : strong) {
            assertThat(post.calls()).as("posterior call for %s", planted).anyMatch(planted::overlaps);
            assertThat(viterbi.calls()).as("Viterbi call for %s", planted).anyMatch(planted::overlaps);
        }
    }

    @Test
    void minLengthDropsExactlyTheShorterSegments() {
        GffCalls all = GffCalls.parse(posterior);
        assertThat(all.calls()).as("the input must have short segments for this test to mean anything")
                .anyMatch(c -> c.length() < 200);
        GffCalls kept = GffCalls.parse(annotate("--min-length", "200", fasta.toString()));
        assertThat(kept.calls()).allMatch(c -> c.length() >= 200);
        assertThat(kept.calls().stream().map(GffCalls.Call::withoutId))
                .containsExactlyElementsOf(all.calls().stream().filter(c -> c.length() >= 200)
                        .map(GffCalls.Call::withoutId).toList());
    }

    private byte[] annotate(String... options) {
        String[] args = new String[options.length + 4];
        args[0] = "annotate";
        args[1] = "-q";
        args[2] = "-m";
        args[3] = "cpg-island";
        System.arraycopy(options, 0, args, 4, options.length);
        CliRun.Result r = CliRun.run(args);
        assertThat(r.status()).as(r.stderr()).isZero();
        assertThat(r.stderr()).isEmpty();
        return r.stdout();
    }

    /**
     * GFF3 specification v1.26: start <= end, 1-based, within the ##sequence-region; score a number. Our own
     * promises (README): segments of a record sorted by start and disjoint, score and posterior_min in [0, 1],
     * IDs unique.
     */
    private static void assertValidSegments(GffCalls gff) {
        assertThat(gff.regions()).containsOnlyKeys("sim1", "sim2", "sim3").allSatisfy((k, v) -> assertThat(v)
                .isEqualTo(LENGTH));
        assertThat(gff.calls().stream().map(c -> c.attributes().get("ID").get(0))).doesNotHaveDuplicates();
        for (String seqid : gff.regions().keySet()) {
            int lastEnd = 0;
            for (GffCalls.Call c : gff.on(seqid)) {
                assertThat(c.type()).isEqualTo("CpG_island");
                assertThat(c.start()).isGreaterThan(lastEnd).isLessThanOrEqualTo(c.end());
                assertThat(c.end()).isLessThanOrEqualTo(gff.regions().get(seqid));
                assertThat(c.score()).isBetween(0.0, 1.0);
                double min = Double.parseDouble(c.attributes().get("posterior_min").get(0));
                assertThat(min).isBetween(0.0, c.score());
                lastEnd = c.end();
            }
        }
    }

    private static List<String> sequenceRegionLines(String gff3) {
        return gff3.lines().filter(l -> l.startsWith("##sequence-region")).toList();
    }

    private static Map<String, String> readFasta(Path path) throws IOException {
        Map<String, String> out = new LinkedHashMap<>();
        String name = null;
        StringBuilder seq = new StringBuilder();
        for (String line : Files.readAllLines(path, StandardCharsets.US_ASCII)) {
            if (line.startsWith(">")) {
                if (name != null) {
                    out.put(name, seq.toString());
                }
                name = line.substring(1).split("\\s+")[0];
                seq.setLength(0);
            } else {
                seq.append(line.strip().toUpperCase());
            }
        }
        out.put(name, seq.toString());
        return out;
    }

    private static double gcFraction(String s) {
        long gc = s.chars().filter(c -> c == 'G' || c == 'C').count();
        return (double) gc / s.length();
    }

    /** Gardiner-Garden & Frommer (1987): CpG observed/expected = n(CG) x L / (n(C) x n(G)). */
    private static double cpgObservedOverExpected(String s) {
        Matcher m = Pattern.compile("(?=CG)").matcher(s);
        long cg = m.results().count();
        long c = s.chars().filter(ch -> ch == 'C').count();
        long g = s.chars().filter(ch -> ch == 'G').count();
        return (double) cg * s.length() / ((double) c * g);
    }
}
