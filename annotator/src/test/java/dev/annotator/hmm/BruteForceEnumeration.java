package dev.annotator.hmm;

import dev.annotator.seq.BaseCode;

/**
 * Reference values by enumerating every state path: exponential, for sequences of a few bases only. It
 * evaluates the model's definition directly (start x emissions x transitions along a path), so it shares no
 * recursion with the kernels under test.
 */
final class BruteForceEnumeration {
    final double likelihood;
    final double[][] posterior;
    final int[] bestPath;
    final double bestProbability;

    BruteForceEnumeration(HmmParameters p, byte[] seq) {
        int n = seq.length;
        int k = p.stateCount();
        posterior = new double[n][k];
        int[] path = new int[n];
        long total = (long) Math.pow(k, n);
        double sum = 0;
        double best = -1;
        int[] bestSoFar = new int[n];
        for (long code = 0; code < total; code++) {
            long c = code;
            for (int t = n - 1; t >= 0; t--) {
                path[t] = (int) (c % k);
                c /= k;
            }
            double joint = joint(p, seq, path);
            sum += joint;
            for (int t = 0; t < n; t++) {
                posterior[t][path[t]] += joint;
            }
            if (joint > best) {
                best = joint;
                bestSoFar = path.clone();
            }
        }
        for (int t = 0; t < n; t++) {
            for (int s = 0; s < k; s++) {
                posterior[t][s] /= sum;
            }
        }
        likelihood = sum;
        bestPath = bestSoFar;
        bestProbability = best;
    }

    /** P(path, seq); see {@link #logJoint}. */
    static double joint(HmmParameters p, byte[] seq, int[] path) {
        return Math.exp(logJoint(p, seq, path));
    }

    /**
     * ln P(path, seq) by the model's definition: start, then per base its transition and emission; a missing base
     * emits with probability 1, and a context uses only the clean bases since the last missing one (DEVELOPERS.md,
     * "Kernels"), read through the reduced tables {@link HmmParameters#emission} exposes.
     */
    static double logJoint(HmmParameters p, byte[] seq, int[] path) {
        double log = Math.log(p.start(path[0]));
        for (int t = 0; t < seq.length; t++) {
            if (t > 0) {
                log += Math.log(p.transition(path[t - 1], path[t]));
            }
            int base = BaseCode.of(seq[t]);
            if (base == BaseCode.MISSING) {
                continue;
            }
            int s = path[t];
            int j = 0;
            int context = 0;
            int weight = 1;
            while (j < p.order(s) && t - j - 1 >= 0 && BaseCode.of(seq[t - j - 1]) != BaseCode.MISSING) {
                context += BaseCode.of(seq[t - j - 1]) * weight;
                weight *= 4;
                j++;
            }
            log += Math.log(p.emission(s, j, context, base));
        }
        return log;
    }
}
