package dev.annotator.evaluate;

import dev.annotator.labels.StrandedFeature;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The stranded features of one type read from one annotation file, with the record lengths the file states.
 *
 * @param name          the file as named in messages
 * @param features      in file order; a feature split over several lines (a spliced CDS) is one entry per part
 * @param recordLengths length of each record the file declares, in file order; records it does not declare are
 *                      absent (their length is then taken from the other file or from the features)
 */
public record FeatureSet(String name, List<StrandedFeature> features, Map<String, Long> recordLengths) {
    public FeatureSet {
        features = List.copyOf(features);
        recordLengths = Collections.unmodifiableMap(new LinkedHashMap<>(recordLengths));
    }
}
