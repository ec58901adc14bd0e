package dev.annotator.gff;

import java.util.HashMap;
import java.util.Map;

/**
 * Hands out feature IDs {@code <label>_<n>}, n counting 1, 2, ... per label across all records of one output
 * file, because GFF3 requires IDs to be unique within the file (specification v1.26, Column 9, "ID").
 *
 * <p>Distinct labels cannot collide: if {@code L_n} equalled {@code M_m} with M longer, M would be
 * {@code L_q} and n would be {@code q_m}, which is not all digits. Create one allocator per output file; it is not
 * thread-safe.
 */
public final class FeatureIdAllocator {
    private final Map<String, Long> counters = new HashMap<>();
    private final String prefix;

    public FeatureIdAllocator() {
        this("");
    }

    /**
     * @param prefix put before every ID, so that files annotated separately (shards of one genome) can be
     *               concatenated with their IDs still unique
     */
    public FeatureIdAllocator(String prefix) {
        this.prefix = prefix;
    }

    public String next(String label) {
        if (label == null || label.isEmpty()) {
            throw new IllegalArgumentException("label must not be empty");
        }
        long n = counters.merge(label, 1L, Long::sum);
        return prefix + label + "_" + n;
    }
}
