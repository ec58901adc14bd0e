package dev.annotator.train;

/**
 * Who wrote a trained model, how and when, for its provenance.
 *
 * @param tool    program and version, e.g. "annotator 0.1.0"
 * @param command the command line, without options that cannot change the result
 * @param date    ISO-8601 UTC time, e.g. "2026-12-01T10:15:30Z"
 */
public record RunStamp(String tool, String command, String date) {
}
