package dev.annotator.evaluate;

import dev.annotator.error.UsageException;
import dev.annotator.io.InputOpener;
import dev.annotator.labels.GenbankCds;

import java.io.InputStream;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A GenBank flat file as the reference: its simple CDS features (one interval each) and the LOCUS lengths. CDS in
 * several parts (joins: spliced, trans-spliced or frame-shifted genes) are left out, as for training, unless
 * {@code withParts}, when each part becomes a feature of its own (so the bases of spliced genes count as coding;
 * no unspliced prediction can match such a part exactly). Partial CDS are always left out; {@link #skipped} says
 * how many CDS were.
 */
public final class GenbankTruth implements TruthSource {
    private final InputStream stdin;
    private final boolean withParts;
    private int skipped;

    public GenbankTruth(InputStream stdin) {
        this(stdin, false);
    }

    public GenbankTruth(InputStream stdin, boolean withParts) {
        this.stdin = stdin;
        this.withParts = withParts;
    }

    @Override
    public FeatureSet read(String pathOrDash, String featureType) {
        if (!"CDS".equals(featureType)) {
            throw new UsageException(InputOpener.displayName(pathOrDash) + ": a GenBank reference gives CDS features "
                    + "only, not " + featureType);
        }
        GenbankCds cds = GenbankCds.read(pathOrDash, stdin);
        java.util.List<dev.annotator.labels.StrandedFeature> features = new java.util.ArrayList<>(cds.simple());
        if (withParts) {
            cds.multiPart().forEach(features::addAll);
        }
        skipped = cds.total() - cds.simple().size() - (withParts ? cds.multiPart().size() : 0);
        Map<String, Long> lengths = new LinkedHashMap<>();
        cds.recordLengths().forEach((k, v) -> lengths.put(k, v.longValue()));
        return new FeatureSet(InputOpener.displayName(pathOrDash), features, lengths);
    }

    /** CDS of the last file read that are not compared (joined, partial or other). */
    public int skipped() {
        return skipped;
    }
}
