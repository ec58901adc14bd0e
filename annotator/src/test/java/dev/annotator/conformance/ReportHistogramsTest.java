package dev.annotator.conformance;

import dev.annotator.cli.Main;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

import javax.xml.parsers.DocumentBuilderFactory;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The report's two histograms against the GFF3 written in the same run (read by {@link StrictGff3Reader}): each
 * bar's count, read from its tooltip, equals the number of segments that fall in its bin, computed here apart from
 * the report's code. Lengths: bins of a quarter decade from 1 bp, so a length L is in bin b exactly when
 * 10^b <= L^4 < 10^(b+1), compared in integers (the last bin also takes longer ones). Confidence: twenty bins of
 * 0.05; the GFF3 score is the mean posterior at 3 decimals, so a segment within half a thousandth of an edge may
 * sit on either side of it.
 */
class ReportHistogramsTest {
    private static final String SVG = "http://www.w3.org/2000/svg";
    private static final Pattern TOOLTIP = Pattern.compile("(\\d+) segment\\(s\\) from .*");

    @TempDir
    Path dir;

    @Test
    void barsCountTheSegmentsInTheirBins() throws Exception {
        Path fasta = dir.resolve("sim.fa");
        Path gff = dir.resolve("out.gff3");
        Path html = dir.resolve("r.html");
        assertThat(run("simulate", "-m", "cpg-island", "--length", "400000", "--records", "3", "--seed", "21", "-o",
                fasta.toString())).isZero();
        assertThat(run("annotate", "-m", "cpg-island", "-q", "-o", gff.toString(), "--report", html.toString(),
                fasta.toString())).isZero();
        List<ParsedFeature> segments = StrictGff3Reader.read(gff).features();
        assertThat(segments).hasSizeGreaterThan(30);

        DocumentBuilderFactory factory = DocumentBuilderFactory.newInstance();
        factory.setNamespaceAware(true);
        Document doc = factory.newDocumentBuilder().parse(html.toFile());
        long[] lengthBars = bars(doc, "histogram of Segment length");
        long[] confidenceBars = bars(doc, "histogram of Segment confidence (mean posterior)");
        assertThat(lengthBars).hasSize(28);
        assertThat(confidenceBars).hasSize(20);

        long[] lengths = new long[28];
        for (ParsedFeature f : segments) {
            lengths[quarterDecade(f.length(), 28)]++;
        }
        assertThat(lengthBars).containsExactly(lengths);

        long[] sure = new long[20];
        long[] maybe = new long[20];
        for (ParsedFeature f : segments) {
            int low = Math.min(19, (int) Math.floor((f.score() - 0.0005) * 20));
            int high = Math.min(19, (int) Math.floor((f.score() + 0.0005) * 20));
            if (low == high) {
                sure[low]++;
            } else {
                maybe[low]++;
                maybe[high]++;
            }
        }
        long total = 0;
        for (int b = 0; b < 20; b++) {
            assertThat(confidenceBars[b]).as("confidence bin %d", b).isBetween(sure[b], sure[b] + maybe[b]);
            total += confidenceBars[b];
        }
        assertThat(total).isEqualTo(segments.size());
    }

    /** The bin b with 10^b <= L^4 < 10^(b+1), the last one taking everything beyond. */
    private static int quarterDecade(long length, int bins) {
        BigInteger fourth = BigInteger.valueOf(length).pow(4);
        int b = 0;
        while (b + 1 < bins && fourth.compareTo(BigInteger.TEN.pow(b + 1)) >= 0) {
            b++;
        }
        return b;
    }

    /** Each bar's count, in order, from the tooltips of the histogram with this accessible name. */
    private static long[] bars(Document doc, String name) {
        NodeList svgs = doc.getElementsByTagNameNS(SVG, "svg");
        for (int i = 0; i < svgs.getLength(); i++) {
            Element svg = (Element) svgs.item(i);
            if (!svg.getAttribute("aria-label").equals(name)) {
                continue;
            }
            List<Long> counts = new ArrayList<>();
            NodeList rects = svg.getElementsByTagNameNS(SVG, "rect");
            for (int k = 0; k < rects.getLength(); k++) {
                Element title = (Element) ((Element) rects.item(k)).getElementsByTagNameNS(SVG, "title").item(0);
                Matcher m = TOOLTIP.matcher(title.getTextContent());
                assertThat(m.matches()).as(title.getTextContent()).isTrue();
                counts.add(Long.parseLong(m.group(1)));
            }
            return counts.stream().mapToLong(Long::longValue).toArray();
        }
        throw new AssertionError("no histogram named " + name);
    }

    private static int run(String... args) {
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int status = Main.run(args, new ByteArrayInputStream(new byte[0]), new ByteArrayOutputStream(),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        if (status != 0) {
            System.err.println(err.toString(StandardCharsets.UTF_8));
        }
        return status;
    }
}
