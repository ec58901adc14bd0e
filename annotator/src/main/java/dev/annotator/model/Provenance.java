package dev.annotator.model;

import java.util.List;

/**
 * Where a model's numbers come from: a published source, or the run that trained it.
 *
 * @param source one line naming the source of the numbers
 * @param notes  further lines (how values were derived, what is a rule of thumb, training details)
 */
public record Provenance(String source, List<String> notes) {
    public Provenance {
        notes = List.copyOf(notes);
    }
}
