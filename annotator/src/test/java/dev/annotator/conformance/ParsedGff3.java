package dev.annotator.conformance;

import java.util.List;
import java.util.Map;

/**
 * A GFF3 file that passed {@link StrictGff3Reader}.
 *
 * @param version  the version of the {@code ##gff-version} line ("3" or "3.x" or "3.x.y")
 * @param regions  decoded seqid to its {@code ##sequence-region}, in file order
 * @param features the feature lines in file order
 */
public record ParsedGff3(String version, Map<String, Region> regions, List<ParsedFeature> features) {

    /** A {@code ##sequence-region seqid start end} directive. */
    public record Region(int line, String seqid, long start, long end) {
    }
}
