package dev.annotator.conformance;

import dev.annotator.cli.Main;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.SimulationRun;
import dev.annotator.seq.FastaWriter;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.simulate.SimulatedRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.io.TempDir;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The outputs {@code annotate} writes beside the GFF3 in the same run. {@code --summary}: every number of a row
 * recomputed here from the FASTA file (read apart from the project's reader) and from the GFF3 (read by
 * {@link StrictGff3Reader}). {@code --posterior-track}: the bedGraph format as the UCSC Genome Browser documents
 * it (genome.ucsc.edu/goldenPath/help/bedgraph.html), and agreement with the GFF3's segments. {@code --report}:
 * parsed as XML (XHTML, W3C), every GFF3 segment drawn with its coordinates, the table's composition recounted from
 * the FASTA, and nothing outside the file referenced.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class SideOutputsTest {
    private Path dir;
    private HmmModel model;
    private Map<String, byte[]> bases;
    private List<ParsedFeature> calls;
    private List<String[]> rows;
    private Path fasta;
    private List<String> track;

    @BeforeAll
    void annotate(@TempDir Path tmp) throws IOException {
        dir = tmp;
        model = ModelLoader.load("cpg-island");
        List<SimulatedRecord> sampled = new SimulationRun(model)
                .sample(List.of("r1", "r2", "tiny"), new int[]{80_000, 30_000, 150}, 99L);
        List<SequenceRecord> records = new ArrayList<>();
        for (SimulatedRecord s : sampled) {
            byte[] b = s.record().bases().clone();
            if (s.record().name().equals("r1")) {
                Arrays.fill(b, 10_000, 12_500, (byte) 'N'); // an assembly gap
                b[40_000] = 'R';
            }
            records.add(new SequenceRecord(s.record().name(), "", b));
        }
        fasta = dir.resolve("in.fa");
        try (OutputStream out = Files.newOutputStream(fasta)) {
            FastaWriter w = new FastaWriter(out);
            for (SequenceRecord r : records) {
                w.write(r);
            }
            w.flush();
        }
        Path gff = dir.resolve("out.gff3");
        Path tsv = dir.resolve("summary.tsv");
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status = Main.run(new String[]{"annotate", "-m", "cpg-island", "-q", "--threads", "2", "-o", gff.toString(),
                "--summary", tsv.toString(), "--posterior-track", dir.resolve("t.bedgraph.gz").toString(), "--report", dir.resolve("r.html").toString(),
                fasta.toString()}, new ByteArrayInputStream(new byte[0]),
                new ByteArrayOutputStream(), new PrintStream(err, true, StandardCharsets.UTF_8));
        assertThat(status).as(err.toString(StandardCharsets.UTF_8)).isZero();
        bases = PlainFasta.read(fasta);
        calls = StrictGff3Reader.read(gff).features();
        try (var in = new java.util.zip.GZIPInputStream(Files.newInputStream(dir.resolve("t.bedgraph.gz")))) {
            track = new String(in.readAllBytes(), StandardCharsets.UTF_8).lines().toList();
        }
        rows = Files.readAllLines(tsv).stream().map(l -> l.split("\t", -1)).toList();
    }

    @Test
    void headerThenOneRowPerRecordInInputOrder() {
        assertThat(rows.get(0)).containsExactly("seqid", "length", "gc", "cpg_oe", "n_fraction", "island_segments",
                "island_bases", "island_longest", "island_mean_confidence", "island_min_confidence",
                "island_log_odds_bits_per_base");
        assertThat(rows.subList(1, rows.size()).stream().map(r -> r[0])).containsExactly("r1", "r2", "tiny");
        assertThat(rows).allSatisfy(r -> assertThat(r).hasSize(11));
    }

    @Test
    void compositionMatchesTheBasesCountedHere() {
        for (String[] row : rows.subList(1, rows.size())) {
            byte[] b = bases.get(row[0]);
            BaseCounts counts = BaseCounts.of(b, 1, b.length);
            assertThat(Integer.parseInt(row[1])).isEqualTo(b.length);
            // GC fraction and o/e as defined by Gardiner-Garden & Frommer (1987), over unambiguous bases
            assertThat(Double.parseDouble(row[2])).isCloseTo(counts.gc(), within(0.5e-4));
            assertThat(Double.parseDouble(row[3])).isCloseTo(counts.cpgObservedExpected(), within(0.5e-4));
            assertThat(Double.parseDouble(row[4])).isCloseTo((double) counts.ambiguous() / b.length, within(0.5e-4));
        }
        assertThat(Double.parseDouble(rows.get(1)[4])).isGreaterThan(0.03); // the 2.5 kb gap in 80 kb
    }

    @Test
    void segmentColumnsMatchTheGff3OfTheSameRun() {
        for (String[] row : rows.subList(1, rows.size())) {
            List<ParsedFeature> mine = calls.stream().filter(f -> f.seqid().equals(row[0])).toList();
            assertThat(Integer.parseInt(row[5])).isEqualTo(mine.size());
            assertThat(Long.parseLong(row[6])).isEqualTo(mine.stream().mapToLong(ParsedFeature::length).sum());
            assertThat(Long.parseLong(row[7])).isEqualTo(mine.stream().mapToLong(ParsedFeature::length).max().orElse(0));
            if (mine.isEmpty()) {
                assertThat(row[8]).isEqualTo("NA");
                assertThat(row[9]).isEqualTo("NA");
            } else {
                // GFF3 scores carry 3 decimals, so their mean may differ from the unrounded one by half a unit
                assertThat(Double.parseDouble(row[8])).isCloseTo(
                        mine.stream().mapToDouble(ParsedFeature::score).average().orElseThrow(), within(1.01e-3));
                assertThat(row[9]).isEqualTo(String.format(java.util.Locale.ROOT, "%.3f",
                        mine.stream().mapToDouble(ParsedFeature::score).min().orElseThrow()));
            }
        }
        assertThat(Integer.parseInt(rows.get(1)[5])).isPositive();
    }

    @Test
    void logOddsPerBaseIsTheTwoChainScoreOfTheWholeRecord() {
        TwoChainLogOdds chains = new TwoChainLogOdds(model.states().get(model.stateIndex("island")),
                model.states().get(model.stateIndex("background")));
        for (String[] row : rows.subList(1, rows.size())) {
            byte[] b = bases.get(row[0]);
            double expected = chains.bits(b, 1, b.length) / b.length;
            assertThat(Double.parseDouble(row[10])).isCloseTo(expected, within(0.5e-4 + 1e-9));
        }
    }

    @Test
    void trackIsBedGraphCoveringEveryRecordAndAgreesWithTheSegments() {
        // UCSC bedGraph: a track line with type=bedGraph, then chrom, chromStart, chromEnd, dataValue; 0-based,
        // end excluded
        assertThat(track.get(0)).startsWith("track type=bedGraph name=\"").contains(" description=\"");
        Map<String, int[]> covered = new java.util.LinkedHashMap<>();
        Map<String, double[]> value = new java.util.HashMap<>();
        for (String line : track.subList(1, track.size())) {
            String[] f = line.split("\t", -1);
            assertThat(f).hasSize(4);
            int start = Integer.parseInt(f[1]);
            int end = Integer.parseInt(f[2]);
            double v = Double.parseDouble(f[3]);
            assertThat(f[3]).matches("[01]\\.\\d{3}");
            int[] upTo = covered.computeIfAbsent(f[0], k -> new int[1]);
            assertThat(start).as(line).isEqualTo(upTo[0]);
            assertThat(end).isGreaterThan(start);
            upTo[0] = end;
            double[] perBase = value.computeIfAbsent(f[0], k -> new double[bases.get(k).length]);
            Arrays.fill(perBase, start, end, v);
        }
        assertThat(covered.keySet()).containsExactly("r1", "r2", "tiny");
        covered.forEach((seqid, upTo) -> assertThat(upTo[0]).isEqualTo(bases.get(seqid).length));
        // a segment is a maximal run of posterior > 0.5: its bases read at least 0.500 after rounding, the bases
        // just outside it at most 0.500
        for (ParsedFeature f : calls) {
            double[] perBase = value.get(f.seqid());
            for (long i = f.start() - 1; i < f.end(); i++) {
                assertThat(perBase[(int) i]).isGreaterThanOrEqualTo(0.5);
            }
            if (f.start() > 1) {
                assertThat(perBase[(int) f.start() - 2]).isLessThanOrEqualTo(0.5);
            }
            if (f.end() < perBase.length) {
                assertThat(perBase[(int) f.end()]).isLessThanOrEqualTo(0.5);
            }
        }
    }

    @Test
    void sideOutputsAreRefusedLikeTheGff3() throws IOException {
        Path existing = Files.writeString(dir.resolve("existing.tsv"), "keep");
        for (String option : List.of("--summary", "--posterior-track")) {
            assertThat(run("annotate", "-m", "cpg-island", "-o", dir.resolve("x.gff3").toString(), option,
                    existing.toString(), fasta.toString())).isEqualTo(2);
            assertThat(run("annotate", "-m", "cpg-island", "--force", "-o", dir.resolve("x.gff3").toString(), option,
                    fasta.toString(), fasta.toString())).isEqualTo(2);
        }
        assertThat(Files.readString(existing)).isEqualTo("keep");
        assertThat(run("annotate", "-m", "cpg-island", "--track-label", "background", "--posterior-track",
                dir.resolve("y.bedgraph").toString(), fasta.toString())).isEqualTo(2);
        assertThat(dir.resolve("x.gff3")).doesNotExist();
    }

    private static int run(String... args) {
        return Main.run(args, new ByteArrayInputStream(new byte[0]), new ByteArrayOutputStream(),
                new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
    }

    @Test
    void reportIsWellFormedSelfContainedAndShowsEverySegment() throws Exception {
        javax.xml.parsers.DocumentBuilderFactory factory = javax.xml.parsers.DocumentBuilderFactory.newInstance();
        factory.setNamespaceAware(true);
        org.w3c.dom.Document doc = factory.newDocumentBuilder().parse(dir.resolve("r.html").toFile());
        // every segment of the GFF3 appears as a bar carrying its 1-based coordinates, in its record's plot
        org.w3c.dom.NodeList svgs = doc.getElementsByTagNameNS("http://www.w3.org/2000/svg", "svg");
        java.util.Set<String> drawn = new java.util.HashSet<>();
        for (int i = 0; i < svgs.getLength(); i++) {
            org.w3c.dom.Element svg = (org.w3c.dom.Element) svgs.item(i);
            org.w3c.dom.NodeList rects = svg.getElementsByTagNameNS("http://www.w3.org/2000/svg", "rect");
            for (int k = 0; k < rects.getLength(); k++) {
                org.w3c.dom.Element r = (org.w3c.dom.Element) rects.item(k);
                if (r.getAttribute("class").equals("segment")) {
                    drawn.add(svg.getAttribute("data-seqid") + ":" + r.getAttribute("data-start") + "-"
                            + r.getAttribute("data-end"));
                }
            }
        }
        assertThat(drawn).containsExactlyInAnyOrderElementsOf(
                calls.stream().map(f -> f.seqid() + ":" + f.start() + "-" + f.end()).toList());
        // nothing external: no src/href attribute, no url(...) or @import in the style, no http address at all
        String html = Files.readString(dir.resolve("r.html"));
        assertThat(html).doesNotContain(" src=", " href=", "url(", "@import", "<link", "https:");
        // the XHTML and SVG namespace names are identifiers, never fetched; no other address may appear
        assertThat(html.replace("http://www.w3.org/1999/xhtml", "").replace("http://www.w3.org/2000/svg", ""))
                .doesNotContain("http");
        // the run's date in ISO 8601 extended form with seconds, also on the whole minute (ISO 8601:2004 5.4.1)
        assertThat(html).containsPattern("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\d(Z|[+-]\\d\\d:\\d\\d)");
        // the records table: composition recounted from the FASTA (Gardiner-Garden & Frommer 1987 definitions)
        org.w3c.dom.NodeList trs = doc.getElementsByTagNameNS("http://www.w3.org/1999/xhtml", "tr");
        int checked = 0;
        for (int i = 0; i < trs.getLength(); i++) {
            org.w3c.dom.NodeList tds = ((org.w3c.dom.Element) trs.item(i))
                    .getElementsByTagNameNS("http://www.w3.org/1999/xhtml", "td");
            if (tds.getLength() != 9 || !bases.containsKey(tds.item(0).getTextContent())) {
                continue;
            }
            byte[] b = bases.get(tds.item(0).getTextContent());
            BaseCounts counts = BaseCounts.of(b, 1, b.length);
            assertThat(Integer.parseInt(tds.item(1).getTextContent())).isEqualTo(b.length);
            assertThat(Double.parseDouble(tds.item(2).getTextContent())).isCloseTo(counts.gc(), within(0.5e-3));
            assertThat(Double.parseDouble(tds.item(3).getTextContent()))
                    .isCloseTo(counts.cpgObservedExpected(), within(0.5e-3));
            assertThat(Long.parseLong(tds.item(4).getTextContent())).isEqualTo(counts.ambiguous());
            long segments = calls.stream().filter(f -> f.seqid().equals(tds.item(0).getTextContent())).count();
            assertThat(Long.parseLong(tds.item(5).getTextContent())).isEqualTo(segments);
            // the 2.5 kb gap of r1 is flagged in words
            if (tds.item(0).getTextContent().equals("r1")) {
                assertThat(tds.item(8).getTextContent()).startsWith("CHECK:").contains("N run of 2500 bp");
            }
            checked++;
        }
        assertThat(checked).isEqualTo(3);
        assertThat(html).contains("research tool");
    }

    /**
     * Renders the report once in headless Chromium (Debian's package; .ci/run installs it when it can) and keeps
     * the screenshot as target/report-screenshot.png for a person to look at. Skipped where Chromium is absent.
     */
    @Test
    void reportRendersInAHeadlessBrowser() throws Exception {
        Path chromium = Path.of("/usr/bin/chromium");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.isExecutable(chromium), "chromium is not installed");
        Path shot = Path.of("target", "report-screenshot.png").toAbsolutePath();
        Files.deleteIfExists(shot);
        // the flags keep Chromium off the network: no background services, no updates, a fresh profile
        Process p = new ProcessBuilder(chromium.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + dir.resolve("chromium-profile"), "--window-size=1300,2400",
                "--screenshot=" + shot, dir.resolve("r.html").toUri().toString())
                .redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile()).start();
        org.junit.jupiter.api.Assumptions.assumeTrue(p.waitFor(90, java.util.concurrent.TimeUnit.SECONDS),
                "chromium did not finish in 90 s");
        assertThat(shot).exists();
        byte[] png = Files.readAllBytes(shot);
        assertThat(png.length).as("a page with plots, not a blank one").isGreaterThan(20_000);
        assertThat(Arrays.copyOf(png, 4)).containsExactly(0x89, 'P', 'N', 'G');
    }
}
