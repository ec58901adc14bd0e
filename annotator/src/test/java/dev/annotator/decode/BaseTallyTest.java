package dev.annotator.decode;

import dev.annotator.conformance.BaseCounts;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

import java.util.Arrays;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * A record's base counts tallied in consecutive pieces (as the decoding windows count them, each on its own thread)
 * and joined must equal one count of the whole by {@link BaseCounts} (the conformance tests' own count of the
 * letters, after Gardiner-Garden &amp; Frommer 1987, J Mol Biol 196:261), and the longest ambiguous run one plain
 * loop over the bytes; ambiguous runs may cross any number of piece boundaries.
 */
class BaseTallyTest {
    private static final byte[] CLEAN = "ACGTacgt".getBytes();
    private static final byte[] AMBIGUOUS = "NnRYK".getBytes();

    @Property(tries = 150)
    void piecesJoinIntoTheTallyOfTheWhole(@ForAll long seed, @ForAll @IntRange(min = 1, max = 9) int pieces) {
        Random random = new Random(seed);
        byte[] bases = sequence(random, random.nextInt(200_000));
        int[] cuts = new int[pieces + 1];
        for (int i = 1; i < pieces; i++) {
            cuts[i] = random.nextInt(bases.length + 1);
        }
        cuts[pieces] = bases.length;
        Arrays.sort(cuts);

        // joined left to right, as the windows are; and as two halves joined at the end, which needs what each
        // half knows of the ambiguous runs at its edges
        BaseTally joined = new BaseTally();
        int middlePiece = pieces / 2;
        BaseTally left = new BaseTally();
        BaseTally right = BaseTally.startingAt(bases, cuts[middlePiece]);
        for (int i = 0; i < pieces; i++) {
            joined.append(piece(bases, cuts[i], cuts[i + 1]));
            (i < middlePiece ? left : right).append(piece(bases, cuts[i], cuts[i + 1]));
        }
        left.append(right);
        check(bases, joined);
        check(bases, left);
    }

    private static BaseTally piece(byte[] bases, int from, int to) {
        BaseTally piece = BaseTally.startingAt(bases, from);
        // a piece may itself be added in several steps, as the plot bins are
        int middle = from + (to - from) / 3;
        piece.add(bases, from, middle);
        piece.add(bases, middle, to);
        return piece;
    }

    private static void check(byte[] bases, BaseTally joined) {
        BaseCounts counts = BaseCounts.of(bases, 1, bases.length);
        long longest = 0;
        long run = 0;
        for (byte b : bases) {
            run = "ACGTacgt".indexOf(b) >= 0 ? 0 : run + 1;
            longest = Math.max(longest, run);
        }
        assertThat(joined.unambiguous()).isEqualTo(counts.unambiguous());
        assertThat(joined.gcCount()).isEqualTo(counts.c() + counts.g());
        assertThat(joined.ambiguous()).isEqualTo(counts.ambiguous());
        assertThat(joined.longestAmbiguousRun()).isEqualTo(longest);
        if (counts.hasObservedExpected()) {
            assertThat(joined.composition().cpgObservedExpected()).isEqualTo(counts.cpgObservedExpected());
        } else {
            assertThat(joined.composition().cpgObservedExpected()).isNaN();
        }
    }

    /** Stretches of clean bases (C and G often, so CpG pairs occur) between ambiguous runs of 1 to 70,000. */
    private static byte[] sequence(Random random, int length) {
        byte[] bases = new byte[length];
        int i = 0;
        while (i < length) {
            boolean ambiguous = random.nextInt(3) == 0;
            int run = Math.min(length - i, 1 + random.nextInt(random.nextBoolean() ? 40 : 70_000));
            for (int k = 0; k < run; k++, i++) {
                bases[i] = ambiguous ? AMBIGUOUS[random.nextInt(AMBIGUOUS.length)]
                        : random.nextInt(4) == 0 ? (byte) 'C' : CLEAN[random.nextInt(CLEAN.length)];
            }
        }
        return bases;
    }
}
