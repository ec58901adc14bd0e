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
        // each window counted on its own: bins*200 bases at most, for records of under 200 x plot points bases
        float[] gc = new float[bins];
        for (int b = 0; b < bins; b++) {
            int centre = Math.min(n, b * bin + bin / 2);
            int from = Math.max(0, centre - MIN_GC_WINDOW / 2);
            int to = Math.min(n, from + MIN_GC_WINDOW);
            from = Math.max(0, to - MIN_GC_WINDOW);
            long packed = BaseTally.packedCounts(bases, from, to);
            long strong = BaseTally.c(packed) + BaseTally.g(packed);
            long clean = BaseTally.a(packed) + strong + BaseTally.t(packed);
            gc[b] = clean == 0 ? Float.NaN : (float) strong / clean;
        }
        return gc;
    }

    /** What the bases alone give a record's profile: composition, ambiguous bases, and the plot's GC per bin. */
    record BaseProfile(Composition composition, long ambiguous, int longestRun, float[] gc) {
    }

    /**
     * What the bases [start, end) of a record give its profile, to be joined in order with the pieces beside it
     * ({@link #bases(ProfileOptions, byte[], List)}): their tally, and the unambiguous and G/C bases in each plot
     * bin they touch. Each decoding window counts its own stretch, so the pass over the bases is shared out among
     * the threads like the decoding.
     */
    record BasePiece(BaseTally tally, int firstBin, int[] clean, int[] gc) {
    }

    static BasePiece basePiece(ProfileOptions options, byte[] bases, int start, int end) {
        int n = bases.length;
        BaseTally tally = BaseTally.startingAt(bases, start);
        boolean plotting = options.plotPoints() > 0 && end > start;
        if (!plotting) {
            if (options.composition()) {
                tally.add(bases, start, end);
            }
            return new BasePiece(tally, 0, new int[0], new int[0]);
        }
        int bin = PosteriorPlot.binSize(n, options.plotPoints());
        if (bin < MIN_GC_WINDOW) {
            // the plot's GC then comes from windows around the bins (windowedGc), not from the bins' own counts,
            // which in bins of a few bases would cost a call per few bases
            tally.add(bases, start, end);
            return new BasePiece(tally, 0, new int[0], new int[0]);
        }
        int firstBin = start / bin;
        int bins = (end - 1) / bin - firstBin + 1;
        int[] clean = new int[bins];
        int[] gc = new int[bins];
        // one pass over the bases: each bin's counts are the differences between the running counts
        for (int b = 0; b < bins; b++) {
            long gcBefore = tally.gcCount();
            long cleanBefore = tally.unambiguous();
            int from = Math.max(start, (firstBin + b) * bin);
            int to = (int) Math.min(end, (long) (firstBin + b + 1) * bin);
            tally.add(bases, from, to);
            clean[b] = (int) (tally.unambiguous() - cleanBefore);
            gc[b] = (int) (tally.gcCount() - gcBefore);
        }
        return new BasePiece(tally, firstBin, clean, gc);
    }

    /** The profile's part from the bases, counted in one piece. */
    static BaseProfile bases(ProfileOptions options, byte[] bases) {
        return bases(options, bases, List.of(basePiece(options, bases, 0, bases.length)));
    }

    /** The profile's part from the bases, joined from pieces that cover the record in order. */
    static BaseProfile bases(ProfileOptions options, byte[] bases, List<BasePiece> pieces) {
        int n = bases.length;
        boolean plotting = options.plotPoints() > 0 && n > 0;
        int bin = plotting ? PosteriorPlot.binSize(n, options.plotPoints()) : 0;
        int bins = plotting ? (n - 1) / bin + 1 : 0;
        BaseTally tally = new BaseTally();
        long[] clean = new long[bins];
        long[] gcCount = new long[bins];
        for (BasePiece piece : pieces) {
            tally.append(piece.tally());
            for (int b = 0; b < piece.clean().length; b++) {
                clean[piece.firstBin() + b] += piece.clean()[b];
                gcCount[piece.firstBin() + b] += piece.gc()[b];
            }
        }
        float[] gc = new float[bins];
        if (plotting && bin < MIN_GC_WINDOW) {
            gc = windowedGc(bases, bin, bins);
        } else {
            for (int b = 0; b < bins; b++) {
                gc[b] = clean[b] == 0 ? Float.NaN : (float) ((double) gcCount[b] / clean[b]);
            }
        }
        if (!options.composition()) {
            return new BaseProfile(null, 0, 0, gc);
        }
        return new BaseProfile(tally.composition(), tally.ambiguous(), (int) tally.longestAmbiguousRun(), gc);
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
