package dev.annotator.conformance;

/**
 * Base counts of a stretch of sequence, counted here from the letters, apart from the project's code, for the
 * composition measures of Gardiner-Garden &amp; Frommer (1987, J Mol Biol 196:261): GC fraction (C+G)/L and
 * observed/expected CpG = n(CpG) x L / (n(C) x n(G)).
 *
 * <p>L counts only unambiguous bases (A, C, G, T or U in either case) and a CpG counts only when both its bases
 * are unambiguous, as the project's contributor guide defines {@code gc} and {@code cpg_oe} for sequence with
 * ambiguity codes. All figures are integers, so comparisons against printed decimals and thresholds are exact.
 *
 * @param unambiguous L, the number of A, C, G, T/U
 * @param ambiguous   every other letter (N and the other IUPAC codes)
 * @param cpg         C immediately followed by G
 */
public record BaseCounts(long a, long c, long g, long t, long unambiguous, long ambiguous, long cpg) {

    /** Counts {@code bases[start1 - 1 .. end1 - 1]}: 1-based, both ends included, as in GFF3. */
    public static BaseCounts of(byte[] bases, long start1, long end1) {
        long a = 0;
        long c = 0;
        long g = 0;
        long t = 0;
        long ambiguous = 0;
        long cpg = 0;
        char previous = 0;
        for (int i = (int) start1 - 1; i < end1; i++) {
            char base = Character.toUpperCase((char) (bases[i] & 0xFF));
            switch (base) {
                case 'A' -> a++;
                case 'C' -> c++;
                case 'G' -> {
                    g++;
                    if (previous == 'C') {
                        cpg++;
                    }
                }
                case 'T', 'U' -> t++;
                default -> ambiguous++;
            }
            previous = base;
        }
        return new BaseCounts(a, c, g, t, a + c + g + t, ambiguous, cpg);
    }

    /**
     * The Gardiner-Garden &amp; Frommer (1987) criteria for a CpG island: length at least 200 bp, GC fraction above
     * 0.5, observed/expected CpG above 0.6, compared exactly in integers. {@code length} is the stretch's length
     * in bases, ambiguous ones included.
     */
    public boolean meetsGardinerGardenFrommer(long length) {
        boolean gcAbove = 2 * (c + g) > unambiguous;
        boolean oeAbove = c > 0 && g > 0 && 10 * cpg * unambiguous > 6 * c * g;
        return length >= 200 && gcAbove && oeAbove;
    }

    /** Whether {@code printed} is (C+G)/L to three decimals; see {@link #isRoundedToThreeDecimals}. */
    public boolean gcPrintedAs(String printed) {
        return isRoundedToThreeDecimals(printed, c + g, unambiguous);
    }

    /** Whether {@code printed} is n(CpG) x L / (n(C) x n(G)) to three decimals. */
    public boolean cpgObservedExpectedPrintedAs(String printed) {
        return isRoundedToThreeDecimals(printed, Math.multiplyExact(cpg, unambiguous), Math.multiplyExact(c, g));
    }

    public boolean hasObservedExpected() {
        return c > 0 && g > 0;
    }

    public double gc() {
        return (double) (c + g) / unambiguous;
    }

    public double cpgObservedExpected() {
        return (double) cpg * unambiguous / ((double) c * g);
    }

    /**
     * Whether {@code printed} ("0.613") has exactly three decimals and lies within half a unit of the third decimal
     * of num/den, the bound included: a value exactly halfway may be rounded either way, since its binary floating
     * point neighbour decides which way a formatter goes.
     */
    static boolean isRoundedToThreeDecimals(String printed, long num, long den) {
        if (!printed.matches("[0-9]+\\.[0-9]{3}") || den <= 0) {
            return false;
        }
        long thousandths = Long.parseLong(printed.replace(".", ""));
        long diff = Math.abs(Math.subtractExact(Math.multiplyExact(thousandths, den), Math.multiplyExact(1000L, num)));
        return Math.multiplyExact(2L, diff) <= den;
    }
}
