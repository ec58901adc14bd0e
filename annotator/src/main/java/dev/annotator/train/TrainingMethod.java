package dev.annotator.train;

import dev.annotator.model.Training;

import java.util.Locale;

/** How a model is fitted: counting along known labels, or Baum-Welch (expectation-maximisation). */
public enum TrainingMethod {
    /**
     * Maximum-likelihood counts along the labelled state path: one state per label, or a gene model whose
     * labelled genes fix the path.
     */
    COUNTING(Training.COUNTING),
    /** Baum-Welch iterations, with labels restricting each base to its label's states when given. */
    BAUM_WELCH(Training.BAUM_WELCH);

    private final String word;

    TrainingMethod(String word) {
        this.word = word;
    }

    /** The spelling on the command line and in model files. */
    public String word() {
        return word;
    }

    /** The method of that spelling (case-insensitive), or null. */
    public static TrainingMethod of(String word) {
        String w = word.toLowerCase(Locale.ROOT);
        for (TrainingMethod m : values()) {
            if (m.word.equals(w)) {
                return m;
            }
        }
        return null;
    }
}
