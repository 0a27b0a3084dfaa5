package org.spindrift.sim.history;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.IntConsumer;

/**
 * Independent pieces of work over a history (snapshots, blocks of particles) on a fixed number of
 * threads. Each piece writes only its own slots and computes its sums in its own order, so the
 * result is the same bit for bit whatever the thread count. The helpers are plain daemon threads
 * of their own (no fork-join pool: a caller that is itself a pool worker never ends up running
 * unrelated tasks while it waits).
 */
public final class Chunked {
    private Chunked() {
    }

    /**
     * Runs {@code body.accept(c)} for every chunk c in [0, chunks), on the calling thread when
     * threads is 1, else on it and up to threads - 1 helpers, each taking the next chunk not yet
     * taken; returns when all are done. The first failure of a chunk is thrown here, after the
     * other chunks have stopped.
     */
    public static void forEach(int chunks, int threads, IntConsumer body) {
        int n = Math.min(threads, chunks);
        if (n <= 1) {
            for (int c = 0; c < chunks; c++) {
                body.accept(c);
            }
            return;
        }
        AtomicInteger next = new AtomicInteger();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable work = () -> {
            for (int c = next.getAndIncrement(); c < chunks && failure.get() == null; c = next.getAndIncrement()) {
                try {
                    body.accept(c);
                } catch (Throwable t) {
                    failure.compareAndSet(null, t);
                }
            }
        };
        Thread[] helpers = new Thread[n - 1];
        for (int k = 0; k < helpers.length; k++) {
            helpers[k] = new Thread(work, "spindrift-chunk-" + k);
            helpers[k].setDaemon(true);
            helpers[k].start();
        }
        work.run();
        boolean interrupted = false;
        for (Thread t : helpers) {
            while (true) {
                try {
                    t.join();
                    break;
                } catch (InterruptedException e) {
                    // the helpers finish their chunks soon; keep the interrupt for the caller
                    interrupted = true;
                }
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
        Throwable t = failure.get();
        if (t instanceof RuntimeException re) {
            throw re;
        }
        if (t instanceof Error er) {
            throw er;
        }
        if (t != null) {
            throw new IllegalStateException(t);
        }
    }

    /** @return chunk c's first index when count items are cut into chunks pieces (the last ends at count) */
    public static int start(int c, int chunks, int count) {
        return (int) ((long) c * count / chunks);
    }
}
