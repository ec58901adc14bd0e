package dev.annotator.model;

/**
 * What a group of states means. Reported labels become GFF3 features of {@code featureType} (a Sequence
 * Ontology term name) with accession {@code soAccession}; exactly one label of a model is the background,
 * which is never reported.
 *
 * @param composition whether segments of this label carry the composition attributes {@code gc} and
 *                    {@code cpg_oe} (meant for island-type labels)
 */
public record Label(String name, String featureType, String soAccession, boolean background, boolean composition) {
}
