package dev.annotator.text;

import java.util.Locale;

/**
 * Fixed-point decimal text exactly as {@code String.format(Locale.ROOT, "%.Nf", v)} writes it, for every double
 * (NaN and infinities included), written by hand where that is safe. The writers format thousands of numbers, and
 * the formatter's conversion code, compiled for them in a cold process, cost more than the rest of a report and
 * 100-290 ms of a plain 40 Mbp annotation. The formatter rounds the shortest decimal form of the double half up;
 * scaling the double itself gives the same digits except near a rounding midpoint, so values within a millionth
 * of a unit of the last decimal from one, large values, more than six decimals and values that are not finite
 * still go through the formatter.
 */
public final class FixedPoint {
    /** Powers of ten up to the most decimals written by hand. */
    private static final long[] TEN = {1, 10, 100, 1_000, 10_000, 100_000, 1_000_000};

    private FixedPoint() {
    }

    public static String format(double v, int decimals) {
        return append(new StringBuilder(16), v, decimals).toString();
    }

    /** Appends {@link #format}{@code (v, decimals)} to {@code b}. */
    public static StringBuilder append(StringBuilder b, double v, int decimals) {
        if (Double.isFinite(v) && decimals < TEN.length) {
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
