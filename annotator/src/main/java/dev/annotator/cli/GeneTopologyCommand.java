package dev.annotator.cli;

import dev.annotator.error.IoFailureException;
import dev.annotator.error.UsageException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelJson;
import dev.annotator.model.ModelValidator;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

import java.io.IOException;
import java.util.List;

/** Writes the untrained gene topology, the starting point for training a gene model on another genome. */
@Command(name = "gene-topology", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Write an untrained protein-coding gene model for both strands: a non-coding state and, per "
                + "strand, start-codon states, three codon positions in a cycle and stop-codon states. The "
                + "genetic code becomes structural zeros (no stop codon inside a gene); all other values are "
                + "uniform, so train it by counting along annotated genes before use:",
                "  annotator train -m start.json --method counting --labels genome.gbk -o genes.json genome.gbk"},
        footerHeading = "%n",
        footer = {"Examples:", "  annotator model gene-topology -o start.json",
                "  annotator model gene-topology --stops TAA,TAG -o start.json   (TGA read as tryptophan)", "",
                Caution.TEXT})
final class GeneTopologyCommand implements java.util.concurrent.Callable<Integer> {
    @ParentCommand
    ModelCommand model;

    @Option(names = {"-o", "--output"}, paramLabel = "FILE", defaultValue = "-",
            description = "Where to write the model (- for standard output; default: ${DEFAULT-VALUE}).")
    String output;

    @Option(names = "--name", defaultValue = "gene-model", description = "The model's name (default: ${DEFAULT-VALUE}).")
    String name;

    @Option(names = "--coding-order", defaultValue = "4", paramLabel = "K",
            description = "Emission order of the codon-position states, 2..8 (default: ${DEFAULT-VALUE}).")
    int codingOrder;

    @Option(names = "--noncoding-order", defaultValue = "4", paramLabel = "K",
            description = "Emission order of the non-coding state, 0..8 (default: ${DEFAULT-VALUE}).")
    int noncodingOrder;

    @Option(names = "--upstream", defaultValue = "" + GeneTopology.DEFAULT_UPSTREAM, paramLabel = "BP",
            description = "Bases before each start codon modelled position by position, where the ribosome-binding "
                    + "site lies; 0 for none (default: ${DEFAULT-VALUE}).")
    int upstream;

    @Option(names = "--starts", split = ",", paramLabel = "CODON",
            description = "Start codons (default: ATG,GTG,TTG of NCBI translation table 11).")
    List<String> starts;

    @Option(names = "--stops", split = ",", paramLabel = "CODON",
            description = "Stop codons (default: TAA,TAG,TGA of NCBI translation table 11).")
    List<String> stops;

    @Option(names = "--force", description = "Replace an output file that exists (default: refuse).")
    boolean force;

    @Override
    public Integer call() {
        if (codingOrder < GeneTopology.CODON_SIGNAL_ORDER || codingOrder > ModelValidator.MAX_ORDER) {
            throw new UsageException("--coding-order " + codingOrder + " is outside " + GeneTopology.CODON_SIGNAL_ORDER
                    + ".." + ModelValidator.MAX_ORDER);
        }
        if (noncodingOrder < 0 || noncodingOrder > ModelValidator.MAX_ORDER) {
            throw new UsageException("--noncoding-order " + noncodingOrder + " is outside 0.." + ModelValidator.MAX_ORDER);
        }
        GeneticCode code = GeneticCode.TABLE_11;
        if (starts != null || stops != null) {
            try {
                code = new GeneticCode("a genetic code given on the command line",
                        starts == null ? code.starts() : starts, stops == null ? code.stops() : stops);
            } catch (IllegalArgumentException e) {
                throw new UsageException(e.getMessage());
            }
        }
        if (upstream < 0 || upstream > GeneTopology.MAX_UPSTREAM) {
            throw new UsageException("--upstream " + upstream + " is outside 0.." + GeneTopology.MAX_UPSTREAM);
        }
        HmmModel topology = GeneTopology.build(name, code, codingOrder, noncodingOrder, upstream);
        OutputTarget.refuseBeforeRun(List.of(), List.of(output), force);
        Streams streams = model.parent.streams();
        try (OutputTarget out = OutputTarget.open(output, streams.out(), force)) {
            ModelJson.write(topology, out.stream());
            out.commit();
        } catch (IOException e) {
            throw new IoFailureException(output + ": write failed (" + e.getMessage() + ")", e);
        }
        return 0;
    }
}
