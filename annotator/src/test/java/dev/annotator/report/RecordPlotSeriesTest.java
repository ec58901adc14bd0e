package dev.annotator.report;

import dev.annotator.decode.PosteriorPlot;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

import javax.xml.parsers.DocumentBuilderFactory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The plotted series read back the way a browser places them: the drawing parsed as XML (SVG is an XML language),
 * each point of the polylines and the polygon mapped through the enclosing group's transform as SVG 1.1 defines it
 * (section 7.6: {@code translate(tx ty) scale(sx sy)} maps (x, y) to (tx + sx x, ty + sy y)), and compared with
 * where the bins belong in the frame, computed here from the plot's numbers: x at each bin's centre (the last one
 * clamped to the record's end) across the 880 pixels from 60 to 940, y at 170 - 140 x value. A point may be left out
 * where the line is flat through it, so every bin is checked to lie on the drawn line, and every drawn point to be
 * a bin's.
 */
class RecordPlotSeriesTest {
    private static final Pattern TRANSFORM = Pattern.compile(
            "translate\\((\\S+) (\\S+)\\) scale\\((\\S+) (\\S+)\\)");

    @Test
    void everyFiniteBinIsDrawnWhereItBelongs() throws Exception {
        Random random = new Random(11);
        for (int[] shape : new int[][]{{100_000, 100}, {99_950, 100}, {12_345, 13}, {1_000, 1}, {7, 1}}) {
            int length = shape[0];
            int bin = shape[1];
            int bins = (length - 1) / bin + 1;
            float[] max = new float[bins];
            float[] mean = new float[bins];
            float[] gc = new float[bins];
            for (int i = 0; i < bins; i++) {
                mean[i] = random.nextFloat();
                max[i] = Math.max(mean[i], random.nextFloat());
                gc[i] = random.nextInt(10) == 0 ? Float.NaN : random.nextFloat(); // NaN: a bin of Ns only
            }
            max[0] = 1f;
            mean[bins - 1] = 0f;
            PosteriorPlot plot = new PosteriorPlot(bin, max, mean, gc);
            StringBuilder svg = new StringBuilder();
            RecordPlot.draw(svg, new HtmlReport.Plotted("r", length, plot, List.of(), "island"),
                    RecordPlot.frame("island"));
            Document doc = DocumentBuilderFactory.newInstance().newDocumentBuilder()
                    .parse(new ByteArrayInputStream(svg.toString().getBytes(StandardCharsets.UTF_8)));

            List<double[]> drawnMax = points(doc, "polyline", 0);
            List<double[]> drawnGc = points(doc, "polyline", 1);
            List<double[]> drawnMean = points(doc, "polygon", 0);
            expect(drawnMax, max, bin, length);
            expect(drawnGc, gc, bin, length);
            // the shaded area runs from the frame's bottom-left corner along the means to its bottom-right corner
            assertThat(drawnMean.get(0)[0]).isCloseTo(60, within(1e-6));
            assertThat(drawnMean.get(0)[1]).isCloseTo(170, within(1e-6));
            assertThat(drawnMean.get(drawnMean.size() - 1)[0]).isCloseTo(940, within(1e-3));
            assertThat(drawnMean.get(drawnMean.size() - 1)[1]).isCloseTo(170, within(1e-6));
            expect(drawnMean.subList(1, drawnMean.size() - 1), mean, bin, length);
        }
    }

    @Test
    void aFlatStretchIsDrawnByItsEnds() throws Exception {
        int length = 100_000;
        int bin = 100;
        float[] values = new float[1000];
        java.util.Arrays.fill(values, 0.25f);
        values[500] = 0.75f;
        StringBuilder svg = new StringBuilder();
        RecordPlot.draw(svg, new HtmlReport.Plotted("r", length, new PosteriorPlot(bin, values, values, values),
                List.of(), "island"), RecordPlot.frame("island"));
        Document doc = DocumentBuilderFactory.newInstance().newDocumentBuilder()
                .parse(new ByteArrayInputStream(svg.toString().getBytes(StandardCharsets.UTF_8)));
        List<double[]> drawn = points(doc, "polyline", 0);
        // first, last before the peak, peak, first after it, last
        assertThat(drawn).hasSize(5);
        expect(drawn, values, bin, length);
    }

    /**
     * The drawn line, in pixels, against the finite values: every drawn point is a bin's point, in order, the first
     * and last finite bins are drawn, and every bin in between lies on the line.
     */
    private static void expect(List<double[]> drawn, float[] values, int bin, int length) {
        List<double[]> expected = new ArrayList<>();
        for (int i = 0; i < values.length; i++) {
            if (Float.isFinite(values[i])) {
                double centre = Math.min(length, (i + 0.5) * bin);
                expected.add(new double[]{60 + 880 * centre / length, 170 - 140 * values[i]});
            }
        }
        // values are written in thousandths: half a thousandth of the 140-pixel height at most
        double yTolerance = 0.07 + 1e-6;
        int at = 0;
        for (double[] d : drawn) {
            while (at < expected.size() && Math.abs(expected.get(at)[0] - d[0]) > 1e-3) {
                at++;
            }
            assertThat(at).as("drawn point at x %.3f is a bin's", d[0]).isLessThan(expected.size());
            assertThat(d[1]).isCloseTo(expected.get(at)[1], within(yTolerance));
        }
        assertThat(drawn.get(0)[0]).isCloseTo(expected.get(0)[0], within(1e-3));
        assertThat(drawn.get(drawn.size() - 1)[0]).isCloseTo(expected.get(expected.size() - 1)[0], within(1e-3));
        int segment = 0;
        for (double[] e : expected) {
            while (segment + 1 < drawn.size() - 1 && drawn.get(segment + 1)[0] < e[0] - 1e-3) {
                segment++;
            }
            double[] a = drawn.get(segment);
            double[] b = drawn.get(Math.min(segment + 1, drawn.size() - 1));
            double y = b[0] - a[0] < 1e-9 ? a[1] : a[1] + (b[1] - a[1]) * (e[0] - a[0]) / (b[0] - a[0]);
            assertThat(y).as("line at x %.3f", e[0]).isCloseTo(e[1], within(yTolerance));
        }
    }

    /** Points of the n-th element with this name, in pixels of the drawing. */
    private static List<double[]> points(Document doc, String element, int n) {
        Element e = (Element) doc.getElementsByTagName(element).item(n);
        Element group = (Element) e.getParentNode();
        Matcher m = TRANSFORM.matcher(group.getAttribute("transform"));
        assertThat(m.matches()).as(group.getAttribute("transform")).isTrue();
        double tx = Double.parseDouble(m.group(1));
        double ty = Double.parseDouble(m.group(2));
        double sx = Double.parseDouble(m.group(3));
        double sy = Double.parseDouble(m.group(4));
        List<double[]> out = new ArrayList<>();
        for (String pair : e.getAttribute("points").trim().split(" ")) {
            String[] xy = pair.split(",");
            out.add(new double[]{tx + sx * Double.parseDouble(xy[0]), ty + sy * Double.parseDouble(xy[1])});
        }
        return out;
    }

    @Test
    void elementsOutsideTheSeriesAreNotInTheGroup() throws Exception {
        NodeList groups;
        StringBuilder svg = new StringBuilder();
        RecordPlot.draw(svg, new HtmlReport.Plotted("r", 50, new PosteriorPlot(1, new float[50], new float[50],
                new float[50]), List.of(), "island"), RecordPlot.frame("island"));
        Document doc = DocumentBuilderFactory.newInstance().newDocumentBuilder()
                .parse(new ByteArrayInputStream(svg.toString().getBytes(StandardCharsets.UTF_8)));
        groups = doc.getElementsByTagName("g");
        assertThat(groups.getLength()).isEqualTo(1);
        assertThat(((Element) groups.item(0)).getElementsByTagName("*").getLength()).isEqualTo(3);
    }
}
