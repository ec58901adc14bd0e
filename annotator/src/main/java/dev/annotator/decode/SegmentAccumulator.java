package dev.annotator.decode;

/**
 * Running statistics of one segment of one label as positions stream in (in any order): mean and minimum
 * posterior of the label, and the log-likelihood ratio of the bases under the label's states against the rest.
 *
 * <p>Per base, the label's emission probability is the posterior-weighted mean over its states (plain mean when
 * their posterior is 0), likewise for the other states; the segment's log-odds is the sum of the log ratios.
 * For a label with one state against one background state this is the classic log-likelihood ratio of two
 * Markov chains.
 */
final class SegmentAccumulator {
    private static final double LOG2 = Math.log(2);
    private final boolean[] inLabel;
    private double posteriorSum;
    private double posteriorMin = Double.POSITIVE_INFINITY;
    private double logOdds;
    private int count;

    SegmentAccumulator(boolean[] inLabel) {
        this.inLabel = inLabel;
    }

    void reset() {
        posteriorSum = 0;
        posteriorMin = Double.POSITIVE_INFINITY;
        logOdds = 0;
        count = 0;
    }

    /** The label's posterior at one base (the row at {@code off}): the sum over its states. */
    static double labelPosterior(boolean[] inLabel, double[] posterior, int off) {
        double p = 0;
        for (int s = 0; s < inLabel.length; s++) {
            if (inLabel[s]) {
                p += posterior[off + s];
            }
        }
        return p;
    }

    /** Adds the base whose posterior and emission rows start at {@code off}. */
    void add(double[] posterior, double[] emission, int off) {
        add(labelPosterior(inLabel, posterior, off), posterior, emission, off);
    }

    /** Joins the statistics of an adjacent piece of the same segment (a segment cut by a window boundary). */
    void merge(SegmentAccumulator other) {
        posteriorSum += other.posteriorSum;
        posteriorMin = Math.min(posteriorMin, other.posteriorMin);
        logOdds += other.logOdds;
        count += other.count;
    }

    void add(double labelPosterior, double[] posterior, double[] emission, int off) {
        add(labelPosterior, emissionRatio(inLabel, labelPosterior, posterior, emission, off));
    }

    /** Adds one base given its label posterior and its {@link #emissionRatio}. */
    void add(double labelPosterior, double ratio) {
        posteriorSum += labelPosterior;
        posteriorMin = Math.min(posteriorMin, labelPosterior);
        count++;
        if (ratio != 1) {
            logOdds += Math.log(ratio);
        }
    }

    /**
     * One base's likelihood ratio, the label's states against the others (each side's emission probability
     * weighted by its states' posterior); 1 (no evidence) when either side cannot emit the base.
     */
    static double emissionRatio(boolean[] inLabel, double labelPosterior, double[] posterior, double[] emission,
                                int off) {
        double inWeighted = 0;
        double inPlain = 0;
        int inCount = 0;
        double outWeighted = 0;
        double outPlain = 0;
        int outCount = 0;
        for (int s = 0; s < inLabel.length; s++) {
            double e = emission[off + s];
            if (inLabel[s]) {
                inWeighted += posterior[off + s] * e;
                inPlain += e;
                inCount++;
            } else {
                outWeighted += posterior[off + s] * e;
                outPlain += e;
                outCount++;
            }
        }
        double outPosterior = 1 - labelPosterior;
        if (labelPosterior > 0 && outPosterior > 0 && inWeighted > 0 && outWeighted > 0) {
            // (inWeighted / labelPosterior) / (outWeighted / outPosterior) with one division: this runs per base
            return (inWeighted * outPosterior) / (outWeighted * labelPosterior);
        }
        double eIn = labelPosterior > 0 ? inWeighted / labelPosterior : inPlain / inCount;
        double eOut = outPosterior > 0 && outWeighted > 0 ? outWeighted / outPosterior : outPlain / Math.max(1, outCount);
        return eIn > 0 && eOut > 0 ? eIn / eOut : 1;
    }

    Segment toSegment(String label, int start0, int endExclusive, Composition composition, GeneDetails gene) {
        return new Segment(label, start0 + 1, endExclusive, posteriorSum / count, posteriorMin, logOdds / LOG2,
                composition, gene);
    }
}
