package dev.annotator.pipeline;

import dev.annotator.decode.DecodeMethod;

/**
 * How to annotate.
 *
 * @param method    posterior (default) or Viterbi decoding
 * @param minLength segments shorter than this are dropped
 * @param threads   records decoded at once; output order and bytes do not depend on it
 */
public record AnnotationOptions(DecodeMethod method, int minLength, int threads) {
    public AnnotationOptions {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1");
        }
        if (minLength < 0) {
            throw new IllegalArgumentException("min-length must not be negative");
        }
    }
}
