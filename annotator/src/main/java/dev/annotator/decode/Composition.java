package dev.annotator.decode;

/**
 * Base composition of a segment, as used by CpG-island criteria (Gardiner-Garden &amp; Frommer 1987,
 * J Mol Biol 196:261).
 *
 * @param gc                  (C+G) / L over the segment's unambiguous bases
 * @param cpgObservedExpected n(CG) x L / (n(C) x n(G)); NaN when the segment has no C or no G
 */
public record Composition(double gc, double cpgObservedExpected) {
}
