package dev.annotator.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ScopeType;

/** The top-level command: only lists the subcommands. */
@Command(name = "annotator",
        mixinStandardHelpOptions = true,
        versionProvider = VersionProvider.class,
        description = {
                "Annotates DNA with hidden Markov models: reads FASTA, decodes each record with a model "
                        + "(posterior or Viterbi), and writes GFF3 segments with per-segment confidence."},
        subcommands = {AnnotateCommand.class, SimulateCommand.class, TrainCommand.class, ModelCommand.class, ModelsCommand.class,
                DemoCommand.class, EvaluateCommand.class},
        footerHeading = "%n",
        footer = {
                "Examples:",
                "  annotator annotate -m cpg-island -o islands.gff3 genome.fa.gz",
                "  annotator demo",
                "",
                Caution.TEXT,
                "",
                "Exit status: 0 success, 2 bad command line or refused output (exists without --force, or "
                        + "is an input), 65 bad input data, 66 missing input, "
                        + "74 read/write failure, 70 internal error."})
public final class AnnotatorCommand implements java.util.concurrent.Callable<Integer> {

    private final Streams streams;

    AnnotatorCommand(Streams streams) {
        this.streams = streams;
    }

    Streams streams() {
        return streams;
    }

    @Option(names = "--debug", scope = ScopeType.INHERIT,
            description = "Print stack traces with errors (for reporting bugs).")
    boolean debug;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    /** Without a subcommand there is nothing to do: show the usage on stderr and fail as a usage error. */
    @Override
    public Integer call() {
        spec.commandLine().usage(spec.commandLine().getErr());
        return dev.annotator.error.ExitCodes.USAGE;
    }
}
