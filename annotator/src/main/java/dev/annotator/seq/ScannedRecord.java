package dev.annotator.seq;

/**
 * What {@link FastaLineScanner} saw of one record, from its header line up to the next header or the end.
 *
 * @param name           the header's first word
 * @param description    the rest of the header, trimmed; may be empty
 * @param headerText     the header as BioJava reports it (after '>', trailing whitespace removed), for the
 *                       cross-check that both parsers are looking at the same record
 * @param asciiHeader    whether the header is plain ASCII (only then is {@code headerText} comparable,
 *                       since BioJava decodes with the platform charset)
 * @param line           1-based line number of the header
 * @param bases          number of sequence bytes, whitespace excluded
 * @param interiorBlanks whether some sequence line has a space or tab between bases (BioJava keeps those)
 */
record ScannedRecord(String name, String description, String headerText, boolean asciiHeader, long line,
                     long bases, boolean interiorBlanks) {
}
