package org.spindrift.sim.motion;

/**
 * Receives the whole batch at each requested snapshot time, in snapshot order, on the thread
 * that called {@link BatchIntegrator#integrate}. The {@link Snapshot} view is valid only during
 * the call; copy what you keep.
 */
@FunctionalInterface
public interface SnapshotSink {
    /**
     * @param index snapshot index (0-based, order of the requested times)
     * @param t the common coordinate time of the snapshot (M)
     * @param snapshot read-only view of every particle at t
     */
    void accept(int index, double t, Snapshot snapshot);
}
