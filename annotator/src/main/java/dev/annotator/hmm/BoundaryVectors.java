package dev.annotator.hmm;

/**
 * Forward and backward vectors at a cut inside a long sequence, found from a limited stretch of sequence beside
 * the cut instead of from the whole record, with a certificate that the limit did not matter.
 *
 * <p>The forward vector at base c-1 is a positive linear function of the forward vector at any earlier base w-1;
 * normalised, it is therefore a convex combination of the vectors obtained by starting at w-1 from each single
 * state. When those candidates agree within {@link #TOLERANCE}, the true vector agrees with them too, whatever
 * the bases before w were. If they do not agree, the stretch is lengthened (x4) until they do or the record's
 * end is reached, where the computation is exact. The backward vector is handled the same way from the right.
 * A candidate that cannot emit the stretch at all (probability 0) carries no weight and is skipped.
 */
public final class BoundaryVectors {
    /** Largest difference allowed between candidate normalised vectors. */
    public static final double TOLERANCE = 1e-12;
    /** First stretch tried beside a cut. */
    public static final int INITIAL_MARGIN = 1 << 14;

    private BoundaryVectors() {
    }

    /** Normalised forward vector of base {@code cut - 1}; {@code cut} must be positive. */
    public static double[] forwardBefore(ForwardBackward fb, byte[] seq, int cut) {
        int k = fb.stateCount();
        for (long margin = INITIAL_MARGIN; ; margin *= 4) {
            int from = (int) Math.max(0, cut - margin);
            if (from == 0) {
                return fb.forwardVector(seq, 0, cut, null);
            }
            double[][] candidates = new double[k][];
            for (int s = 0; s < k; s++) {
                try {
                    candidates[s] = fb.forwardVector(seq, from, cut, unit(k, s));
                } catch (ImpossibleSequenceException | IllegalArgumentException impossible) {
                    candidates[s] = null;
                }
            }
            double[] agreed = agreed(candidates);
            if (agreed != null) {
                return agreed;
            }
        }
    }

    /** Normalised backward vector of base {@code position}, which must not be the record's last base. */
    public static double[] backwardAt(ForwardBackward fb, byte[] seq, int position) {
        int n = seq.length;
        int k = fb.stateCount();
        for (long margin = INITIAL_MARGIN; ; margin *= 4) {
            int to = (int) Math.min(n, position + 1 + margin);
            if (to == n) {
                return fb.backwardVector(seq, position, n, null);
            }
            double[][] candidates = new double[k][];
            for (int s = 0; s < k; s++) {
                try {
                    candidates[s] = fb.backwardVector(seq, position, to, unit(k, s));
                } catch (IllegalArgumentException impossible) {
                    candidates[s] = null;
                }
            }
            double[] agreed = agreed(candidates);
            if (agreed != null) {
                return agreed;
            }
        }
    }

    /** The first candidate if every possible candidate is within the tolerance of it, else null. */
    private static double[] agreed(double[][] candidates) {
        double[] first = null;
        for (double[] c : candidates) {
            if (c == null) {
                continue;
            }
            if (first == null) {
                first = c;
                continue;
            }
            for (int s = 0; s < c.length; s++) {
                if (Math.abs(c[s] - first[s]) > TOLERANCE) {
                    return null;
                }
            }
        }
        return first;
    }

    private static double[] unit(int k, int s) {
        double[] v = new double[k];
        v[s] = 1.0;
        return v;
    }
}
