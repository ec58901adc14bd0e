package dev.annotator.model;

/**
 * Names emission rows by their context: the k preceding bases as a string over A, C, G, T. Row index =
 * context read as a base-4 number, oldest base (leftmost) most significant, matching {@link State}.
 */
public final class EmissionContexts {
    private static final String BASES = "ACGT";

    private EmissionContexts() {
    }

    /** Number of contexts (rows) of an order-k table: 4^k. */
    public static int count(int order) {
        if (order < 0 || order > ModelValidator.MAX_ORDER) {
            throw new IllegalArgumentException("order " + order + " outside 0.." + ModelValidator.MAX_ORDER);
        }
        return 1 << (2 * order);
    }

    /** The context string of a row, e.g. row 1 of order 2 is "AC". */
    public static String name(int row, int order) {
        char[] out = new char[order];
        for (int i = order - 1; i >= 0; i--) {
            out[i] = BASES.charAt(row & 3);
            row >>>= 2;
        }
        return new String(out);
    }

    /** The row of a context string, or -1 when it is not a string of A, C, G, T (upper case). */
    public static int row(String context) {
        if (context.length() > ModelValidator.MAX_ORDER) {
            return -1;
        }
        int row = 0;
        for (int i = 0; i < context.length(); i++) {
            int b = BASES.indexOf(context.charAt(i));
            if (b < 0) {
                return -1;
            }
            row = row * 4 + b;
        }
        return row;
    }
}
