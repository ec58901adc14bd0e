package dev.annotator.decode;

import org.junit.jupiter.api.Test;

import java.nio.charset.StandardCharsets;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/** Observed/expected CpG as defined by Gardiner-Garden &amp; Frommer (1987): n(CG) x L / (n(C) x n(G)). */
class CompositionCounterTest {

    @Test
    void handCountedSequence() {
        // ACGCGTTCGA: L=10, C at 2,4,8 -> 3, G at 3,5,9 -> 3, CG at 2-3, 4-5, 8-9 -> 3 (counted by hand)
        // o/e = 3 x 10 / (3 x 3) = 3.333..., GC = 6/10
        Composition c = CompositionCounter.of(bytes("ACGCGTTCGA"), 0, 10);
        assertThat(c.gc()).isCloseTo(0.6, within(1e-12));
        assertThat(c.cpgObservedExpected()).isCloseTo(10.0 / 3.0, within(1e-12));
    }

    @Test
    void ambiguousBasesAreLeftOutAndBreakPairs() {
        // cgNcgTTgc: unambiguous bases c,g,c,g,T,T,g,c -> L=8, C=3, G=3; CG pairs: 1-2 and 4-5 (the pair across N
        // does not count; "gc" is not CpG) -> 2; o/e = 2 x 8 / 9
        Composition c = CompositionCounter.of(bytes("cgNcgTTgc"), 0, 9);
        assertThat(c.gc()).isCloseTo(6.0 / 8.0, within(1e-12));
        assertThat(c.cpgObservedExpected()).isCloseTo(16.0 / 9.0, within(1e-12));
    }

    @Test
    void subrangeAndUndefinedRatio() {
        Composition c = CompositionCounter.of(bytes("GGGGATATAT"), 4, 10);
        assertThat(c.gc()).isZero();
        assertThat(c.cpgObservedExpected()).isNaN();
    }

    private static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.US_ASCII);
    }
}
