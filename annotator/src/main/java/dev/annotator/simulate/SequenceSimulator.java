package dev.annotator.simulate;

import dev.annotator.hmm.HmmParameters;
import dev.annotator.model.HmmModel;
import dev.annotator.model.Label;
import dev.annotator.model.ModelCompiler;
import dev.annotator.seq.SequenceRecord;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Samples records from a hidden Markov model: the first state from the start distribution, each next state from
 * the current state's transitions, and each base from the current state's emission table given the preceding
 * bases. Where fewer than k bases precede (the first k bases of a record), the reduced-order tables of
 * {@link HmmParameters} are used, the same ones the decoders use there.
 *
 * <p>All probabilities are turned into cumulative tables once, so a base costs two uniform draws and two short
 * scans; the state path is never stored, only the current run of its label. The output depends only on the
 * model and the generator's state: one seed always gives the same bytes. Immutable and safe to share between
 * threads as long as each thread has its own generator.
 */
public final class SequenceSimulator {
    private static final byte[] UPPER = {'A', 'C', 'G', 'T'};

    private final int maxOrder;
    private final int[] order;
    // cumulative emission rows of state s and context length j start at emitRow[s * (maxOrder + 1) + j]
    private final double[] emitCum;
    private final int[] emitRow;
    private final double[] startCum;
    private final int[] succOffset;
    private final int[] succState;
    private final double[] succCum;
    private final int[] labelOf;
    private final boolean[] labelReported;
    private final String[] labelName;

    public SequenceSimulator(HmmModel model) {
        HmmParameters p = ModelCompiler.compile(model);
        int k = p.stateCount();
        this.maxOrder = p.maxOrder();
        this.order = new int[k];

        int stride = maxOrder + 1;
        emitRow = new int[k * stride];
        int total = 0;
        for (int s = 0; s < k; s++) {
            order[s] = p.order(s);
            for (int j = 0; j <= order[s]; j++) {
                emitRow[s * stride + j] = total;
                total += 4 << (2 * j);
            }
        }
        emitCum = new double[total];
        for (int s = 0; s < k; s++) {
            for (int j = 0; j <= order[s]; j++) {
                int rows = 1 << (2 * j);
                for (int ctx = 0; ctx < rows; ctx++) {
                    double[] row = new double[4];
                    for (int b = 0; b < 4; b++) {
                        row[b] = p.emission(s, j, ctx, b);
                    }
                    double[] cum = cumulative(row, "state " + model.states().get(s).name() + " emission row " + ctx);
                    System.arraycopy(cum, 0, emitCum, emitRow[s * stride + j] + ctx * 4, 4);
                }
            }
        }

        double[] start = new double[k];
        for (int s = 0; s < k; s++) {
            start[s] = p.start(s);
        }
        startCum = cumulative(start, "start distribution");

        succOffset = new int[k + 1];
        List<Integer> to = new ArrayList<>();
        List<Double> cumProb = new ArrayList<>();
        for (int s = 0; s < k; s++) {
            List<Integer> targets = new ArrayList<>();
            for (int t = 0; t < k; t++) {
                if (p.transition(s, t) > 0) {
                    targets.add(t);
                }
            }
            double[] row = new double[targets.size()];
            for (int i = 0; i < row.length; i++) {
                row[i] = p.transition(s, targets.get(i));
            }
            double[] cum = cumulative(row, "transitions from state " + model.states().get(s).name());
            for (int i = 0; i < row.length; i++) {
                to.add(targets.get(i));
                cumProb.add(cum[i]);
            }
            succOffset[s + 1] = to.size();
        }
        succState = to.stream().mapToInt(Integer::intValue).toArray();
        succCum = cumProb.stream().mapToDouble(Double::doubleValue).toArray();

        int[] stateLabels = model.stateLabels();
        List<Label> labels = model.labels();
        labelOf = new int[k];
        for (int s = 0; s < k; s++) {
            if (stateLabels[s] < 0) {
                throw new IllegalArgumentException("state " + model.states().get(s).name() + " has an unknown label");
            }
            labelOf[s] = stateLabels[s];
        }
        labelReported = new boolean[labels.size()];
        labelName = new String[labels.size()];
        for (int l = 0; l < labels.size(); l++) {
            labelReported[l] = !labels.get(l).background();
            labelName[l] = labels.get(l).name();
        }
    }

    /**
     * Samples one record of {@code length} bases named {@code name} (empty description).
     *
     * @param rng consumed in a fixed order (emission draw, then transition draw, per base)
     */
    public SimulatedRecord sample(String name, int length, SplittableRandom rng) {
        if (length < 0) {
            throw new IllegalArgumentException("length must not be negative, got " + length);
        }
        byte[] bases = new byte[length];
        List<PlantedSegment> planted = new ArrayList<>();
        if (length == 0) {
            return new SimulatedRecord(new SequenceRecord(name, "", bases), planted);
        }
        final int stride = maxOrder + 1;
        final int historyMask = (1 << (2 * maxOrder)) - 1;
        final double[] emit = emitCum;
        int s = draw(startCum, 0, startCum.length - 1, rng.nextDouble());
        int history = 0; // the last maxOrder bases, oldest most significant
        int runLabel = labelOf[s];
        int runStart = 1;
        for (int i = 0; i < length; i++) {
            int j = Math.min(i, order[s]);
            int row = emitRow[s * stride + j] + ((history & ((1 << (2 * j)) - 1)) << 2);
            double u = rng.nextDouble();
            int b = u < emit[row] ? 0 : u < emit[row + 1] ? 1 : u < emit[row + 2] ? 2 : 3;
            bases[i] = UPPER[b];
            history = ((history << 2) | b) & historyMask;

            if (i + 1 < length) {
                s = succState[draw(succCum, succOffset[s], succOffset[s + 1] - 1, rng.nextDouble())];
                int label = labelOf[s];
                if (label != runLabel) {
                    if (labelReported[runLabel]) {
                        planted.add(new PlantedSegment(labelName[runLabel], runStart, i + 1));
                    }
                    runLabel = label;
                    runStart = i + 2;
                }
            }
        }
        if (labelReported[runLabel]) {
            planted.add(new PlantedSegment(labelName[runLabel], runStart, length));
        }
        return new SimulatedRecord(new SequenceRecord(name, "", bases), planted);
    }

    /** First index in [from, last] whose cumulative value exceeds u; cum[last] is exactly 1. */
    private static int draw(double[] cum, int from, int last, double u) {
        int i = from;
        while (i < last && u >= cum[i]) {
            i++;
        }
        return i;
    }

    /**
     * Normalised running sums. The entry of the last positive probability (and all after it) is set to exactly
     * 1, so a uniform draw in [0, 1) always lands on an outcome of positive probability despite rounding.
     */
    private static double[] cumulative(double[] p, String what) {
        double total = 0;
        for (double v : p) {
            if (!(v >= 0) || Double.isInfinite(v)) {
                throw new IllegalArgumentException(what + ": probabilities must be finite and non-negative");
            }
            total += v;
        }
        if (!(total > 0)) {
            throw new IllegalArgumentException(what + ": probabilities sum to 0");
        }
        double[] cum = new double[p.length];
        double run = 0;
        int lastPositive = 0;
        for (int i = 0; i < p.length; i++) {
            run += p[i] / total;
            cum[i] = run;
            if (p[i] > 0) {
                lastPositive = i;
            }
        }
        for (int i = lastPositive; i < p.length; i++) {
            cum[i] = 1.0;
        }
        return cum;
    }
}
