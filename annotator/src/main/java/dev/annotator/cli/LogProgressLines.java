package dev.annotator.cli;

import dev.annotator.pipeline.ProgressReporter;
import dev.annotator.pipeline.ProgressSnapshot;

import java.io.PrintWriter;
import java.util.Locale;

/** One progress line every few seconds, for logs of unattended runs. */
final class LogProgressLines implements ProgressReporter {
    private final PrintWriter err;
    private final long intervalMillis;

    LogProgressLines(PrintWriter err, long intervalMillis) {
        this.err = err;
        this.intervalMillis = intervalMillis;
    }

    @Override
    public long intervalMillis() {
        return intervalMillis;
    }

    @Override
    public void report(ProgressSnapshot s) {
        err.println(line(s));
        err.flush();
    }

    @Override
    public void finish(ProgressSnapshot s) {
        // the run's summary line follows; nothing more to say here
    }

    static String line(ProgressSnapshot s) {
        StringBuilder b = new StringBuilder(String.format(Locale.ROOT, "annotator: progress: %.1f Mbp", s.basesDone() / 1e6));
        if (s.basesTotal() > 0) {
            b.append(String.format(Locale.ROOT, " of %s%.1f Mbp (%.0f%%)", s.totalIsFinal() ? "" : "~",
                    s.basesTotal() / 1e6, 100.0 * s.basesDone() / s.basesTotal()));
        }
        b.append(String.format(Locale.ROOT, ", %.1f Mbp/s", s.megabasesPerSecond()));
        if (s.secondsLeft() >= 0) {
            b.append(String.format(Locale.ROOT, ", about %.0f s left", s.secondsLeft()));
        }
        return b.toString();
    }
}
