package dev.annotator.decode;

/** A called run before composition and filtering: label index, 0-based start, exclusive end, statistics. */
record RawSegment(int label, int start0, int endExclusive, SegmentAccumulator stats) {
    int length() {
        return endExclusive - start0;
    }
}
