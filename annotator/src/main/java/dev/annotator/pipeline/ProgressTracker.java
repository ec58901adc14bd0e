package dev.annotator.pipeline;

import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.LongAdder;

/**
 * Counts a run's progress from the threads doing the work and hands snapshots to a reporter on a timer. The
 * total is estimated from the input file's size and the bases per byte seen so far, which works for plain and
 * gzipped FASTA alike, and becomes exact when the reader reaches the end of the input.
 */
final class ProgressTracker implements AutoCloseable, dev.annotator.io.RawInputObserver {
    private final ProgressReporter reporter;
    private final long inputBytes;
    private final long startNanos = System.nanoTime();
    final LongAdder rawBytesRead = new LongAdder();
    private final AtomicLong basesDecoded = new AtomicLong();
    private final AtomicLong basesRead = new AtomicLong();
    private volatile boolean readingDone;
    private final ScheduledExecutorService timer;

    /** @param inputBytes size of the input file, or -1 (standard input) */
    ProgressTracker(ProgressReporter reporter, long inputBytes) {
        this.reporter = reporter;
        this.inputBytes = inputBytes;
        this.timer = Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "annotator-progress");
            t.setDaemon(true);
            return t;
        });
        timer.scheduleAtFixedRate(() -> reporter.report(snapshot()), reporter.intervalMillis(),
                reporter.intervalMillis(), TimeUnit.MILLISECONDS);
    }

    @Override
    public void consumed(byte[] bytes, int offset, int length) {
        rawBytesRead.add(length);
    }

    void recordRead(int length) {
        basesRead.addAndGet(length);
    }

    void readingFinished() {
        readingDone = true;
    }

    void decoded(long bases) {
        basesDecoded.addAndGet(bases);
    }

    ProgressSnapshot snapshot() {
        double seconds = (System.nanoTime() - startNanos) / 1e9;
        long read = basesRead.get();
        long total;
        boolean exact = readingDone;
        if (exact) {
            total = read;
        } else {
            long bytes = rawBytesRead.sum();
            total = inputBytes > 0 && bytes > 0 && read > 0 ? Math.max(read, Math.round((double) read / bytes * inputBytes)) : -1;
        }
        return new ProgressSnapshot(basesDecoded.get(), total, exact, seconds);
    }

    @Override
    public void close() {
        timer.shutdownNow();
        try {
            timer.awaitTermination(1, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        reporter.finish(snapshot());
    }
}
