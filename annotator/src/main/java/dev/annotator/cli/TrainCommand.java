package dev.annotator.cli;

import dev.annotator.error.BadInputException;
import dev.annotator.error.IoFailureException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelJson;
import dev.annotator.model.ModelLoader;
import dev.annotator.model.ModelValidator;
import dev.annotator.pipeline.CountsMerge;
import dev.annotator.pipeline.TrainingPipeline;
import dev.annotator.train.CountsJson;
import dev.annotator.train.ShardCounts;
import dev.annotator.train.Freeze;
import dev.annotator.train.IterationProgress;
import dev.annotator.train.RunStamp;
import dev.annotator.train.TrainingMethod;
import dev.annotator.train.TrainingOptions;
import picocli.CommandLine.Command;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ParseResult;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;
import picocli.CommandLine.TypeConversionException;

import java.io.IOException;
import java.io.PrintWriter;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

@Command(name = "train", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Fit a model's probabilities to sequence: by counting along known labels, or by Baum-Welch "
                + "(with or without labels). The model's states, labels and allowed transitions stay as they are; "
                + "the written model records how it was trained (model check prints it)."},
        footerHeading = "%n",
        footer = {
                "Examples:",
                "  annotator train -m cpg-island --method counting --labels known.gff3 \\",
                "      -o counted.json genome.fa.gz",
                "  annotator train -m cpg-island --method baum-welch --threads 2 \\",
                "      -o fitted.json contigs.fa",
                "  annotator train -m my-model.json --method baum-welch --restarts 4 --seed 7 \\",
                "      --freeze transitions -o fitted.json a.fa b.fa",
                "  annotator train -m m0.json --method baum-welch --emit-counts p1.counts.json \\",
                "      part1.fa",
                "  annotator train -m m0.json --merge-counts p1.counts.json p2.counts.json \\",
                "      -o m1.json",
                "  annotator train -m start.json --method counting --labels relative.gbk \\",
                "      -o genes.json relative.gbk",
                "",
                "Progress: one line per iteration on standard error (log-likelihood, gain, seconds).",
                "",
                Caution.TEXT})
final class TrainCommand implements Callable<Integer> {
    /** Options that cannot change the trained numbers; left out of the command line the model records. */
    private static final List<String> RESULT_NEUTRAL_FLAGS = List.of("-q", "--quiet", "--debug", "--force");
    private static final List<String> RESULT_NEUTRAL_WITH_VALUE = List.of("--threads");

    @Spec
    CommandSpec spec;

    @ParentCommand
    AnnotatorCommand parent;

    @Option(names = {"-m", "--model"}, required = true, paramLabel = "START_MODEL",
            description = "Model to start from: a model file (JSON) or the name of a shipped model.")
    String model;

    @Option(names = "--method", paramLabel = "METHOD", converter = MethodConverter.class,
            description = "counting (needs --labels, and one state per label or a gene model) or baum-welch.")
    TrainingMethod method;

    @Option(names = {"-o", "--output"}, paramLabel = "OUT_MODEL.json",
            description = "Where to write the trained model (- for standard output). Written only if the run succeeds.")
    String output;

    @Option(names = "--labels", paramLabel = "TRUTH",
            description = "Known features, GFF3 or the CDS of a GenBank file: bases inside a feature whose type is a "
                    + "label's feature type (for a gene model: CDS on the label's strand) get that label, all others "
                    + "the background label. Baum-Welch keeps each base in its label's states. Input files may be "
                    + "FASTA or GenBank.")
    String labels;

    @Option(names = "--pseudocount", paramLabel = "X", defaultValue = "1",
            description = "Added to every expected count of a probability that is not zero (default: ${DEFAULT-VALUE});"
                    + " zeros (unlisted transitions, zero emissions) stay zero.")
    double pseudocount;

    @Option(names = "--max-iter", paramLabel = "N", defaultValue = "100",
            description = "Baum-Welch iterations at most (default: ${DEFAULT-VALUE}).")
    int maxIterations;

    @Option(names = "--tolerance", paramLabel = "T", defaultValue = "1e-6",
            description = "Stop when the log-likelihood gain per base falls below T (default: ${DEFAULT-VALUE}).")
    double tolerance;

    @Option(names = "--restarts", paramLabel = "R", defaultValue = "0",
            description = "Also run Baum-Welch from R random perturbations of the start model and keep the run of "
                    + "highest log-likelihood (default: ${DEFAULT-VALUE}).")
    int restarts;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1",
            description = "Seed of the perturbations (default: ${DEFAULT-VALUE}); the same seed gives the same model.")
    long seed;

    @Option(names = "--freeze", paramLabel = "PART", converter = FreezeConverter.class,
            description = "transitions (keep start and transition probabilities, train emissions) or emissions "
                    + "(keep emissions, train the rest).")
    Freeze freeze;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads (default: number of processors). The trained model is identical for any N.")
    Integer threads;

    @Option(names = "--emit-counts", paramLabel = "SHARD.counts.json",
            description = "Write the expected counts of one E-step on these inputs instead of a model: one shard of a "
                    + "sharded iteration.")
    String emitCounts;

    @Option(names = "--merge-counts", paramLabel = "SHARD.counts.json", arity = "1..*",
            description = "Add up shard count files made with START_MODEL and write the re-estimated model "
                    + "(the M-step of a sharded iteration); takes no INPUT.")
    List<String> mergeCounts;

    @Option(names = "--force", description = "Replace an output file that exists (default: refuse).")
    boolean force;

    @Option(names = {"-q", "--quiet"}, description = "Print nothing on standard error except errors.")
    boolean quiet;

    @Parameters(paramLabel = "INPUT.fa", arity = "0..*", description = "FASTA files, plain or gzipped.")
    List<String> inputs = new ArrayList<>();

    @Override
    public Integer call() {
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        require(n >= 1, "--threads must be at least 1, got " + n);
        require(pseudocount >= 0 && Double.isFinite(pseudocount),
                "--pseudocount must be a finite number of at least 0, got " + pseudocount);
        require(maxIterations >= 0, "--max-iter must not be negative, got " + maxIterations);
        require(tolerance >= 0 && Double.isFinite(tolerance),
                "--tolerance must be a finite number of at least 0, got " + tolerance);
        require(restarts >= 0, "--restarts must not be negative, got " + restarts);
        if (mergeCounts != null) {
            List<String> read = new ArrayList<>(mergeCounts);
            read.add(model);
            OutputTarget.refuseBeforeRun(read, Collections.singletonList(output), force);
            return merge();
        }
        require(method != null, "--method is required (counting or baum-welch)");
        require(output != null || emitCounts != null, "-o or --emit-counts is required");
        require(output == null || emitCounts == null, "-o and --emit-counts exclude each other: a shard writes counts, "
                + "not a model");
        require(emitCounts == null || restarts == 0, "--restarts does not apply to --emit-counts (one E-step)");
        require(!inputs.isEmpty(), "no INPUT.fa given");
        require(!inputs.contains("-"), "train reads its inputs more than once and records their SHA-256; "
                + "give FASTA files, not standard input (-)");
        if (method == TrainingMethod.COUNTING) {
            require(labels != null, "--method counting needs --labels");
            require(restarts == 0, "--restarts applies to --method baum-welch only");
        }

        List<String> read = new ArrayList<>(inputs);
        read.add(model);
        if (labels != null) {
            read.add(labels);
        }
        OutputTarget.refuseBeforeRun(read, Arrays.asList(output, emitCounts), force);
        TrainingOptions options = new TrainingOptions(method, pseudocount, maxIterations, tolerance, restarts, seed,
                freeze == null ? Freeze.NONE : freeze);
        HmmModel start = ModelLoader.load(model);
        PrintWriter err = parent.streams().err();
        TrainingPipeline pipeline = new TrainingPipeline(start, model, inputs, labels, options, n,
                w -> err.println("annotator: warning: " + w));
        if (emitCounts != null) {
            return emit(pipeline, start, err);
        }
        try (OutputTarget out = OutputTarget.open(output, parent.streams().out(), force)) {
            HmmModel trained = pipeline.train(quiet ? (r, rs, i, ll, g, b, s) -> { } : progress(err), stamp());
            validate(trained, out.name());
            ModelJson.write(trained, out.stream());
            commit(out);
            if (!quiet) {
                var t = trained.provenance().training();
                err.println(String.format(Locale.ROOT, "annotator: wrote %s: %s, %d iteration(s)%s, "
                                + "log-likelihood %.6f", out.name(), t.method(), t.iterations(),
                        t.converged() == null ? "" : t.converged() ? ", converged" : ", not converged",
                        t.logLikelihood()));
            }
        }
        return 0;
    }

    private int emit(TrainingPipeline pipeline, HmmModel start, PrintWriter err) {
        long t0 = System.nanoTime();
        try (OutputTarget out = OutputTarget.open(emitCounts, parent.streams().out(), force)) {
            ShardCounts shard = pipeline.countShard();
            CountsJson.write(shard, start, out.stream());
            commit(out);
            if (!quiet) {
                err.println(String.format(Locale.ROOT, "annotator: wrote %s: counts of %d record(s), %.3f Mbp, "
                                + "log-likelihood %.6f, %.2f s", out.name(), shard.counts().records(),
                        shard.counts().bases() / 1e6, shard.counts().logLikelihood(), (System.nanoTime() - t0) / 1e9));
            }
        }
        return 0;
    }

    private int merge() {
        ParseResult parsed = spec.commandLine().getParseResult();
        for (String notHere : List.of("--labels", "--emit-counts", "--restarts", "--max-iter")) {
            require(!parsed.hasMatchedOption(notHere), notHere + " does not apply to --merge-counts");
        }
        require(inputs.isEmpty(), "--merge-counts takes count files, not INPUT.fa files");
        require(output != null, "-o is required");
        HmmModel start = ModelLoader.load(model);
        TrainingOptions options = new TrainingOptions(method == null ? TrainingMethod.BAUM_WELCH : method,
                pseudocount, maxIterations, tolerance, 0, seed, freeze == null ? Freeze.NONE : freeze);
        PrintWriter err = parent.streams().err();
        try (OutputTarget out = OutputTarget.open(output, parent.streams().out(), force)) {
            CountsMerge.Outcome m = new CountsMerge(start, options).merge(mergeCounts, method, stamp());
            validate(m.model(), out.name());
            ModelJson.write(m.model(), out.stream());
            commit(out);
            if (!quiet) {
                String gain = Double.isNaN(m.gain()) ? "" : String.format(Locale.ROOT, ", gain %.6f (%.3g per base)",
                        m.gain(), m.gain() / Math.max(1, m.bases()));
                err.println(String.format(Locale.ROOT, "annotator: merged %d shard(s), iteration %d: log-likelihood "
                                + "of %s %.6f%s%s; wrote %s", m.shards(), m.iteration(), model, m.startLogLikelihood(),
                        gain, m.converged() ? ", converged" : "", out.name()));
            }
        }
        return 0;
    }

    private static void commit(OutputTarget out) {
        try {
            out.commit();
        } catch (IOException e) {
            throw new IoFailureException(out.name() + ": write failed (" + e.getMessage() + ")", e);
        }
    }

    /** A trained model must read back: with --pseudocount 0 a state can lose every way in. */
    private void validate(HmmModel trained, String outName) {
        try {
            ModelValidator.validate(trained, outName);
        } catch (BadInputException e) {
            throw new BadInputException(e.getMessage() + (pseudocount == 0
                    ? " (after training with --pseudocount 0; a positive pseudocount keeps every allowed probability "
                    + "above 0)" : ""));
        }
    }

    private IterationProgress progress(PrintWriter err) {
        return (run, runs, iteration, logLik, gain, bases, seconds) -> {
            String prefix = runs > 1 ? "annotator: run " + (run + 1) + " of " + runs + ", " : "annotator: ";
            if (method == TrainingMethod.COUNTING) {
                err.println(String.format(Locale.ROOT, "annotator: counting: log-likelihood %.6f (start model %.6f), "
                        + "%.2f s", logLik, logLik - gain, seconds));
            } else if (iteration == 0) {
                err.println(String.format(Locale.ROOT, "%siteration 0 (start model): log-likelihood %.6f, %.2f s",
                        prefix, logLik, seconds));
            } else {
                err.println(String.format(Locale.ROOT, "%siteration %d: log-likelihood %.6f, gain %.6f "
                        + "(%.3g per base), %.2f s", prefix, iteration, logLik, gain, gain / Math.max(1, bases), seconds));
            }
        };
    }

    /** Tool, command line and date for the model's provenance. */
    private RunStamp stamp() {
        return new RunStamp("annotator " + VersionProvider.version(), "annotator train "
                + recordedArguments(spec.commandLine().getParseResult().originalArgs()), date());
    }

    /** The arguments after "train", without options that cannot change the result, quoted for a shell. */
    static String recordedArguments(List<String> original) {
        int from = original.indexOf("train") + 1;
        List<String> kept = new ArrayList<>();
        for (int i = from; i < original.size(); i++) {
            String a = original.get(i);
            if (RESULT_NEUTRAL_FLAGS.contains(a)) {
                continue;
            }
            if (RESULT_NEUTRAL_WITH_VALUE.contains(a)) {
                i++;
                continue;
            }
            if (RESULT_NEUTRAL_WITH_VALUE.stream().anyMatch(o -> a.startsWith(o + "="))) {
                continue;
            }
            kept.add(shellQuoted(a));
        }
        return String.join(" ", kept);
    }

    private static String shellQuoted(String a) {
        if (!a.isEmpty() && a.chars().allMatch(c -> Character.isLetterOrDigit(c) || "_./:=@%+,-".indexOf(c) >= 0)) {
            return a;
        }
        return "'" + a.replace("'", "'\\''") + "'";
    }

    /**
     * Now, or the time in SOURCE_DATE_EPOCH when it is set: the reproducible-builds.org convention for fixing
     * timestamps, so that a rerun can give the same file byte for byte.
     */
    static String date() {
        Instant when = Instant.now();
        String epoch = System.getenv("SOURCE_DATE_EPOCH");
        if (epoch != null) {
            try {
                when = Instant.ofEpochSecond(Long.parseLong(epoch.trim()));
            } catch (NumberFormatException | java.time.DateTimeException ignored) {
                // not a number of seconds: the convention says to ignore it
            }
        }
        return when.truncatedTo(ChronoUnit.SECONDS).toString();
    }

    private void require(boolean ok, String message) {
        if (!ok) {
            throw new ParameterException(spec.commandLine(), message);
        }
    }

    /** Reads --method in the spelling the help shows. */
    static final class MethodConverter implements ITypeConverter<TrainingMethod> {
        @Override
        public TrainingMethod convert(String value) {
            TrainingMethod m = TrainingMethod.of(value);
            if (m == null) {
                throw new TypeConversionException("expected counting or baum-welch, got '" + value + "'");
            }
            return m;
        }
    }

    /** Reads --freeze in the spelling the help shows. */
    static final class FreezeConverter implements ITypeConverter<Freeze> {
        @Override
        public Freeze convert(String value) {
            return switch (value.toLowerCase(Locale.ROOT)) {
                case "transitions" -> Freeze.TRANSITIONS;
                case "emissions" -> Freeze.EMISSIONS;
                default -> throw new TypeConversionException("expected transitions or emissions, got '" + value + "'");
            };
        }
    }
}
