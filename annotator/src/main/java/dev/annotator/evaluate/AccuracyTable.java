package dev.annotator.evaluate;

import java.io.IOException;
import java.io.Writer;
import java.util.Locale;

/**
 * Writes an {@link Evaluation} as text for reading: the inputs, then a base-level and a feature-level table,
 * each with one row per record and a total row. Undefined measures (zero denominators) show as "-".
 */
public final class AccuracyTable {
    private static final String ESTIMATED = "*";

    private AccuracyTable() {
    }

    public static void write(Evaluation e, String featureType, Writer out) throws IOException {
        out.write("truth:      " + e.truthName() + "\n");
        out.write("predicted:  " + e.predictedName() + "\n");
        out.write("type:       " + featureType + "\n");
        out.write("\nBase level (each base counted once per strand):\n");
        AlignedColumns bases = new AlignedColumns("record", "length", "TP", "FP", "FN", "TN", "Sn", "Sp", "AC");
        for (RecordAccuracy r : e.records()) {
            String length = r.length() + (r.lengthSource() == LengthSource.FURTHEST_FEATURE ? ESTIMATED : "");
            bases.row(baseCells(r.seqid(), length, r.accuracy()));
        }
        bases.rule();
        bases.row(baseCells("total", e.totalLength() + (e.anyLengthEstimated() ? ESTIMATED : ""), e.total()));
        bases.write(out);
        if (e.anyLengthEstimated()) {
            out.write(ESTIMATED + " length given in neither file: taken as the furthest feature end, so TN may be "
                    + "too low\n");
        }

        out.write("\nFeature level (" + featureType + " features; exact, 3'end and missed as % of truth, wrong as % "
                + "of predicted):\n");
        AlignedColumns features = new AlignedColumns("record", "truth", "predicted", "exact", "exact%", "3'end",
                "3'end%", "missed", "missed%", "wrong", "wrong%");
        for (RecordAccuracy r : e.records()) {
            features.row(featureCells(r.seqid(), r.accuracy()));
        }
        features.rule();
        features.row(featureCells("total", e.total()));
        features.write(out);
    }

    private static String[] baseCells(String name, String length, GeneAccuracy a) {
        return new String[]{name, length, Long.toString(a.truePositives()), Long.toString(a.falsePositives()),
                Long.toString(a.falseNegatives()), Long.toString(a.trueNegatives()), fraction(a.sensitivity()),
                fraction(a.specificity()), fraction(a.approximateCorrelation())};
    }

    private static String[] featureCells(String name, GeneAccuracy a) {
        return new String[]{name, Long.toString(a.truthFeatures()), Long.toString(a.predictedFeatures()),
                Long.toString(a.exactMatches()), percent(a.exactPercent()), Long.toString(a.threePrimeMatches()),
                percent(a.threePrimePercent()), Long.toString(a.missedFeatures()), percent(a.missedPercent()),
                Long.toString(a.wrongFeatures()), percent(a.wrongPercent())};
    }

    private static String fraction(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.4f", v);
    }

    private static String percent(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.1f", v);
    }
}
