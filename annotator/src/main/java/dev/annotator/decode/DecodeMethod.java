package dev.annotator.decode;

/** How segments are called from the model. */
public enum DecodeMethod {
    /** Maximal runs where the posterior of a reported label exceeds 0.5. */
    POSTERIOR,
    /** Runs of a reported label along the single most probable state path. */
    VITERBI,
    /**
     * Runs of a reported label along the allowed state path with the largest sum of state posteriors (Fariselli,
     * Martelli &amp; Casadio 2005): posterior decoding that keeps the topology's structure, for models whose
     * labels have more than one state.
     */
    POSTERIOR_VITERBI;

    /** The method for a model when none is asked for: posterior-Viterbi when some label has several states. */
    public static DecodeMethod defaultFor(dev.annotator.model.HmmModel model) {
        java.util.Map<String, Integer> statesPerLabel = new java.util.HashMap<>();
        for (var s : model.states()) {
            if (statesPerLabel.merge(s.label(), 1, Integer::sum) > 1) {
                return POSTERIOR_VITERBI;
            }
        }
        return POSTERIOR;
    }
}
