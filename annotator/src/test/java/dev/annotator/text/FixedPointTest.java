package dev.annotator.text;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * {@link FixedPoint} writes numbers by hand; the reference is the JDK's own formatter,
 * {@code String.format(Locale.ROOT, "%.Nf", v)} (java.util.Formatter, which rounds the shortest decimal form half
 * up), on values chosen to sit on and next to rounding midpoints as well as random ones, and on values that are
 * not finite.
 */
class FixedPointTest {

    @Test
    void agreesWithTheJdkFormatter() {
        Random random = new Random(20261202);
        List<Double> values = new ArrayList<>(List.of(0.0, -0.0, 1.0, -1.0, 0.5, 0.05, 0.005, 0.0005, 0.00049999,
                0.9995, 0.9994999999, 1.0005, 2.675, 0.125, 0.375, 1e-9, -1e-9, 123456.7895, 999999.9995, 4e8, 2e9,
                1e15, 1e300, Double.MIN_VALUE, Double.MAX_VALUE, 40.0, 0.25 + 0.75 * 0.9715, Double.NaN,
                Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY));
        for (int i = 0; i < 50_000; i++) {
            values.add(random.nextDouble());
            values.add(random.nextDouble() * 1e6);
            values.add(-random.nextDouble() * 100);
            // rounding midpoints of one to three decimals, and the doubles on either side of them
            double midpoint = (random.nextInt(2_000_000) + 0.5) / Math.pow(10, 1 + random.nextInt(3));
            values.add(midpoint);
            values.add(Math.nextUp(midpoint));
            values.add(Math.nextDown(midpoint));
            // a mean of a few posteriors, as the report prints them
            values.add((random.nextDouble() + random.nextDouble() + random.nextDouble()) / 3);
        }
        int checked = 0;
        for (double v : values) {
            for (int decimals = 0; decimals <= 7; decimals++) {
                assertThat(FixedPoint.format(v, decimals)).as("%s with %d decimals", v, decimals)
                        .isEqualTo(String.format(Locale.ROOT, "%." + decimals + "f", v));
                checked++;
            }
        }
        assertThat(checked).isGreaterThan(2_000_000);
    }
}
