package dev.annotator.evaluate;

import dev.annotator.error.BadInputException;
import dev.annotator.labels.StrandedFeature;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Compares predicted stranded features with reference ones, record by record, at base and feature level (see
 * {@link GeneAccuracy} for the measures).
 *
 * <p>Records are those the reference declares or has features on, then those only the predictions have features
 * on. A record's length is the reference's, else the predictions', else its furthest feature end. Features are
 * taken once per distinct position and strand, so a CDS part listed under several mRNAs counts once; the
 * parts of a spliced CDS stay separate features.
 */
public final class GeneComparison {
    private GeneComparison() {
    }

    /**
     * @throws BadInputException the two files give a record different lengths, or a feature lies past its
     *                           record's end
     */
    public static Evaluation compare(FeatureSet truth, FeatureSet predicted) {
        Map<String, List<StrandedFeature>> truthBySeqid = bySeqid(truth.features());
        Map<String, List<StrandedFeature>> predictedBySeqid = bySeqid(predicted.features());
        Set<String> seqids = new LinkedHashSet<>(truth.recordLengths().keySet());
        seqids.addAll(truthBySeqid.keySet());
        seqids.addAll(predictedBySeqid.keySet());

        List<RecordAccuracy> records = new ArrayList<>();
        GeneAccuracy total = GeneAccuracy.NONE;
        for (String seqid : seqids) {
            List<StrandedFeature> t = truthBySeqid.getOrDefault(seqid, List.of());
            List<StrandedFeature> p = predictedBySeqid.getOrDefault(seqid, List.of());
            Long truthLength = truth.recordLengths().get(seqid);
            Long predictedLength = predicted.recordLengths().get(seqid);
            if (truthLength != null && predictedLength != null && !truthLength.equals(predictedLength)) {
                throw new BadInputException(predicted.name() + ": record " + seqid + ": length " + predictedLength
                        + " differs from length " + truthLength + " in " + truth.name());
            }
            LengthSource source;
            long length;
            if (truthLength != null) {
                source = LengthSource.TRUTH;
                length = truthLength;
            } else if (predictedLength != null) {
                source = LengthSource.PREDICTED;
                length = predictedLength;
            } else {
                source = LengthSource.FURTHEST_FEATURE;
                length = Math.max(furthestEnd(t), furthestEnd(p));
            }
            String lengthFrom = source == LengthSource.TRUTH ? truth.name() : predicted.name();
            requireWithin(t, length, truth.name(), seqid, lengthFrom);
            requireWithin(p, length, predicted.name(), seqid, lengthFrom);
            GeneAccuracy a = compareRecord(length, t, p);
            records.add(new RecordAccuracy(seqid, length, source, a));
            total = total.plus(a);
        }
        return new Evaluation(truth.name(), predicted.name(), records, total);
    }

    /**
     * Compares the features of one record (their seqids are not looked at).
     *
     * @param length the record length; every feature must end at or before it
     */
    public static GeneAccuracy compareRecord(long length, List<StrandedFeature> truth,
                                             List<StrandedFeature> predicted) {
        if (length < 1) {
            throw new IllegalArgumentException("record length must be positive, got " + length);
        }
        GeneAccuracy sum = GeneAccuracy.NONE;
        for (char strand : new char[]{'+', '-'}) {
            Set<Interval> t = onStrand(truth, strand, length);
            Set<Interval> p = onStrand(predicted, strand, length);
            sum = sum.plus(compareStrand(length, strand, t, p));
        }
        return sum;
    }

    private static GeneAccuracy compareStrand(long length, char strand, Set<Interval> truth, Set<Interval> predicted) {
        StrandCoverage t = StrandCoverage.of(new ArrayList<>(truth));
        StrandCoverage p = StrandCoverage.of(new ArrayList<>(predicted));
        long tp = t.sharedWith(p);
        long fn = t.covered() - tp;
        long fp = p.covered() - tp;
        long tn = length - tp - fn - fp;

        Set<Long> predictedStops = new HashSet<>();
        for (Interval i : predicted) {
            predictedStops.add(stopEnd(i, strand));
        }
        long exact = 0;
        long threePrime = 0;
        long missed = 0;
        for (Interval i : truth) {
            exact += predicted.contains(i) ? 1 : 0;
            threePrime += predictedStops.contains(stopEnd(i, strand)) ? 1 : 0;
            missed += p.overlaps(i.start(), i.end()) ? 0 : 1;
        }
        long wrong = 0;
        for (Interval i : predicted) {
            wrong += t.overlaps(i.start(), i.end()) ? 0 : 1;
        }
        return new GeneAccuracy(tp, fp, fn, tn, truth.size(), predicted.size(), exact, threePrime, missed, wrong);
    }

    /** The downstream end in the strand's direction of reading, where a CDS ends with its stop codon. */
    private static long stopEnd(Interval i, char strand) {
        return strand == '+' ? i.end() : i.start();
    }

    private static Set<Interval> onStrand(List<StrandedFeature> features, char strand, long length) {
        Set<Interval> out = new LinkedHashSet<>();
        for (StrandedFeature f : features) {
            if (f.end() > length) {
                throw new IllegalArgumentException("feature " + f + " ends past the record length " + length);
            }
            if (f.strand() == strand) {
                out.add(new Interval(f.start(), f.end()));
            }
        }
        return out;
    }

    private static Map<String, List<StrandedFeature>> bySeqid(List<StrandedFeature> features) {
        Map<String, List<StrandedFeature>> out = new LinkedHashMap<>();
        for (StrandedFeature f : features) {
            out.computeIfAbsent(f.seqid(), s -> new ArrayList<>()).add(f);
        }
        return out;
    }

    private static long furthestEnd(List<StrandedFeature> features) {
        long max = 0;
        for (StrandedFeature f : features) {
            max = Math.max(max, f.end());
        }
        return max;
    }

    private static void requireWithin(List<StrandedFeature> features, long length, String file, String seqid,
                                      String lengthFrom) {
        for (StrandedFeature f : features) {
            if (f.end() > length) {
                throw new BadInputException(file + ": record " + seqid + ": feature " + f.start() + ".." + f.end()
                        + " (" + f.strand() + ") ends past the record's length " + length + " (from " + lengthFrom
                        + ")");
            }
        }
    }
}
