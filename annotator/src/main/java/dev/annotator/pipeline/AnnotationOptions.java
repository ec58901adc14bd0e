package dev.annotator.pipeline;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.decode.GeneStarts;
import dev.annotator.decode.ProfileOptions;

/**
 * How to annotate.
 *
 * @param method    posterior (default) or Viterbi decoding
 * @param minLength segments shorter than this are dropped
 * @param threads   records decoded at once; output order and bytes do not depend on it
 * @param idPrefix  put before every feature ID (for shards of one genome annotated separately); may be empty
 * @param profile   per-record products beside the segments (tracks, summary, report)
 * @param starts    where genes of a gene model start
 */
public record AnnotationOptions(DecodeMethod method, int minLength, int threads, String idPrefix,
                                ProfileOptions profile, GeneStarts starts) {
    public AnnotationOptions(DecodeMethod method, int minLength, int threads, String idPrefix,
                             ProfileOptions profile) {
        this(method, minLength, threads, idPrefix, profile, GeneStarts.LIKELIEST_START);
    }

    public AnnotationOptions(DecodeMethod method, int minLength, int threads) {
        this(method, minLength, threads, "");
    }

    public AnnotationOptions(DecodeMethod method, int minLength, int threads, String idPrefix) {
        this(method, minLength, threads, idPrefix, ProfileOptions.NONE);
    }

    public AnnotationOptions {
        if (profile == null) {
            throw new IllegalArgumentException("profile must not be null");
        }
        if (starts == null) {
            throw new IllegalArgumentException("starts must not be null");
        }
        if (idPrefix == null) {
            throw new IllegalArgumentException("idPrefix must not be null");
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1");
        }
        if (minLength < 0) {
            throw new IllegalArgumentException("min-length must not be negative");
        }
    }
}
