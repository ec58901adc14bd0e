package dev.annotator.model;

/** A model that comes inside the jar, listed by the name that loads it. */
public record ShippedModel(String name, String description) {
}
