package dev.annotator.seq;

/**
 * One entry of a GenBank feature table as written: its key and its location text, not yet interpreted.
 * Interpreting locations belongs to whoever needs features (labels, evaluation); reading sequences does not
 * depend on them, so a location that cannot be understood never stops a sequence from being read.
 *
 * @param key      the feature key, such as {@code CDS} or {@code gene}
 * @param location the location with its continuation lines joined and blanks removed, e.g. {@code complement(3..41)}
 * @param line     the 1-based line of the feature key, for messages
 */
public record FeatureLocation(String key, String location, long line) {
}
