package dev.annotator.hmm;

import dev.annotator.seq.BaseCode;

/**
 * Expected counts by enumerating every state path: each path's joint probability (start x emissions x
 * transitions, from the model's definition, as in {@link BruteForceEnumeration}) weighs its starts, transitions
 * and emissions. A base emitted under a reduced-order context is credited to the full-order contexts it is
 * compatible with, in proportion to their probability of the base: the posterior of the unseen older bases, which
 * the model's reduced table treats as equally likely. Shares no recursion with the kernel under test.
 */
final class BruteForceCounts {
    final double logLikelihood;
    final double[] start;
    final double[][] transition;
    final double[][] emission;

    /**
     * @param stateClass null, or a class per state
     * @param baseClass  null, or a class per base (-1: any state); paths through a state of another class count 0
     */
    BruteForceCounts(HmmParameters p, byte[] seq, int[] stateClass, byte[] baseClass) {
        int n = seq.length;
        int k = p.stateCount();
        start = new double[k];
        transition = new double[k][k];
        emission = new double[k][];
        for (int s = 0; s < k; s++) {
            emission[s] = new double[4 << (2 * p.order(s))];
        }
        int[] path = new int[n];
        long total = (long) Math.pow(k, n);
        double sum = 0;
        for (long code = 0; code < total; code++) {
            long c = code;
            for (int t = n - 1; t >= 0; t--) {
                path[t] = (int) (c % k);
                c /= k;
            }
            if (!allowed(path, stateClass, baseClass)) {
                continue;
            }
            double joint = BruteForceEnumeration.joint(p, seq, path);
            if (joint == 0) {
                continue;
            }
            sum += joint;
            start[path[0]] += joint;
            for (int t = 1; t < n; t++) {
                transition[path[t - 1]][path[t]] += joint;
            }
            for (int t = 0; t < n; t++) {
                creditEmission(p, seq, t, path[t], joint);
            }
        }
        for (int s = 0; s < k; s++) {
            start[s] /= sum;
            for (int j = 0; j < k; j++) {
                transition[s][j] /= sum;
            }
            for (int i = 0; i < emission[s].length; i++) {
                emission[s][i] /= sum;
            }
        }
        logLikelihood = Math.log(sum);
    }

    private static boolean allowed(int[] path, int[] stateClass, byte[] baseClass) {
        if (baseClass == null) {
            return true;
        }
        for (int t = 0; t < path.length; t++) {
            if (baseClass[t] >= 0 && stateClass[path[t]] != baseClass[t]) {
                return false;
            }
        }
        return true;
    }

    private void creditEmission(HmmParameters p, byte[] seq, int t, int s, double weight) {
        int base = BaseCode.of(seq[t]);
        if (base == BaseCode.MISSING) {
            return;
        }
        int k = p.order(s);
        int j = 0;
        int context = 0;
        int w = 1;
        while (j < k && t - j - 1 >= 0 && BaseCode.of(seq[t - j - 1]) != BaseCode.MISSING) {
            context += BaseCode.of(seq[t - j - 1]) * w;
            w *= 4;
            j++;
        }
        // full contexts whose newest j bases are the seen ones: the unseen k - j older bases take every value
        int seenRows = 1 << (2 * j);
        int unseen = 1 << (2 * (k - j));
        double norm = 0;
        for (int older = 0; older < unseen; older++) {
            norm += p.emission(s, k, older * seenRows + context, base);
        }
        for (int older = 0; older < unseen; older++) {
            int full = older * seenRows + context;
            emission[s][full * 4 + base] += weight * p.emission(s, k, full, base) / norm;
        }
    }
}
