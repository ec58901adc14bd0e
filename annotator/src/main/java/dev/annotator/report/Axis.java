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

    /** Powers of ten up to the most decimals {@link #fixed} writes by hand. */
    private static final long[] TEN = {1, 10, 100, 1_000, 10_000, 100_000, 1_000_000};

    /**
     * {@code v} with {@code decimals} decimals exactly as {@code String.format(Locale.ROOT, "%.Nf", v)} writes it;
     * NA when not finite. Written by hand: a report formats thousands of numbers, and the formatter's conversion
     * code, compiled for them in a cold process, cost more than the rest of the report. The formatter rounds the
     * shortest decimal form of the double half up; scaling the double itself gives the same digits except near a
     * rounding midpoint, so values within a millionth of a unit of the last decimal from one, and large values, still
     * go through the formatter.
     */
    static String fixed(double v, int decimals) {
        return appendFixed(new StringBuilder(16), v, decimals).toString();
    }

    /** Appends {@link #fixed}{@code (v, decimals)} to {@code b}. */
    static StringBuilder appendFixed(StringBuilder b, double v, int decimals) {
        if (!Double.isFinite(v)) {
            return b.append("NA");
        }
        if (decimals < TEN.length) {
            boolean negative = Double.compare(v, 0.0) < 0; // as the formatter: -0.0 gives "-0.000"
            double scaled = Math.abs(v) * TEN[decimals];
            double whole = Math.floor(scaled);
            double fraction = scaled - whole;
            if (scaled < 1e9 && Math.abs(fraction - 0.5) > 1e-6) {
                long units = (long) whole + (fraction > 0.5 ? 1 : 0);
                if (negative) {
                    b.append('-');
                }
                b.append(units / TEN[decimals]);
                if (decimals > 0) {
                    b.append('.');
                    long decimalPart = units % TEN[decimals];
                    for (int d = decimals - 1; d >= 0; d--) {
                        b.append((char) ('0' + decimalPart / TEN[d] % 10));
                    }
                }
                return b;
            }
        }
        return b.append(String.format(Locale.ROOT, "%." + decimals + "f", v));
    }
}
