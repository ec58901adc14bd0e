package dev.annotator.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ScopeType;

import java.util.List;

/** The top-level command: only lists the subcommands. */
@Command(name = "annotator",
        mixinStandardHelpOptions = true,
        versionProvider = VersionProvider.class,
        description = {
                "Annotates DNA with hidden Markov models: reads FASTA, decodes each record with a model "
                        + "(posterior or Viterbi), and writes GFF3 segments with per-segment confidence."},
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
    /** The subcommands, in the order the help lists them. */
    private static final List<Class<?>> SUBCOMMANDS = List.of(AnnotateCommand.class, SimulateCommand.class,
            TrainCommand.class, ModelCommand.class, ModelsCommand.class, DemoCommand.class, EvaluateCommand.class);

    private final Streams streams;

    AnnotatorCommand(Streams streams) {
        this.streams = streams;
    }

    Streams streams() {
        return streams;
    }

    /**
     * The command line for {@code args}: with only the subcommand they name, when they name one, else with all.
     * Picocli reads every option of every subcommand it is given before it parses anything, and doing that for all
     * seven took about 45 ms of each run's start-up (measured cold: 126-140 ms against 81-94 ms for one).
     */
    static CommandLine commandLine(Streams streams, String[] args) {
        CommandLine cl = new CommandLine(new AnnotatorCommand(streams));
        String named = null;
        for (String a : args) {
            if (!a.startsWith("-")) {
                named = a;
                break;
            }
        }
        String name = named;
        List<Class<?>> chosen = SUBCOMMANDS.stream().filter(c -> nameOf(c).equals(name)).toList();
        (chosen.isEmpty() ? SUBCOMMANDS : chosen).forEach(cl::addSubcommand);
        return cl;
    }

    static List<Class<?>> subcommands() {
        return SUBCOMMANDS;
    }

    private static String nameOf(Class<?> command) {
        return command.getAnnotation(Command.class).name();
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
