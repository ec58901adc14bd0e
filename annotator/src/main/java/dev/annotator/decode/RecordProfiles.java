package dev.annotator.decode;

import dev.annotator.model.Label;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Joins the windows' {@link WindowProfile}s of one record, in window order, and adds what the bases give. */
final class RecordProfiles {
    private RecordProfiles() {
    }

    static RecordProfile join(ProfileOptions options, ReportedLabels labels, int trackLabel, byte[] bases,
                              List<WindowProfile> windows) {
        int n = bases.length;
        PosteriorTrack track = null;
        if (options.track()) {
            track = TrackPiece.join(windows.stream().map(w -> w.track).toList(), n);
        }
        Composition composition = null;
        long ambiguous = 0;
        int longestRun = 0;
        Map<String, Double> logOdds = null;
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
            if (options.composition()) {
                composition = tally.composition();
                ambiguous = tally.ambiguous();
                longestRun = (int) tally.longestAmbiguousRun();
            }
        }
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
