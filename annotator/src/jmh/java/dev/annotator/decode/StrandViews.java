package dev.annotator.decode;

import dev.annotator.model.HmmModel;

/**
 * The strand views of a gene model for the kernel benchmarks: the views are what the gene model is decoded with
 * ({@link StrandView} is package-private, and benchmarks only read it).
 */
public final class StrandViews {
    private StrandViews() {
    }

    /** @param strand '+' or '-' */
    public static HmmModel of(HmmModel joint, char strand) {
        return StrandView.of(joint, strand);
    }
}
