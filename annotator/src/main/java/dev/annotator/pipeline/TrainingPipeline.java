package dev.annotator.pipeline;

import dev.annotator.error.BadInputException;
import dev.annotator.io.InputFormat;
import dev.annotator.labels.GenbankLabels;
import dev.annotator.labels.KnownLabels;
import dev.annotator.labels.LabelGff3Reader;
import dev.annotator.labels.LabelledFeatures;
import dev.annotator.labels.LabelledInterval;
import dev.annotator.model.HmmModel;
import dev.annotator.model.InputFingerprint;
import dev.annotator.model.Label;
import dev.annotator.model.State;
import dev.annotator.seq.SequenceFiles;
import dev.annotator.seq.SequenceReader;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.train.CountItem;
import dev.annotator.train.CountSource;
import dev.annotator.train.ExpectationRunner;
import dev.annotator.train.IterationProgress;
import dev.annotator.train.ModelCounts;
import dev.annotator.train.ModelIdentity;
import dev.annotator.train.Reestimation;
import dev.annotator.train.RunStamp;
import dev.annotator.train.ShardCounts;
import dev.annotator.train.Trainer;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;
import dev.annotator.train.TrainingProvenance;
import dev.annotator.train.TrainingResult;
import dev.annotator.train.WholeFeatureScreen;

import java.io.InputStream;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.Consumer;

/**
 * FASTA files (and a labels file) in, a trained model or one shard's counts out: the library form of
 * {@code annotator train}. The inputs must be files, not standard input: when they do not fit in memory they are
 * read again at every E-step, one record at a time, so memory does not grow with the amount of data.
 *
 * <p>Before any counting the run checks what it can: that every input exists (and takes its size and SHA-256),
 * that the labels file is well formed, names only records of the inputs and places every feature inside its
 * record, and, for counting, that every label has one state.
 */
public final class TrainingPipeline {
    /** Records are kept in memory between E-steps when they take at most 1/CACHE_SHARE of the maximum heap. */
    static final int CACHE_SHARE = 4;

    private final HmmModel start;
    private final String startName;
    private final List<String> inputs;
    private final String labelsPath;
    private final TrainingOptions options;
    private final int threads;
    private final Consumer<String> warnings;
    private final long cacheBytes;

    /**
     * @param start      the model to start from (validated)
     * @param startName  how the user named it (file or shipped name), for messages
     * @param inputs     FASTA files, plain or gzipped
     * @param labelsPath GFF3 file of known features, or null
     * @param threads    threads to count on; the result does not depend on it
     * @param warnings   one-line warnings (records without bases, feature types that are no label)
     */
    public TrainingPipeline(HmmModel start, String startName, List<String> inputs, String labelsPath,
                            TrainingOptions options, int threads, Consumer<String> warnings) {
        this(start, startName, inputs, labelsPath, options, threads, warnings,
                Runtime.getRuntime().maxMemory() / CACHE_SHARE);
    }

    /** As above, keeping records in memory between E-steps only up to {@code cacheBytes}. */
    TrainingPipeline(HmmModel start, String startName, List<String> inputs, String labelsPath,
                     TrainingOptions options, int threads, Consumer<String> warnings, long cacheBytes) {
        this.cacheBytes = cacheBytes;
        this.start = start;
        this.startName = startName;
        this.inputs = List.copyOf(inputs);
        this.labelsPath = labelsPath;
        this.options = options;
        this.threads = threads;
        this.warnings = warnings;
    }

    /** Fits the model; returns it with its provenance filled in. */
    public HmmModel train(IterationProgress progress, RunStamp stamp) {
        Prepared p = prepare(true);
        TrainingResult r;
        try (ExpectationRunner runner = new ExpectationRunner(threads)) {
            r = new Trainer(options, progress).train(start, new FileData(p.labels, runner));
        }
        return Reestimation.withProvenance(r.model(), start.name(), TrainingProvenance.describe(start,
                options.method(), options, p.inputs, p.labelFiles, r.bases(), r.iterations(), r.converged(),
                r.logLikelihood(), r.startLogLikelihood(), 0, r.run(), stamp));
    }

    /**
     * One E-step of the start model on the inputs: a shard's counts. The labels file may also describe records
     * of other shards.
     */
    public ShardCounts countShard() {
        Prepared p = prepare(false);
        ModelCounts counts;
        try (ExpectationRunner runner = new ExpectationRunner(threads)) {
            counts = new FileData(p.labels, runner).count(start);
        }
        return new ShardCounts(start.name(), ModelIdentity.sha256(start), options.method(), p.inputs, p.labelFiles,
                counts);
    }

    private record Prepared(List<InputFingerprint> inputs, List<InputFingerprint> labelFiles, KnownLabels labels) {
    }

    /**
     * @param allSeqids whether every labelled seqid must be a record of the inputs; a shard's E-step may be given
     *                  one labels file for all shards, so it checks only the records it has
     */
    private Prepared prepare(boolean allSeqids) {
        if (options.method() == TrainingMethod.COUNTING && !WholeFeatureScreen.applies(start)) {
            requireOneStatePerLabel();
        }
        List<InputFingerprint> fingerprints = new ArrayList<>();
        for (String input : inputs) {
            fingerprints.add(InputFingerprints.of(input));
        }
        if (labelsPath == null) {
            return new Prepared(fingerprints, List.of(), null);
        }
        InputFingerprint labelFile = InputFingerprints.of(labelsPath);
        LabelledFeatures features = InputFormat.detect(labelsPath) == InputFormat.GENBANK
                ? GenbankLabels.read(start, labelsPath, warnings)
                : new LabelGff3Reader(start).readFeatures(labelsPath, warnings);
        Map<String, Integer> lengths = new HashMap<>();
        if (WholeFeatureScreen.applies(start)) {
            features = screenGenes(features, lengths);
        } else {
            lengths = recordLengths();
        }
        KnownLabels labels = features.known(start);
        labels.checkAgainst(lengths, inputs.size() == 1 ? inputs.get(0)
                : "the inputs (" + String.join(", ", inputs) + ")", allSeqids);
        return new Prepared(fingerprints, List.of(labelFile), labels);
    }

    /**
     * For a gene model: keeps the labelled genes it can be trained on (see {@link WholeFeatureScreen}), reading
     * every record once, and fills {@code lengths} with the records' names and lengths. Says in one warning line
     * how many genes were left out and why.
     */
    private LabelledFeatures screenGenes(LabelledFeatures features, Map<String, Integer> lengths) {
        WholeFeatureScreen screen = new WholeFeatureScreen(start);
        Map<String, List<LabelledInterval>> kept = new TreeMap<>(features.bySeqid());
        Map<String, List<LabelledInterval>> leftOut = new TreeMap<>();
        int stranded = 0;
        int notEmittable = 0;
        int overlapping = 0;
        for (String input : inputs) {
            try (SequenceReader reader = SequenceFiles.open(input, InputStream.nullInputStream(), w -> { })) {
                SequenceRecord r;
                while ((r = reader.next()) != null) {
                    if (lengths.putIfAbsent(r.name(), r.length()) != null || !kept.containsKey(r.name())) {
                        continue;
                    }
                    int length = r.length();
                    List<LabelledInterval> inside = new ArrayList<>();
                    List<LabelledInterval> outside = new ArrayList<>();
                    for (LabelledInterval f : kept.get(r.name())) {
                        (f.end() <= length ? inside : outside).add(f);
                    }
                    WholeFeatureScreen.Outcome o = screen.screen(r.bases(), inside);
                    List<LabelledInterval> out = new ArrayList<>(o.kept());
                    out.addAll(outside); // left for the inside-the-record check to report
                    kept.put(r.name(), out);
                    leftOut.put(r.name(), o.excluded());
                    stranded += o.stranded();
                    notEmittable += o.notEmittable();
                    overlapping += o.overlapping();
                }
            }
        }
        if (notEmittable + overlapping > 0) {
            warnings.accept(features.fileName() + ": trained on " + (stranded - notEmittable - overlapping) + " of "
                    + stranded + " genes; left out " + notEmittable + " the model cannot emit (a start or stop codon "
                    + "it does not allow, a stop inside, or a length that is not a whole number of codons) and "
                    + overlapping + " that overlap or touch another gene (their bases are left out of training)");
        }
        return features.with(kept, leftOut);
    }

    /** Names and lengths of all records, read before training so that label errors come before any work. */
    private Map<String, Integer> recordLengths() {
        Map<String, Integer> lengths = new HashMap<>();
        for (String input : inputs) {
            try (SequenceReader reader = SequenceFiles.open(input, InputStream.nullInputStream(), w -> { })) {
                SequenceRecord r;
                while ((r = reader.next()) != null) {
                    lengths.putIfAbsent(r.name(), r.length());
                }
            }
        }
        return lengths;
    }

    private void requireOneStatePerLabel() {
        for (Label l : start.labels()) {
            List<String> states = new ArrayList<>();
            for (State s : start.states()) {
                if (s.label().equals(l.name())) {
                    states.add(s.name());
                }
            }
            if (states.size() != 1) {
                throw new BadInputException(startName + ": label \"" + l.name() + "\" has " + states.size()
                        + " states (" + String.join(", ", states) + "); counting needs one state per label (use "
                        + "--method baum-welch with --labels)");
            }
        }
    }

    /**
     * The inputs as a count source. The first E-step reads the files; if the records (and their labels) fit in
     * the cache budget (by default 1/{@link #CACHE_SHARE} of the heap) they are kept for the later E-steps, otherwise every E-step reads the files
     * again, one record at a time. Warnings come from the first read only.
     */
    private final class FileData implements CountSource {
        private final KnownLabels labels;
        private final ExpectationRunner runner;
        private List<CountItem> cache;
        private boolean warned;

        FileData(KnownLabels labels, ExpectationRunner runner) {
            this.labels = labels;
            this.runner = runner;
        }

        @Override
        public ModelCounts count(HmmModel model) {
            if (cache != null) {
                return runner.count(model, labels != null, cache.iterator());
            }
            try (FastaRecords records = records()) {
                Keeping keeping = new Keeping(records);
                ModelCounts counts = runner.count(model, labels != null, keeping);
                cache = keeping.kept();
                return counts;
            }
        }

        @Override
        public double logLikelihood(HmmModel model) {
            if (cache != null) {
                return runner.logLikelihood(model, labels != null, cache.iterator());
            }
            try (FastaRecords records = records()) {
                return runner.logLikelihood(model, labels != null, records);
            }
        }

        private FastaRecords records() {
            Consumer<String> sink = warned ? w -> { } : warnings;
            warned = true;
            return new FastaRecords(inputs, labels, sink);
        }

        /** Passes the records on and keeps them while they fit in the budget. */
        private final class Keeping implements Iterator<CountItem> {
            private final Iterator<CountItem> source;
            private List<CountItem> kept = new ArrayList<>();
            private long bytes;

            Keeping(Iterator<CountItem> source) {
                this.source = source;
            }

            @Override
            public boolean hasNext() {
                return source.hasNext();
            }

            @Override
            public CountItem next() {
                CountItem item = source.next();
                if (kept != null) {
                    bytes += item.bases().length * (item.labels() == null ? 1L : 2L);
                    if (bytes > cacheBytes) {
                        kept = null;
                    } else {
                        kept.add(item);
                    }
                }
                return item;
            }

            /** The records seen, or null when they did not fit. */
            List<CountItem> kept() {
                return kept == null ? null : List.copyOf(kept);
            }
        }
    }
}
