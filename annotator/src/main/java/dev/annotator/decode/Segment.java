package dev.annotator.decode;

/**
 * A called segment of one reported label, in GFF3 coordinates (1-based, both ends included).
 *
 * @param label         the label's name in the model
 * @param start         first base, 1-based
 * @param end           last base, 1-based, inclusive
 * @param meanPosterior mean posterior probability of the label over the segment (the confidence)
 * @param minPosterior  lowest posterior of the label inside the segment
 * @param logOddsBits   log2 likelihood ratio of the segment's bases under the label's states against the other
 *                      states
 * @param composition   for labels marked {@code composition}, else null
 * @param gene          for labels with a strand (genes), else null
 */
public record Segment(String label, int start, int end, double meanPosterior, double minPosterior,
                      double logOddsBits, Composition composition, GeneDetails gene) {

    public Segment(String label, int start, int end, double meanPosterior, double minPosterior, double logOddsBits,
                   Composition composition) {
        this(label, start, end, meanPosterior, minPosterior, logOddsBits, composition, null);
    }

    public int length() {
        return end - start + 1;
    }
}
