package dev.annotator.parallel;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.Future;
import java.util.function.Consumer;
import java.util.function.Function;
import java.util.function.ToLongFunction;

/**
 * Applies a function to a stream of items on a fixed number of threads and hands the results on in input order,
 * keeping at most threads + 1 items in flight so memory stays bounded on large inputs. Items also have a weight
 * (a record's length): the weights in flight stay within a budget, except that one item is always let through.
 * Items run as fork-join tasks, so an item may fork work of its own onto the same threads.
 */
public final class OrderedParallelMap<I, O> implements AutoCloseable {
    private final Function<I, O> function;
    private final Consumer<O> downstream;
    private final int threads;
    private final ToLongFunction<I> weight;
    private final long maxWeightInFlight;
    private final ForkJoinPool pool;
    private final Deque<Future<O>> inFlight = new ArrayDeque<>();
    private final Deque<Long> weights = new ArrayDeque<>();
    private long weightInFlight;

    public OrderedParallelMap(int threads, Function<I, O> function, Consumer<O> downstream) {
        this(threads, function, downstream, item -> 0, Long.MAX_VALUE);
    }

    public OrderedParallelMap(int threads, Function<I, O> function, Consumer<O> downstream, ToLongFunction<I> weight,
                       long maxWeightInFlight) {
        this.function = function;
        this.downstream = downstream;
        this.threads = threads;
        this.weight = weight;
        this.maxWeightInFlight = maxWeightInFlight;
        // a fork-join pool, so that work items can split themselves (windows of a long record) on the same threads
        this.pool = threads > 1 ? new ForkJoinPool(threads) : null;
    }

    public void submit(I item) {
        if (pool == null) {
            downstream.accept(function.apply(item));
            return;
        }
        long w = weight.applyAsLong(item);
        while (!inFlight.isEmpty() && weightInFlight > maxWeightInFlight - w) {
            passOnOldest();
        }
        inFlight.add(pool.submit(() -> function.apply(item)));
        weights.add(w);
        weightInFlight += w;
        while (inFlight.size() > threads) {
            passOnOldest();
        }
    }

    /** Waits for everything submitted and passes it on. */
    public void finish() {
        while (!inFlight.isEmpty()) {
            passOnOldest();
        }
    }

    private void passOnOldest() {
        O result = await(inFlight.poll());
        weightInFlight -= weights.poll();
        downstream.accept(result);
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
