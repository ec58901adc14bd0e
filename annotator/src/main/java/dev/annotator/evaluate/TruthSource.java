package dev.annotator.evaluate;

/**
 * Where reference features come from: a reader of one annotation format. GFF3 is {@link StrandedGff3Reader}; any
 * other format plugs in as a function of the same shape.
 */
@FunctionalInterface
public interface TruthSource {
    /**
     * Reads the features of one type, with the record lengths the file states.
     *
     * @param pathOrDash  a file (plain or gzip) or "-" for {@code stdin}
     * @param featureType the feature type to keep, such as {@code CDS}
     * @throws dev.annotator.error.AnnotatorException missing file (66), malformed data (65), read failure (74)
     */
    FeatureSet read(String pathOrDash, String featureType);
}
