package dev.annotator.decode;

/** How segments are called from the model. */
public enum DecodeMethod {
    /** Maximal runs where the posterior of a reported label exceeds 0.5. */
    POSTERIOR,
    /** Runs of a reported label along the single most probable state path. */
    VITERBI
}
