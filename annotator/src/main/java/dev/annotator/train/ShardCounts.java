package dev.annotator.train;

import dev.annotator.model.InputFingerprint;

import java.util.List;

/**
 * The result of one E-step on one machine's share of the data, written by {@code train --emit-counts} and added
 * up by {@code train --merge-counts}.
 *
 * @param modelName   name of the model the E-step ran with
 * @param modelSha256 SHA-256 of that model's canonical JSON: a merge checks it against its START model
 * @param method      how the counts were made (with labels, counting or restricted Baum-Welch)
 * @param inputs      the sequence files counted
 * @param labels      the label files used (empty for none)
 * @param counts      the expected counts, with log-likelihood, bases and records
 */
public record ShardCounts(String modelName, String modelSha256, TrainingMethod method, List<InputFingerprint> inputs,
                          List<InputFingerprint> labels, ModelCounts counts) {
    public ShardCounts {
        inputs = List.copyOf(inputs);
        labels = List.copyOf(labels);
    }
}
