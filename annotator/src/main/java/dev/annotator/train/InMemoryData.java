package dev.annotator.train;

import dev.annotator.model.HmmModel;

import java.util.List;

/** Training data held in memory: for embedding and tests. Counts the same as the file-based pipeline. */
public final class InMemoryData implements CountSource {
    private final List<CountItem> items;
    private final boolean labelled;
    private final ExpectationRunner runner;

    /**
     * @param items   the sequences (all with labels, or all without)
     * @param runner  threads to count on; closed by the caller
     */
    public InMemoryData(List<CountItem> items, ExpectationRunner runner) {
        this.items = List.copyOf(items);
        this.labelled = !items.isEmpty() && items.get(0).labels() != null;
        for (CountItem i : items) {
            if ((i.labels() != null) != labelled) {
                throw new IllegalArgumentException("either every item has labels or none has");
            }
        }
        this.runner = runner;
    }

    @Override
    public ModelCounts count(HmmModel model) {
        return runner.count(model, labelled, items.iterator());
    }

    @Override
    public double logLikelihood(HmmModel model) {
        return runner.logLikelihood(model, labelled, items.iterator());
    }
}
