package dev.annotator.pipeline;

/**
 * How far a run has got.
 *
 * @param basesDone      bases decoded so far
 * @param basesTotal     bases in the whole input: exact once the input is read to its end, before that an
 *                       estimate from the share of the file read so far; -1 when unknown (standard input)
 * @param totalIsFinal   whether basesTotal is exact
 * @param seconds        time since the run started
 */
public record ProgressSnapshot(long basesDone, long basesTotal, boolean totalIsFinal, double seconds) {

    public double megabasesPerSecond() {
        return seconds > 0 ? basesDone / seconds / 1e6 : 0;
    }

    /** Seconds left at the current rate, or -1 when unknown. */
    public double secondsLeft() {
        if (basesTotal < 0 || basesDone <= 0) {
            return -1;
        }
        return Math.max(0, (basesTotal - basesDone) * seconds / basesDone);
    }
}
