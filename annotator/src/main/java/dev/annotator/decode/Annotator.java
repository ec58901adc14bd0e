package dev.annotator.decode;

import dev.annotator.hmm.ForwardBackward;
import dev.annotator.hmm.HmmParameters;
import dev.annotator.hmm.Viterbi;
import dev.annotator.hmm.ViterbiPath;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelCompiler;
import dev.annotator.seq.SequenceRecord;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Decodes FASTA records with one model: the library entry point for embedding. Immutable and thread-safe; every
 * call works in its own memory, so records can be annotated in parallel with one instance.
 */
public final class Annotator {
    private final HmmModel model;
    private final HmmParameters parameters;
    private final ReportedLabels labels;
    private final int[] stateToReported;
    private final DecodeMethod method;
    private final int minLength;
    private final ForwardBackward forwardBackward;
    private final Viterbi viterbi;

    /**
     * @param minLength segments shorter than this many bases are dropped (0 or 1 keeps all)
     */
    public Annotator(HmmModel model, DecodeMethod method, int minLength) {
        this.model = model;
        this.parameters = ModelCompiler.compile(model);
        this.labels = ReportedLabels.of(model);
        this.method = method;
        this.minLength = minLength;
        this.forwardBackward = new ForwardBackward(parameters);
        this.viterbi = method == DecodeMethod.VITERBI ? new Viterbi(parameters) : null;
        this.stateToReported = new int[model.stateCount()];
        for (int s = 0; s < stateToReported.length; s++) {
            stateToReported[s] = -1;
            for (int r = 0; r < labels.size(); r++) {
                if (labels.stateMasks()[r][s]) {
                    stateToReported[s] = r;
                }
            }
        }
    }

    public HmmModel model() {
        return model;
    }

    /**
     * @throws dev.annotator.hmm.ImpossibleSequenceException if no state path of the model can emit the record
     */
    public RecordAnnotation annotate(SequenceRecord record) {
        byte[] bases = record.bases();
        List<RawSegment> raw;
        double logLik;
        if (method == DecodeMethod.VITERBI) {
            ViterbiPath path = viterbi.decode(bases);
            PathRuns runs = new PathRuns(labels, path.states(), stateToReported);
            logLik = forwardBackward.run(bases, runs);
            raw = runs.segments();
        } else {
            PosteriorRuns runs = new PosteriorRuns(labels);
            logLik = forwardBackward.run(bases, runs);
            raw = runs.segments();
        }
        List<Segment> segments = new ArrayList<>(raw.size());
        for (RawSegment r : raw) {
            if (r.length() < minLength) {
                continue;
            }
            Label label = labels.labels().get(r.label());
            Composition composition = label.composition()
                    ? CompositionCounter.of(bases, r.start0(), r.endExclusive()) : null;
            segments.add(r.stats().toSegment(label.name(), r.start0(), r.endExclusive(), composition));
        }
        List<String> order = labels.labels().stream().map(Label::name).toList();
        segments.sort(Comparator.comparingInt(Segment::start).thenComparingInt(s -> order.indexOf(s.label())));
        return new RecordAnnotation(record.name(), bases.length, logLik, segments);
    }
}
