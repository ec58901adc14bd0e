package dev.annotator.cli;

/** The research-use caution shown in every command's help. */
final class Caution {
    static final String TEXT = "Caution: predictions are computational and need experimental confirmation; "
            + "annotator is a research tool, not for clinical or diagnostic decisions.";

    private Caution() {
    }
}
