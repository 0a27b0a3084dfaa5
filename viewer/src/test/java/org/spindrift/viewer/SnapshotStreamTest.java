package org.spindrift.viewer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.FloatBuffer;
import java.util.List;
import java.util.concurrent.atomic.AtomicIntegerArray;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.UserInputException;
import org.spindrift.viewer.data.Landmarks;
import org.spindrift.viewer.data.RunData;
import org.spindrift.viewer.data.RunInfo;
import org.spindrift.viewer.data.SnapshotStream;

/**
 * The background reader hands out the snapshot that was asked for, reads each snapshot once on a
 * forward pass (read-ahead, no re-reads), and reports a read failure to the render thread as a
 * user-input error. No OpenGL needed.
 */
class SnapshotStreamTest {
    static final int S = 40;
    static final int N = 7;

    /** A run whose snapshot s has every coordinate equal to s (and particle index in y). */
    static final class CountingRun implements RunData {
        final AtomicIntegerArray reads = new AtomicIntegerArray(S);
        final int failAt;
        final RunInfo info;

        CountingRun(int failAt) {
            this.failAt = failAt;
            double[] t = new double[S];
            float[][] c = new float[S][0];
            for (int i = 0; i < S; i++) {
                t[i] = i;
            }
            info = new RunInfo("counting", t, List.of(), new int[N], c,
                    new Landmarks(0, 2, Double.NaN, 6, Double.NaN, 2), 1, 1, 60, 0);
        }

        @Override public RunInfo info() {
            return info;
        }

        @Override public void readSnapshot(int s, FloatBuffer dest) {
            reads.incrementAndGet(s);
            if (s == failAt) {
                throw new IllegalStateException("bad bytes");
            }
            for (int i = 0; i < N; i++) {
                dest.put(i * STRIDE + X, s);
                dest.put(i * STRIDE + Y, i);
            }
        }

        @Override public void close() {
        }
    }

    @Test void forwardPassReadsEachSnapshotOnceAndHandsOutTheRightOne() {
        CountingRun run = new CountingRun(-1);
        try (SnapshotStream stream = new SnapshotStream(run)) {
            for (int s = 0; s < S; s++) {
                final int want = s;
                stream.aim(s, 1);
                boolean got = stream.get(s, true, (snap, data) -> {
                    assertEquals(want, snap);
                    for (int i = 0; i < N; i++) {
                        assertEquals(want, data.get(i * RunData.STRIDE + RunData.X), "snapshot data");
                        assertEquals(i, data.get(i * RunData.STRIDE + RunData.Y), "particle order");
                    }
                });
                assertTrue(got);
            }
        }
        for (int s = 0; s < S; s++) {
            assertEquals(1, run.reads.get(s), "snapshot " + s + " read once");
        }
    }

    @Test void aReadFailureReachesTheRenderThreadAsUserInputError() {
        CountingRun run = new CountingRun(3);
        try (SnapshotStream stream = new SnapshotStream(run)) {
            UserInputException e = assertThrows(UserInputException.class, () -> {
                for (int s = 0; s < S; s++) {
                    stream.aim(s, 1);
                    stream.get(s, true, (snap, data) -> { });
                }
            });
            assertTrue(e.getMessage().contains("snapshot 3"), e.getMessage());
        }
    }
}
