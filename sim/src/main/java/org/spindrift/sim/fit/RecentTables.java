package org.spindrift.sim.fit;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.function.Supplier;

/**
 * The most recently used values of an expensive computation (ray tables, spacetimes), at most
 * {@code capacity} of them, shared by threads: a value is computed once while others asking for
 * the same key wait for it, and the least recently used one is dropped beyond the capacity (a
 * fit that moves spin or inclination continuously would otherwise keep every table it traced).
 * A dropped value is computed again when asked for, with the same result. Values are computed on
 * threads of their own (see {@link #get}).
 */
final class RecentTables<K, V> {
    private final int capacity;
    private final LinkedHashMap<K, CompletableFuture<V>> map;

    RecentTables(int capacity) {
        this.capacity = capacity;
        // access order: iteration starts at the least recently used entry
        this.map = new LinkedHashMap<>(16, 0.75f, true);
    }

    /** @return the value for key, computed by make when it is not held (the caller waits) */
    V get(K key, Supplier<V> make) {
        CompletableFuture<V> mine = new CompletableFuture<>();
        CompletableFuture<V> held;
        synchronized (map) {
            held = map.get(key);
            if (held == null) {
                map.put(key, mine);
                while (map.size() > capacity) {
                    Map.Entry<K, CompletableFuture<V>> eldest = map.entrySet().iterator().next();
                    map.remove(eldest.getKey());
                }
            }
        }
        if (held != null) {
            return join(held);
        }
        // computed on a thread of its own, never on a fork-join worker: a worker waiting for the
        // table's tracing pool would help with other tasks of its own pool meanwhile, and such a
        // task asking for this very table would wait for itself
        MAKERS.execute(() -> {
            try {
                mine.complete(make.get());
            } catch (RuntimeException | Error e) {
                synchronized (map) {
                    map.remove(key, mine);
                }
                mine.completeExceptionally(e);
            }
        });
        return join(mine);
    }

    /** Daemon threads that compute the values (idle ones end after a minute). */
    private static final ExecutorService MAKERS = Executors.newCachedThreadPool(r -> {
        Thread t = new Thread(r, "spindrift-table");
        t.setDaemon(true);
        return t;
    });

    private static <V> V join(CompletableFuture<V> f) {
        try {
            return f.join();
        } catch (CompletionException e) {
            throw rethrow(e.getCause());
        }
    }

    /** @return how many values are held */
    int size() {
        synchronized (map) {
            return map.size();
        }
    }

    private static RuntimeException rethrow(Throwable t) {
        if (t instanceof RuntimeException r) {
            return r;
        }
        if (t instanceof Error e) {
            throw e;
        }
        return new IllegalStateException(t);
    }
}
