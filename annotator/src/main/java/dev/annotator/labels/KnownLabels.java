package dev.annotator.labels;

import dev.annotator.error.BadInputException;
import dev.annotator.model.HmmModel;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * The label of every base, as a labels file gives it: bases inside a feature of a label's type get that label,
 * all other bases the model's background label. Features of the same label may overlap; features of different
 * labels may not (a base has one label). Immutable.
 */
public final class KnownLabels {
    /** Labels are stored one byte per base, so a model used with labels may have at most this many. */
    public static final int MAX_LABELS = Byte.MAX_VALUE;

    private final String fileName;
    private final String[] labelNames;
    private final int background;
    private final Map<String, List<LabelledInterval>> bySeqid;
    private final Map<String, List<LabelledInterval>> excluded;

    KnownLabels(String fileName, HmmModel model, Map<String, List<LabelledInterval>> features) {
        this(fileName, model, features, Map.of());
    }

    /** @param excluded per seqid, sorted disjoint spans whose bases are left out of training */
    KnownLabels(String fileName, HmmModel model, Map<String, List<LabelledInterval>> features,
                Map<String, List<LabelledInterval>> excluded) {
        this.excluded = excluded;
        if (model.labels().size() > MAX_LABELS) {
            throw new BadInputException(fileName + ": model " + model.name() + " has " + model.labels().size()
                    + " labels; training with labels supports at most " + MAX_LABELS);
        }
        this.fileName = fileName;
        this.labelNames = model.labels().stream().map(l -> l.name()).toArray(String[]::new);
        this.background = model.labelIndex(model.backgroundLabel().name());
        Map<String, List<LabelledInterval>> sorted = new TreeMap<>();
        for (Map.Entry<String, List<LabelledInterval>> e : features.entrySet()) {
            List<LabelledInterval> list = new ArrayList<>(e.getValue());
            list.sort(Comparator.comparingLong(LabelledInterval::start).thenComparingLong(LabelledInterval::line));
            checkOverlaps(list);
            sorted.put(e.getKey(), Collections.unmodifiableList(list));
        }
        this.bySeqid = Collections.unmodifiableMap(sorted);
    }

    /** Sweep by start: a feature that begins inside the furthest-reaching earlier one must share its label. */
    private void checkOverlaps(List<LabelledInterval> sorted) {
        LabelledInterval reach = null;
        for (LabelledInterval f : sorted) {
            if (reach != null && f.start() <= reach.end() && f.label() != reach.label()) {
                LabelledInterval later = f.line() > reach.line() ? f : reach;
                LabelledInterval earlier = later == f ? reach : f;
                throw new BadInputException(fileName + ":" + later.line() + ": feature " + later.start() + ".."
                        + later.end() + " on " + later.seqid() + " (label " + labelNames[later.label()]
                        + ") overlaps the feature at line " + earlier.line() + " (label " + labelNames[earlier.label()]
                        + "); a base can have only one label");
            }
            if (reach == null || f.end() > reach.end()) {
                reach = f;
            }
        }
    }

    public String fileName() {
        return fileName;
    }

    /** The seqids that carry at least one labelled feature. */
    public Set<String> seqids() {
        return bySeqid.keySet();
    }

    /** The first labelled feature of a seqid (by start), for messages. */
    public LabelledInterval first(String seqid) {
        return bySeqid.get(seqid).get(0);
    }

    /**
     * Checks that every feature lies inside its record and, when {@code allSeqids}, that every labelled seqid is
     * a record of the inputs.
     *
     * @param recordLengths record name to length, over all inputs
     * @param inputs        how to name the inputs in a message
     */
    public void checkAgainst(Map<String, Integer> recordLengths, String inputs, boolean allSeqids) {
        for (Map.Entry<String, List<LabelledInterval>> e : bySeqid.entrySet()) {
            Integer length = recordLengths.get(e.getKey());
            LabelledInterval first = e.getValue().get(0);
            if (length == null && !allSeqids) {
                continue;
            }
            if (length == null) {
                throw new BadInputException(fileName + ":" + first.line() + ": seqid " + e.getKey()
                        + " is not a record of " + inputs);
            }
            checkInside(e.getValue(), length);
        }
    }

    private void checkInside(List<LabelledInterval> features, int length) {
        for (LabelledInterval f : features) {
            if (f.end() > length) {
                throw new BadInputException(fileName + ":" + f.line() + ": feature " + f.start() + ".." + f.end()
                        + " lies outside record " + f.seqid() + " (" + length + " bases)");
            }
        }
    }

    /**
     * The parts of a record that are trained on: [from, to) 0-based pairs between the excluded spans, in order
     * (the whole record when nothing is excluded).
     */
    public List<int[]> pieces(String seqid, int length) {
        List<int[]> out = new ArrayList<>();
        int from = 0;
        for (LabelledInterval x : excluded.getOrDefault(seqid, List.of())) {
            int to = (int) Math.min(length, x.start() - 1);
            if (to > from) {
                out.add(new int[]{from, to});
            }
            from = (int) Math.max(from, Math.min(length, x.end()));
        }
        if (length > from || out.isEmpty()) {
            out.add(new int[]{from, Math.max(from, length)});
        }
        return out;
    }

    /** Label index of every base of a record: the background label where no feature lies. */
    public byte[] labelsOf(String seqid, int length) {
        byte[] out = new byte[length];
        Arrays.fill(out, (byte) background);
        List<LabelledInterval> features = bySeqid.get(seqid);
        if (features != null) {
            checkInside(features, length);
            for (LabelledInterval f : features) {
                Arrays.fill(out, (int) f.start() - 1, (int) f.end(), (byte) f.label());
            }
        }
        return out;
    }
}
