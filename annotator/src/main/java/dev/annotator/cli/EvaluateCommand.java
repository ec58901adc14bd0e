package dev.annotator.cli;

import dev.annotator.error.IoFailureException;
import dev.annotator.error.UsageException;
import dev.annotator.evaluate.AccuracyJson;
import dev.annotator.evaluate.AccuracyTable;
import dev.annotator.evaluate.Evaluation;
import dev.annotator.evaluate.GenbankTruth;
import dev.annotator.evaluate.FeatureSet;
import dev.annotator.evaluate.GeneComparison;
import dev.annotator.evaluate.StrandedGff3Reader;
import dev.annotator.evaluate.TruthFormat;
import dev.annotator.evaluate.TruthSource;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "evaluate", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Compare predicted features (such as CDS) with a reference annotation, strand by strand: "
                + "base-level sensitivity, specificity and approximate correlation, and feature-level exact, "
                + "3'-end, missed and wrong counts, per record and in total.",
        footerHeading = "%n",
        footer = {"Examples:",
                "  annotator evaluate --truth reference.gff3 --predicted predicted.gff3",
                "  annotator evaluate --truth ref.gff3.gz --predicted pred.gff3 \\",
                "      --format json -o accuracy.json",
                "  annotator evaluate --truth genome.gbk.gz --predicted genes.gff3",
                "",
                "Base level: every base counts once per strand; TP, FP, FN, TN count positions coding in both,",
                "only the predictions, only the reference, neither. Sn = TP/(TP+FN), Sp = TP/(TP+FP),",
                "AC = 2 (ACP - 0.5) with ACP the mean of TP/(TP+FN), TP/(TP+FP), TN/(TN+FP), TN/(TN+FN)",
                "over the terms with a non-zero denominator (Burset and Guigo, Genomics 34:353, 1996).",
                "Record lengths come from a GenBank reference's LOCUS lines or from ##sequence-region lines",
                "(the reference's first); without either, the furthest feature end stands in, and the",
                "output says so.",
                "",
                "Feature level: features of the type, once per distinct position and strand; each line of",
                "a multi-line (spliced) CDS is one feature. Exact: both ends and strand equal; 3'end: strand",
                "and downstream end equal (end on +, start on -); missed: a reference feature no prediction",
                "on its strand overlaps; wrong: a prediction no reference feature on its strand overlaps.",
                "",
                "JSON fields (--format json):",
                "  truth, predicted, feature_type: the inputs; records: one object per record;",
                "  total: counts summed over records, measures from those sums.",
                "  seqid, length, length_from (truth, predicted or furthest_feature): the record.",
                "  tp, fp, fn, tn: base-strand position counts as above.",
                "  sensitivity, specificity, approximate_correlation: Sn, Sp, AC (null if undefined).",
                "  truth_features, predicted_features: feature counts.",
                "  exact, three_prime, missed: counts; exact_percent, three_prime_percent,",
                "  missed_percent: as %% of truth_features; wrong, wrong_percent: count, %% of predicted.",
                "",
                Caution.TEXT})
final class EvaluateCommand implements Callable<Integer> {
    enum Format { table, json }

    @Spec
    CommandSpec spec;

    @ParentCommand
    AnnotatorCommand parent;

    @Option(names = "--truth", required = true, paramLabel = "REF",
            description = "Reference annotation: GFF3, or a GenBank flat file (its simple CDS; joined and partial CDS "
                    + "are left out), plain or gzip; - for standard input (GFF3).")
    String truth;

    @Option(names = "--predicted", required = true, paramLabel = "PRED.gff3",
            description = "Predicted features (GFF3, plain or gzip), or - for standard input.")
    String predicted;

    @Option(names = "--type", paramLabel = "TYPE", defaultValue = "CDS",
            description = "Feature type (GFF3 column 3) to compare (default: ${DEFAULT-VALUE}).")
    String type;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "table",
            description = "table (aligned text) or json (default: ${DEFAULT-VALUE}).")
    Format format;

    @Option(names = {"-o", "--output"}, paramLabel = "FILE",
            description = "Write the result here, or - for standard output (default).")
    String output;

    @Option(names = "--force", description = "Replace the output file if it exists (default: refuse).")
    boolean force;

    @Option(names = "--cds-parts", description = "GenBank reference: count each part of a joined (spliced) CDS as a "
            + "feature of its own, so its bases count as coding (default: joined CDS are left out, as in training).")
    boolean cdsParts;

    @Override
    public Integer call() {
        if ("-".equals(truth) && "-".equals(predicted)) {
            throw new ParameterException(spec.commandLine(), "--truth and --predicted cannot both be standard input");
        }
        if (type.isBlank()) {
            throw new ParameterException(spec.commandLine(), "--type cannot be empty");
        }
        List<String> inputs = new ArrayList<>(Arrays.asList(truth, predicted));
        inputs.remove("-");
        OutputTarget.refuseBeforeRun(inputs, Arrays.asList(output), force);

        StrandedGff3Reader gff3 = new StrandedGff3Reader(parent.streams().in());
        FeatureSet reference = truthSource(gff3).read(truth, type);
        FeatureSet predictions = gff3.read(predicted, type);
        Evaluation evaluation = GeneComparison.compare(reference, predictions);

        try (OutputTarget target = OutputTarget.open(output, parent.streams().out(), force)) {
            try {
                Writer w = new BufferedWriter(target.writer(), 1 << 16);
                if (format == Format.json) {
                    AccuracyJson.write(evaluation, type, w);
                } else {
                    AccuracyTable.write(evaluation, type, w);
                }
                w.flush();
                target.commit();
            } catch (IOException e) {
                throw new IoFailureException(target.name() + ": write failed (" + e.getMessage() + ")", e);
            }
        }
        return 0;
    }

    /** The reader for the reference file's format, told by its first line. */
    private TruthSource truthSource(StrandedGff3Reader gff3) {
        return switch (TruthFormat.detect(truth)) {
            case GFF3 -> gff3;
            case GENBANK -> new GenbankTruth(parent.streams().in(), cdsParts);
        };
    }
}
