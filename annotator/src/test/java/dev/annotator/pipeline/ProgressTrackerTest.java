package dev.annotator.pipeline;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/** The total is estimated from the share of the input read, and exact once reading is finished. */
class ProgressTrackerTest {

    @Test
    void estimateFromBytesThenExactTotal() {
        List<ProgressSnapshot> finished = new ArrayList<>();
        ProgressReporter reporter = new ProgressReporter() {
            @Override
            public long intervalMillis() {
                return 60_000;
            }

            @Override
            public void report(ProgressSnapshot snapshot) {
            }

            @Override
            public void finish(ProgressSnapshot snapshot) {
                finished.add(snapshot);
            }
        };
        ProgressTracker tracker = new ProgressTracker(reporter, 1_000_000);
        assertThat(tracker.snapshot().basesTotal()).as("nothing read yet").isEqualTo(-1);
        // a quarter of the file read, holding 240,000 bases -> about 960,000 bases in all
        tracker.rawBytesRead.add(250_000);
        tracker.recordRead(240_000);
        tracker.decoded(100_000);
        ProgressSnapshot s = tracker.snapshot();
        assertThat(s.basesTotal()).isEqualTo(960_000);
        assertThat(s.totalIsFinal()).isFalse();
        assertThat(s.basesDone()).isEqualTo(100_000);
        tracker.recordRead(700_000);
        tracker.readingFinished();
        assertThat(tracker.snapshot().basesTotal()).isEqualTo(940_000);
        assertThat(tracker.snapshot().totalIsFinal()).isTrue();
        tracker.close();
        assertThat(finished).hasSize(1);
    }
}
