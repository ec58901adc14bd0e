package dev.annotator.evaluate;

import dev.annotator.error.UsageException;
import dev.annotator.io.InputOpener;
import dev.annotator.labels.GenbankCds;

import java.io.InputStream;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A GenBank flat file as the reference: its simple CDS features (one interval each) and the LOCUS lengths. CDS in
 * several parts (joins) and partial ones are left out, as for training; {@link #skipped} says how many.
 */
public final class GenbankTruth implements TruthSource {
    private final InputStream stdin;
    private int skipped;

    public GenbankTruth(InputStream stdin) {
        this.stdin = stdin;
    }

    @Override
    public FeatureSet read(String pathOrDash, String featureType) {
        if (!"CDS".equals(featureType)) {
            throw new UsageException(InputOpener.displayName(pathOrDash) + ": a GenBank reference gives CDS features "
                    + "only, not " + featureType);
        }
        GenbankCds cds = GenbankCds.read(pathOrDash, stdin);
        skipped = cds.total() - cds.simple().size();
        Map<String, Long> lengths = new LinkedHashMap<>();
        cds.recordLengths().forEach((k, v) -> lengths.put(k, v.longValue()));
        return new FeatureSet(InputOpener.displayName(pathOrDash), cds.simple(), lengths);
    }

    /** CDS of the last file read that are not compared (joined, partial or other). */
    public int skipped() {
        return skipped;
    }
}
