package dev.annotator.pipeline;

import dev.annotator.decode.Annotator;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.gff.FeatureIdAllocator;
import dev.annotator.gff.Gff3Feature;
import dev.annotator.gff.Gff3Writer;
import dev.annotator.gff.SegmentFeatures;
import dev.annotator.hmm.ImpossibleSequenceException;
import dev.annotator.io.InputOpener;
import dev.annotator.model.HmmModel;
import dev.annotator.parallel.OrderedParallelMap;
import dev.annotator.seq.SequenceFiles;
import dev.annotator.seq.SequenceReader;
import dev.annotator.seq.SequenceRecord;

import java.io.IOException;
import java.io.InputStream;
import java.io.Writer;
import java.util.function.Consumer;

/**
 * FASTA in, GFF3 out: reads records one at a time, decodes them on {@code threads} threads, and writes their
 * segments in input order. The library form of {@code annotator annotate}.
 */
public final class AnnotationPipeline {
    private final HmmModel model;
    private final AnnotationOptions options;
    private final Annotator annotator;
    private final SegmentFeatures features;

    /** A record and the annotator it gets. */
    private record Job(SequenceRecord record, Annotator annotator) {
    }

    public AnnotationPipeline(HmmModel model, AnnotationOptions options) {
        this.model = model;
        this.options = options;
        this.annotator = new Annotator(model, options.method(), options.minLength(), Annotator.WINDOW, options.profile(),
                options.starts());
        this.features = new SegmentFeatures(model.labels());
    }

    /**
     * @param input      a FASTA path (plain or gzipped) or "-" for {@code stdin}
     * @param gff        where the GFF3 goes; flushed, not closed
     * @param outputName how to name the output in error messages
     * @param warnings   receives one-line warnings (skipped empty records)
     * @param progress   receives each finished record in input order, before its GFF3 lines are written (side
     *                   outputs, progress display); may ignore it
     */
    public RunSummary run(String input, InputStream stdin, Writer gff, String outputName, Consumer<String> warnings,
                          Consumer<RecordAnnotation> progress) {
        return run(input, stdin, gff, outputName, warnings, progress, null);
    }

    /**
     * As above, and shows progress through {@code reporter} (null for none) while the run lasts.
     */
    public RunSummary run(String input, InputStream stdin, Writer gff, String outputName, Consumer<String> warnings,
                          Consumer<RecordAnnotation> progress, ProgressReporter reporter) {
        long started = System.nanoTime();
        String inputName = InputOpener.displayName(input);
        Gff3Writer writer = new Gff3Writer(gff);
        FeatureIdAllocator ids = new FeatureIdAllocator(options.idPrefix());
        long[] bases = {0};
        int[] counts = {0, 0};
        Consumer<RecordAnnotation> sink = annotation -> {
            // the caller's consumer first: side outputs that work on threads of their own (the report draws its
            // plots) then run beside the writing of this record's GFF3
            progress.accept(annotation);
            try {
                writer.writeSequenceRegion(annotation.seqid(), annotation.length());
                for (Gff3Feature f : features.called(annotation, ids)) {
                    writer.writeFeature(f);
                }
            } catch (IOException e) {
                throw new IoFailureException(outputName + ": write failed (" + e.getMessage() + ")", e);
            }
            bases[0] += annotation.length();
            counts[0]++;
            counts[1] += annotation.segments().size();
        };
        ProgressTracker tracker = reporter == null ? null : new ProgressTracker(reporter, inputSize(input));
        // a report names its input by size and CRC-32, taken from the bytes as they are parsed: one pass
        StreamChecksum checksum = options.profile().plotPoints() > 0 ? new StreamChecksum() : null;
        dev.annotator.io.RawInputObserver observer = tracker == null ? checksum
                : checksum == null ? tracker : tracker.andThen(checksum);
        MemoryBudget budget = MemoryBudget.ofThisJvm(annotator.pathBytesPerBase(), annotator.widestBackPointerRow(),
                model.reportedLabels().size(), options.method(), annotator.pathsAtOnce());
        // with a second thread allowed, gzip input is inflated on it while the first parses (a long record's read
        // is otherwise the one stretch that leaves a core idle)
        try (SequenceReader reader = SequenceFiles.open(input, stdin, warnings, budget.recordLimit(), observer,
                options.threads() > 1);
             OrderedParallelMap<Job, RecordAnnotation> map = new OrderedParallelMap<>(options.threads(),
                     job -> decode(job, inputName, tracker), sink, job -> job.record().length(),
                     budget.basesInFlight())) {
            writer.writeHeader();
            SequenceRecord record;
            long index = 0;
            // records past the plotted ones (in input order) are decoded without plot bins, by an annotator made
            // when the first of them comes (a gene model's takes a moment to build; one record never needs it)
            Annotator unplotted = null;
            while ((record = reader.next()) != null) {
                if (tracker != null) {
                    tracker.recordRead(record.length());
                }
                Annotator use = annotator;
                if (options.profile().plotsSomeRecordsOnly() && index >= options.profile().plotted()) {
                    if (unplotted == null) {
                        unplotted = new Annotator(model, options.method(), options.minLength(), Annotator.WINDOW,
                                options.profile().withoutPlot(), options.starts());
                    }
                    use = unplotted;
                }
                map.submit(new Job(record, use));
                index++;
            }
            if (tracker != null) {
                tracker.readingFinished();
            }
            map.finish();
            writer.flush();
        } catch (IOException e) {
            throw new IoFailureException(outputName + ": write failed (" + e.getMessage() + ")", e);
        } finally {
            if (tracker != null) {
                tracker.close();
            }
        }
        return new RunSummary(counts[0], bases[0], counts[1], (System.nanoTime() - started) / 1e9,
                checksum == null ? null : checksum.finish(inputName));
    }

    private static long inputSize(String input) {
        try {
            return InputOpener.STDIN.equals(input) ? -1 : java.nio.file.Files.size(java.nio.file.Path.of(input));
        } catch (IOException | RuntimeException e) {
            return -1;
        }
    }

    private RecordAnnotation decode(Job job, String inputName, ProgressTracker tracker) {
        SequenceRecord record = job.record();
        Annotator annotator = job.annotator();
        try {
            return tracker == null ? annotator.annotate(record) : annotator.annotate(record, tracker::decoded);
        } catch (ImpossibleSequenceException e) {
            throw new BadInputException(inputName + ": record " + record.name() + ": model " + model.name()
                    + " cannot emit this sequence (probability 0 at base " + (e.position() + 1) + ")");
        }
    }
}
