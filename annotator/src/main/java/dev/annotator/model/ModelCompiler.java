package dev.annotator.model;

import dev.annotator.hmm.HmmParameters;

import java.util.List;

/** Lays a validated {@link HmmModel} out as the kernels' primitive arrays. */
public final class ModelCompiler {
    private ModelCompiler() {
    }

    public static HmmParameters compile(HmmModel model) {
        int k = model.stateCount();
        List<Transition> ts = model.transitions();
        int[] from = new int[ts.size()];
        int[] to = new int[ts.size()];
        double[] prob = new double[ts.size()];
        for (int i = 0; i < ts.size(); i++) {
            Transition t = ts.get(i);
            from[i] = model.stateIndex(t.from());
            to[i] = model.stateIndex(t.to());
            prob[i] = t.probability();
        }
        int[] orders = new int[k];
        double[][] tables = new double[k][];
        for (int s = 0; s < k; s++) {
            State st = model.states().get(s);
            orders[s] = st.order();
            tables[s] = st.emissions();
        }
        return new HmmParameters(model.start(), from, to, prob, orders, tables);
    }
}
