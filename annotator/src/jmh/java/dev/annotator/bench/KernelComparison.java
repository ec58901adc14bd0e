package dev.annotator.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.lang.reflect.Method;
import java.lang.reflect.Proxy;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Two or more builds' kernels compared in one JVM: each build's benchmark jar in a class loader of its own, the
 * builds called in turn within every round (the order rotating from round to round), each call timed by the thread's
 * processor time. A shared machine's speed drifts by tens of percent over seconds; within a round every build meets
 * the same conditions, so the median of the per-round ratios to the first build settles in a few dozen rounds where
 * whole-process timings need many more. Same topologies and 1 Mbp sequences as {@link KernelBenchmark}.
 *
 * <p>Each build is compiled by the JIT on its own (its classes are distinct), so identical builds should come out
 * at a ratio near 1; run one build against a copy of itself first to see the spread on the machine at hand.
 *
 * <pre>java -cp annotator/target/benchmarks.jar dev.annotator.bench.KernelComparison TOPOLOGY ROUNDS A.jar B.jar...</pre>
 *
 * where every jar is a {@code benchmarks.jar} (built with {@code -Pjmh}) of the build to compare.
 */
public final class KernelComparison {
    private static final int WARMUP = 3;
    private static final String[] KERNELS = {"forward", "forwardBackwardPosteriors", "posteriorViterbi"};

    private KernelComparison() {
    }

    /** One build's kernels, called through reflection so that every build keeps its own classes. */
    private record Build(String name, List<Runnable> kernels) {
    }

    public static void main(String[] args) throws Exception {
        if (args.length < 4) {
            System.err.println("usage: KernelComparison TOPOLOGY ROUNDS A.jar B.jar...");
            System.exit(64);
        }
        String topology = args[0];
        int rounds = Integer.parseInt(args[1]);
        List<Build> builds = new ArrayList<>();
        for (int i = 2; i < args.length; i++) {
            Path jar = Path.of(args[i]);
            if (!Files.isRegularFile(jar)) {
                System.err.println("KernelComparison: " + jar + ": no such file");
                System.exit(66);
            }
            builds.add(load(jar, topology));
        }
        int n = builds.size();
        double[][][] ms = new double[KERNELS.length][n][rounds];
        for (int w = 0; w < WARMUP; w++) {
            for (Build b : builds) {
                b.kernels.forEach(Runnable::run);
            }
        }
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        for (int r = 0; r < rounds; r++) {
            for (int i = 0; i < n; i++) {
                int b = (i + r) % n;
                List<Runnable> kernels = builds.get(b).kernels;
                for (int k = 0; k < KERNELS.length; k++) {
                    long start = threads.getCurrentThreadCpuTime();
                    kernels.get(k).run();
                    ms[k][b][r] = (threads.getCurrentThreadCpuTime() - start) / 1e6;
                }
            }
        }
        System.out.printf(Locale.ROOT, "%-26s %-24s %12s %12s %22s%n", "kernel", "build", "cpu_ms_med",
                "ratio_med", "ratio_quartiles");
        for (int k = 0; k < KERNELS.length; k++) {
            for (int b = 0; b < n; b++) {
                double[] ratio = new double[rounds];
                for (int r = 0; r < rounds; r++) {
                    ratio[r] = ms[k][b][r] / ms[k][0][r];
                }
                Arrays.sort(ratio);
                System.out.printf(Locale.ROOT, "%-26s %-24s %12.1f %12.3f %10.3f-%-11.3f%n", KERNELS[k],
                        builds.get(b).name, median(ms[k][b]), ratio[rounds / 2], ratio[rounds / 4],
                        ratio[(3 * rounds) / 4]);
            }
        }
        System.out.println(rounds + " rounds, " + topology + ", 1 Mbp; ratio: per-round processor time against the "
                + "first build");
    }

    private static Build load(Path jar, String topology) throws Exception {
        ClassLoader loader = new URLClassLoader(new URL[]{jar.toUri().toURL()},
                ClassLoader.getPlatformClassLoader());
        Class<?> bench = loader.loadClass(KernelBenchmark.class.getName());
        Object parameters = declared(bench, "parameters").invoke(null, topology);
        byte[] sequence = (byte[]) declared(bench, "sequence").invoke(null, topology);
        Class<?> parametersClass = loader.loadClass("dev.annotator.hmm.HmmParameters");
        Object forwardBackward = loader.loadClass("dev.annotator.hmm.ForwardBackward")
                .getConstructor(parametersClass).newInstance(parameters);
        Object posteriorViterbi = loader.loadClass("dev.annotator.hmm.PosteriorViterbi")
                .getConstructor(parametersClass).newInstance(parameters);
        Class<?> sinkClass = loader.loadClass("dev.annotator.hmm.PosteriorBlockSink");
        double[] touched = new double[1];
        // the sink touches each block's posteriors, as KernelBenchmark's does, so the pass cannot be skipped
        Object sink = Proxy.newProxyInstance(loader, new Class<?>[]{sinkClass}, (proxy, method, a) -> {
            if (method.getName().equals("block")) {
                touched[0] += ((double[]) a[2])[0];
                return null;
            }
            throw new UnsupportedOperationException(method.getName());
        });
        Method forward = forwardBackward.getClass().getMethod("logLikelihood", byte[].class);
        Method run = forwardBackward.getClass().getMethod("run", byte[].class, sinkClass);
        Method decode = posteriorViterbi.getClass().getMethod("decode", byte[].class);
        List<Runnable> kernels = List.of(
                call(forward, forwardBackward, sequence),
                call(run, forwardBackward, sequence, sink),
                call(decode, posteriorViterbi, sequence));
        return new Build(jar.toString(), kernels);
    }

    /** A static method taking the topology's name; builds before these were public had them package-private. */
    private static Method declared(Class<?> bench, String name) throws NoSuchMethodException {
        Method m = bench.getDeclaredMethod(name, String.class);
        m.setAccessible(true);
        return m;
    }

    private static Runnable call(Method method, Object target, Object... args) {
        return () -> {
            try {
                method.invoke(target, args);
            } catch (ReflectiveOperationException e) {
                throw new IllegalStateException(method + " failed", e);
            }
        };
    }

    private static double median(double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        return sorted[sorted.length / 2];
    }
}
