package dev.annotator.model;

import java.util.List;

/**
 * Where a model's numbers come from: a published source, or the run that trained it.
 *
 * @param source   one line naming the source of the numbers
 * @param notes    further lines (how values were derived, what is a rule of thumb, training details)
 * @param training the training run that wrote the model, or null for a model written by hand
 */
public record Provenance(String source, List<String> notes, Training training) {
    public Provenance {
        notes = List.copyOf(notes);
    }

    /** A model written by hand (no training run). */
    public Provenance(String source, List<String> notes) {
        this(source, notes, null);
    }
}
