package dev.annotator.gff;

import java.util.List;
import java.util.Map;

/**
 * One GFF3 feature line before escaping. Coordinates are 1-based and closed, as in the specification.
 *
 * @param score      printed with 3 decimals, or "." when null
 * @param strand     '+', '-', '.' or '?'
 * @param phase      "0", "1", "2" or "." (CDS features need a phase)
 * @param attributes tag/value pairs in print order; values are unescaped, the writer percent-encodes them.
 *                   A tag with several values is given as one entry whose values are joined by the writer with ','
 */
public record Gff3Feature(String seqid, String source, String type, long start, long end, Double score,
                          char strand, String phase, List<Map.Entry<String, List<String>>> attributes) {
    public Gff3Feature {
        attributes = List.copyOf(attributes);
    }
}
