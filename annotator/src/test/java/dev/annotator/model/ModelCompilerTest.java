package dev.annotator.model;

import dev.annotator.hmm.HmmParameters;
import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class ModelCompilerTest {

    @Test
    void shippedModelLaysOutAsTheFileSays() {
        HmmModel m = ShippedModels.load("cpg-island").orElseThrow();
        HmmParameters p = ModelCompiler.compile(m);

        assertThat(p.stateCount()).isEqualTo(2);
        assertThat(p.maxOrder()).isEqualTo(1);
        assertThat(p.start(0)).isEqualTo(1.0 / 21);
        assertThat(p.start(1)).isEqualTo(20.0 / 21);
        assertThat(p.transitionCount()).isEqualTo(4);
        assertThat(p.transition(0, 0)).isEqualTo(0.999);
        assertThat(p.transition(0, 1)).isEqualTo(0.001);
        assertThat(p.transition(1, 1)).isEqualTo(0.99995);
        assertThat(p.transition(1, 0)).isEqualTo(0.00005);

        // the C -> G step, the one CpG islands are about: .274/1.001 inside, .078 outside (Table 3.1, recalled
        // from memory, as the model file says)
        int c = 1;
        int g = 2;
        assertThat(p.emission(0, 1, c, g)).isCloseTo(0.274 / 1.001, within(1e-15));
        assertThat(p.emission(1, 1, c, g)).isEqualTo(0.078);
        for (int s = 0; s < 2; s++) {
            State st = m.states().get(s);
            for (int ctx = 0; ctx < 4; ctx++) {
                for (int b = 0; b < 4; b++) {
                    assertThat(p.emission(s, 1, ctx, b)).isEqualTo(st.emission(ctx, b));
                }
            }
        }
        // the order-0 fallback is the plain average of the four rows (HmmParameters' documented rule)
        assertThat(p.emission(1, 0, 0, 0)).isCloseTo((0.300 + 0.322 + 0.248 + 0.177) / 4, within(1e-15));
    }
}
