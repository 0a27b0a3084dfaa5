package org.spindrift.sim.fit;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.function.Supplier;

/**
 * The most recently used values of an expensive computation (ray tables, spacetimes), at most
 * {@code capacity} of them, shared by threads: a value is computed once while others asking for
 * the same key wait for it, and the least recently used one is dropped beyond the capacity (a
 * fit that moves spin or inclination continuously would otherwise keep every table it traced).
 * A dropped value is computed again when asked for, with the same result.
 */
final class RecentTables<K, V> {
    private final int capacity;
    private final LinkedHashMap<K, CompletableFuture<V>> map;

    RecentTables(int capacity) {
        this.capacity = capacity;
        // access order: iteration starts at the least recently used entry
        this.map = new LinkedHashMap<>(16, 0.75f, true);
    }

    /** @return the value for key, computed by make (on this thread) when it is not held */
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
            try {
                return held.join();
            } catch (CompletionException e) {
                throw rethrow(e.getCause());
            }
        }
        try {
            V v = make.get();
            mine.complete(v);
            return v;
        } catch (RuntimeException | Error e) {
            synchronized (map) {
                map.remove(key, mine);
            }
            mine.completeExceptionally(e);
            throw e;
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
