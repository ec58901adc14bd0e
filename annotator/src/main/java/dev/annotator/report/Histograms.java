package dev.annotator.report;

import java.io.IOException;

/** Draws a {@link Histogram} as an SVG bar chart with labelled axes. */
final class Histograms {
    private static final int LEFT = 60;
    private static final int RIGHT = 560;
    private static final int TOP = 20;
    private static final int BOTTOM = 170;

    private Histograms() {
    }

    static void draw(Xml x, Histogram h, String title, boolean basesAxis) throws IOException {
        long most = 1;
        for (int b = 0; b < h.bins(); b++) {
            most = Math.max(most, h.count(b));
        }
        x.open("svg", "xmlns", "http://www.w3.org/2000/svg", "width", "600", "height", "220", "viewBox", "0 0 600 220",
                "role", "img", "aria-label", "histogram of " + title);
        x.element("text", title + " (segments per bin; " + (basesAxis ? "logarithmic" : "linear") + " axis)",
                "x", str(LEFT), "y", "14");
        double w = (RIGHT - LEFT) / (double) h.bins();
        for (int b = 0; b < h.bins(); b++) {
            double height = (BOTTOM - TOP) * (double) h.count(b) / most;
            x.open("rect", "x", RecordPlot.num(LEFT + b * w), "y", RecordPlot.num(BOTTOM - height), "width",
                    RecordPlot.num(w - 1), "height", RecordPlot.num(height), "fill", HtmlReport.BLUE);
            x.element("title", h.count(b) + " segment(s) from " + label(h.edge(b), basesAxis) + " to "
                    + label(h.edge(b + 1), basesAxis));
            x.close("rect");
        }
        x.element("line", "", "x1", str(LEFT), "y1", str(BOTTOM), "x2", str(RIGHT), "y2", str(BOTTOM), "stroke", "#555");
        x.element("text", "0", "x", str(LEFT - 6), "y", str(BOTTOM + 4), "text-anchor", "end");
        x.element("text", Long.toString(most), "x", str(LEFT - 6), "y", str(TOP + 4), "text-anchor", "end");
        int every = Math.max(1, h.bins() / 7);
        for (int b = 0; b <= h.bins(); b += every) {
            x.element("text", label(h.edge(b), basesAxis), "x", RecordPlot.num(LEFT + b * w), "y", str(BOTTOM + 16),
                    "text-anchor", "middle");
        }
        x.element("text", basesAxis ? "length" : "confidence", "x", str((LEFT + RIGHT) / 2), "y", "210",
                "text-anchor", "middle");
        x.close("svg");
    }

    private static String label(double v, boolean bases) {
        return bases ? Axis.bases(Math.round(v)) : Axis.fixed(v, 2);
    }

    private static String str(int v) {
        return Integer.toString(v);
    }
}
