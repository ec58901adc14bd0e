package dev.annotator.io;

/**
 * Sees the raw bytes of an input as they are read (compressed bytes for gzip), for progress and checksums taken
 * in the same pass as the parsing.
 */
@FunctionalInterface
public interface RawInputObserver {
    void consumed(byte[] bytes, int offset, int length);

    /** Both observers, in this order. */
    default RawInputObserver andThen(RawInputObserver next) {
        return (b, off, len) -> {
            consumed(b, off, len);
            next.consumed(b, off, len);
        };
    }
}
