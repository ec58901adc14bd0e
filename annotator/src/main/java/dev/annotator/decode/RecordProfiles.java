package dev.annotator.decode;

import dev.annotator.model.Label;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Joins the windows' {@link WindowProfile}s of one record, in window order, and adds what the bases give. */
final class RecordProfiles {
    /**
     * Shortest stretch a plotted GC value is taken over: on short records the plot bins hold a few bases, and the
     * GC of 3 bases jumps between 0, 1/3, 2/3 and 1. 200 bp is the length over which island criteria judge GC
     * (Gardiner-Garden &amp; Frommer 1987).
     */
    static final int MIN_GC_WINDOW = 200;

    private RecordProfiles() {
    }

    /** GC of a {@link #MIN_GC_WINDOW}-base window centred on each bin (clipped at the record's ends). */
    private static float[] windowedGc(byte[] bases, int bin, int bins) {
        int n = bases.length;
        // prefix counts of unambiguous and of G/C bases; only for short records (bins under 200 bp), so small
        int[] clean = new int[n + 1];
        int[] gcCount = new int[n + 1];
        for (int i = 0; i < n; i++) {
            int code = dev.annotator.seq.BaseCode.of(bases[i]);
            boolean unambiguous = code >= 0 && code < 4;
            clean[i + 1] = clean[i] + (unambiguous ? 1 : 0);
            gcCount[i + 1] = gcCount[i] + (code == 1 || code == 2 ? 1 : 0);
        }
        float[] gc = new float[bins];
        for (int b = 0; b < bins; b++) {
            int centre = Math.min(n, b * bin + bin / 2);
            int from = Math.max(0, centre - MIN_GC_WINDOW / 2);
            int to = Math.min(n, from + MIN_GC_WINDOW);
            from = Math.max(0, to - MIN_GC_WINDOW);
            int c = clean[to] - clean[from];
            gc[b] = c == 0 ? Float.NaN : (float) (gcCount[to] - gcCount[from]) / c;
        }
        return gc;
    }

    /** What the bases alone give a record's profile: composition, ambiguous bases, and the plot's GC per bin. */
    record BaseProfile(Composition composition, long ambiguous, int longestRun, float[] gc) {
    }

    /**
     * The part of a profile that needs only the bases, so it can be computed while the record is decoded.
     */
    static BaseProfile bases(ProfileOptions options, byte[] bases) {
        int n = bases.length;
        Composition composition = null;
        long ambiguous = 0;
        int longestRun = 0;
        boolean plotting = options.plotPoints() > 0 && n > 0;
        int bin = plotting ? PosteriorPlot.binSize(n, options.plotPoints()) : 0;
        int bins = plotting ? (n - 1) / bin + 1 : 0;
        float[] gc = new float[bins];
        if (options.composition() || plotting) {
            // one pass over the bases: the record's composition, and each bin's GC from the running counts
            BaseTally tally = new BaseTally();
            if (plotting) {
                for (int b = 0; b < bins; b++) {
                    long gcBefore = tally.gcCount();
                    long basesBefore = tally.unambiguous();
                    tally.add(bases, b * bin, Math.min(n, (b + 1) * bin));
                    long clean = tally.unambiguous() - basesBefore;
                    gc[b] = clean == 0 ? Float.NaN : (float) ((double) (tally.gcCount() - gcBefore) / clean);
                }
            } else {
                tally.add(bases, 0, n);
            }
            if (plotting && bin < MIN_GC_WINDOW) {
                gc = windowedGc(bases, bin, bins);
            }
            if (options.composition()) {
                composition = tally.composition();
                ambiguous = tally.ambiguous();
                longestRun = (int) tally.longestAmbiguousRun();
            }
        }
        return new BaseProfile(composition, ambiguous, longestRun, gc);
    }

    static RecordProfile join(ProfileOptions options, ReportedLabels labels, int trackLabel, byte[] bases,
                              List<WindowProfile> windows) {
        return join(options, labels, trackLabel, bases, windows, bases(options, bases));
    }

    static RecordProfile join(ProfileOptions options, ReportedLabels labels, int trackLabel, byte[] bases,
                              List<WindowProfile> windows, BaseProfile fromBases) {
        int n = bases.length;
        PosteriorTrack track = null;
        if (options.track()) {
            track = TrackPiece.join(windows.stream().map(w -> w.track).toList(), n);
        }
        Composition composition = fromBases.composition();
        long ambiguous = fromBases.ambiguous();
        int longestRun = fromBases.longestRun();
        Map<String, Double> logOdds = null;
        boolean plotting = options.plotPoints() > 0 && n > 0;
        int bin = plotting ? PosteriorPlot.binSize(n, options.plotPoints()) : 0;
        int bins = plotting ? (n - 1) / bin + 1 : 0;
        float[] gc = fromBases.gc();
        if (options.logOdds()) {
            logOdds = new LinkedHashMap<>();
            for (int r = 0; r < labels.size(); r++) {
                double total = 0;
                for (WindowProfile w : windows) {
                    total += w.logRatio(r);
                }
                logOdds.put(labels.labels().get(r).name(), n == 0 ? Double.NaN : total / Math.log(2) / n);
            }
        }
        PosteriorPlot plot = null;
        if (plotting) {
            float[] max = new float[bins];
            double[] sum = new double[bins];
            for (WindowProfile w : windows) {
                for (int b = 0; b < w.max.length; b++) {
                    max[w.firstBin + b] = Math.max(max[w.firstBin + b], w.max[b]);
                    sum[w.firstBin + b] += w.sum[b];
                }
            }
            float[] mean = new float[bins];
            for (int b = 0; b < bins; b++) {
                int from = b * bin;
                int to = Math.min(n, from + bin);
                mean[b] = (float) (sum[b] / (to - from));
            }
            plot = new PosteriorPlot(bin, max, mean, gc);
        }
        Label label = labels.labels().get(trackLabel);
        return new RecordProfile(label.name(), track, composition, ambiguous, longestRun, logOdds, plot);
    }
}
