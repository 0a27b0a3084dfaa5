package org.spindrift.sim.sweep;

import java.io.IOException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

/**
 * Worker pools of daemon threads (an interrupted command never waits for them) and waiting for
 * their results, shared by sweep planning, sweep runs and studies.
 */
public final class Workers {
    private Workers() {
    }

    /** A fixed pool of max(1, n) daemon threads named {@code name}. */
    public static ExecutorService daemonPool(int n, String name) {
        return Executors.newFixedThreadPool(Math.max(1, n), r -> {
            Thread t = new Thread(r, name);
            t.setDaemon(true);
            return t;
        });
    }

    /**
     * Waits for every future in order; the first failure is rethrown as it was thrown (I/O and
     * unchecked exceptions), anything else wrapped.
     */
    public static void awaitAll(Iterable<? extends Future<?>> futures) throws IOException {
        for (Future<?> f : futures) {
            try {
                f.get();
            } catch (ExecutionException e) {
                Throwable c = e.getCause();
                if (c instanceof IOException io) {
                    throw io;
                }
                if (c instanceof RuntimeException re) {
                    throw re;
                }
                if (c instanceof Error err) {
                    throw err;
                }
                throw new IllegalStateException(c);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IOException("interrupted", e);
            }
        }
    }
}
