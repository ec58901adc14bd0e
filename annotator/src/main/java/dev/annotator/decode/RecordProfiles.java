package dev.annotator.decode;

import dev.annotator.model.Label;
import dev.annotator.seq.BaseCode;

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
        if (options.composition()) {
            composition = CompositionCounter.of(bases, 0, n);
            int run = 0;
            for (byte b : bases) {
                int code = BaseCode.of(b);
                if (code >= 0 && code < 4) {
                    run = 0;
                } else {
                    ambiguous++;
                    run++;
                    longestRun = Math.max(longestRun, run);
                }
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
        if (options.plotPoints() > 0 && n > 0) {
            int bin = PosteriorPlot.binSize(n, options.plotPoints());
            int bins = (n - 1) / bin + 1;
            float[] max = new float[bins];
            double[] sum = new double[bins];
            for (WindowProfile w : windows) {
                for (int b = 0; b < w.max.length; b++) {
                    max[w.firstBin + b] = Math.max(max[w.firstBin + b], w.max[b]);
                    sum[w.firstBin + b] += w.sum[b];
                }
            }
            float[] mean = new float[bins];
            float[] gc = new float[bins];
            for (int b = 0; b < bins; b++) {
                int from = b * bin;
                int to = Math.min(n, from + bin);
                mean[b] = (float) (sum[b] / (to - from));
                gc[b] = (float) CompositionCounter.of(bases, from, to).gc();
            }
            plot = new PosteriorPlot(bin, max, mean, gc);
        }
        Label label = labels.labels().get(trackLabel);
        return new RecordProfile(label.name(), track, composition, ambiguous, longestRun, logOdds, plot);
    }
}
