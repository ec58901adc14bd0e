package dev.annotator.decode;

import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelLoader;
import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * What a record's state paths cost per base, as the memory budget is told: counted here from the model files,
 * state by state, independently of the kernels' own bookkeeping.
 */
class PathMemoryTest {
    /** States with more than one allowed successor: the only ones posterior-Viterbi keeps a back-pointer for. */
    private static long branchingStates(HmmModel m) {
        return m.states().stream().filter(st -> m.transitions().stream()
                .filter(t -> t.from().equals(st.name()) && t.probability() > 0).count() > 1).count();
    }

    @Test
    void geneModelHoldsBothStrandViewsAtOnceWithBackPointersOnlyWhereAPathBranches() {
        HmmModel genes = ModelLoader.load("bacterial-genes");
        HmmModel plus = StrandView.of(genes, '+');
        HmmModel minus = StrandView.of(genes, '-');
        Annotator a = new Annotator(genes, DecodeMethod.POSTERIOR_VITERBI, 0);
        assertThat(a.pathBytesPerBase()).isEqualTo(branchingStates(plus) + 1 + branchingStates(minus) + 1);
        assertThat(a.widestBackPointerRow()).isEqualTo((int) Math.max(branchingStates(plus), branchingStates(minus)));
        assertThat(a.pathBytesPerBase()).isLessThan(2L * (genes.stateCount() + 1));
    }

    @Test
    void viterbiKeepsOneBackPointerPerStateAndPosteriorDecodingNone() {
        HmmModel islands = ModelLoader.load("cpg-island");
        assertThat(new Annotator(islands, DecodeMethod.VITERBI, 0).pathBytesPerBase())
                .isEqualTo(islands.stateCount() + 1L);
        assertThat(new Annotator(islands, DecodeMethod.VITERBI, 0).widestBackPointerRow())
                .isEqualTo(islands.stateCount());
        assertThat(new Annotator(islands, DecodeMethod.POSTERIOR, 0).pathBytesPerBase()).isZero();
    }
}
