package dev.annotator.labels;

import dev.annotator.model.HmmModel;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * The features of a labels file that map to model labels, per seqid, as read: not yet checked for overlaps
 * between labels. Immutable.
 *
 * @param fileName how the file is named in messages
 * @param bySeqid  features per seqid, in file order
 * @param excluded per seqid, spans whose bases are left out of training (sorted, disjoint; label -1)
 */
public record LabelledFeatures(String fileName, Map<String, List<LabelledInterval>> bySeqid,
                               Map<String, List<LabelledInterval>> excluded) {
    public LabelledFeatures {
        bySeqid = copy(bySeqid);
        excluded = copy(excluded);
    }

    public LabelledFeatures(String fileName, Map<String, List<LabelledInterval>> bySeqid) {
        this(fileName, bySeqid, Map.of());
    }

    private static Map<String, List<LabelledInterval>> copy(Map<String, List<LabelledInterval>> m) {
        Map<String, List<LabelledInterval>> copy = new TreeMap<>();
        m.forEach((k, v) -> copy.put(k, List.copyOf(v)));
        return java.util.Collections.unmodifiableMap(copy);
    }

    /** The labels of every base these features give, checked (a base has one label). */
    public KnownLabels known(HmmModel model) {
        return new KnownLabels(fileName, model, bySeqid, excluded);
    }

    /** The same file's features with only {@code kept} of each seqid, and the spans to leave out. */
    public LabelledFeatures with(Map<String, List<LabelledInterval>> kept,
                                 Map<String, List<LabelledInterval>> leftOut) {
        return new LabelledFeatures(fileName, kept, leftOut);
    }

    public int size() {
        int n = 0;
        for (List<LabelledInterval> v : bySeqid.values()) {
            n += v.size();
        }
        return n;
    }

    /** All features of one seqid (empty when it has none). */
    public List<LabelledInterval> of(String seqid) {
        return bySeqid.getOrDefault(seqid, new ArrayList<>());
    }
}
