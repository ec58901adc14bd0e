package dev.annotator.conformance;

import java.util.List;
import java.util.Map;

/**
 * One feature line as {@link StrictGff3Reader} read it, every text column percent-decoded.
 *
 * @param line       1-based line number in the file
 * @param score      null for "."
 * @param phase      "0", "1", "2" or "."
 * @param attributes tag to its values, in file order (no attributes when column 9 is ".")
 */
public record ParsedFeature(int line, String seqid, String source, String type, long start, long end, Double score,
                            char strand, String phase, Map<String, List<String>> attributes) {

    /** The single value of {@code tag}, or null when the feature does not carry it. */
    public String attribute(String tag) {
        List<String> values = attributes.get(tag);
        if (values == null) {
            return null;
        }
        if (values.size() != 1) {
            throw new IllegalStateException("line " + line + ": " + tag + " has " + values.size() + " values");
        }
        return values.get(0);
    }

    public long length() {
        return end - start + 1;
    }
}
