package dev.annotator.train;

import dev.annotator.error.BadInputException;
import dev.annotator.hmm.BaumWelchKernel;
import dev.annotator.hmm.ExpectedCounts;
import dev.annotator.hmm.ImpossibleSequenceException;
import dev.annotator.model.HmmModel;
import dev.annotator.model.ModelCompiler;
import dev.annotator.parallel.OrderedParallelMap;


import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;

import java.util.concurrent.Callable;
import java.util.concurrent.ForkJoinTask;

/**
 * Runs E-steps over a stream of sequences on a fixed number of threads, with results that do not depend on it.
 *
 * <p>Sequences are grouped, in input order, into batches of at least {@value #BATCH_BASES} bases (or one
 * sequence); a batch is counted by one task into its own accumulators, and batch totals are added up in input
 * order. Inside a task, long sequences are counted as two halves that run as parallel fork/join tasks (see
 * {@link BaumWelchKernel}), so a single long record keeps two threads busy too. Batches, halves and the order of
 * every sum depend on the input only. At most threads + 1 batches are in flight, so memory stays bounded.
 */
public final class ExpectationRunner implements AutoCloseable {
    /** Bases per batch: enough that a batch's work dwarfs allocating its accumulators. */
    public static final long BATCH_BASES = 1_000_000;

    private final int threads;

    public ExpectationRunner(int threads) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1");
        }
        this.threads = threads;
    }

    /** The kernel for a model: label-restricted when {@code labelled}. */
    private static BaumWelchKernel kernel(HmmModel model, boolean labelled) {
        return new BaumWelchKernel(ModelCompiler.compile(model), labelled ? model.stateLabels() : null,
                BaumWelchKernel.DEFAULT_BLOCK, BaumWelchKernel.DEFAULT_SPLIT);
    }

    /** Expected counts of all items under the model, folded into full-order tables. */
    public ModelCounts count(HmmModel model, boolean labelled, Iterator<CountItem> items) {
        BaumWelchKernel kernel = kernel(model, labelled);
        ExpectedCounts total = kernel.newCounts();
        runBatches(items, batch -> () -> countBatch(kernel, model, batch), total::add);
        kernel.fold(total);
        return ModelCounts.of(model, total);
    }

    /** Log-likelihood of all items under the model, by the forward pass. */
    public double logLikelihood(HmmModel model, boolean labelled, Iterator<CountItem> items) {
        BaumWelchKernel kernel = kernel(model, labelled);
        double[] total = {0};
        runBatches(items, batch -> () -> {
            double sum = 0;
            for (CountItem item : batch) {
                try {
                    sum += kernel.logLikelihood(item.bases(), item.labels());
                } catch (ImpossibleSequenceException e) {
                    throw impossible(item, model, e);
                }
            }
            return sum;
        }, v -> total[0] += v);
        return total[0];
    }

    private ExpectedCounts countBatch(BaumWelchKernel kernel, HmmModel model, List<CountItem> batch) {
        ExpectedCounts head = kernel.newCounts();
        ExpectedCounts tail = kernel.newCounts();
        for (CountItem item : batch) {
            try {
                kernel.accumulate(item.bases(), item.labels(), head, tail, ForkJoinTask.inForkJoinPool());
            } catch (ImpossibleSequenceException e) {
                throw impossible(item, model, e);
            }
        }
        head.add(tail);
        return head;
    }

    private static BadInputException impossible(CountItem item, HmmModel model, ImpossibleSequenceException e) {
        return new BadInputException(item.where() + ": model " + model.name() + " cannot emit this sequence"
                + (item.labels() == null ? "" : " with its labels") + " (probability 0 at base " + (e.position() + 1)
                + (item.labels() == null ? "" : "; do the labels ask for a transition the model forbids?") + ")");
    }

    private <R> void runBatches(Iterator<CountItem> items, java.util.function.Function<List<CountItem>, Callable<R>> task,
                                java.util.function.Consumer<R> sink) {
        try (OrderedParallelMap<List<CountItem>, R> map = new OrderedParallelMap<>(threads,
                batch -> call(task.apply(batch)), sink)) {
            List<CountItem> batch = new ArrayList<>();
            long bases = 0;
            while (items.hasNext()) {
                CountItem item = items.next();
                batch.add(item);
                bases += item.bases().length;
                if (bases >= BATCH_BASES) {
                    map.submit(batch);
                    batch = new ArrayList<>();
                    bases = 0;
                }
            }
            if (!batch.isEmpty()) {
                map.submit(batch);
            }
            map.finish();
        }
    }

    private static <R> R call(Callable<R> job) {
        try {
            return job.call();
        } catch (RuntimeException e) {
            throw e;
        } catch (Exception e) {
            throw new IllegalStateException(e);
        }
    }

    /** Nothing to release: each run's threads end with it. */
    @Override
    public void close() {
    }
}
