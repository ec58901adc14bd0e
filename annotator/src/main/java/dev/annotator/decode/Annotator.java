package dev.annotator.decode;

import dev.annotator.hmm.BoundaryVectors;
import dev.annotator.hmm.ForwardBackward;
import dev.annotator.hmm.HmmParameters;
import dev.annotator.hmm.PosteriorBlockSink;
import dev.annotator.hmm.PosteriorDecoding;
import dev.annotator.hmm.PosteriorViterbi;
import dev.annotator.hmm.Viterbi;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelCompiler;
import dev.annotator.seq.SequenceRecord;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.ForkJoinTask;
import java.util.concurrent.RecursiveTask;
import java.util.function.LongConsumer;

/**
 * Decodes FASTA records with one model: the library entry point for embedding. Immutable and thread-safe; every
 * call works in its own memory, so records can be annotated in parallel with one instance.
 */
public final class Annotator {
    /** Length of the windows a long record is split into for posterior decoding (4 Mi bases). */
    public static final int WINDOW = 1 << 22;

    private final HmmModel model;
    private final HmmParameters parameters;
    private final ReportedLabels labels;
    private final int[] stateToReported;
    private final DecodeMethod method;
    private final int minLength;
    private final ForwardBackward forwardBackward;
    private final Viterbi viterbi;
    private final PosteriorViterbi posteriorViterbi;
    private final int window;
    private final ProfileOptions profile;
    private final int trackLabel;
    /** For a gene model with genes on both strands: the decoders of the two strand views, else null. */
    private final List<Annotator> strandViews;
    private final LongestOrfStarts longestOrfStarts;

    /**
     * @param minLength segments shorter than this many bases are dropped (0 or 1 keeps all)
     */
    public Annotator(HmmModel model, DecodeMethod method, int minLength) {
        this(model, method, minLength, WINDOW);
    }

    /**
     * @param window length of the windows long records are split into for posterior decoding (results agree with
     *               undivided decoding within {@link BoundaryVectors#TOLERANCE}; output is stable for one window)
     */
    public Annotator(HmmModel model, DecodeMethod method, int minLength, int window) {
        this(model, method, minLength, window, ProfileOptions.NONE);
    }

    /**
     * @param profile what to collect per record beside the segments ({@link RecordAnnotation#profile()})
     * @throws IllegalArgumentException when the profile's track label is not a reported label of the model
     */
    public Annotator(HmmModel model, DecodeMethod method, int minLength, int window, ProfileOptions profile) {
        this(model, method, minLength, window, profile, GeneStarts.LIKELIEST_START);
    }

    /**
     * @param starts where genes of a gene model start (used with Viterbi and posterior-Viterbi decoding)
     */
    public Annotator(HmmModel model, DecodeMethod method, int minLength, int window, ProfileOptions profile,
                     GeneStarts starts) {
        if (window < 1) {
            throw new IllegalArgumentException("window must be positive");
        }
        this.window = window;
        this.model = model;
        this.parameters = ModelCompiler.compile(model);
        this.labels = ReportedLabels.of(model);
        this.method = method;
        this.minLength = minLength;
        this.forwardBackward = new ForwardBackward(parameters);
        this.viterbi = method == DecodeMethod.VITERBI ? new Viterbi(parameters) : null;
        this.posteriorViterbi = method == DecodeMethod.POSTERIOR_VITERBI ? new PosteriorViterbi(parameters) : null;
        this.profile = profile;
        this.trackLabel = trackLabelIndex(labels, profile.trackLabel());
        this.strandViews = StrandView.applies(model) ? List.of(
                new Annotator(StrandView.of(model, '+'), method, minLength, window, ProfileOptions.NONE, starts),
                new Annotator(StrandView.of(model, '-'), method, minLength, window, ProfileOptions.NONE, starts))
                : null;
        this.longestOrfStarts = starts == GeneStarts.DECODED ? null : LongestOrfStarts.of(model, parameters, starts);
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

    private static int trackLabelIndex(ReportedLabels labels, String name) {
        if (name == null) {
            return 0;
        }
        for (int r = 0; r < labels.size(); r++) {
            if (labels.labels().get(r).name().equals(name)) {
                return r;
            }
        }
        throw new IllegalArgumentException("label " + name + " is not a reported label of the model");
    }

    public HmmModel model() {
        return model;
    }

    /**
     * Decodes one record. Posterior decoding splits records longer than {@link #WINDOW} bases into windows at
     * fixed positions (multiples of {@link #WINDOW}, whatever the thread count, so output never depends on it);
     * each window gets its boundary vectors from {@link BoundaryVectors} and the windows run in parallel when
     * called from a fork-join pool (as {@code AnnotationPipeline} does with more than one thread). Viterbi and
     * posterior-Viterbi decoding run the record's path in one piece.
     *
     * @throws dev.annotator.hmm.ImpossibleSequenceException if no state path of the model can emit the record
     */
    public RecordAnnotation annotate(SequenceRecord record) {
        return annotate(record, bases -> { });
    }

    /**
     * As {@link #annotate(SequenceRecord)}, telling {@code progress} how many bases each finished piece held (it
     * may be called from several threads at once).
     */
    public RecordAnnotation annotate(SequenceRecord record, LongConsumer progress) {
        if (strandViews != null) {
            return annotateByStrand(record, progress);
        }
        byte[] bases = record.bases();
        List<RawSegment> raw;
        double logLik;
        List<WindowProfile> windowProfiles = null;
        int k = parameters.stateCount();
        byte[] statePath = null;
        RecordProfiles.BaseProfile baseProfile = null;
        if (method != DecodeMethod.POSTERIOR) {
            // one forward-backward pass gives the path (posterior-Viterbi), the per-base evidence of the runs and
            // the profile; the runs are known only once the path is read off, so the evidence is kept per base
            BaseEvidence evidence = new BaseEvidence(labels, bases.length, k);
            WindowProfile whole = profile.any()
                    ? new WindowProfile(labels, trackLabel, profile, 0, bases.length, bases.length, k) : null;
            PosteriorBlockSink sink = whole == null || !whole.perBase() ? evidence : (s, e, p, em) -> {
                evidence.block(s, e, p, em);
                whole.block(s, e, p, em);
            };
            if (method == DecodeMethod.VITERBI) {
                // the path and the forward-backward pass are independent: in a fork-join pool (more than one
                // thread) they run at once; the path first, so a sequence no path can emit fails as before
                RecursiveTask<byte[]> path = new RecursiveTask<>() {
                    @Override
                    protected byte[] compute() {
                        return viterbi.decode(bases).path();
                    }
                };
                RecursiveTask<Double> pass = new RecursiveTask<>() {
                    @Override
                    protected Double compute() {
                        return forwardBackward.run(bases, sink);
                    }
                };
                if (ForkJoinTask.inForkJoinPool()) {
                    ForkJoinTask.invokeAll(path, pass);
                } else {
                    path.invoke();
                    pass.invoke();
                }
                statePath = path.join();
                logLik = pass.join();
            } else {
                PosteriorDecoding decoding = posteriorViterbi.decode(bases, sink);
                statePath = decoding.path().path();
                logLik = decoding.logLikelihood();
            }
            if (whole != null) {
                whole.finish();
                windowProfiles = List.of(whole);
            }
            raw = PathRuns.runsOf(labels, statePath, stateToReported);
            if (longestOrfStarts != null) {
                raw = longestOrfStarts.extend(bases, statePath, raw, labels);
            }
            raw.forEach(evidence::collect);
            progress.accept(bases.length);
        } else {
            int n = bases.length;
            int windows = Math.max(1, (int) ((n + (long) window - 1) / window));
            List<WindowTask> tasks = new ArrayList<>(windows);
            for (int w = 0; w < windows; w++) {
                tasks.add(new WindowTask(bases, w * window, (int) Math.min(n, (long) (w + 1) * window), progress));
            }
            if (windows > 1 && ForkJoinTask.inForkJoinPool()) {
                ForkJoinTask.invokeAll(tasks);
            } else {
                tasks.forEach(WindowTask::invoke);
            }
            raw = new ArrayList<>();
            logLik = 0;
            windowProfiles = profile.any() ? new ArrayList<>(windows) : null;
            List<RecordProfiles.BasePiece> basePieces = new ArrayList<>(windows);
            for (WindowTask task : tasks) {
                raw.addAll(task.join().segments());
                logLik += task.logLikelihood;
                if (windowProfiles != null) {
                    windowProfiles.add(task.profile);
                    basePieces.add(task.basePiece);
                }
            }
            baseProfile = windowProfiles == null ? null : RecordProfiles.bases(profile, bases, basePieces);
            raw = WindowStitcher.stitch(raw);
        }
        List<Segment> segments = new ArrayList<>(raw.size());
        for (RawSegment r : raw) {
            Label label = labels.labels().get(r.label());
            if (r.length() < Math.max(minLength, label.minLength())) {
                continue;
            }
            Composition composition = label.composition()
                    ? CompositionCounter.of(bases, r.start0(), r.endExclusive()) : null;
            GeneDetails gene = label.stranded() ? GeneDetails.of(label.strand(), bases, r.start0(), r.endExclusive(),
                    fivePrimeCodonPosition(statePath, label.strand(), r)) : null;
            segments.add(r.stats().toSegment(label.name(), r.start0(), r.endExclusive(), composition, gene));
        }
        List<String> order = labels.labels().stream().map(Label::name).toList();
        segments.sort(Comparator.comparingInt(Segment::start).thenComparingInt(s -> order.indexOf(s.label())));
        RecordProfile recordProfile = windowProfiles == null ? null
                : baseProfile == null ? RecordProfiles.join(profile, labels, trackLabel, bases, windowProfiles)
                : RecordProfiles.join(profile, labels, trackLabel, bases, windowProfiles, baseProfile);
        return new RecordAnnotation(record.name(), bases.length, logLik, segments, recordProfile);
    }

    /**
     * A gene model decoded strand by strand ({@link StrandView}): genes of each strand from its own view, merged in
     * order; the profile, when asked for, from the model itself, which gives the log-likelihood too. Without a
     * profile the record's log-likelihood is NaN: the whole model's forward pass would cost about a seventh of the
     * decoding for a number no output reads ({@link #logLikelihood(byte[])} computes it).
     */
    private RecordAnnotation annotateByStrand(SequenceRecord record, LongConsumer progress) {
        byte[] bases = record.bases();
        // the two views and the model's own pass (log-likelihood, profile) are independent: in a fork-join pool
        // (more than one thread) they run at once
        List<RecursiveTask<RecordAnnotation>> views = new ArrayList<>();
        for (Annotator view : strandViews) {
            views.add(new RecursiveTask<>() {
                @Override
                protected RecordAnnotation compute() {
                    return view.annotate(record);
                }
            });
        }
        RecursiveTask<RecordAnnotation> whole = profile.any() ? new RecursiveTask<>() {
            @Override
            protected RecordAnnotation compute() {
                return wholeModelPass(record);
            }
        } : null;
        List<ForkJoinTask<RecordAnnotation>> all = new ArrayList<>(views);
        if (whole != null) {
            all.add(whole);
        }
        if (ForkJoinTask.inForkJoinPool()) {
            ForkJoinTask.invokeAll(all);
        } else {
            all.forEach(ForkJoinTask::invoke);
        }
        List<Segment> segments = new ArrayList<>();
        for (RecursiveTask<RecordAnnotation> view : views) {
            segments.addAll(view.join().segments());
        }
        List<String> order = labels.labels().stream().map(Label::name).toList();
        segments.sort(Comparator.comparingInt(Segment::start).thenComparingInt(s -> order.indexOf(s.label()))
                .thenComparingInt(Segment::end));
        progress.accept(bases.length);
        if (whole == null) {
            return new RecordAnnotation(record.name(), bases.length, Double.NaN, segments, null);
        }
        RecordAnnotation model = whole.join();
        return new RecordAnnotation(record.name(), bases.length, model.logLikelihood(), segments, model.profile());
    }

    /** The whole model's profile of a record, with its log-likelihood; no segments. */
    private RecordAnnotation wholeModelPass(SequenceRecord record) {
        byte[] bases = record.bases();
        WindowProfile window = new WindowProfile(labels, trackLabel, profile, 0, bases.length, bases.length,
                parameters.stateCount());
        double logLik = forwardBackward.run(bases, window);
        window.finish();
        RecordProfile recordProfile = RecordProfiles.join(profile, labels, trackLabel, bases, List.of(window));
        return new RecordAnnotation(record.name(), bases.length, logLik, List.of(), recordProfile);
    }

    /**
     * Natural log of P(bases | model) by a forward pass of the whole model: the figure a strand-by-strand gene
     * decoding without a profile leaves out of its {@link RecordAnnotation}.
     *
     * @throws dev.annotator.hmm.ImpossibleSequenceException if no state path of the model can emit the bases
     */
    public double logLikelihood(byte[] bases) {
        return forwardBackward.logLikelihood(bases);
    }

    /**
     * Bytes per base that the state paths of one call hold at once: back-pointers (Viterbi one per state,
     * posterior-Viterbi one per state with several successors) and the path itself; 0 for posterior decoding.
     */
    public long pathBytesPerBase() {
        if (strandViews != null) {
            return strandViews.stream().mapToLong(Annotator::pathBytesPerBase).sum();
        }
        return switch (method) {
            case POSTERIOR -> 0;
            case VITERBI -> parameters.stateCount() + 1L;
            case POSTERIOR_VITERBI -> posteriorViterbi.backPointerBytesPerBase() + 1L;
        };
    }

    /** Back-pointer bytes per base of the widest single back-pointer table (one Java array); 0 without one. */
    public int widestBackPointerRow() {
        if (strandViews != null) {
            return strandViews.stream().mapToInt(Annotator::widestBackPointerRow).max().orElse(0);
        }
        return switch (method) {
            case POSTERIOR -> 0;
            case VITERBI -> parameters.stateCount();
            case POSTERIOR_VITERBI -> posteriorViterbi.backPointerBytesPerBase();
        };
    }

    /** How many state paths of a record's length one call holds at once (2 for a gene model's strand views). */
    public int pathsAtOnce() {
        return strandViews == null ? 1 : strandViews.size();
    }

    /** Codon position of the path's state at a gene's 5'-most base; 0 without a path. */
    private int fivePrimeCodonPosition(byte[] path, char strand, RawSegment r) {
        if (path == null) {
            return 0;
        }
        int at = strand == '+' ? r.start0() : r.endExclusive() - 1;
        return model.states().get(path[at] & 0xFF).codonPosition();
    }

    /** Posterior decoding of the bases [start, end) of one record, with exact boundary vectors. */
    private final class WindowTask extends RecursiveTask<PosteriorRuns> {
        private final byte[] bases;
        private final int start;
        private final int end;
        private final LongConsumer progress;
        private double logLikelihood;
        private WindowProfile profile;
        private RecordProfiles.BasePiece basePiece;

        WindowTask(byte[] bases, int start, int end, LongConsumer progress) {
            this.bases = bases;
            this.start = start;
            this.end = end;
            this.progress = progress;
        }

        @Override
        protected PosteriorRuns compute() {
            double[] before = start == 0 ? null : BoundaryVectors.forwardBefore(forwardBackward, bases, start);
            double[] last = end == bases.length ? null : BoundaryVectors.backwardAt(forwardBackward, bases, end - 1);
            PosteriorRuns runs = new PosteriorRuns(labels, start, parameters.stateCount());
            if (Annotator.this.profile.any()) {
                WindowProfile window = new WindowProfile(labels, trackLabel, Annotator.this.profile, start, end,
                        bases.length, parameters.stateCount());
                if (!window.perBase()) {
                    logLikelihood = forwardBackward.runRange(bases, start, end, before, last, runs);
                } else {
                    logLikelihood = forwardBackward.runRange(bases, start, end, before, last, (s, e, p, em) -> {
                        runs.block(s, e, p, em);
                        window.block(s, e, p, em);
                    });
                }
                window.finish();
                profile = window;
                // the window's own bases for the composition and the plot's GC, so that pass is shared out too
                basePiece = RecordProfiles.basePiece(Annotator.this.profile, bases, start, end);
            } else {
                logLikelihood = forwardBackward.runRange(bases, start, end, before, last, runs);
            }
            progress.accept(end - start);
            return runs.finish();
        }
    }
}
