package dev.annotator.report;

import org.junit.jupiter.api.Test;


import static org.assertj.core.api.Assertions.assertThat;

/** The report's axis text: fixed-point numbers from {@code text.FixedPoint} (tested there), NA, bases in bp/kb/Mb. */
class AxisFixedTest {

    @Test
    void finiteValuesAreTheSharedFixedPointText() {
        for (double v : new double[]{0.0, -0.0, 0.9995, 2.675, 123456.7895, 0.25 + 0.75 * 0.9715}) {
            assertThat(Axis.fixed(v, 3)).isEqualTo(dev.annotator.text.FixedPoint.format(v, 3));
        }
    }

    @Test
    void notFiniteIsNa() {
        assertThat(Axis.fixed(Double.NaN, 3)).isEqualTo("NA");
        assertThat(Axis.fixed(Double.POSITIVE_INFINITY, 2)).isEqualTo("NA");
    }

    @Test
    void basesDropTrailingZeros() {
        assertThat(Axis.bases(40_000_000)).isEqualTo("40 Mb");
        assertThat(Axis.bases(2_500)).isEqualTo("2.5 kb");
        assertThat(Axis.bases(1_234_567)).isEqualTo("1.235 Mb");
        assertThat(Axis.bases(0)).isEqualTo("0 bp");
        assertThat(Axis.bases(999)).isEqualTo("999 bp");
    }
}
