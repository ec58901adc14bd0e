package dev.annotator.cli;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.decode.GeneStarts;
import dev.annotator.decode.ProfileOptions;
import dev.annotator.error.IoFailureException;
import dev.annotator.io.InputChecksum;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.AnnotationOptions;
import dev.annotator.pipeline.AnnotationPipeline;
import dev.annotator.pipeline.InputFingerprints;
import dev.annotator.pipeline.ProgressReporter;
import dev.annotator.pipeline.RunSummary;
import dev.annotator.report.HtmlReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

@Command(name = "annotate", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Decode every record of a FASTA (or GenBank) file with a model and write the called segments "
                + "as GFF3.",
        footerHeading = "%n",
        footer = {
                "Examples:",
                "  annotator annotate -m cpg-island -o islands.gff3 contigs.fa",
                "  zcat assembly.fa.gz | annotator annotate -m cpg-island --min-length 200 - \\",
                "      > islands.gff3",
                "  annotator annotate -m my-model.json --decode viterbi --threads 2 \\",
                "      -o calls.gff3 genome.fa.gz",
                "  annotator annotate -m bacterial-genes -o genes.gff3 phage.fa",
                "",
                "Segments: with posterior decoding, maximal runs where a reported label's posterior exceeds 0.5; "
                        + "with Viterbi, runs of the label on the most probable path; with posterior-Viterbi, runs on "
                        + "the allowed path of largest summed posterior. Score = mean posterior.",
                "Gene models (labels with a strand): each strand is decoded on its own, so genes on opposite strands "
                        + "may overlap; each gene is written as a gene with a child CDS (start and stop codons "
                        + "included, phase, start_codon, partial=5'/3' where it runs off a record end).",
                "",
                Caution.TEXT})
final class AnnotateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @ParentCommand
    AnnotatorCommand parent;

    @Option(names = {"-m", "--model"}, required = true, paramLabel = "MODEL",
            description = "Model file (JSON) or the name of a shipped model (see 'annotator models').")
    String model;

    @Option(names = {"-o", "--output"}, paramLabel = "OUT.gff3",
            description = "GFF3 output file (default: standard output). Written only if the run succeeds.")
    String output;

    @Option(names = "--force", description = "Replace the output file if it exists (default: refuse).")
    boolean force;

    @Option(names = "--decode", paramLabel = "METHOD", converter = DecodeMethodConverter.class,
            description = "posterior, viterbi or posterior-viterbi (the allowed path of largest summed posterior). "
                    + "Default: posterior-viterbi for models with a label of several states (gene models), else "
                    + "posterior.")
    DecodeMethod decode;

    @Option(names = "--gene-starts", paramLabel = "RULE", defaultValue = "likeliest-start",
            converter = GeneStartsConverter.class,
            description = "Gene models: where a gene starts within its open reading frame. likeliest-start (default): "
                    + "the 5'-most of the likeliest start codons (by the model's start-codon frequencies) between "
                    + "the frame's first start codon and the decoded start; longest-orf: the frame's first start "
                    + "codon; decoded: the start the decoded path gives.")
    GeneStarts geneStarts;

    @Option(names = "--min-length", paramLabel = "BP", defaultValue = "0",
            description = "Drop segments shorter than BP bases (default: ${DEFAULT-VALUE}).")
    int minLength;

    @Option(names = "--threads", paramLabel = "N",
            description = "Records decoded in parallel (default: number of processors). Output is identical for any N.")
    Integer threads;

    @Option(names = "--id-prefix", paramLabel = "TEXT", defaultValue = "",
            description = "Put TEXT before every feature ID, so GFF3 files of separately annotated shards of one "
                    + "genome can be concatenated with unique IDs.")
    String idPrefix;

    @Option(names = "--summary", paramLabel = "OUT.tsv",
            description = "Also write one tab-separated row per record (length, GC, CpG o/e, N fraction, and per "
                    + "label segments, bases covered, longest segment, mean and lowest confidence, log-odds in bits "
                    + "per base).")
    String summary;

    @Option(names = "--posterior-track", paramLabel = "OUT.bedgraph",
            description = "Also write the posterior of one label along every record as a bedGraph track "
                    + "(gzipped when the name ends in .gz).")
    String posteriorTrack;

    @Option(names = "--track-label", paramLabel = "LABEL",
            description = "The label the track and the report's plots follow (default: the model's first reported label).")
    String trackLabel;

    @Option(names = "--track-step", paramLabel = "BP", defaultValue = "1",
            description = "1 (default): per-base values, neighbours equal at 3 decimals merged; larger: the mean "
                    + "posterior of each BP-base bin.")
    int trackStep;

    @Option(names = "--report", paramLabel = "OUT.html",
            description = "Also write a self-contained HTML report: run summary, a sortable table of records with "
                    + "flags, posterior plots of the first 50 records, histograms of segment length and confidence.")
    String report;

    @Option(names = {"-q", "--quiet"}, description = "Print nothing on standard error except errors and warnings.")
    boolean quiet;

    @Option(names = "--progress", paramLabel = "MODE", defaultValue = "auto",
            description = "auto (a bar when standard error is a terminal, else nothing), bar, log (a line every "
                    + "10 s, for logs) or none.")
    String progress;

    @Parameters(paramLabel = "INPUT", description = "FASTA file, plain or gzipped, or - for standard input.")
    String input;

    private ProgressReporter reporter(PrintWriter err) {
        String mode = progress.toLowerCase(Locale.ROOT);
        if (!List.of("auto", "bar", "log", "none").contains(mode)) {
            throw new ParameterException(spec.commandLine(),
                    "--progress must be auto, bar, log or none, got '" + progress + "'");
        }
        if (quiet || mode.equals("none")) {
            return null;
        }
        if (mode.equals("log")) {
            return new LogProgressLines(err, 10_000);
        }
        boolean terminal = TerminalProgressBar.stderrIsTerminal();
        return mode.equals("bar") || terminal ? new TerminalProgressBar(System.err) : null;
    }

    @Override
    public Integer call() throws IOException {
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1) {
            throw new ParameterException(spec.commandLine(), "--threads must be at least 1, got " + n);
        }
        if (minLength < 0) {
            throw new ParameterException(spec.commandLine(), "--min-length must not be negative, got " + minLength);
        }
        for (String side : Arrays.asList(summary, posteriorTrack, report)) {
            if ("-".equals(side)) {
                throw new ParameterException(spec.commandLine(),
                        "only the GFF3 can go to standard output; name a file for the other outputs");
            }
        }
        OutputTarget.refuseBeforeRun(List.of(input, model), Arrays.asList(output, summary, posteriorTrack, report), force);
        if (trackStep < 1) {
            throw new ParameterException(spec.commandLine(), "--track-step must be at least 1, got " + trackStep);
        }
        ProgressReporter reporter = reporter(parent.streams().err());
        HmmModel hmm = ModelLoader.load(model);
        PrintWriter err = parent.streams().err();
        List<String> reported = hmm.reportedLabels().stream().map(Label::name).toList();
        if (trackLabel != null && !reported.contains(trackLabel)) {
            throw new ParameterException(spec.commandLine(), "--track-label " + trackLabel
                    + " is not a reported label of model " + hmm.name() + " (reported: " + String.join(", ", reported) + ")");
        }
        String label = trackLabel == null ? reported.get(0) : trackLabel;
        ProfileOptions profile = new ProfileOptions(label, trackStep, posteriorTrack != null,
                summary != null || report != null, report != null ? HtmlReport.PLOT_POINTS : 0,
                summary != null, HtmlReport.PLOTTED);
        List<InputChecksum> checksums = new ArrayList<>();
        if (report != null) {
            if (Files.isRegularFile(Path.of(model))) {
                checksums.add(InputFingerprints.checksumOf(model));
            }
        }
        AnnotationPipeline pipeline = new AnnotationPipeline(hmm,
                new AnnotationOptions(decode == null ? DecodeMethod.defaultFor(hmm) : decode, minLength, n, idPrefix,
                        profile, geneStarts));
        RunSummary run;
        try (OutputTarget out = OutputTarget.open(output, parent.streams().out(), force);
             SideOutputs side = SideOutputs.open(hmm, summary, posteriorTrack, label, trackStep, report, force)) {
            run = pipeline.run(input, parent.streams().in(), out.writer(), out.name(),
                    w -> err.println("annotator: warning: " + w), side::record, reporter);
            if (run.inputChecksum() != null) {
                checksums.add(0, run.inputChecksum());
            }
            side.finishReport(checksums, "-".equals(input) ? "standard input" : input,
                    String.join(" ", spec.commandLine().getParseResult().originalArgs()), run.seconds());
            side.commit();
            try {
                out.commit();
            } catch (IOException e) {
                throw new IoFailureException(out.name() + ": write failed (" + e.getMessage() + ")", e);
            }
        }
        RunSummary summary = run;
        if (!quiet) {
            // a gene model's features are genes (each written as a gene and its CDS)
            String features = hmm.labels().stream().anyMatch(dev.annotator.model.Label::stranded) ? "gene(s)"
                    : "segment(s)";
            err.println(String.format(Locale.ROOT, "annotator: %d record(s), %.3f Mbp, %d %s in %.2f s (%.1f Mbp/s)",
                    summary.records(), summary.bases() / 1e6, summary.segments(), features, summary.seconds(),
                    summary.megabasesPerSecond()));
        }
        return 0;
    }
}
