package dev.annotator.hmm;

/**
 * One direction of a model's sparse transitions (each state's predecessors, or each state's successors) laid out
 * for the sparse forward and backward recursions: every state gets the same number of slots (the width, 1 to 4;
 * a zero-probability slot reads state 0), and the terms of a state with more than that many continue in an
 * overflow list. The recursions then run one loop over the states with a fixed number of terms each and no inner
 * loop, except for the few states that overflow: a gene topology mixes long chains of states with one
 * predecessor with a few states that have a dozen (every upstream position can follow a stop codon), which
 * neither a loop over each state's list nor slots for the largest fan suit.
 *
 * <p>Each state's terms are added in its list's order, the first product first, as the plain loop
 * {@code s = 0; s += w[i] * p[i]} does (a padded term adds an exact 0), so results are the same bit for bit.
 * Immutable.
 */
final class TransitionGroups {
    static final int MAX_WIDTH = 4;

    private final int stateCount;
    private final int width;
    private final int[] slot;
    private final double[] slotProb;
    /** Terms past the width of state s at {@code [overflowOffset[s], overflowOffset[s + 1])}; null if none. */
    private final int[] overflowOffset;
    private final int[] overflowIndex;
    private final double[] overflowProb;

    /**
     * @param offset the terms of state s at {@code [offset[s], offset[s + 1])} of {@code other} (the state at
     *               the other end of the transition) and {@code p} (its probability)
     */
    TransitionGroups(int[] offset, int[] other, double[] p) {
        this(offset, other, p, widthFor(offset));
    }

    TransitionGroups(int[] offset, int[] other, double[] p, int width) {
        if (width < 1 || width > MAX_WIDTH) {
            throw new IllegalArgumentException("width " + width);
        }
        int k = offset.length - 1;
        this.stateCount = k;
        this.width = width;
        this.slot = new int[k * width];
        this.slotProb = new double[k * width];
        int overflow = 0;
        for (int s = 0; s < k; s++) {
            int lo = offset[s];
            int fan = offset[s + 1] - lo;
            int inSlots = Math.min(fan, width);
            System.arraycopy(other, lo, slot, s * width, inSlots);
            System.arraycopy(p, lo, slotProb, s * width, inSlots);
            overflow += fan - inSlots;
        }
        if (overflow == 0) {
            overflowOffset = null;
            overflowIndex = null;
            overflowProb = null;
            return;
        }
        overflowOffset = new int[k + 1];
        overflowIndex = new int[overflow];
        overflowProb = new double[overflow];
        int fill = 0;
        for (int s = 0; s < k; s++) {
            for (int q = offset[s] + width; q < offset[s + 1]; q++) {
                overflowIndex[fill] = other[q];
                overflowProb[fill++] = p[q];
            }
            overflowOffset[s + 1] = fill;
        }
    }

    /**
     * Slots for the largest fan when that is at most {@value #MAX_WIDTH} (no state then loops); otherwise one slot
     * and the rest as overflow. Measured on the gene model's strand views, whose largest fans are 5 and 16 and
     * most states have one or two: padding every state to 2 or 4 slots was slower than one slot with overflow,
     * the zero terms costing more than the inner loop they save.
     */
    static int widthFor(int[] offset) {
        int maxFan = 1;
        for (int s = 0; s + 1 < offset.length; s++) {
            maxFan = Math.max(maxFan, offset[s + 1] - offset[s]);
        }
        return maxFan <= MAX_WIDTH ? maxFan : 1;
    }

    int width() {
        return width;
    }

    /**
     * {@code out[outOff + s] = (sum over the terms of s of in[inOff + other] * p) * scale[scaleOff + s]} for
     * every state s, in state order; {@code scale} null multiplies by nothing.
     *
     * @return the sum of the values written, added in state order
     */
    double gather(double[] in, int inOff, double[] out, int outOff, double[] scale, int scaleOff) {
        return switch (width) {
            case 1 -> gather1(in, inOff, out, outOff, scale, scaleOff);
            case 2 -> gather2(in, inOff, out, outOff, scale, scaleOff);
            case 3 -> gather3(in, inOff, out, outOff, scale, scaleOff);
            default -> gather4(in, inOff, out, outOff, scale, scaleOff);
        };
    }

    private double gather1(double[] in, int inOff, double[] out, int outOff, double[] scale, int scaleOff) {
        final int[] ix = slot;
        final double[] pr = slotProb;
        final int[] oo = overflowOffset;
        double sum = 0;
        for (int s = 0; s < stateCount; s++) {
            double v = in[inOff + ix[s]] * pr[s];
            if (oo != null) {
                v = overflow(v, s, in, inOff);
            }
            if (scale != null) {
                v *= scale[scaleOff + s];
            }
            out[outOff + s] = v;
            sum += v;
        }
        return sum;
    }

    private double gather2(double[] in, int inOff, double[] out, int outOff, double[] scale, int scaleOff) {
        final int[] ix = slot;
        final double[] pr = slotProb;
        final int[] oo = overflowOffset;
        double sum = 0;
        for (int s = 0, b = 0; s < stateCount; s++, b += 2) {
            double v = in[inOff + ix[b]] * pr[b] + in[inOff + ix[b + 1]] * pr[b + 1];
            if (oo != null) {
                v = overflow(v, s, in, inOff);
            }
            if (scale != null) {
                v *= scale[scaleOff + s];
            }
            out[outOff + s] = v;
            sum += v;
        }
        return sum;
    }

    private double gather3(double[] in, int inOff, double[] out, int outOff, double[] scale, int scaleOff) {
        final int[] ix = slot;
        final double[] pr = slotProb;
        final int[] oo = overflowOffset;
        double sum = 0;
        for (int s = 0, b = 0; s < stateCount; s++, b += 3) {
            double v = in[inOff + ix[b]] * pr[b] + in[inOff + ix[b + 1]] * pr[b + 1]
                    + in[inOff + ix[b + 2]] * pr[b + 2];
            if (oo != null) {
                v = overflow(v, s, in, inOff);
            }
            if (scale != null) {
                v *= scale[scaleOff + s];
            }
            out[outOff + s] = v;
            sum += v;
        }
        return sum;
    }

    private double gather4(double[] in, int inOff, double[] out, int outOff, double[] scale, int scaleOff) {
        final int[] ix = slot;
        final double[] pr = slotProb;
        final int[] oo = overflowOffset;
        double sum = 0;
        for (int s = 0, b = 0; s < stateCount; s++, b += 4) {
            double v = in[inOff + ix[b]] * pr[b] + in[inOff + ix[b + 1]] * pr[b + 1]
                    + in[inOff + ix[b + 2]] * pr[b + 2] + in[inOff + ix[b + 3]] * pr[b + 3];
            if (oo != null) {
                v = overflow(v, s, in, inOff);
            }
            if (scale != null) {
                v *= scale[scaleOff + s];
            }
            out[outOff + s] = v;
            sum += v;
        }
        return sum;
    }

    /** {@code v} plus the terms of state s past the slots, in order. */
    private double overflow(double v, int s, double[] in, int inOff) {
        final int[] oi = overflowIndex;
        final double[] op = overflowProb;
        for (int q = overflowOffset[s], end = overflowOffset[s + 1]; q < end; q++) {
            v += in[inOff + oi[q]] * op[q];
        }
        return v;
    }
}
