package org.spindrift.sim.history;

import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.function.IntConsumer;
import java.util.stream.IntStream;

/**
 * Independent pieces of work over a history (snapshots, blocks of particles) on a fixed number of
 * threads. Each piece writes only its own slots and computes its sums in its own order, so the
 * result is the same bit for bit whatever the thread count.
 */
public final class Chunked {
    private Chunked() {
    }

    /**
     * Runs {@code body.accept(c)} for every chunk c in [0, chunks), on the calling thread when
     * threads is 1, else on a pool of at most that many threads; returns when all are done.
     * An exception of a chunk is thrown here.
     */
    public static void forEach(int chunks, int threads, IntConsumer body) {
        int n = Math.min(threads, chunks);
        if (n <= 1) {
            for (int c = 0; c < chunks; c++) {
                body.accept(c);
            }
            return;
        }
        ForkJoinPool pool = new ForkJoinPool(n);
        try {
            pool.submit(() -> IntStream.range(0, chunks).parallel().forEach(body)).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            Throwable t = e.getCause();
            if (t instanceof RuntimeException re) {
                throw re;
            }
            if (t instanceof Error er) {
                throw er;
            }
            throw new IllegalStateException(t);
        } finally {
            pool.shutdown();
        }
    }

    /** @return chunk c's first index when count items are cut into chunks pieces (the last ends at count) */
    public static int start(int c, int chunks, int count) {
        return (int) ((long) c * count / chunks);
    }
}
