package dev.annotator.pipeline;

import dev.annotator.decode.DecodeMethod;
import dev.annotator.seq.RecordLengthLimit;
import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;

/** The sizing arithmetic, from the bytes per base documented in {@link MemoryBudget}. */
class MemoryBudgetTest {
    private static final long MIB = 1 << 20;

    @Test
    void posteriorDecodingNeedsFiveBytesPerBaseOfTheUsableHeap() {
        MemoryBudget b = MemoryBudget.of(1000 * MIB, 2, 1, DecodeMethod.POSTERIOR);
        // 80% of the heap, over 4 bytes for reading and 1 for the record being decoded
        long expected = 1000 * MIB / 100 * 80 / 5;
        assertThat(b.recordLimit().bases()).isEqualTo(expected);
        assertThat(b.basesInFlight()).isEqualTo(expected);
        assertThat(b.recordLimit().reason()).isEqualTo(
                "the most this run can hold in memory (Java heap limit 1000 MiB; give java more with -Xmx)");
    }

    @Test
    void viterbiAddsABackPointerPerStateAPathByteAndTheEvidenceOfEachLabelPerBase() {
        MemoryBudget b = MemoryBudget.of(1000 * MIB, 3, 2, DecodeMethod.VITERBI);
        // reading 4 + record 1 + back-pointers 3 + path 1 + two labels' posterior and ratio (2 doubles each)
        assertThat(b.recordLimit().bases()).isEqualTo(1000 * MIB / 100 * 80 / (4 + 1 + 3 + 1 + 2 * 16));
    }

    @Test
    void pathsHeldAtOnceAddTheirBytesAndEachItsEvidence() {
        // two paths (a gene model's strand views) of 7 and 19 path bytes per base, three labels
        MemoryBudget b = MemoryBudget.of(1000 * MIB, 26, 18, 3, DecodeMethod.POSTERIOR_VITERBI, 2);
        assertThat(b.recordLimit().bases()).isEqualTo(1000 * MIB / 100 * 80 / (4 + 1 + 26 + 2 * 3 * 16));
        // the widest table alone bounds the length: 18 bytes per base in one array
        assertThat(MemoryBudget.of(1L << 50, 26, 18, 3, DecodeMethod.POSTERIOR_VITERBI, 2).recordLimit().bases())
                .isEqualTo(RecordLengthLimit.ARRAY_MAX / 18);
    }

    @Test
    void neverMoreThanAnArrayHoldsNorLessThanOneBase() {
        assertThat(MemoryBudget.of(1L << 50, 2, 1, DecodeMethod.POSTERIOR).recordLimit().bases())
                .isEqualTo(RecordLengthLimit.ARRAY_MAX);
        // the back-pointer table is bases x states in one array
        assertThat(MemoryBudget.of(1L << 50, 4, 1, DecodeMethod.VITERBI).recordLimit().bases())
                .isEqualTo(RecordLengthLimit.ARRAY_MAX / 4);
        assertThat(MemoryBudget.of(1, 2, 1, DecodeMethod.POSTERIOR).recordLimit().bases()).isEqualTo(1);
    }
}
