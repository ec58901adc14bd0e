package dev.annotator.hmm;

/**
 * The valid state path of largest summed posterior, one byte per base. A separate record from {@link ViterbiPath}
 * because its score is not a probability: it is a sum of per-position posteriors, between 0 and the length.
 *
 * @param path         state index per position, read unsigned ({@code path[t] & 0xFF})
 * @param posteriorSum sum over positions t of P(state path[t] at t | sequence)
 */
public record PosteriorPath(byte[] path, double posteriorSum) {

    /** The path as ints (a copy; for small inputs and tests). */
    public int[] states() {
        int[] out = new int[path.length];
        for (int t = 0; t < path.length; t++) {
            out[t] = path[t] & 0xFF;
        }
        return out;
    }
}
