package dev.annotator.decode;

/**
 * What to collect per record beside the segments (all off by default, so plain annotation pays nothing).
 *
 * @param trackLabel  the reported label whose posterior the track and the plot follow; null for the first one
 * @param trackStep   the track's bin in bases: 1 gives per-base values run-length merged at 3 decimals, larger
 *                    bins give the mean posterior of each bin (bins at multiples of the step, from 0)
 * @param track       collect the posterior track
 * @param composition collect the record's GC, CpG o/e and ambiguous bases
 * @param plotPoints  when positive, the posterior's maximum and mean and the GC fraction in about this many bins
 * @param logOdds     collect each reported label's log-odds per base over the whole record (a pass over every
 *                    base's emissions, so only when asked for)
 * @param plotted     how many records, the first in input order, get the plot bins (a report draws only so many;
 *                    later records get everything else)
 */
public record ProfileOptions(String trackLabel, int trackStep, boolean track, boolean composition, int plotPoints,
                             boolean logOdds, int plotted) {
    /** Nothing beyond the segments. */
    public static final ProfileOptions NONE = new ProfileOptions(null, 1, false, false, 0, false);

    /** With the plot bins, when asked for, for every record. */
    public ProfileOptions(String trackLabel, int trackStep, boolean track, boolean composition, int plotPoints,
                          boolean logOdds) {
        this(trackLabel, trackStep, track, composition, plotPoints, logOdds, Integer.MAX_VALUE);
    }

    /** With the log-odds collected whenever the composition is. */
    public ProfileOptions(String trackLabel, int trackStep, boolean track, boolean composition, int plotPoints) {
        this(trackLabel, trackStep, track, composition, plotPoints, composition);
    }

    public ProfileOptions {
        if (trackStep < 1) {
            throw new IllegalArgumentException("track step must be at least 1");
        }
        if (plotPoints < 0) {
            throw new IllegalArgumentException("plot points must not be negative");
        }
        if (plotted < 0) {
            throw new IllegalArgumentException("plotted records must not be negative");
        }
    }

    /** Whether records from the {@code plotted + 1}-th on need options of their own ({@link #withoutPlot}). */
    public boolean plotsSomeRecordsOnly() {
        return plotPoints > 0 && plotted < Integer.MAX_VALUE;
    }

    /** The same without the plot bins: what records past the plotted ones get. */
    public ProfileOptions withoutPlot() {
        return new ProfileOptions(trackLabel, trackStep, track, composition, 0, logOdds, plotted);
    }

    boolean any() {
        return track || composition || plotPoints > 0 || logOdds;
    }
}
