package dev.annotator.seq;

import java.util.List;

/**
 * One GenBank record: its sequence and its feature table's locations.
 *
 * @param sequence  the bases, named by the record's seqid (see {@link GenbankRecordReader})
 * @param locusName the name on the LOCUS line (may differ from the seqid)
 * @param circular  the LOCUS line says the molecule is circular
 * @param features  every feature of the table in file order, qualifiers dropped
 */
public record GenbankEntry(SequenceRecord sequence, String locusName, boolean circular,
                           List<FeatureLocation> features) {
    public GenbankEntry {
        features = List.copyOf(features);
    }

    /** The features with the given key, such as "CDS", in file order. */
    public List<FeatureLocation> featuresOf(String key) {
        return features.stream().filter(f -> f.key().equals(key)).toList();
    }
}
