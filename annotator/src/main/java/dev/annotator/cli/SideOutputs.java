package dev.annotator.cli;

import dev.annotator.decode.RecordAnnotation;
import dev.annotator.error.IoFailureException;
import dev.annotator.gff.RecordSummaryWriter;
import dev.annotator.model.HmmModel;

import java.io.IOException;
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

    private SideOutputs() {
    }

    /** @param summaryPath the summary table's path, or null for none */
    static SideOutputs open(HmmModel model, String summaryPath, boolean force) throws IOException {
        SideOutputs s = new SideOutputs();
        try {
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
        if (summary != null) {
            try {
                summary.write(a);
            } catch (IOException e) {
                throw failed(summaryTarget, e);
            }
        }
    }

    private static IoFailureException failed(OutputTarget t, IOException e) {
        return new IoFailureException(t.name() + ": write failed (" + e.getMessage() + ")", e);
    }

    /** Moves every side output into place (before the GFF3, whose presence marks a finished run). */
    void commit() {
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
        for (OutputTarget t : targets) {
            t.close();
        }
    }
}
