package dev.annotator.hmm;

/**
 * Sums the logarithms of many scale factors without calling log per factor: the running product is kept as a
 * mantissa near 1 and a separate binary exponent, renormalised only when the mantissa drifts far from 1.
 */
final class LogScaleAccumulator {
    private static final double LN2 = Math.log(2);
    private double mantissa = 1.0;
    private long exponent;

    void multiply(double factor) {
        mantissa *= factor;
        if (mantissa < 0x1p-500 || mantissa > 0x1p500) {
            int e = Math.getExponent(mantissa);
            exponent += e;
            mantissa = Math.scalb(mantissa, -e);
        }
    }

    /** Natural log of the product of all factors so far. */
    double log() {
        return Math.log(mantissa) + exponent * LN2;
    }
}
