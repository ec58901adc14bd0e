package dev.annotator.bench;

import dev.annotator.decode.StrandViews;
import dev.annotator.hmm.BaumWelchKernel;
import dev.annotator.hmm.ExpectedCounts;
import dev.annotator.hmm.ForwardBackward;
import dev.annotator.hmm.HmmParameters;
import dev.annotator.hmm.PosteriorBlockSink;
import dev.annotator.hmm.PosteriorViterbi;
import dev.annotator.hmm.Viterbi;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelCompiler;
import dev.annotator.model.ModelLoader;
import dev.annotator.simulate.SequenceSimulator;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;

/**
 * Kernel throughput per topology (forward, forward-backward with posteriors, Viterbi, posterior-Viterbi, Baum-Welch
 * expected counts) on 1 Mbp of sequence (each benchmark in its own JVM fork). The score is
 * milliseconds per 1 Mbp: Mbp/s = 1000 / score.
 *
 * <p>Topologies: {@code island} is the shipped two-state first-order model; {@code dense3} a three-state
 * second-order model with every transition allowed; {@code sparse20} a twenty-state model with orders up to 5
 * and about three allowed transitions per state, the shape of a coding-structure topology; {@code genes} the
 * shipped 43-state gene model (both strands, sparse transitions, orders up to 4); {@code genesPlus} and
 * {@code genesMinus} its two 25-state strand views, which are what a gene model is decoded with (forward-backward
 * and posterior-Viterbi per strand). The first three run on uniform random bases; the gene topologies on a
 * sequence sampled from the whole gene model, so that genes, start and stop codons occur as the decoder meets
 * them in a genome.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class KernelBenchmark {
    private static final int LENGTH = 1_000_000;

    @Param({"island", "dense3", "sparse20", "genes", "genesPlus", "genesMinus"})
    public String topology;

    private byte[] sequence;
    private ForwardBackward forwardBackward;
    private Viterbi viterbi;
    private PosteriorViterbi posteriorViterbi;
    private BaumWelchKernel baumWelch;

    @Setup
    public void setUp() {
        HmmParameters p = parameters(topology);
        forwardBackward = new ForwardBackward(p);
        viterbi = new Viterbi(p);
        posteriorViterbi = new PosteriorViterbi(p);
        baumWelch = new BaumWelchKernel(p);
        sequence = sequence(topology);
    }

    /** The compiled model of a topology named as in {@link #topology}. */
    public static HmmParameters parameters(String topology) {
        return switch (topology) {
            case "island" -> ModelCompiler.compile(ModelLoader.load("cpg-island"));
            case "dense3" -> randomModel(new SplittableRandom(3), 3, 2, 3);
            case "sparse20" -> randomModel(new SplittableRandom(20), 20, 5, 3);
            case "genes" -> ModelCompiler.compile(ModelLoader.load("bacterial-genes"));
            case "genesPlus" -> ModelCompiler.compile(StrandViews.of(ModelLoader.load("bacterial-genes"), '+'));
            case "genesMinus" -> ModelCompiler.compile(StrandViews.of(ModelLoader.load("bacterial-genes"), '-'));
            default -> throw new IllegalArgumentException(topology);
        };
    }

    /** The 1 Mbp a topology is measured on. */
    public static byte[] sequence(String topology) {
        SplittableRandom rng = new SplittableRandom(1);
        if (topology.startsWith("genes")) {
            HmmModel genes = ModelLoader.load("bacterial-genes");
            return new SequenceSimulator(genes).sample("bench", LENGTH, rng).record().bases();
        }
        byte[] bases = new byte[LENGTH];
        for (int i = 0; i < LENGTH; i++) {
            bases[i] = (byte) "ACGT".charAt(rng.nextInt(4));
        }
        return bases;
    }

    @Benchmark
    public double forward() {
        return forwardBackward.logLikelihood(sequence);
    }

    /** Forward pass, block recomputation, backward pass and posteriors (a sink that only touches them). */
    @Benchmark
    public double forwardBackwardPosteriors(Blackhole hole) {
        PosteriorBlockSink sink = (start, end, posterior, emission) -> hole.consume(posterior[0]);
        return forwardBackward.run(sequence, sink);
    }

    @Benchmark
    public double viterbi() {
        return viterbi.decode(sequence).logProbability();
    }

    /** Forward-backward feeding the backward-in-time max-sum pass, then the path read off. */
    @Benchmark
    public double posteriorViterbi() {
        return posteriorViterbi.decode(sequence).posteriorSum();
    }

    /** One Baum-Welch E-step: expected start, transition and emission counts (one thread, no fork). */
    @Benchmark
    public ExpectedCounts expectedCounts() {
        ExpectedCounts head = baumWelch.newCounts();
        ExpectedCounts tail = baumWelch.newCounts();
        baumWelch.accumulate(sequence, null, head, tail, false);
        head.add(tail);
        return head;
    }

    /** States, each with a self-loop and links to {@code fanOut - 1} others; orders 0..maxOrder. */
    static HmmParameters randomModel(SplittableRandom rng, int states, int maxOrder, int fanOut) {
        int n = states * fanOut;
        int[] from = new int[n];
        int[] to = new int[n];
        double[] prob = new double[n];
        int t = 0;
        for (int s = 0; s < states; s++) {
            double[] row = distribution(rng, fanOut);
            for (int f = 0; f < fanOut; f++) {
                from[t] = s;
                to[t] = (s + f) % states;
                prob[t] = row[f];
                t++;
            }
        }
        int[] orders = new int[states];
        double[][] tables = new double[states][];
        for (int s = 0; s < states; s++) {
            orders[s] = s % (maxOrder + 1);
            int rows = 1 << (2 * orders[s]);
            tables[s] = new double[rows * 4];
            for (int r = 0; r < rows; r++) {
                System.arraycopy(distribution(rng, 4), 0, tables[s], r * 4, 4);
            }
        }
        return new HmmParameters(distribution(rng, states), from, to, prob, orders, tables);
    }

    private static double[] distribution(SplittableRandom rng, int n) {
        double[] d = new double[n];
        double sum = 0;
        for (int i = 0; i < n; i++) {
            d[i] = 0.05 + rng.nextDouble();
            sum += d[i];
        }
        for (int i = 0; i < n; i++) {
            d[i] /= sum;
        }
        return d;
    }
}
