package dev.annotator.gff;

import dev.annotator.text.FixedPoint;

/** Fixed-point numbers for GFF3 text: locale-independent, and never "-0.000" for values that round to zero. */
final class FixedDecimals {
    private FixedDecimals() {
    }

    static String format(double value, int decimals) {
        String s = FixedPoint.format(value, decimals);
        if (s.charAt(0) == '-' && isZero(s)) {
            return s.substring(1);
        }
        return s;
    }

    private static boolean isZero(String s) {
        for (int i = 1; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c != '0' && c != '.') {
                return false;
            }
        }
        return true;
    }
}
