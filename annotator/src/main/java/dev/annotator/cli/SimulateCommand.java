package dev.annotator.cli;

import dev.annotator.error.IoFailureException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.SimulationRun;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;
import picocli.CommandLine.ParentCommand;

import java.io.IOException;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "simulate", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "Sample sequences and their true state paths from a model; write FASTA, and the true "
                + "segments of the reported labels as GFF3.",
        footerHeading = "%n",
        footer = {"Examples:",
                "  annotator simulate -m cpg-island --length 200000 --records 4 --seed 11 \\",
                "      -o sim.fa --truth sim.gff3",
                "  annotator simulate -m my-model.json --length 1000000 -o test.fa",
                "",
                "Records are named sim1, sim2, ...; the same seed gives the same files byte for byte.",
                "",
                Caution.TEXT})
final class SimulateCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @ParentCommand
    AnnotatorCommand parent;

    @Option(names = {"-m", "--model"}, required = true, paramLabel = "MODEL",
            description = "Model file (JSON) or the name of a shipped model.")
    String model;

    @Option(names = "--length", required = true, paramLabel = "BP", description = "Length of each record in bases.")
    int length;

    @Option(names = "--records", paramLabel = "N", defaultValue = "1", description = "Number of records (default: ${DEFAULT-VALUE}).")
    int records;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Random seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = {"-o", "--output"}, required = true, paramLabel = "OUT.fa",
            description = "FASTA output file, or - for standard output.")
    String output;

    @Option(names = "--truth", paramLabel = "TRUTH.gff3", description = "Also write the true segments as GFF3.")
    String truth;

    @Option(names = "--force", description = "Replace output files that exist (default: refuse).")
    boolean force;

    @Override
    public Integer call() {
        if (length < 1) {
            throw new ParameterException(spec.commandLine(), "--length must be at least 1, got " + length);
        }
        // a record is sampled whole, one byte per base, before it is written: refuse what cannot fit at once
        long usable = Runtime.getRuntime().maxMemory() / 100 * 80;
        if (length > usable) {
            throw new ParameterException(spec.commandLine(), "--length " + length + " is more than one record this "
                    + "run can hold in memory (Java heap limit " + (Runtime.getRuntime().maxMemory() >> 20)
                    + " MiB; give java more with -Xmx)");
        }
        if (records < 1) {
            throw new ParameterException(spec.commandLine(), "--records must be at least 1, got " + records);
        }
        if (truth != null && OutputTarget.isStdout(output) && OutputTarget.isStdout(truth)) {
            throw new ParameterException(spec.commandLine(), "-o and --truth cannot both be standard output");
        }
        OutputTarget.refuseBeforeRun(List.of(model), Arrays.asList(output, truth), force);
        HmmModel hmm = ModelLoader.load(model);
        try (OutputTarget fasta = OutputTarget.open(output, parent.streams().out(), force);
             OutputTarget truthFile = truth == null ? null : OutputTarget.open(truth, parent.streams().out(), force)) {
            try {
                new SimulationRun(hmm).write("sim", length, records, seed, fasta.stream(),
                        truthFile == null ? null : truthFile.writer());
                if (truthFile != null) {
                    truthFile.commit();
                }
                fasta.commit();
            } catch (IOException e) {
                // both outputs are written as records are sampled, so a failed write may be either
                String name = truthFile == null ? fasta.name() : fasta.name() + " or " + truthFile.name();
                throw new IoFailureException(name + ": write failed (" + e.getMessage() + ")", e);
            }
        }
        return 0;
    }
}
