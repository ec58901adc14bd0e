package dev.annotator.hmm;

/**
 * The posterior-Viterbi optimum by the definition of Fariselli, Martelli and Casadio (2005, BMC Bioinformatics
 * 6(Suppl 4):S12): over every state path that is valid (first state with start probability above zero, every
 * transition above zero, every state's posterior above zero at its position), the largest sum of posteriors.
 * Posteriors come from {@link BruteForceEnumeration}, so nothing here shares code with the kernel under test.
 * Exponential: a few bases only.
 */
final class PosteriorPathEnumeration {
    final double[][] posterior;
    final double likelihood;
    /** Lexicographically first valid path of largest posterior sum (ties within 1e-12), or null if none. */
    final int[] bestPath;
    final double bestSum;
    final int validPaths;

    PosteriorPathEnumeration(HmmParameters p, byte[] seq) {
        BruteForceEnumeration truth = new BruteForceEnumeration(p, seq);
        this.posterior = truth.posterior;
        this.likelihood = truth.likelihood;
        int n = seq.length;
        int k = p.stateCount();
        int[] path = new int[n];
        long total = (long) Math.pow(k, n);
        double best = Double.NEGATIVE_INFINITY;
        int[] bestSoFar = null;
        int valid = 0;
        for (long code = 0; code < total && likelihood > 0; code++) {
            long c = code;
            for (int t = n - 1; t >= 0; t--) {
                path[t] = (int) (c % k);
                c /= k;
            }
            if (!isValid(p, posterior, path)) {
                continue;
            }
            valid++;
            double sum = sum(posterior, path);
            if (sum > best + 1e-12) {
                best = sum;
                bestSoFar = path.clone();
            }
        }
        this.bestPath = bestSoFar;
        this.bestSum = best;
        this.validPaths = valid;
    }

    /** Validity exactly as Fariselli et al. 2005 define the allowed paths of posterior-Viterbi decoding. */
    static boolean isValid(HmmParameters p, double[][] posterior, int[] path) {
        if (!(p.start(path[0]) > 0)) {
            return false;
        }
        for (int t = 0; t < path.length; t++) {
            if (!(posterior[t][path[t]] > 0)) {
                return false;
            }
            if (t > 0 && !(p.transition(path[t - 1], path[t]) > 0)) {
                return false;
            }
        }
        return true;
    }

    static double sum(double[][] posterior, int[] path) {
        double sum = 0;
        for (int t = 0; t < path.length; t++) {
            sum += posterior[t][path[t]];
        }
        return sum;
    }

    /** The state of largest posterior at each position on its own (lowest index on ties). */
    int[] perPositionMaximum() {
        int[] out = new int[posterior.length];
        for (int t = 0; t < posterior.length; t++) {
            for (int s = 1; s < posterior[t].length; s++) {
                if (posterior[t][s] > posterior[t][out[t]]) {
                    out[t] = s;
                }
            }
        }
        return out;
    }

    /** Row-major copy of the posteriors, the layout {@link PosteriorViterbi#decode(double[])} takes. */
    double[] flatPosterior() {
        int k = posterior.length == 0 ? 0 : posterior[0].length;
        double[] out = new double[posterior.length * k];
        for (int t = 0; t < posterior.length; t++) {
            System.arraycopy(posterior[t], 0, out, t * k, k);
        }
        return out;
    }
}
