package dev.annotator.model;

import java.util.List;

/**
 * How a model's numbers were fitted to data: the run that wrote it. Enough to repeat the run and to check that
 * the same data were used.
 *
 * @param tool               the program and its version, e.g. "annotator 0.1.0"
 * @param command            the command line, without options that cannot change the result (threads, quiet)
 * @param date               when the model was written, ISO-8601 UTC ("2026-12-01T10:15:30Z")
 * @param method             "counting" or "baum-welch"
 * @param inputs             the sequence files
 * @param labels             the label files (empty without labels)
 * @param bases              bases in the inputs
 * @param iterations         M-steps done (counting: 1)
 * @param converged          whether the stopping rule was met (null for counting)
 * @param logLikelihood      natural log-likelihood of the inputs under this model, null when not computed (after
 *                           a merge of shard counts)
 * @param startLogLikelihood natural log-likelihood of the inputs under the model the run started from, null when
 *                           not computed
 */
public record Training(String tool, String command, String date, String method, List<InputFingerprint> inputs,
                       List<InputFingerprint> labels, long bases, int iterations, Boolean converged,
                       Double logLikelihood, Double startLogLikelihood) {
    public static final String COUNTING = "counting";
    public static final String BAUM_WELCH = "baum-welch";

    public Training {
        inputs = List.copyOf(inputs);
        labels = List.copyOf(labels);
    }
}
