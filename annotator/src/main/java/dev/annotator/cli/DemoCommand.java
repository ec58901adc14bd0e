package dev.annotator.cli;

import dev.annotator.error.IoFailureException;
import dev.annotator.evaluate.ComparisonResult;
import dev.annotator.model.ModelLoader;
import dev.annotator.pipeline.DemoScenario;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

@Command(name = "demo", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = {"Run a generated screening scenario: a batch of synthetic expression constructs and one "
                + "simulated contig are sampled from the shipped cpg-island model (fixed seed), annotated, and "
                + "scored against the planted islands. Writes FASTA, truth and predicted GFF3 into DIR."},
        footerHeading = "%n",
        footer = {"Examples:", "  annotator demo", "  annotator demo --out /tmp/island-demo", "",
                "Planted islands and calls shorter than 200 bp are not counted (Gardiner-Garden & Frommer 1987 "
                        + "minimum length). All data are simulated; nothing is real sequence.",
                "", Caution.TEXT})
final class DemoCommand implements Callable<Integer> {
    @ParentCommand
    AnnotatorCommand parent;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "annotator-demo",
            description = "Output directory (default: ${DEFAULT-VALUE}); created if missing.")
    Path out;

    @Override
    public Integer call() {
        DemoScenario.Report report;
        try {
            report = new DemoScenario(ModelLoader.load("cpg-island"))
                    .run(out, Runtime.getRuntime().availableProcessors());
        } catch (IOException e) {
            throw new IoFailureException(describe(out, e), e);
        }
        PrintWriter w = new PrintWriter(parent.streams().out(), true);
        w.println("Screening batch: synthetic constructs and one simulated contig (all sampled from cpg-island, seed "
                + DemoScenario.SEED + ")");
        w.println();
        String header = String.format(Locale.ROOT, "%-12s %10s %8s %7s %7s %9s %15s",
                "record", "length", "planted", "called", "recall", "precision", "median_bnd_err");
        w.println(header);
        for (DemoScenario.Row row : report.rows()) {
            w.println(line(row.record(), row.length(), row.comparison()));
        }
        long total = report.rows().stream().mapToLong(DemoScenario.Row::length).sum();
        w.println(line("all", total, report.total()));
        w.println();
        w.println("planted/called: islands of at least " + DemoScenario.MIN_LENGTH + " bp; recall = planted islands "
                + "overlapped by a call; precision = calls overlapping a planted island; median_bnd_err = median "
                + "|start| and |end| difference in bp.");
        w.printf(Locale.ROOT, "annotated %.2f Mbp in %.2f s; files in %s:%n  %s%n  %s%n  %s%n",
                report.run().bases() / 1e6, report.run().seconds(), out,
                report.fasta().getFileName(), report.truth().getFileName(), report.predicted().getFileName());
        w.println();
        w.println(Caution.TEXT);
        if (w.checkError()) {
            throw new IoFailureException("<stdout>: write failed");
        }
        return 0;
    }

    /**
     * A FileSystemException's message is often the bare path (a file where the directory should be, a parent
     * that cannot hold directories), which alone does not say what went wrong.
     */
    static String describe(Path out, IOException e) {
        if (!(e instanceof FileSystemException f)) {
            return out + ": " + e.getMessage();
        }
        String what = e instanceof FileAlreadyExistsException ? "exists and is not a directory"
                : e instanceof AccessDeniedException ? "permission denied"
                : e instanceof NoSuchFileException ? "cannot be created (no such file or directory)"
                : f.getReason() != null ? f.getReason() : e.getClass().getSimpleName();
        boolean aboutOut = f.getFile() == null
                || Path.of(f.getFile()).toAbsolutePath().normalize().equals(out.toAbsolutePath().normalize());
        return out + ": " + (aboutOut ? "" : f.getFile() + ": ") + what;
    }

    private static String line(String name, long length, ComparisonResult c) {
        return String.format(Locale.ROOT, "%-12s %10d %8d %7d %7s %9s %15s", name, length, c.plantedCount(),
                c.calledCount(), fraction(c.recall()), fraction(c.precision()),
                Double.isNaN(c.medianBoundaryError()) ? "n/a" : String.format(Locale.ROOT, "%.1f", c.medianBoundaryError()));
    }

    private static String fraction(double v) {
        return Double.isNaN(v) ? "n/a" : String.format(Locale.ROOT, "%.3f", v);
    }
}
