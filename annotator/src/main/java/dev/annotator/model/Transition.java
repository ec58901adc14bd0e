package dev.annotator.model;

/** An allowed transition; transitions a model does not list are forbidden (probability exactly 0). */
public record Transition(String from, String to, double probability) {
}
