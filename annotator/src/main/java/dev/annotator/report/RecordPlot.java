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

    private RecordPlot() {
    }

    static void draw(Xml x, HtmlReport.Plotted p) throws IOException {
        PosteriorPlot plot = p.plot();
        double length = p.length();
        x.open("svg", "xmlns", "http://www.w3.org/2000/svg", "width", Integer.toString(WIDTH), "height",
                Integer.toString(HEIGHT), "viewBox", "0 0 " + WIDTH + " " + HEIGHT, "role", "img",
                "aria-label", "posterior of " + p.label() + " along " + p.seqid(), "data-seqid", p.seqid());
        // legend
        x.element("line", "", "x1", "60", "y1", "12", "x2", "80", "y2", "12", "stroke", HtmlReport.BLUE,
                "stroke-width", "2");
        x.element("text", "posterior of " + p.label() + " (maximum per bin; shaded: mean)", "x", "84", "y", "16");
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
        // mean (shaded area), maximum (line), GC (dashed line)
        StringBuilder area = new StringBuilder().append(LEFT).append(',').append(BOTTOM);
        StringBuilder max = new StringBuilder();
        StringBuilder gc = new StringBuilder();
        for (int b = 0; b < plot.bins(); b++) {
            double mid = Math.min(length, (b + 0.5) * plot.binSize());
            String xs = num(xOf(mid, length));
            area.append(' ').append(xs).append(',').append(num(yOf(plot.mean()[b])));
            max.append(xs).append(',').append(num(yOf(plot.max()[b]))).append(' ');
            if (Float.isFinite(plot.gc()[b])) {
                gc.append(xs).append(',').append(num(yOf(plot.gc()[b]))).append(' ');
            }
        }
        area.append(' ').append(RIGHT).append(',').append(BOTTOM);
        x.element("polygon", "", "points", area.toString(), "fill", HtmlReport.BLUE, "fill-opacity", "0.25",
                "stroke", "none");
        x.element("polyline", "", "points", max.toString().trim(), "fill", "none", "stroke", HtmlReport.BLUE,
                "stroke-width", "1.5");
        if (gc.length() > 0) {
            x.element("polyline", "", "points", gc.toString().trim(), "fill", "none", "stroke", HtmlReport.ORANGE,
                    "stroke-width", "1", "stroke-dasharray", "4 2");
        }
        // segments
        x.element("text", "segments", "x", str(LEFT - 6), "y", str(BAR_TOP + 12), "text-anchor", "end");
        for (Segment s : p.segments()) {
            double x0 = xOf(s.start() - 1, length);
            double width = Math.max(1, xOf(s.end(), length) - x0);
            x.open("rect", "class", "segment", "data-label", s.label(), "data-start", Integer.toString(s.start()),
                    "data-end", Integer.toString(s.end()), "data-confidence", Axis.fixed(s.meanPosterior(), 3),
                    "x", num(x0), "y", str(BAR_TOP), "width", num(width), "height", str(BAR_HEIGHT),
                    "fill", HtmlReport.colour(0), "fill-opacity", Axis.fixed(0.25 + 0.75 * s.meanPosterior(), 2));
            x.element("title", s.label() + " " + s.start() + "-" + s.end() + ", confidence "
                    + Axis.fixed(s.meanPosterior(), 3));
            x.close("rect");
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

    private static double yOf(double value) {
        return BOTTOM - value * (BOTTOM - TOP);
    }

    /**
     * A plot coordinate with one decimal, rounded half up. Written by hand rather than with the formatter: a plot has
     * thousands of coordinates, and formatting them was most of the report's cost on a cold start.
     */
    static String num(double v) {
        long tenths = Math.round(v * 10);
        long whole = Math.abs(tenths) / 10;
        return (tenths < 0 ? "-" : "") + whole + "." + Math.abs(tenths) % 10;
    }

    static String str(int v) {
        return Integer.toString(v);
    }
}
