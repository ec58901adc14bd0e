package dev.annotator.decode;

import java.util.Map;

/**
 * What {@link ProfileOptions} asked to collect for one record; parts not asked for are null.
 *
 * @param trackLabel          the label the track and the plot follow
 * @param track               the label's posterior along the record
 * @param composition         GC and CpG o/e of the record's unambiguous bases
 * @param ambiguousBases      bases that are N or another IUPAC ambiguity code
 * @param longestAmbiguousRun longest run of such bases
 * @param logOddsBitsPerBase  per reported label: the record's log2 likelihood ratio, the label's states against
 *                            the others, divided by its length (insertion order = the model's label order)
 * @param plot                the binned posterior and GC for drawing
 */
public record RecordProfile(String trackLabel, PosteriorTrack track, Composition composition, long ambiguousBases,
                            int longestAmbiguousRun, Map<String, Double> logOddsBitsPerBase, PosteriorPlot plot) {
}
