package dev.annotator.pipeline;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.Future;
import java.util.function.Consumer;
import java.util.function.Function;

/**
 * Applies a function to a stream of items on a fixed number of threads and hands the results on in input order,
 * keeping at most threads + 1 items in flight so memory stays bounded on large inputs. Items run as fork-join
 * tasks, so an item may fork work of its own onto the same threads.
 */
final class OrderedParallelMap<I, O> implements AutoCloseable {
    private final Function<I, O> function;
    private final Consumer<O> downstream;
    private final int threads;
    private final ExecutorService pool;
    private final Deque<Future<O>> inFlight = new ArrayDeque<>();

    OrderedParallelMap(int threads, Function<I, O> function, Consumer<O> downstream) {
        this.function = function;
        this.downstream = downstream;
        this.threads = threads;
        // a fork-join pool, so that work items can split themselves (windows of a long record) on the same threads
        this.pool = threads > 1 ? new ForkJoinPool(threads) : null;
    }

    void submit(I item) {
        if (pool == null) {
            downstream.accept(function.apply(item));
            return;
        }
        inFlight.add(pool.submit(() -> function.apply(item)));
        while (inFlight.size() > threads) {
            downstream.accept(await(inFlight.poll()));
        }
    }

    /** Waits for everything submitted and passes it on. */
    void finish() {
        while (!inFlight.isEmpty()) {
            downstream.accept(await(inFlight.poll()));
        }
    }

    private O await(Future<O> future) {
        try {
            return future.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    @Override
    public void close() {
        if (pool != null) {
            for (Future<O> f : inFlight) {
                f.cancel(true);
            }
            pool.shutdownNow();
        }
    }
}
