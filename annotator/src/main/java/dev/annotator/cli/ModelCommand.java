package dev.annotator.cli;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.model.ModelSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Groups commands that work on one model file. */
@Command(name = "model", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Work with a model file.",
        subcommands = {ModelCommand.Check.class, GeneTopologyCommand.class},
        footerHeading = "%n",
        footer = {"Examples:", "  annotator model check cpg-island", "  annotator model check my-model.json",
                "  annotator model gene-topology -o start.json", "",
                Caution.TEXT})
final class ModelCommand implements java.util.concurrent.Callable<Integer> {
    @Spec
    CommandSpec spec;

    @picocli.CommandLine.ParentCommand
    AnnotatorCommand parent;

    /** Without a subcommand there is nothing to do: show the usage on stderr and fail as a usage error. */
    @Override
    public Integer call() {
        spec.commandLine().usage(spec.commandLine().getErr());
        return dev.annotator.error.ExitCodes.USAGE;
    }

    @Command(name = "check", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
            description = "Validate a model and print a summary: states, labels, emission orders, and the "
                    + "expected segment length of each label implied by the transitions.",
            footerHeading = "%n",
            footer = {"Examples:", "  annotator model check cpg-island", "  annotator model check my-model.json",
                    "", Caution.TEXT})
    static final class Check implements Runnable {
        @Spec
        CommandSpec spec;

        @Parameters(paramLabel = "MODEL", description = "Model file (JSON) or the name of a shipped model.")
        String model;

        @Override
        public void run() {
            HmmModel hmm = ModelLoader.load(model);
            spec.commandLine().getOut().print(ModelSummary.describe(hmm));
            spec.commandLine().getOut().flush();
        }
    }
}
