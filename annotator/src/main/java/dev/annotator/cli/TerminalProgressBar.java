package dev.annotator.cli;

import dev.annotator.pipeline.ProgressReporter;
import dev.annotator.pipeline.ProgressSnapshot;
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;

import java.io.PrintStream;
import java.util.Locale;

/** A progress bar on a terminal: megabases done of the (estimated) total, rate and time left. */
final class TerminalProgressBar implements ProgressReporter {
    private final ProgressBar bar;

    TerminalProgressBar(PrintStream terminal) {
        this.bar = new ProgressBarBuilder()
                .setTaskName("annotate")
                .setUnit(" Mbp", 1_000_000)
                .setInitialMax(-1)
                .setStyle(ProgressBarStyle.ASCII)
                .setUpdateIntervalMillis(250)
                .setConsumer(new ConsoleProgressBarConsumer(terminal))
                .showSpeed()
                .clearDisplayOnFinish()
                .build();
    }

    @Override
    public long intervalMillis() {
        return 200;
    }

    @Override
    public synchronized void report(ProgressSnapshot s) {
        if (s.basesTotal() > 0) {
            bar.maxHint(s.basesTotal());
        }
        bar.stepTo(s.basesDone());
        bar.setExtraMessage(s.totalIsFinal() || s.basesTotal() < 0 ? "" : String.format(Locale.ROOT, "(total estimated)"));
    }

    @Override
    public synchronized void finish(ProgressSnapshot s) {
        bar.close();
    }

    /** Whether this process's standard error is a terminal (Linux: what file descriptor 2 points to). */
    static boolean stderrIsTerminal() {
        try {
            String target = java.nio.file.Files.readSymbolicLink(java.nio.file.Path.of("/proc/self/fd/2")).toString();
            return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty");
        } catch (Exception e) {
            return false;
        }
    }
}
