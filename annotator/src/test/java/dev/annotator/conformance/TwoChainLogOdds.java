package dev.annotator.conformance;

import dev.annotator.model.State;

/**
 * The log2 likelihood ratio of a stretch of bases under two first-order Markov chains, the island chain against
 * the background chain: the discrimination score of Durbin, Eddy, Krogh &amp; Mitchison (1998), section 3.1
 * (recalled from memory). Written here from that definition and the contributor guide's rules for missing
 * observations, apart from the project's kernels: an ambiguity code emits with factor 1 in both chains (adds 0),
 * and a base with no unambiguous predecessor (first base of a record, or after an ambiguity code) uses the plain
 * average of the four rows of each table.
 */
final class TwoChainLogOdds {
    private final double[][] in = new double[5][4];
    private final double[][] out = new double[5][4];

    TwoChainLogOdds(State island, State background) {
        if (island.order() != 1 || background.order() != 1) {
            throw new IllegalArgumentException("both chains must be first order");
        }
        fill(in, island);
        fill(out, background);
    }

    /** Bits for {@code bases[start1 - 1 .. end1 - 1]} (1-based, closed), contexts taken from the whole record. */
    double bits(byte[] bases, long start1, long end1) {
        double sum = 0;
        for (int i = (int) start1 - 1; i < end1; i++) {
            int b = code(bases[i]);
            if (b < 0) {
                continue;
            }
            int row = i > 0 && code(bases[i - 1]) >= 0 ? code(bases[i - 1]) : 4;
            sum += Math.log(in[row][b] / out[row][b]);
        }
        return sum / Math.log(2);
    }

    /** Rows 0-3 by preceding base A, C, G, T; row 4 the average of the four. */
    private static void fill(double[][] table, State s) {
        for (int b = 0; b < 4; b++) {
            double average = 0;
            for (int previous = 0; previous < 4; previous++) {
                table[previous][b] = s.emission(previous, b);
                average += s.emission(previous, b);
            }
            table[4][b] = average / 4;
        }
    }

    private static int code(byte letter) {
        return switch (Character.toUpperCase((char) (letter & 0xFF))) {
            case 'A' -> 0;
            case 'C' -> 1;
            case 'G' -> 2;
            case 'T', 'U' -> 3;
            default -> -1;
        };
    }
}
