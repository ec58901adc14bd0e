package dev.annotator.model;

import java.math.BigDecimal;
import java.math.MathContext;

/** Prints numbers in messages and summaries short enough to read and exact enough to act on. */
final class Numbers {
    private Numbers() {
    }

    /** Up to 8 significant digits, no exponent for ordinary magnitudes, no trailing zeros. */
    static String show(double x) {
        if (Double.isNaN(x) || Double.isInfinite(x)) {
            return Double.toString(x);
        }
        if (x == 0) {
            return "0";
        }
        BigDecimal d = new BigDecimal(x).round(new MathContext(8)).stripTrailingZeros();
        double mag = Math.abs(x);
        return mag >= 1e-6 && mag < 1e12 ? d.toPlainString() : d.toString();
    }

    /** A natural log-likelihood with six decimals, the way progress lines print it. */
    static String logLikelihood(double x) {
        return String.format(java.util.Locale.ROOT, "%.6f", x);
    }
}
