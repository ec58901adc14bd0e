package dev.annotator.pipeline;

/** Shows progress somewhere (a terminal bar, a log line); called from one background thread. */
public interface ProgressReporter {
    /** How often {@link #report} wants to be called. */
    long intervalMillis();

    void report(ProgressSnapshot snapshot);

    /** The run ended (successfully or not); release the display. */
    void finish(ProgressSnapshot snapshot);
}
