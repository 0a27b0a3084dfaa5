package org.spindrift.sim.history;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.concurrent.atomic.AtomicIntegerArray;
import org.junit.jupiter.api.Test;

/** Chunked work: every chunk runs exactly once for any thread count, and a chunk's failure reaches the caller. */
class ChunkedTest {
    @Test void everyChunkRunsOnceAndTheCutsCoverTheRange() {
        for (int threads : new int[] {1, 2, 5, 40}) {
            AtomicIntegerArray runs = new AtomicIntegerArray(17);
            Chunked.forEach(17, threads, runs::incrementAndGet);
            for (int c = 0; c < 17; c++) {
                assertEquals(1, runs.get(c), "chunk " + c + " on " + threads + " threads");
            }
        }
        // the cuts of 10 items into 4 chunks: 0, 2, 5, 7, 10 (floor of c n / k; common practice, no source)
        int[] cuts = new int[5];
        for (int c = 0; c <= 4; c++) {
            cuts[c] = Chunked.start(c, 4, 10);
        }
        assertEquals("[0, 2, 5, 7, 10]", java.util.Arrays.toString(cuts));
    }

    @Test void aFailingChunkIsThrownToTheCaller() {
        for (int threads : new int[] {1, 3}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Chunked.forEach(8, threads, c -> {
                if (c == 5) {
                    throw new IllegalArgumentException("chunk 5 failed");
                }
            }));
            assertEquals("chunk 5 failed", e.getMessage());
        }
    }
}
