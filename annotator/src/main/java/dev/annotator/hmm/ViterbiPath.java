package dev.annotator.hmm;

/**
 * The most probable state path, one byte per base (states are numbered in model-file order, at most 256).
 *
 * @param path           state index per position, read unsigned ({@code path[t] & 0xFF})
 * @param logProbability natural log of the joint probability P(path, sequence)
 */
public record ViterbiPath(byte[] path, double logProbability) {

    /** The path as ints (a copy; for small inputs and tests). */
    public int[] states() {
        int[] out = new int[path.length];
        for (int t = 0; t < path.length; t++) {
            out[t] = path[t] & 0xFF;
        }
        return out;
    }
}
