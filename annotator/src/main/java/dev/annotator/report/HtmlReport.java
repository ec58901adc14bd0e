package dev.annotator.report;

import dev.annotator.decode.PosteriorPlot;
import dev.annotator.decode.RecordAnnotation;
import dev.annotator.decode.RecordProfile;
import dev.annotator.decode.Segment;
import dev.annotator.model.HmmModel;
import dev.annotator.io.InputChecksum;
import dev.annotator.model.Label;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.FutureTask;

/**
 * A self-contained HTML report of one annotation run, collected record by record as the records are done and
 * written at the end: run summary, a sortable table of records with flags in words, a posterior plot of each of
 * the first {@link #PLOTTED} records (inline SVG drawn here), and histograms of segment length and confidence.
 * The markup is well-formed XHTML, so XML tools read it. Memory: one table row per record, the drawn plots of at
 * most {@link #PLOTTED} records, and fixed-size histograms.
 *
 * <p>Plots are drawn on a thread of the report's own as the records come in, so the last record's plot is drawn
 * while its GFF3 is written rather than after. Close the report to end the thread.
 *
 * <p>Colours: the Okabe-Ito palette, chosen to stay distinct under the common colour-vision deficiencies (Okabe
 * &amp; Ito 2008, "Color Universal Design", jfly.uni-koeln.de/color/). Flags are words, never colour alone.
 */
public final class HtmlReport implements AutoCloseable {
    /** Records drawn; later records appear in the table only. */
    public static final int PLOTTED = 50;
    /**
     * Bins per plotted record: about one per unit of the plot's 880-unit width (each bin keeps its maximum, so a
     * segment shorter than a bin still shows); more would only lengthen the file and its drawing.
     */
    public static final int PLOT_POINTS = 1000;
    /** A segment below this confidence flags its record (common practice: a posterior near 0.5 is a coin toss). */
    static final double LOW_CONFIDENCE = 0.7;
    /** An N run at least this long flags its record (the size of a typical assembly gap, common practice). */
    static final int LONG_N_RUN = 100;

    static final String BLUE = "#0072B2";
    static final String ORANGE = "#E69F00";
    static final String VERMILLION = "#D55E00";
    static final String GREY = "#999999";

    private final HmmModel model;
    private final List<String> labels;
    private final List<Row> rows = new ArrayList<>();
    private final List<Drawn> plots = new ArrayList<>();
    private final ExecutorService drawing;
    private final Histogram lengths = Histogram.logarithmic(1, 1e7, 28);
    private final Histogram confidences = Histogram.linear(0, 1, 20);
    /** The last plot frame made, and its label: used by the drawing thread only, whose tasks run one after another. */
    private String frameLabel;
    private String frameText;

    record Row(String seqid, int length, double gc, double oe, long ambiguous, int[] counts, long[] covered,
               double meanConfidence, List<String> flags) {
    }

    record Plotted(String seqid, int length, PosteriorPlot plot, List<Segment> segments, String label) {
    }

    /** A plot being drawn: its record's name and the plot's markup. */
    private record Drawn(String seqid, Future<String> svg) {
    }

    public HtmlReport(HmmModel model) {
        this.model = model;
        this.labels = model.reportedLabels().stream().map(Label::name).toList();
        this.drawing = Executors.newSingleThreadExecutor(task -> {
            Thread t = new Thread(task, "report-drawing");
            t.setDaemon(true);
            return t;
        });
        // Made while the run starts up, on this otherwise idle thread: the frame of the first reported label (the
        // plotted one unless asked otherwise), whose first making also loads and sets up the drawing code (~10 ms at
        // the first plot), and what the report's end needs and would load then, on the one thread still busy: the
        // histograms' drawing code, and the time-zone rules and formatter for the report's local date (~5 ms).
        String first = labels.isEmpty() ? null : labels.get(0);
        drawing.execute(() -> {
            try {
                if (first != null) {
                    frameFor(first);
                }
                Histograms.draw(new Xml(new StringBuilder(4096)), Histogram.linear(0, 1, 1), "", false);
            } catch (IOException e) {
                // markup into a StringBuilder does not fail; were it to, the report's end does the same work again
            }
            java.time.format.DateTimeFormatter.ISO_OFFSET_DATE_TIME.format(java.time.OffsetDateTime.now());
        });
    }

    /** Takes one finished record (with a profile holding composition and a plot). */
    public void record(RecordAnnotation a) {
        RecordProfile p = a.profile();
        int[] counts = new int[labels.size()];
        long[] covered = new long[labels.size()];
        double sum = 0;
        boolean low = false;
        for (Segment s : a.segments()) {
            int l = labels.indexOf(s.label());
            counts[l]++;
            covered[l] += s.length();
            sum += s.meanPosterior();
            low |= s.meanPosterior() < LOW_CONFIDENCE;
            lengths.add(s.length());
            confidences.add(s.meanPosterior());
        }
        List<String> flags = new ArrayList<>();
        if (low) {
            flags.add("low-confidence segment");
        }
        if (p.longestAmbiguousRun() >= LONG_N_RUN) {
            flags.add("N run of " + p.longestAmbiguousRun() + " bp");
        }
        if (a.length() <= model.maxOrder()) {
            flags.add("shorter than the model's context");
        }
        rows.add(new Row(a.seqid(), a.length(), p.composition().gc(), p.composition().cpgObservedExpected(),
                p.ambiguousBases(), counts, covered, a.segments().isEmpty() ? Double.NaN : sum / a.segments().size(),
                flags));
        if (plots.size() < PLOTTED && p.plot() != null) {
            Plotted plotted = new Plotted(a.seqid(), a.length(), p.plot(), a.segments(), p.trackLabel());
            FutureTask<String> svg = new FutureTask<>(() -> {
                StringBuilder b = new StringBuilder(4096 + 256 * plotted.segments().size());
                RecordPlot.draw(b, plotted, frameFor(plotted.label()));
                return b.toString();
            });
            drawing.execute(svg);
            plots.add(new Drawn(a.seqid(), svg));
        }
    }

    /** The plots' shared frame for a label, made on the drawing thread (the only one that touches it). */
    private String frameFor(String label) throws IOException {
        if (!label.equals(frameLabel)) {
            frameText = RecordPlot.frame(label);
            frameLabel = label;
        }
        return frameText;
    }

    /**
     * @param inputs    the input files with size and CRC-32 (empty for standard input)
     * @param options   the command line as given
     * @param version   the tool's version
     * @param date      when the run ended (ISO 8601)
     * @param seconds   the run's wall time
     * @param caution   the research-use caution
     */
    public void write(Writer out, List<InputChecksum> inputs, String inputName, String options, String version,
                      String date, double seconds, String caution) throws IOException {
        Xml x = new Xml(out);
        out.write("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<!DOCTYPE html>\n");
        x.open("html", "xmlns", "http://www.w3.org/1999/xhtml", "lang", "en");
        x.open("head");
        x.element("meta", "", "charset", "UTF-8");
        x.element("title", "annotator report: " + inputName);
        x.open("style");
        x.text(Style.CSS);
        x.close("style");
        x.close("head");
        x.open("body");
        x.element("h1", "Annotation report: " + inputName);
        x.element("p", caution, "class", "caution");
        x.element("h2", "Run");
        x.open("table", "class", "run");
        for (InputChecksum f : inputs) {
            runRow(x, "input", f.name() + " (" + f.bytes() + " bytes, CRC-32 " + f.crc32Hex() + ")");
        }
        if (inputs.isEmpty()) {
            runRow(x, "input", inputName + " (standard input: no size or checksum)");
        }
        runRow(x, "model", model.name() + (model.provenance() == null || model.provenance().source() == null ? ""
                : " (" + model.provenance().source() + ")"));
        runRow(x, "command", options);
        runRow(x, "tool", "annotator " + version);
        runRow(x, "date", date);
        runRow(x, "runtime", Axis.fixed(seconds, 2) + " s");
        long total = 0;
        for (Row r : rows) {
            total += r.length();
        }
        runRow(x, "records", rows.size() + " (" + Axis.bases(total) + ")");
        x.close("table");
        recordTable(x);
        x.element("h2", "Posterior along the records");
        if (rows.size() > plots.size()) {
            x.element("p", "The first " + plots.size() + " of " + rows.size() + " records are drawn.");
        }
        for (Drawn p : plots) {
            x.element("h3", p.seqid());
            out.write(done(p.svg()));
        }
        x.element("h2", "Segments across the run");
        Histograms.draw(x, lengths, "Segment length", true);
        Histograms.draw(x, confidences, "Segment confidence (mean posterior)", false);
        x.open("script");
        x.text(Style.SORT_SCRIPT);
        x.close("script");
        x.close("body");
        x.close("html");
        out.write("\n");
    }

    /** Ends the drawing thread (plots not yet drawn are dropped). */
    @Override
    public void close() {
        drawing.shutdownNow();
    }

    /** The result of work on the drawing thread, with its failure as this thread's. */
    private static <T> T done(Future<T> work) throws IOException {
        try {
            return work.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new InterruptedIOException("interrupted while drawing the report");
        } catch (ExecutionException e) {
            if (e.getCause() instanceof IOException io) {
                throw io;
            }
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    private static void runRow(Xml x, String key, String value) throws IOException {
        x.open("tr");
        x.element("th", key);
        x.element("td", value);
        x.close("tr");
    }

    private void recordTable(Xml x) throws IOException {
        x.element("h2", "Records");
        x.element("p", "Click a column header to sort. Flags: a segment of confidence below " + LOW_CONFIDENCE
                + ", an N run of " + LONG_N_RUN + " bp or more, a record no longer than the model's context.");
        x.open("table", "class", "records sortable");
        x.open("thead");
        x.open("tr");
        List<String> heads = new ArrayList<>(List.of("record", "length (bp)", "GC", "CpG o/e", "N (bp)"));
        for (String l : labels) {
            heads.add(l + " segments");
            heads.add(l + " bases");
        }
        heads.add("mean confidence");
        heads.add("flags");
        for (String h : heads) {
            x.element("th", h);
        }
        x.close("tr");
        x.close("thead");
        x.open("tbody");
        for (Row r : rows) {
            x.open("tr", "class", r.flags().isEmpty() ? "" : "flagged");
            x.element("td", r.seqid());
            x.element("td", Long.toString(r.length()));
            x.element("td", Axis.fixed(r.gc(), 3));
            x.element("td", Axis.fixed(r.oe(), 3));
            x.element("td", Long.toString(r.ambiguous()));
            for (int l = 0; l < labels.size(); l++) {
                x.element("td", Integer.toString(r.counts()[l]));
                x.element("td", Long.toString(r.covered()[l]));
            }
            x.element("td", Axis.fixed(r.meanConfidence(), 3));
            x.element("td", r.flags().isEmpty() ? "none" : "CHECK: " + String.join("; ", r.flags()));
            x.close("tr");
        }
        x.close("tbody");
        x.close("table");
    }

    static String colour(int labelIndex) {
        return switch (labelIndex % 3) {
            case 0 -> BLUE;
            case 1 -> VERMILLION;
            default -> ORANGE;
        };
    }
}
