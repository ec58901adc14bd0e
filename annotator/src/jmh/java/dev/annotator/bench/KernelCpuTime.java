package dev.annotator.bench;

import dev.annotator.hmm.ForwardBackward;
import dev.annotator.hmm.HmmParameters;
import dev.annotator.hmm.PosteriorViterbi;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.Locale;

/**
 * The kernels of {@link KernelBenchmark} timed by the CPU time of the thread that runs them rather than by the
 * clock, for a machine shared with other work: time spent waiting for a core is not counted. Same topologies and
 * 1 Mbp sequences; prints the median and the least of the repeats in ms per Mbp. Run one topology per JVM, as JMH
 * forks do: the compiler's choices for a kernel depend on the models it has seen run.
 *
 * <pre>java -cp annotator/target/benchmarks.jar dev.annotator.bench.KernelCpuTime TOPOLOGY [REPEATS]</pre>
 */
public final class KernelCpuTime {
    private static final int WARMUP = 5;

    private KernelCpuTime() {
    }

    public static void main(String[] args) {
        if (args.length < 1) {
            System.err.println("usage: KernelCpuTime TOPOLOGY [REPEATS]");
            System.exit(64);
        }
        String topology = args[0];
        int repeats = args.length > 1 ? Integer.parseInt(args[1]) : 9;
        HmmParameters p = KernelBenchmark.parameters(topology);
        byte[] sequence = KernelBenchmark.sequence(topology);
        ForwardBackward forwardBackward = new ForwardBackward(p);
        PosteriorViterbi posteriorViterbi = new PosteriorViterbi(p);
        double[] sink = new double[1];
        time(topology, "forward", repeats, () -> sink[0] += forwardBackward.logLikelihood(sequence));
        time(topology, "forwardBackwardPosteriors", repeats, () -> sink[0] += forwardBackward.run(sequence,
                (start, end, posterior, emission) -> sink[0] += posterior[0]));
        time(topology, "posteriorViterbi", repeats, () -> sink[0] += posteriorViterbi.decode(sequence).posteriorSum());
        if (Double.isNaN(sink[0])) {
            System.out.println("NaN");
        }
    }

    private static void time(String topology, String kernel, int repeats, Runnable run) {
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        for (int i = 0; i < WARMUP; i++) {
            run.run();
        }
        double[] ms = new double[repeats];
        for (int i = 0; i < repeats; i++) {
            long start = threads.getCurrentThreadCpuTime();
            run.run();
            ms[i] = (threads.getCurrentThreadCpuTime() - start) / 1e6;
        }
        Arrays.sort(ms);
        System.out.printf(Locale.ROOT, "%-26s %-11s cpu ms/Mbp median %8.2f  least %8.2f%n", kernel, topology,
                ms[repeats / 2], ms[0]);
    }
}
