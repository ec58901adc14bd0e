package dev.annotator.report;

import java.util.Locale;

/** Tick positions and labels in bp, kb or Mb. */
final class Axis {
    private Axis() {
    }

    /** A round tick step giving about {@code ticks} ticks over [0, span]. */
    static double step(double span, int ticks) {
        double raw = span / ticks;
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[]{1, 2, 5, 10}) {
            if (m * p >= raw) {
                return m * p;
            }
        }
        return 10 * p;
    }

    static String bases(double bp) {
        if (bp >= 1e6) {
            return trim(bp / 1e6) + " Mb";
        }
        if (bp >= 1e3) {
            return trim(bp / 1e3) + " kb";
        }
        return trim(bp) + " bp";
    }

    private static String trim(double v) {
        String s = String.format(Locale.ROOT, "%.3f", v);
        s = s.replaceAll("0+$", "");
        return s.endsWith(".") ? s.substring(0, s.length() - 1) : s;
    }

    static String fixed(double v, int decimals) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%." + decimals + "f", v) : "NA";
    }
}
