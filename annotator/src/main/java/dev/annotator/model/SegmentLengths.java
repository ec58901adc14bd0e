package dev.annotator.model;

import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Expected segment length per label implied by a model's transitions.
 *
 * <p>For the states Q of a label, the expected number of steps spent in Q after entering it at state q is
 * row q of the fundamental matrix N = (I - T_QQ)^-1 summed. Entering states are weighted by the long-run flow
 * into Q, sum over i outside Q of w_i T_iq, where w is the long-run share of time in each state when started
 * from the start distribution; this makes the number the average length of a label's segments in a long
 * sequence. A label that is not re-entered in the long run is weighted by the start distribution inside Q,
 * failing that by the plain sum of transitions into Q. If some state that can be entered cannot leave Q at all,
 * the length is infinite.
 */
final class SegmentLengths {
    private static final int MAX_SQUARINGS = 64;

    private SegmentLengths() {
    }

    /** Label name to expected length in bases, in label order; {@code Double.POSITIVE_INFINITY} when unbounded. */
    static Map<String, Double> compute(HmmModel model) {
        int k = model.stateCount();
        double[][] t = new double[k][k];
        for (Transition tr : model.transitions()) {
            t[model.stateIndex(tr.from())][model.stateIndex(tr.to())] += tr.probability();
        }
        double[] start = model.start();
        double[] w = longRunOccupancy(start, t);
        int[] stateLabel = model.stateLabels();
        Map<String, Double> out = new LinkedHashMap<>();
        for (int l = 0; l < model.labels().size(); l++) {
            boolean[] inQ = new boolean[k];
            for (int s = 0; s < k; s++) {
                inQ[s] = stateLabel[s] == l;
            }
            out.put(model.labels().get(l).name(), expectedLength(entryDistribution(inQ, t, w, start), inQ, t));
        }
        return out;
    }

    private static double[] entryDistribution(boolean[] inQ, double[][] t, double[] w, double[] start) {
        int k = inQ.length;
        double[] longRun = new double[k];
        double[] atStart = new double[k];
        double[] plain = new double[k];
        for (int q = 0; q < k; q++) {
            if (!inQ[q]) {
                continue;
            }
            atStart[q] = start[q];
            for (int i = 0; i < k; i++) {
                if (!inQ[i]) {
                    longRun[q] += w[i] * t[i][q];
                    plain[q] += t[i][q];
                }
            }
        }
        for (double[] candidate : List.of(longRun, atStart, plain)) {
            double sum = 0;
            for (double v : candidate) {
                sum += v;
            }
            if (sum > 0) {
                for (int q = 0; q < k; q++) {
                    candidate[q] /= sum;
                }
                return candidate;
            }
        }
        return plain; // Q is never entered: a validated model has no such label
    }

    private static double expectedLength(double[] entry, boolean[] inQ, double[][] t) {
        int k = inQ.length;
        // states of Q reachable from the entry states without leaving Q
        boolean[] reach = new boolean[k];
        Deque<Integer> queue = new ArrayDeque<>();
        for (int q = 0; q < k; q++) {
            if (entry[q] > 0) {
                reach[q] = true;
                queue.add(q);
            }
        }
        if (queue.isEmpty()) {
            return Double.NaN;
        }
        while (!queue.isEmpty()) {
            int i = queue.poll();
            for (int j = 0; j < k; j++) {
                if (inQ[j] && !reach[j] && t[i][j] > 0) {
                    reach[j] = true;
                    queue.add(j);
                }
            }
        }
        // which of them can get out of Q: backwards from the states with a transition leaving Q
        boolean[] exits = new boolean[k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k && reach[i] && !exits[i]; j++) {
                exits[i] = !inQ[j] && t[i][j] > 0;
            }
            if (exits[i]) {
                queue.add(i);
            }
        }
        while (!queue.isEmpty()) {
            int j = queue.poll();
            for (int i = 0; i < k; i++) {
                if (reach[i] && !exits[i] && t[i][j] > 0) {
                    exits[i] = true;
                    queue.add(i);
                }
            }
        }
        List<Integer> r = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            if (reach[i]) {
                if (!exits[i]) {
                    return Double.POSITIVE_INFINITY;
                }
                r.add(i);
            }
        }
        // every state of R can leave, so I - T_RR is invertible; expected steps from each state = N * 1
        int n = r.size();
        RealMatrix m = MatrixUtils.createRealIdentityMatrix(n);
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                m.addToEntry(a, b, -t[r.get(a)][r.get(b)]);
            }
        }
        RealVector steps = new LUDecomposition(m).getSolver().solve(new ArrayRealVector(n, 1.0));
        double length = 0;
        for (int a = 0; a < n; a++) {
            length += entry[r.get(a)] * steps.getEntry(a);
        }
        return length;
    }

    /**
     * Long-run share of time per state when started from {@code start}: the limit of start * P^n for the lazy
     * chain P = (I + T) / 2, which has the same long-run shares as T but no periodic states, so its powers
     * converge; repeated squaring reaches P^(2^64) in 64 multiplications. Rows are renormalised after each
     * squaring so rounding cannot drift them away from summing to 1.
     */
    static double[] longRunOccupancy(double[] start, double[][] t) {
        int k = start.length;
        double[][] p = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                p[i][j] = t[i][j] / 2 + (i == j ? 0.5 : 0);
            }
        }
        for (int round = 0; round < MAX_SQUARINGS; round++) {
            double[][] sq = new double[k][k];
            double change = 0;
            for (int i = 0; i < k; i++) {
                double rowSum = 0;
                for (int m = 0; m < k; m++) {
                    double pim = p[i][m];
                    if (pim != 0) {
                        for (int j = 0; j < k; j++) {
                            sq[i][j] += pim * p[m][j];
                        }
                    }
                }
                for (int j = 0; j < k; j++) {
                    rowSum += sq[i][j];
                }
                for (int j = 0; j < k; j++) {
                    sq[i][j] /= rowSum;
                    change = Math.max(change, Math.abs(sq[i][j] - p[i][j]));
                }
            }
            p = sq;
            if (change < 1e-15) {
                break;
            }
        }
        double[] w = new double[k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                w[j] += start[i] * p[i][j];
            }
        }
        return w;
    }
}
