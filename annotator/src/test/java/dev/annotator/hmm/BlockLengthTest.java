package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Checkpointed forward-backward recomputes each block's forward vectors from the checkpoint before it with the
 * same arithmetic as the first forward pass (the checkpointing idea of Grice, Hughey and Speck 1997, "Reduced
 * space sequence alignment"; recalled from memory). So the block length, and with it the shorter block
 * {@link ForwardBackward#blockFor} picks for larger topologies, must not change a single bit of the posteriors,
 * the log-likelihood or the posterior-Viterbi path.
 */
class BlockLengthTest {

    @Test
    void largerTopologiesGetShorterBlocksAndTwoStatesKeepTheDefault() {
        assertThat(ForwardBackward.blockFor(2)).isEqualTo(ForwardBackward.DEFAULT_BLOCK);
        assertThat(ForwardBackward.blockFor(43)).isLessThan(ForwardBackward.DEFAULT_BLOCK);
        // a work array of the chosen block stays within the stated bound, or the block is at its floor
        int block = ForwardBackward.blockFor(43);
        assertThat((long) block * 43 * Double.BYTES).isLessThanOrEqualTo(Math.max(ForwardBackward.BLOCK_ARRAY_BYTES,
                1024L * 43 * Double.BYTES));
    }

    @Test
    void blockLengthChangesNoBitOfPosteriorsLikelihoodOrPath() {
        SplittableRandom rng = new SplittableRandom(43);
        for (int trial = 0; trial < 3; trial++) {
            int states = 40 + trial;
            HmmParameters p = RandomModels.model(rng, states, 2, false);
            int n = 2500 + rng.nextInt(2000);
            byte[] seq = RandomModels.sequence(rng, n, 0.01);
            double[] reference = new double[n * states];
            double referenceLogLik = posteriors(new ForwardBackward(p, ForwardBackward.DEFAULT_BLOCK), seq,
                    reference);
            PosteriorPath referencePath = new PosteriorViterbi(p, ForwardBackward.DEFAULT_BLOCK).decode(seq);
            for (int block : new int[]{1, 7, 1000, ForwardBackward.blockFor(states)}) {
                double[] got = new double[n * states];
                assertThat(posteriors(new ForwardBackward(p, block), seq, got)).as("block %d", block)
                        .isEqualTo(referenceLogLik);
                assertThat(got).as("block %d", block).isEqualTo(reference);
                PosteriorPath path = new PosteriorViterbi(p, block).decode(seq);
                assertThat(path.path()).as("block %d", block).isEqualTo(referencePath.path());
                assertThat(path.posteriorSum()).as("block %d", block).isEqualTo(referencePath.posteriorSum());
            }
            // the constructors without a block length use blockFor
            double[] byDefault = new double[n * states];
            assertThat(posteriors(new ForwardBackward(p), seq, byDefault)).isEqualTo(referenceLogLik);
            assertThat(byDefault).isEqualTo(reference);
            assertThat(new PosteriorViterbi(p).decode(seq).path()).isEqualTo(referencePath.path());
        }
    }

    private static double posteriors(ForwardBackward fb, byte[] seq, double[] out) {
        int k = fb.stateCount();
        return fb.run(seq, (start, end, post, em) -> System.arraycopy(post, 0, out, start * k, (end - start) * k));
    }
}
