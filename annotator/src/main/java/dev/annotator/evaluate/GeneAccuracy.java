package dev.annotator.evaluate;

/**
 * How well predicted features recover reference features, at two levels.
 *
 * <p>Base level: every base counts once per strand. A base-strand position is coding in the reference when a
 * reference feature on that strand covers it, and likewise for the predictions; {@code truePositives} are coding
 * in both, {@code falsePositives} only in the predictions, {@code falseNegatives} only in the reference and
 * {@code trueNegatives} in neither. From these come sensitivity, specificity in the sense used for gene finding
 * (the share of predicted coding positions that are right), and the approximate correlation of Burset and Guigo
 * (1996, Genomics 34:353-367).
 *
 * <p>Feature level (reference features counted once per distinct position and strand): exact matches share
 * both ends and the strand with a prediction; 3'-end matches share the strand and the downstream end (the end
 * for +, the start for -); missed reference features overlap no prediction on their strand; wrong predictions
 * overlap no reference feature on their strand.
 *
 * <p>A measure whose denominator is zero is NaN.
 */
public record GeneAccuracy(long truePositives, long falsePositives, long falseNegatives, long trueNegatives,
                           long truthFeatures, long predictedFeatures, long exactMatches, long threePrimeMatches,
                           long missedFeatures, long wrongFeatures) {

    public static final GeneAccuracy NONE = new GeneAccuracy(0, 0, 0, 0, 0, 0, 0, 0, 0, 0);

    public GeneAccuracy {
        if (truePositives < 0 || falsePositives < 0 || falseNegatives < 0 || trueNegatives < 0 || truthFeatures < 0
                || predictedFeatures < 0 || exactMatches < 0 || threePrimeMatches < 0 || missedFeatures < 0
                || wrongFeatures < 0) {
            throw new IllegalArgumentException("counts cannot be negative");
        }
        if (exactMatches > threePrimeMatches || threePrimeMatches > truthFeatures || missedFeatures > truthFeatures
                || wrongFeatures > predictedFeatures) {
            throw new IllegalArgumentException("inconsistent feature counts");
        }
    }

    /** TP / (TP + FN): the share of reference coding positions that are predicted. */
    public double sensitivity() {
        return ratio(truePositives, truePositives + falseNegatives);
    }

    /** TP / (TP + FP): the share of predicted coding positions that are coding in the reference. */
    public double specificity() {
        return ratio(truePositives, truePositives + falsePositives);
    }

    /**
     * AC = 2 (ACP - 0.5), where ACP is the mean of TP/(TP+FN), TP/(TP+FP), TN/(TN+FP) and TN/(TN+FN) over those
     * whose denominator is not zero (Burset and Guigo 1996); NaN when all four are undefined.
     */
    public double approximateCorrelation() {
        double sum = 0;
        int terms = 0;
        long[][] parts = {
                {truePositives, truePositives + falseNegatives},
                {truePositives, truePositives + falsePositives},
                {trueNegatives, trueNegatives + falsePositives},
                {trueNegatives, trueNegatives + falseNegatives}};
        for (long[] p : parts) {
            if (p[1] > 0) {
                sum += (double) p[0] / p[1];
                terms++;
            }
        }
        return terms == 0 ? Double.NaN : (sum / terms - 0.5) * 2;
    }

    /** Exact matches as a percentage of reference features. */
    public double exactPercent() {
        return percent(exactMatches, truthFeatures);
    }

    /** 3'-end matches as a percentage of reference features. */
    public double threePrimePercent() {
        return percent(threePrimeMatches, truthFeatures);
    }

    /** Missed reference features as a percentage of reference features. */
    public double missedPercent() {
        return percent(missedFeatures, truthFeatures);
    }

    /** Wrong predictions as a percentage of predicted features. */
    public double wrongPercent() {
        return percent(wrongFeatures, predictedFeatures);
    }

    /** Counts added; the measures of the sum are those of the pooled counts, not an average of measures. */
    public GeneAccuracy plus(GeneAccuracy o) {
        return new GeneAccuracy(truePositives + o.truePositives, falsePositives + o.falsePositives,
                falseNegatives + o.falseNegatives, trueNegatives + o.trueNegatives, truthFeatures + o.truthFeatures,
                predictedFeatures + o.predictedFeatures, exactMatches + o.exactMatches,
                threePrimeMatches + o.threePrimeMatches, missedFeatures + o.missedFeatures,
                wrongFeatures + o.wrongFeatures);
    }

    private static double ratio(long part, long whole) {
        return whole == 0 ? Double.NaN : (double) part / whole;
    }

    private static double percent(long part, long whole) {
        return whole == 0 ? Double.NaN : 100.0 * part / whole;
    }
}
