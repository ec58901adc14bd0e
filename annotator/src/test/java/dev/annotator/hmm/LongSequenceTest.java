package dev.annotator.hmm;

import org.junit.jupiter.api.Test;

import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * 10 Mbp: unscaled probabilities would underflow a double after ~1000 bases (P(x) is about 4^-L), so this
 * checks the scaling survives genome-sized input and that checkpointing is exact whatever the block size.
 */
class LongSequenceTest {

    @Test
    void tenMegabasesDecodeWithoutUnderflowAndPosteriorsSumToOne() {
        SplittableRandom rng = new SplittableRandom(42L);
        HmmParameters p = RandomModels.model(rng, 3, 2, false);
        byte[] seq = RandomModels.sequence(rng, 10_000_000, 0.001);
        // a stretch of Ns as in assembly gaps
        java.util.Arrays.fill(seq, 5_000_000, 5_050_000, (byte) 'N');

        double[] worstSum = {0};
        boolean[] bad = {false};
        float[] sample = new float[10_000];
        double logLik = new ForwardBackward(p).run(seq, (t, gamma, e) -> {
            double sum = 0;
            for (double g : gamma) {
                if (!(g >= 0 && g <= 1)) {
                    bad[0] = true;
                }
                sum += g;
            }
            worstSum[0] = Math.max(worstSum[0], Math.abs(sum - 1));
            if (t % 1000 == 0) {
                sample[t / 1000] = (float) gamma[0];
            }
        });
        assertThat(bad[0]).as("a posterior outside [0,1] or NaN").isFalse();
        assertThat(worstSum[0]).isLessThan(1e-9);
        assertThat(logLik).isFinite().isLessThan(-1e6);
        assertThat(new ForwardBackward(p).logLikelihood(seq)).isEqualTo(logLik);

        // a different checkpoint spacing must give bit-identical posteriors (the recomputation repeats the same arithmetic)
        float[] other = new float[10_000];
        new ForwardBackward(p, 100_003).run(seq, (t, gamma, e) -> {
            if (t % 1000 == 0) {
                other[t / 1000] = (float) gamma[0];
            }
        });
        for (int i = 0; i < sample.length; i++) {
            assertThat(other[i]).isEqualTo(sample[i]);
        }
    }
}
