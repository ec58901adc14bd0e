package dev.annotator.cli;

import dev.annotator.decode.RecordAnnotation;
import dev.annotator.error.IoFailureException;
import dev.annotator.gff.RecordSummaryWriter;
import dev.annotator.model.HmmModel;

import dev.annotator.gff.BedGraphWriter;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.util.zip.GZIPOutputStream;
import java.util.ArrayList;
import java.util.List;

/**
 * The outputs {@code annotate} writes beside the GFF3, record by record in input order as the records are done,
 * each through its own {@link OutputTarget} so it appears only when the whole run succeeded.
 */
final class SideOutputs implements AutoCloseable {
    private final List<OutputTarget> targets = new ArrayList<>();
    private OutputTarget summaryTarget;
    private RecordSummaryWriter summary;
    private OutputTarget trackTarget;
    private Writer trackText;
    private GZIPOutputStream trackGzip;
    private BedGraphWriter track;
    private OutputTarget reportTarget;
    private dev.annotator.report.HtmlReport report;

    private SideOutputs() {
    }

    /**
     * @param summaryPath the summary table's path, or null for none
     * @param trackPath   the bedGraph's path (gzipped when it ends in .gz), or null for none
     * @param trackLabel  the label the track follows
     */
    static SideOutputs open(HmmModel model, String summaryPath, String trackPath, String trackLabel, int trackStep,
                            String reportPath, boolean force) throws IOException {
        SideOutputs s = new SideOutputs();
        try {
            if (reportPath != null) {
                s.reportTarget = s.add(OutputTarget.open(reportPath, null, force));
                s.report = new dev.annotator.report.HtmlReport(model);
            }
            if (trackPath != null) {
                s.trackTarget = s.add(OutputTarget.open(trackPath, null, force));
                OutputStream raw = s.trackTarget.stream();
                if (trackPath.endsWith(".gz")) {
                    s.trackGzip = new dev.annotator.io.TextGzipOutputStream(raw, 1 << 16);
                    raw = s.trackGzip;
                }
                s.trackText = new BufferedWriter(new OutputStreamWriter(raw, StandardCharsets.UTF_8), 1 << 16);
                s.track = new BedGraphWriter(s.trackText);
                s.track.writeTrackLine(model.name() + " " + trackLabel + " posterior",
                        "posterior probability of " + trackLabel + (trackStep > 1 ? ", mean per " + trackStep + " bp" : "")
                                + " (annotator " + VersionProvider.version() + ", model " + model.name() + ")");
            }
            if (summaryPath != null) {
                s.summaryTarget = s.add(OutputTarget.open(summaryPath, null, force));
                s.summary = new RecordSummaryWriter(s.summaryTarget.writer(), model.reportedLabels());
                s.summary.writeHeader();
            }
        } catch (RuntimeException | IOException e) {
            s.close();
            throw e;
        }
        return s;
    }

    private OutputTarget add(OutputTarget t) {
        targets.add(t);
        return t;
    }

    /** Writes one finished record to every side output. */
    void record(RecordAnnotation a) {
        if (report != null) {
            report.record(a);
        }
        if (track != null) {
            try {
                track.write(a.seqid(), a.profile().track());
            } catch (IOException e) {
                throw failed(trackTarget, e);
            }
        }
        if (summary != null) {
            try {
                summary.write(a);
            } catch (IOException e) {
                throw failed(summaryTarget, e);
            }
        }
    }

    /** Writes the report, if one was asked for, once the run is done. */
    void finishReport(java.util.List<dev.annotator.io.InputChecksum> inputs, String inputName, String command,
                      double seconds) {
        if (report == null) {
            return;
        }
        try {
            Writer w = new BufferedWriter(reportTarget.writer(), 1 << 16);
            report.write(w, inputs, inputName, command, VersionProvider.version(),
                    java.time.format.DateTimeFormatter.ISO_OFFSET_DATE_TIME.format(java.time.OffsetDateTime.now().withNano(0)),
                    seconds, Caution.TEXT);
            w.flush();
        } catch (IOException e) {
            throw failed(reportTarget, e);
        }
    }

    private static IoFailureException failed(OutputTarget t, IOException e) {
        return new IoFailureException(t.name() + ": write failed (" + e.getMessage() + ")", e);
    }

    /** Moves every side output into place (before the GFF3, whose presence marks a finished run). */
    void commit() {
        if (trackText != null) {
            try {
                trackText.flush();
                if (trackGzip != null) {
                    trackGzip.finish();
                }
            } catch (IOException e) {
                throw failed(trackTarget, e);
            }
        }
        for (OutputTarget t : targets) {
            try {
                t.commit();
            } catch (IOException e) {
                throw failed(t, e);
            }
        }
    }

    @Override
    public void close() {
        if (report != null) {
            report.close();
        }
        for (OutputTarget t : targets) {
            t.close();
        }
    }
}
