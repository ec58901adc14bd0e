package dev.annotator.genes;

import dev.annotator.decode.Annotator;
import dev.annotator.decode.DecodeMethod;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.Segment;
import dev.annotator.evaluate.FeatureSet;
import dev.annotator.evaluate.GeneAccuracy;
import dev.annotator.evaluate.GeneComparison;
import dev.annotator.labels.StrandedFeature;
import dev.annotator.model.HmmModel;
import dev.annotator.pipeline.TrainingPipeline;
import dev.annotator.seq.FastaWriter;
import dev.annotator.seq.SequenceRecord;
import dev.annotator.train.Freeze;
import dev.annotator.train.RunStamp;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/** Training and predicting on stretches of a real genome through the library, as a pipeline would. */
final class GeneExperiment {
    static final RunStamp STAMP = new RunStamp("annotator test", "annotator train", "2026-12-02T00:00:00Z");

    /** A stretch of a genome: its bases and the reference genes lying wholly inside, in its own coordinates. */
    record Stretch(String seqid, String sequence, List<StrandedFeature> genes) {
        FeatureSet truth() {
            return new FeatureSet("reference", genes, Map.of(seqid, (long) sequence.length()));
        }
    }

    private GeneExperiment() {
    }

    /**
     * The two halves of a genome by its genes: the first half of the genes by start coordinate and the bases up to
     * the start of the first gene of the second half, and the rest. Genes crossing the cut belong to neither.
     */
    static Stretch[] halves(RealGenomes.Genome g) {
        List<StrandedFeature> genes = new ArrayList<>(g.truth().features());
        genes.sort((a, b) -> Long.compare(a.start(), b.start()));
        long cut = genes.get(genes.size() / 2).start() - 1; // bases 1..cut form the first half
        return new Stretch[]{stretch(g, 0, (int) cut, genes), stretch(g, (int) cut, g.sequence().length(), genes)};
    }

    static Stretch whole(RealGenomes.Genome g) {
        return stretch(g, 0, g.sequence().length(), g.truth().features());
    }

    private static Stretch stretch(RealGenomes.Genome g, int from, int to, List<StrandedFeature> genes) {
        List<StrandedFeature> inside = new ArrayList<>();
        for (StrandedFeature f : genes) {
            if (f.start() > from && f.end() <= to) {
                inside.add(new StrandedFeature(g.seqid(), f.start() - from, f.end() - from, f.strand()));
            }
        }
        return new Stretch(g.seqid(), g.sequence().substring(from, to), inside);
    }

    static Path writeFasta(Path dir, Stretch s) {
        Path p = dir.resolve(s.seqid() + "-" + s.sequence().length() + ".fa");
        try (FastaWriter w = new FastaWriter(Files.newOutputStream(p), true)) {
            w.write(new SequenceRecord(s.seqid(), "", s.sequence().getBytes(StandardCharsets.US_ASCII)));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return p;
    }

    static Path writeLabels(Path dir, Stretch s) {
        Path p = dir.resolve(s.seqid() + "-" + s.sequence().length() + ".gff3");
        try (Writer w = Files.newBufferedWriter(p, StandardCharsets.US_ASCII)) {
            w.write("##gff-version 3\n");
            for (StrandedFeature f : s.genes()) {
                w.write(s.seqid() + "\treference\tCDS\t" + f.start() + "\t" + f.end() + "\t.\t" + f.strand() + "\t0\t.\n");
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return p;
    }

    /** Counting along the stretch's genes, pseudocount 1 (the command's default). */
    static HmmModel count(HmmModel start, Path dir, Stretch s) {
        TrainingOptions options = new TrainingOptions(TrainingMethod.COUNTING, 1, 1, 0, 0, 1, Freeze.NONE);
        return new TrainingPipeline(start, start.name(), List.of(writeFasta(dir, s).toString()),
                writeLabels(dir, s).toString(), options, 2, w -> { }).train((r, rs, i, ll, g, n, t) -> { }, STAMP);
    }

    /** Baum-Welch without labels from {@code start}, with the command's defaults (pseudocount 1, tolerance 1e-6). */
    static HmmModel selfTrain(HmmModel start, Path dir, Stretch s, int maxIterations, Freeze freeze) {
        TrainingOptions options = new TrainingOptions(TrainingMethod.BAUM_WELCH, 1, maxIterations, 1e-6, 0, 1, freeze);
        return new TrainingPipeline(start, start.name(), List.of(writeFasta(dir, s).toString()), null, options, 2,
                w -> { }).train((r, rs, i, ll, g, n, t) -> { }, STAMP);
    }

    static List<Segment> decode(HmmModel model, Stretch s) {
        RecordAnnotation a = new Annotator(model, DecodeMethod.POSTERIOR_VITERBI, 0)
                .annotate(new SequenceRecord(s.seqid(), "", s.sequence().getBytes(StandardCharsets.US_ASCII)));
        return a.segments();
    }

    static List<StrandedFeature> genes(String seqid, List<Segment> segments) {
        List<StrandedFeature> out = new ArrayList<>();
        for (Segment seg : segments) {
            out.add(new StrandedFeature(seqid, seg.start(), seg.end(), seg.gene().strand()));
        }
        return out;
    }

    static GeneAccuracy accuracy(Stretch s, List<StrandedFeature> predicted) {
        return GeneComparison.compare(s.truth(), new FeatureSet("predicted", predicted,
                Map.of(s.seqid(), (long) s.sequence().length()))).total();
    }

    static GeneAccuracy baseline(Stretch s) {
        return accuracy(s, NaiveOrfBaseline.predict(s.seqid(), s.sequence(), 300));
    }

    static String figures(GeneAccuracy a) {
        return String.format(java.util.Locale.ROOT, "Sn %.4f Sp %.4f stop %.4f exact %.4f (truth %d, predicted %d)",
                a.sensitivity(), a.specificity(), a.threePrimePercent() / 100, a.exactPercent() / 100,
                a.truthFeatures(), a.predictedFeatures());
    }
}
