package dev.annotator.evaluate;

/** Where the length of a record, and so its count of true-negative positions, came from. */
public enum LengthSource {
    /** The reference file declares it. */
    TRUTH("truth"),
    /** Only the predictions file declares it. */
    PREDICTED("predicted"),
    /** Neither file declares it: the furthest feature end stands in, so true negatives may be undercounted. */
    FURTHEST_FEATURE("furthest_feature");

    private final String key;

    LengthSource(String key) {
        this.key = key;
    }

    /** The name used in machine-readable output. */
    public String key() {
        return key;
    }
}
