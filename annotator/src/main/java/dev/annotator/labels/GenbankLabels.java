package dev.annotator.labels;

import dev.annotator.error.BadInputException;
import dev.annotator.io.InputOpener;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;

import java.io.InputStream;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;

/**
 * Known features for training from a GenBank flat file: its simple CDS features, each given the model's label
 * for coding sequence on that strand (a label of type {@code CDS} or {@code SO:0000316}, with the strand, or
 * without one). CDS in several parts (joins) and partial ones are left out and counted in one warning line.
 */
public final class GenbankLabels {
    private static final String CDS = "CDS";
    private static final String CDS_ACCESSION = "SO:0000316";

    private GenbankLabels() {
    }

    /**
     * @throws BadInputException malformed GenBank data, or a model without a label for CDS
     */
    public static LabelledFeatures read(HmmModel model, String path, Consumer<String> warnings) {
        String name = InputOpener.displayName(path);
        int forward = labelFor(model, '+');
        int reverse = labelFor(model, '-');
        if (forward < 0 || reverse < 0) {
            throw new BadInputException(name + ": model " + model.name() + " has no label for CDS features on the "
                    + (forward < 0 ? "forward" : "reverse") + " strand (feature_type CDS or SO:0000316)");
        }
        GenbankCds cds = GenbankCds.read(path, InputStream.nullInputStream());
        Map<String, List<LabelledInterval>> bySeqid = new HashMap<>();
        for (StrandedFeature f : cds.simple()) {
            bySeqid.computeIfAbsent(f.seqid(), s -> new ArrayList<>()).add(new LabelledInterval(f.seqid(), f.start(),
                    f.end(), f.strand() == '+' ? forward : reverse, 0));
        }
        int skipped = cds.joined() + cds.partial() + cds.other();
        if (skipped > 0) {
            warnings.accept(name + ": using " + cds.simple().size() + " of " + cds.total() + " CDS; skipped "
                    + cds.joined() + " in several parts (joined), " + cds.partial() + " partial (< or >) and "
                    + cds.other() + " other");
        }
        return new LabelledFeatures(name, bySeqid);
    }

    /** The label for CDS on this strand: a stranded one first, else one without a strand; -1 if none. */
    private static int labelFor(HmmModel model, char strand) {
        int unstranded = -1;
        List<Label> labels = model.labels();
        for (int i = 0; i < labels.size(); i++) {
            Label l = labels.get(i);
            boolean isCds = CDS.equals(l.featureType()) || CDS_ACCESSION.equals(l.soAccession());
            if (!isCds || l.background()) {
                continue;
            }
            if (l.strand() == strand) {
                return i;
            }
            if (!l.stranded() && unstranded < 0) {
                unstranded = i;
            }
        }
        return unstranded;
    }
}
