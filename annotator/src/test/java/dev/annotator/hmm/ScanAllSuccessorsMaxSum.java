package dev.annotator.hmm;

/**
 * Posterior-Viterbi's max-sum written the plain way, as the kernel did before its states were grouped by their
 * number of successors: every state in index order scans all of its successors, one back-pointer per state and
 * base. The reference the grouped pass must equal bit for bit (same tie rule, same shifts, same sums).
 */
final class ScanAllSuccessorsMaxSum {
    private ScanAllSuccessorsMaxSum() {
    }

    /**
     * @param posterior {@code [t * k + s]}
     * @param visitable where a state may be; same layout (the posteriors themselves, or the emissions)
     */
    static PosteriorPath decode(HmmParameters p, double[] posterior, double[] visitable, double tolerance) {
        int k = p.stateCount();
        int n = posterior.length / k;
        double minusInf = Double.NEGATIVE_INFINITY;
        byte[] next = new byte[n * k];
        double[] later = new double[k];
        double[] current = new double[k];
        double shift = 0;
        for (int t = n - 1; t >= 0; t--) {
            int row = t * k;
            double best = minusInf;
            for (int i = 0; i < k; i++) {
                double score = minusInf;
                int arg = 0;
                if (visitable[row + i] > 0) {
                    if (t == n - 1) {
                        score = posterior[row + i];
                    } else {
                        double bj = minusInf;
                        int found = -1;
                        for (int q = p.succOffset()[i]; q < p.succOffset()[i + 1]; q++) {
                            if (!(p.succProb()[q] > 0)) {
                                continue;
                            }
                            int j = p.succState()[q];
                            double cand = later[j];
                            if (cand > bj + tolerance || (found < 0 && cand > minusInf)) {
                                bj = cand;
                                found = j;
                            }
                        }
                        if (found >= 0) {
                            score = posterior[row + i] + bj;
                            arg = found;
                        }
                    }
                }
                current[i] = score;
                next[row + i] = (byte) arg;
                best = Math.max(best, score);
            }
            if (best == minusInf) {
                throw new ImpossibleSequenceException(t);
            }
            for (int i = 0; i < k; i++) {
                current[i] -= best;
            }
            shift += best;
            double[] swap = later;
            later = current;
            current = swap;
        }
        int first = -1;
        for (int i = 0; i < k; i++) {
            if (p.start(i) > 0 && later[i] > minusInf && (first < 0 || later[i] > later[first] + tolerance)) {
                first = i;
            }
        }
        if (first < 0) {
            throw new ImpossibleSequenceException(0);
        }
        byte[] path = new byte[n];
        path[0] = (byte) first;
        for (int t = 0; t + 1 < n; t++) {
            path[t + 1] = next[t * k + (path[t] & 0xFF)];
        }
        return new PosteriorPath(path, shift + later[first]);
    }
}
