package org.spindrift.sim.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * The bounded table cache of fits: least-recently-used eviction (common practice, no source),
 * one computation per key while it is held, failures not kept.
 */
class RecentTablesTest {
    @Test
    void keepsAtMostCapacityDroppingTheLeastRecentlyUsed() {
        RecentTables<Integer, String> c = new RecentTables<>(3);
        AtomicInteger made = new AtomicInteger();
        for (int k = 0; k < 3; k++) {
            int key = k;
            c.get(key, () -> "v" + key + "#" + made.incrementAndGet());
        }
        c.get(0, () -> "unused");               // 0 becomes the most recent
        c.get(3, () -> "v3#" + made.incrementAndGet());   // drops 1, the least recent
        assertEquals(3, c.size());
        assertEquals(4, made.get());
        assertEquals("v0#1", c.get(0, () -> "again"));
        assertEquals("v2#3", c.get(2, () -> "again"));
        assertEquals("v1#5", c.get(1, () -> "v1#" + made.incrementAndGet()), "a dropped key is computed again");
    }

    @Test
    void concurrentCallersOfOneKeyShareOneComputation() throws Exception {
        RecentTables<String, Object> c = new RecentTables<>(2);
        AtomicInteger made = new AtomicInteger();
        CountDownLatch start = new CountDownLatch(1);
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            @SuppressWarnings("unchecked")
            Future<Object>[] got = new Future[8];
            for (int i = 0; i < got.length; i++) {
                got[i] = pool.submit(() -> {
                    start.await();
                    return c.get("table", () -> {
                        made.incrementAndGet();
                        return new Object();
                    });
                });
            }
            start.countDown();
            Object first = got[0].get(30, TimeUnit.SECONDS);
            for (Future<Object> f : got) {
                assertSame(first, f.get(30, TimeUnit.SECONDS));
            }
            assertEquals(1, made.get());
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void aFailedComputationIsNotKept() {
        RecentTables<String, String> c = new RecentTables<>(2);
        assertThrows(IllegalArgumentException.class, () -> c.get("k", () -> {
            throw new IllegalArgumentException("no such orbit");
        }));
        assertEquals(0, c.size());
        assertEquals("ok", c.get("k", () -> "ok"));
    }
}
