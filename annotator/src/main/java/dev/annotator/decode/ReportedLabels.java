package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;

import java.util.List;

/** The model's reported labels with, for each, which states belong to it. */
record ReportedLabels(List<Label> labels, boolean[][] stateMasks) {

    static ReportedLabels of(HmmModel model) {
        List<Label> reported = model.reportedLabels();
        int[] stateLabel = model.stateLabels();
        boolean[][] masks = new boolean[reported.size()][model.stateCount()];
        for (int r = 0; r < reported.size(); r++) {
            int labelIndex = model.labelIndex(reported.get(r).name());
            for (int s = 0; s < stateLabel.length; s++) {
                masks[r][s] = stateLabel[s] == labelIndex;
            }
        }
        return new ReportedLabels(reported, masks);
    }

    int size() {
        return labels.size();
    }
}
