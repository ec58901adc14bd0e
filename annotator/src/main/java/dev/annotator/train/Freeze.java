package dev.annotator.train;

/** Which part of a model training leaves as it is. */
public enum Freeze {
    /** Train everything. */
    NONE,
    /** Keep the start distribution and the transitions; train the emissions. */
    TRANSITIONS,
    /** Keep the emissions; train the start distribution and the transitions. */
    EMISSIONS;

    boolean trainsTransitions() {
        return this != TRANSITIONS;
    }

    boolean trainsEmissions() {
        return this != EMISSIONS;
    }
}
