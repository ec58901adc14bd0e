package dev.annotator.topology;

import dev.annotator.model.EmissionContexts;
import dev.annotator.model.HmmModel;
import dev.annotator.model.State;

import java.util.Arrays;
import java.util.Set;
import java.util.TreeSet;

import static org.assertj.core.api.Assertions.assertThat;

/** What runs of three codon states of a model can emit, for tests of structural zeros. */
public final class TripletEmissions {
    private static final String BASES = "ACGT";

    private TripletEmissions() {
    }

    /**
     * Triplets (read forwards) that three consecutive states can emit. Each triplet is tried after every history
     * of preceding bases long enough for the highest order, so every state sees a context consistent with the
     * bases before it; a triplet must be possible after all histories or after none.
     */
    public static Set<String> emitted(HmmModel m, String... stateNames) {
        State[] st = Arrays.stream(stateNames).map(n -> m.states().get(m.stateIndex(n))).toArray(State[]::new);
        int k = Arrays.stream(st).mapToInt(State::order).max().orElseThrow();
        Set<String> out = new TreeSet<>();
        for (String w : NcbiTables.allCodons()) {
            int nonzero = 0;
            int histories = EmissionContexts.count(k);
            for (int h = 0; h < histories; h++) {
                String text = EmissionContexts.name(h, k) + w;
                double p = 1;
                for (int q = 0; q < 3; q++) {
                    int pos = k + q;
                    String context = text.substring(pos - st[q].order(), pos);
                    p *= st[q].emission(EmissionContexts.row(context), BASES.indexOf(text.charAt(pos)));
                }
                if (p > 0) {
                    nonzero++;
                }
            }
            assertThat(nonzero).as("%s after some histories only", w).isIn(0, histories);
            if (nonzero == histories) {
                out.add(w);
            }
        }
        return out;
    }

}
