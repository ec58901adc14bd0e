package dev.annotator.cli;

import dev.annotator.model.ShippedModel;
import dev.annotator.model.ShippedModels;
import picocli.CommandLine.Command;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.io.PrintWriter;

@Command(name = "models", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "List the models shipped inside annotator; use a name with -m.",
        footerHeading = "%n",
        footer = {"Examples:", "  annotator models", "", Caution.TEXT})
final class ModelsCommand implements Runnable {
    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        PrintWriter out = spec.commandLine().getOut();
        for (ShippedModel m : ShippedModels.list()) {
            out.printf("%-16s %s%n", m.name(), m.description());
        }
        out.flush();
    }
}
