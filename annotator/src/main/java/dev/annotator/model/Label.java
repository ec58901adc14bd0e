package dev.annotator.model;

/**
 * What a group of states means. Reported labels become GFF3 features of {@code featureType} (a Sequence
 * Ontology term name) with accession {@code soAccession}; exactly one label of a model is the background,
 * which is never reported.
 *
 * @param composition whether segments of this label carry the composition attributes {@code gc} and
 *                    {@code cpg_oe} (meant for island-type labels)
 * @param strand      {@code '+'} or {@code '-'} for a label whose states read one strand (a gene on the forward
 *                    or the reverse strand); {@code '.'} for a label without a strand
 * @param minLength   segments of this label shorter than this many bases are not reported (0: all are)
 */
public record Label(String name, String featureType, String soAccession, boolean background, boolean composition,
                    char strand, int minLength) {

    public Label {
        if (strand != '.' && strand != '+' && strand != '-') {
            throw new IllegalArgumentException("strand must be '+', '-' or '.', got " + strand);
        }
        if (minLength < 0) {
            throw new IllegalArgumentException("min length must not be negative, got " + minLength);
        }
    }

    /** A label reporting segments of any length. */
    public Label(String name, String featureType, String soAccession, boolean background, boolean composition,
                 char strand) {
        this(name, featureType, soAccession, background, composition, strand, 0);
    }

    /** A label without a strand. */
    public Label(String name, String featureType, String soAccession, boolean background, boolean composition) {
        this(name, featureType, soAccession, background, composition, '.');
    }

    /** Whether the label reads one strand (its segments are genes on that strand). */
    public boolean stranded() {
        return strand != '.';
    }
}
