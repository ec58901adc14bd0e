package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelLoader;
import dev.annotator.model.Provenance;
import dev.annotator.model.State;
import dev.annotator.model.Transition;
import dev.annotator.topology.GeneTopology;
import dev.annotator.topology.GeneticCode;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Which decoding a model gets when none is asked for. Posterior decoding of each base on its own can join labels
 * in an order no path allows; posterior-Viterbi (Fariselli, Martelli &amp; Casadio 2005, BMC Bioinformatics 6 Suppl 4:S12,
 * recalled from memory) keeps to allowed paths, which matters once a label has several states.
 */
class DecodeMethodDefaultTest {

    @Test
    void geneTopologyGetsPosteriorViterbi() {
        assertThat(DecodeMethod.defaultFor(GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 0)))
                .isEqualTo(DecodeMethod.POSTERIOR_VITERBI);
        assertThat(DecodeMethod.defaultFor(GeneTopology.build("genes", GeneticCode.TABLE_11, 2, 0, 0)))
                .isEqualTo(DecodeMethod.POSTERIOR_VITERBI);
    }

    @Test
    void shippedIslandModelGetsPosterior() {
        HmmModel islands = ModelLoader.load("cpg-island");
        // one state per label in the shipped file
        assertThat(islands.states()).extracting(State::label).doesNotHaveDuplicates();
        assertThat(DecodeMethod.defaultFor(islands)).isEqualTo(DecodeMethod.POSTERIOR);
    }

    @Test
    void twoStatesOnOneUnstrandedLabelAreEnough() {
        double[] u = {0.25, 0.25, 0.25, 0.25};
        HmmModel m = new HmmModel("two", "two states on one label", new Provenance("invented", List.of()),
                List.of(new Label("rich", "region", null, false, false), new Label("rest", null, null, true, false)),
                List.of(new State("a", "rich", 0, u), new State("b", "rich", 0, u), new State("r", "rest", 0, u)),
                new double[]{0, 0, 1},
                List.of(new Transition("a", "b", 1), new Transition("b", "r", 1), new Transition("r", "r", 0.9),
                        new Transition("r", "a", 0.1)));
        assertThat(DecodeMethod.defaultFor(m)).isEqualTo(DecodeMethod.POSTERIOR_VITERBI);
    }
}
