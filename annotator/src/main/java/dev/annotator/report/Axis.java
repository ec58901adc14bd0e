package dev.annotator.report;

import dev.annotator.text.FixedPoint;


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

    /** {@code v} with three decimals, trailing zeros (and a trailing point) dropped. */
    private static String trim(double v) {
        String s = fixed(v, 3);
        int end = s.length();
        while (s.charAt(end - 1) == '0') {
            end--;
        }
        if (s.charAt(end - 1) == '.') {
            end--;
        }
        return s.substring(0, end);
    }

    /** {@code v} with {@code decimals} decimals as the JDK's formatter writes it ({@link FixedPoint}); NA when not finite. */
    static String fixed(double v, int decimals) {
        return appendFixed(new StringBuilder(16), v, decimals).toString();
    }

    /** Appends {@link #fixed}{@code (v, decimals)} to {@code b}. */
    static StringBuilder appendFixed(StringBuilder b, double v, int decimals) {
        return Double.isFinite(v) ? FixedPoint.append(b, v, decimals) : b.append("NA");
    }
}
