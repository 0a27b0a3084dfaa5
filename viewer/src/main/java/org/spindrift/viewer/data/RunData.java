package org.spindrift.viewer.data;

import java.nio.FloatBuffer;

/**
 * A run as the viewer reads it: the small {@link RunInfo} plus one snapshot at a time.
 * Implementations must let {@link #readSnapshot} run on a background thread.
 */
public interface RunData extends AutoCloseable {
    /** Floats per particle in a snapshot buffer. */
    int STRIDE = 8;
    /** Offsets inside one particle's floats. */
    int X = 0, Y = 1, Z = 2, TIME_DILATION = 3, WEIGHT = 4, RADIUS = 5, ALIVE = 6;

    RunInfo info();

    /**
     * Fills dest (from position 0) with snapshot s: per particle x, y, z (M), time dilation 1/u^t,
     * emission weight, radius r (M), alive (1 or 0), 0.
     */
    void readSnapshot(int s, FloatBuffer dest);

    @Override void close();
}
