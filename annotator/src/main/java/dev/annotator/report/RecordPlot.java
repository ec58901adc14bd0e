package dev.annotator.report;

import dev.annotator.decode.PosteriorPlot;
import dev.annotator.decode.Segment;

import java.io.IOException;

/**
 * One record's plot: the label posterior (bin maximum, so a short confident stretch stays visible, and bin mean)
 * on the left axis, GC fraction on the right axis, the called segments as bars beneath (each carrying its GFF3
 * coordinates in data attributes and a tooltip with its confidence), an axis in bp/kb/Mb and a legend.
 */
final class RecordPlot {
    static final int WIDTH = 1000;
    private static final int LEFT = 60;
    private static final int RIGHT = 940;
    private static final int TOP = 30;
    private static final int BOTTOM = 170;
    private static final int BAR_TOP = 185;
    private static final int BAR_HEIGHT = 16;
    private static final int HEIGHT = 240;
    /** Units of a plotted value (a posterior or a fraction) in the series' point lists: thousandths. */
    static final int VALUE_UNITS = 1000;

    private RecordPlot() {
    }

    /**
     * What every plot of one label shares, whatever the record: legend, frame, value axes and their titles. Made
     * once per report and appended to each plot as it is (in a cold process the markup writer's calls for it cost
     * more than the plot's own numbers).
     */
    static String frame(String label) throws IOException {
        StringBuilder out = new StringBuilder(2048);
        Xml x = new Xml(out);
        // legend
        x.element("line", "", "x1", "60", "y1", "12", "x2", "80", "y2", "12", "stroke", HtmlReport.BLUE,
                "stroke-width", "2");
        x.element("text", "posterior of " + label + " (maximum per bin; shaded: mean)", "x", "84", "y", "16");
        x.element("line", "", "x1", "470", "y1", "12", "x2", "490", "y2", "12", "stroke", HtmlReport.ORANGE,
                "stroke-width", "2", "stroke-dasharray", "4 2");
        x.element("text", "GC, windows of 200 bp or more (right axis)", "x", "494", "y", "16");
        x.element("rect", "", "x", "720", "y", "6", "width", "20", "height", "10", "fill", HtmlReport.colour(0));
        x.element("text", "called segments (darker = more confident)", "x", "744", "y", "16");
        // frame and y axes
        x.element("rect", "", "x", str(LEFT), "y", str(TOP), "width", str(RIGHT - LEFT), "height", str(BOTTOM - TOP),
                "fill", "none", "stroke", HtmlReport.GREY);
        for (double v = 0; v <= 1.0001; v += 0.25) {
            double y = BOTTOM - v * (BOTTOM - TOP);
            x.element("line", "", "x1", str(LEFT - 4), "y1", num(y), "x2", str(LEFT), "y2", num(y), "stroke", "#555");
            x.element("text", Axis.fixed(v, 2), "x", str(LEFT - 6), "y", num(y + 4), "text-anchor", "end");
            x.element("text", Axis.fixed(v, 2), "x", str(RIGHT + 6), "y", num(y + 4));
        }
        x.element("text", "posterior", "x", "14", "y", num((TOP + BOTTOM) / 2.0), "transform",
                "rotate(-90 14 " + num((TOP + BOTTOM) / 2.0) + ")", "text-anchor", "middle");
        x.element("text", "GC", "x", str(RIGHT + 36), "y", num((TOP + BOTTOM) / 2.0));
        return out.toString();
    }

    /**
     * Draws into {@code out}, with {@code frame} from {@link #frame} for the plot's label. The fixed parts go through {@link Xml}; the parts repeated per bin and per segment are
     * appended directly (numbers need no escaping, labels are escaped once), which made drawing several times
     * cheaper in a cold process, where such code runs interpreted for its first thousands of rounds.
     */
    static void draw(StringBuilder out, HtmlReport.Plotted p, String frame) throws IOException {
        Xml x = new Xml(out);
        PosteriorPlot plot = p.plot();
        double length = p.length();
        x.open("svg", "xmlns", "http://www.w3.org/2000/svg", "width", Integer.toString(WIDTH), "height",
                Integer.toString(HEIGHT), "viewBox", "0 0 " + WIDTH + " " + HEIGHT, "role", "img",
                "aria-label", "posterior of " + p.label() + " along " + p.seqid(), "data-seqid", p.seqid());
        out.append(frame);
        // mean (shaded area), maximum (line), GC (dashed line), in bin units mapped into the frame by one transform
        String transform = seriesTransform(plot.binSize(), length);
        int last = plot.bins() - 1;
        String lastX = Axis.fixed(binUnits(Math.min(length, (last + 0.5) * plot.binSize()), plot.binSize()), 3);
        StringBuilder area = new StringBuilder(8 * plot.bins() + 64);
        area.append("-0.5,0");
        appendPoints(area, plot.mean(), lastX);
        area.append(' ');
        Axis.appendFixed(area, binUnits(length, plot.binSize()), 3).append(",0");
        StringBuilder max = appendPoints(new StringBuilder(8 * plot.bins()), plot.max(), lastX);
        StringBuilder gc = appendPoints(new StringBuilder(8 * plot.bins()), plot.gc(), lastX);
        // the lines' lists start with the separator of their first point
        trimStart(max);
        trimStart(gc);
        // point lists hold digits, commas, points, minus signs and spaces only: nothing to escape
        out.append("<g transform=\"").append(transform).append("\">");
        out.append("<polygon points=\"").append(area).append("\" fill=\"").append(HtmlReport.BLUE)
                .append("\" fill-opacity=\"0.25\" stroke=\"none\"/>");
        out.append("<polyline points=\"").append(max).append("\" fill=\"none\" stroke=\"").append(HtmlReport.BLUE)
                .append("\" stroke-width=\"1.5\" vector-effect=\"non-scaling-stroke\"/>");
        if (gc.length() > 0) {
            out.append("<polyline points=\"").append(gc).append("\" fill=\"none\" stroke=\"")
                    .append(HtmlReport.ORANGE).append("\" stroke-width=\"1\" stroke-dasharray=\"4 2\"")
                    .append(" vector-effect=\"non-scaling-stroke\"/>");
        }
        out.append("</g>");
        // segments
        x.element("text", "segments", "x", str(LEFT - 6), "y", str(BAR_TOP + 12), "text-anchor", "end");
        String label = null;
        String escapedLabel = null;
        for (Segment s : p.segments()) {
            if (!s.label().equals(label)) {
                label = s.label();
                escapedLabel = Xml.escaped(label);
            }
            double x0 = xOf(s.start() - 1, length);
            double width = Math.max(1, xOf(s.end(), length) - x0);
            out.append("<rect class=\"segment\" data-label=\"").append(escapedLabel)
                    .append("\" data-start=\"").append(s.start()).append("\" data-end=\"").append(s.end())
                    .append("\" data-confidence=\"");
            Axis.appendFixed(out, s.meanPosterior(), 3).append("\" x=\"");
            appendNum(out, x0).append("\" y=\"").append(BAR_TOP).append("\" width=\"");
            appendNum(out, width).append("\" height=\"").append(BAR_HEIGHT).append("\" fill=\"")
                    .append(HtmlReport.colour(0)).append("\" fill-opacity=\"");
            Axis.appendFixed(out, 0.25 + 0.75 * s.meanPosterior(), 2).append("\"><title>").append(escapedLabel)
                    .append(' ').append(s.start()).append('-').append(s.end()).append(", confidence ");
            Axis.appendFixed(out, s.meanPosterior(), 3).append("</title></rect>\n");
        }
        // x axis
        double step = Axis.step(length, 8);
        for (double v = 0; v <= length; v += step) {
            double xv = xOf(v, length);
            x.element("line", "", "x1", num(xv), "y1", str(BAR_TOP + BAR_HEIGHT + 2), "x2", num(xv), "y2",
                    str(BAR_TOP + BAR_HEIGHT + 7), "stroke", "#555");
            x.element("text", Axis.bases(v), "x", num(xv), "y", str(BAR_TOP + BAR_HEIGHT + 19), "text-anchor", "middle");
        }
        x.element("text", "position (record length " + Axis.bases(length) + ")", "x", num((LEFT + RIGHT) / 2.0), "y",
                str(HEIGHT - 4), "text-anchor", "middle");
        x.close("svg");
    }

    private static double xOf(double position, double length) {
        return LEFT + (RIGHT - LEFT) * position / Math.max(1, length);
    }

    /**
     * A plot coordinate with one decimal, rounded half up. Written by hand rather than with the formatter: a plot has
     * thousands of coordinates, and formatting them was most of the report's cost on a cold start.
     */
    static String num(double v) {
        return appendNum(new StringBuilder(8), v).toString();
    }

    /** Appends {@link #num}{@code (v)} to {@code b}. */
    static StringBuilder appendNum(StringBuilder b, double v) {
        long tenths = Math.round(v * 10);
        if (tenths < 0) {
            b.append('-');
        }
        long abs = Math.abs(tenths);
        return b.append(abs / 10).append('.').append((char) ('0' + abs % 10));
    }

    /**
     * The series are written in bin units: x is a bin's index (its centre; the last bin's centre is clamped to the
     * record's end, {@code lastX}), y the value in thousandths, both small integers, shorter and quicker to write
     * than pixel coordinates with decimals. This transform (SVG 1.1, section 7.6: translate, then scale) maps them
     * into the frame; the strokes keep their width in pixels through {@code vector-effect="non-scaling-stroke"}.
     */
    static String seriesTransform(int binSize, double length) {
        double pixelsPerBin = (RIGHT - LEFT) * binSize / Math.max(1, length);
        StringBuilder b = new StringBuilder(64).append("translate(");
        Axis.appendFixed(b, LEFT + pixelsPerBin / 2, 6).append(' ').append(BOTTOM).append(") scale(");
        Axis.appendFixed(b, pixelsPerBin, 9).append(' ');
        return Axis.appendFixed(b, -(BOTTOM - TOP) / (double) VALUE_UNITS, 6).append(')').toString();
    }

    /** A position along the record in bin units: 0 at the first bin's centre. */
    private static double binUnits(double position, int binSize) {
        return position / binSize - 0.5;
    }

    /**
     * Appends " x,y" for the bins whose value is finite, leaving out each point whose neighbours on both sides are at
     * the same height: the line through them is the same without it, and a posterior curve is flat over most of a
     * record. One loop of its own, called three times per plot: run that often, it gets compiled, where the same
     * loop inside {@link #draw} (called once per plot, at most 50 times a run) stayed interpreted.
     */
    private static StringBuilder appendPoints(StringBuilder b, float[] values, String lastX) {
        int last = values.length - 1;
        // the point held back (-1: none) and the height of the last point written (MIN_VALUE: none yet)
        int held = -1;
        int heldY = 0;
        int writtenY = Integer.MIN_VALUE;
        for (int i = 0; i < values.length; i++) {
            if (!Float.isFinite(values[i])) {
                continue;
            }
            int y = Math.round(values[i] * VALUE_UNITS);
            if (held >= 0 && !(heldY == y && writtenY == y)) {
                appendPoint(b, held, heldY, last, lastX);
                writtenY = heldY;
            }
            held = i;
            heldY = y;
        }
        if (held >= 0) {
            appendPoint(b, held, heldY, last, lastX);
        }
        return b;
    }

    private static void appendPoint(StringBuilder b, int bin, int y, int last, String lastX) {
        b.append(' ');
        if (bin < last) {
            b.append(bin);
        } else {
            b.append(lastX);
        }
        b.append(',').append(y);
    }

    /** Drops the leading space. */
    private static void trimStart(StringBuilder b) {
        if (b.length() > 0 && b.charAt(0) == ' ') {
            b.deleteCharAt(0);
        }
    }

    static String str(int v) {
        return Integer.toString(v);
    }
}
