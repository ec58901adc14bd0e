package dev.annotator.pipeline;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.Segment;
import dev.annotator.evaluate.ComparisonResult;
import dev.annotator.evaluate.Interval;
import dev.annotator.evaluate.IntervalComparison;
import dev.annotator.gff.FeatureIdAllocator;
import dev.annotator.gff.Gff3Writer;
import dev.annotator.gff.SegmentFeatures;
import dev.annotator.io.AtomicOutputFile;
import dev.annotator.model.HmmModel;
import dev.annotator.seq.FastaWriter;
import dev.annotator.simulate.PlantedSegment;
import dev.annotator.simulate.SimulatedRecord;

import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The demo: a screening lab checks a batch of synthetic expression constructs and one simulated contig for
 * CpG-rich stretches. Everything is generated here from the shipped island model with a fixed seed (no real
 * sequence is involved), annotated through the same pipeline as {@code annotate}, and scored against the
 * planted truth.
 *
 * <p>Calls shorter than {@link #MIN_LENGTH} bases are dropped, and only planted islands of at least that length
 * are counted: 200 bp is the minimum island length of Gardiner-Garden &amp; Frommer (1987).
 */
public final class DemoScenario {
    public static final long SEED = 20261201L;
    public static final int MIN_LENGTH = 200;
    static final int[] LENGTHS = {4_800, 6_200, 7_500, 9_100, 12_000, 15_500, 22_000, 38_000, 1_500_000};

    private final HmmModel model;

    public DemoScenario(HmmModel model) {
        this.model = model;
    }

    /** One line of the demo table. */
    public record Row(String record, int length, ComparisonResult comparison) {
    }

    /** The demo's result: per record rows, the pooled total, and the files written. */
    public record Report(List<Row> rows, ComparisonResult total, Path fasta, Path truth, Path predicted,
                         RunSummary run) {
    }

    public Report run(Path dir, int threads) throws IOException {
        Files.createDirectories(dir);
        Path fasta = dir.resolve("screening-batch.fa");
        Path truth = dir.resolve("screening-batch.truth.gff3");
        Path predicted = dir.resolve("screening-batch.predicted.gff3");
        String island = model.reportedLabels().get(0).name();

        List<SimulatedRecord> records = new ArrayList<>();
        int[] lengths = LENGTHS.clone();
        try (AtomicOutputFile fastaOut = AtomicOutputFile.create(fasta);
             AtomicOutputFile truthOut = AtomicOutputFile.create(truth)) {
            FastaWriter fastaWriter = new FastaWriter(fastaOut.stream());
            Writer truthText = new OutputStreamWriter(truthOut.stream(), StandardCharsets.UTF_8);
            Gff3Writer truthWriter = new Gff3Writer(truthText);
            truthWriter.writeHeader();
            SegmentFeatures features = new SegmentFeatures(model.labels());
            FeatureIdAllocator ids = new FeatureIdAllocator();
            List<String> names = new ArrayList<>();
            for (int i = 1; i < lengths.length; i++) {
                names.add(String.format(java.util.Locale.ROOT, "construct%02d", i));
            }
            names.add("contig01");
            records.addAll(new SimulationRun(model).sample(names, lengths, SEED));
            for (SimulatedRecord r : records) {
                fastaWriter.write(r.record());
                SimulationRun.writeTruth(truthWriter, features, ids, r);
            }
            fastaWriter.flush();
            truthText.flush();
            fastaOut.commit();
            truthOut.commit();
        }

        List<RecordAnnotation> annotations = new ArrayList<>();
        RunSummary summary;
        AnnotationPipeline pipeline = new AnnotationPipeline(model,
                new AnnotationOptions(DecodeMethod.POSTERIOR, MIN_LENGTH, threads));
        try (AtomicOutputFile out = AtomicOutputFile.create(predicted)) {
            Writer text = new OutputStreamWriter(out.stream(), StandardCharsets.UTF_8);
            summary = pipeline.run(fasta.toString(), java.io.InputStream.nullInputStream(), text,
                    predicted.toString(), w -> { }, annotations::add);
            text.flush();
            out.commit();
        }

        List<Row> rows = new ArrayList<>();
        List<Interval> allPlanted = new ArrayList<>();
        List<Interval> allCalled = new ArrayList<>();
        long offset = 0;
        for (int i = 0; i < records.size(); i++) {
            SimulatedRecord r = records.get(i);
            List<Interval> planted = new ArrayList<>();
            for (PlantedSegment p : r.planted()) {
                if (p.label().equals(island) && p.length() >= MIN_LENGTH) {
                    planted.add(new Interval(p.start(), p.end()));
                    allPlanted.add(new Interval(offset + p.start(), offset + p.end()));
                }
            }
            List<Interval> called = new ArrayList<>();
            for (Segment s : annotations.get(i).segments()) {
                if (s.label().equals(island)) {
                    called.add(new Interval(s.start(), s.end()));
                    allCalled.add(new Interval(offset + s.start(), offset + s.end()));
                }
            }
            rows.add(new Row(r.record().name(), r.record().length(), IntervalComparison.compare(planted, called)));
            // records laid end to end with a gap, so the pooled comparison never pairs across records
            offset += r.record().length() + 1L;
        }
        return new Report(rows, IntervalComparison.compare(allPlanted, allCalled), fasta, truth, predicted, summary);
    }
}
