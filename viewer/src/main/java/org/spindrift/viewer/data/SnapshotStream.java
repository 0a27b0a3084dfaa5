package org.spindrift.viewer.data;

import java.nio.FloatBuffer;
import org.lwjgl.system.MemoryUtil;
import org.spindrift.shared.UserInputException;

/**
 * Streams snapshots from a {@link RunData} on a background thread into a small ring of
 * preallocated direct buffers, reading ahead in the direction of play. Only a handful of
 * snapshots are ever in memory, whatever the size of the run. The render thread asks for a
 * snapshot with {@link #get}: non-blocking for the interactive view (it keeps showing what it
 * has), blocking for frame export and benchmarks.
 */
public final class SnapshotStream implements AutoCloseable {
    /** Receives a snapshot's buffer while the stream guarantees it is not overwritten. */
    public interface Sink {
        void accept(int snapshot, FloatBuffer data);
    }

    private static final int SLOTS = 6;

    private final RunData run;
    private final int snapshots;
    private final FloatBuffer[] buffers = new FloatBuffer[SLOTS];
    private final int[] held = new int[SLOTS];
    private final long[] used = new long[SLOTS];
    private final Thread worker;
    private long clock;
    private int wanted;
    private int direction = 1;
    private boolean closed;
    private RuntimeException failure;

    public SnapshotStream(RunData run) {
        this.run = run;
        this.snapshots = run.info().snapshots();
        int floats = Math.max(1, run.info().particles() * RunData.STRIDE);
        for (int i = 0; i < SLOTS; i++) {
            buffers[i] = MemoryUtil.memAllocFloat(floats);
            held[i] = -1;
        }
        worker = new Thread(this::work, "spindrift-snapshot-reader");
        worker.setDaemon(true);
        worker.start();
    }

    /** Tells the reader where playback is and which way it goes (+1 or -1). */
    public synchronized void aim(int snapshot, int dir) {
        if (snapshot != wanted || dir != direction) {
            wanted = snapshot;
            direction = dir >= 0 ? 1 : -1;
            notifyAll();
        }
    }

    /**
     * Hands snapshot s to the sink if it is in memory (or, with block, once it has been read).
     *
     * @return true if the sink was called
     */
    public synchronized boolean get(int s, boolean block, Sink sink) {
        while (true) {
            if (failure != null) {
                throw failure;
            }
            for (int i = 0; i < SLOTS; i++) {
                if (held[i] == s) {
                    used[i] = ++clock;
                    sink.accept(s, buffers[i]);
                    return true;
                }
            }
            if (!block || closed) {
                return false;
            }
            if (wanted != s) {
                wanted = s;
                notifyAll();
            }
            try {
                wait();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return false;
            }
        }
    }

    private int nextToRead() {
        // the wanted snapshot, then two behind/ahead in the direction of play, then one behind
        for (int k = 0; k < SLOTS - 1; k++) {
            int s = k < SLOTS - 2 ? wanted + direction * k : wanted - direction;
            if (s < 0 || s >= snapshots) {
                continue;
            }
            boolean have = false;
            for (int i = 0; i < SLOTS; i++) {
                have |= held[i] == s;
            }
            if (!have) {
                return s;
            }
        }
        return -1;
    }

    private boolean inWindow(int s) {
        int d = (s - wanted) * direction;
        return d >= -1 && d <= SLOTS - 3;
    }

    private void work() {
        while (true) {
            int s;
            int slot;
            synchronized (this) {
                while (!closed && (s = nextToRead()) < 0) {
                    try {
                        wait();
                    } catch (InterruptedException e) {
                        return;
                    }
                }
                if (closed) {
                    return;
                }
                s = nextToRead();
                slot = 0;
                long oldest = Long.MAX_VALUE;
                for (int i = 0; i < SLOTS; i++) {
                    long age = held[i] < 0 ? Long.MIN_VALUE : (inWindow(held[i]) ? Long.MAX_VALUE - 1 : used[i]);
                    if (age < oldest) {
                        oldest = age;
                        slot = i;
                    }
                }
                held[slot] = -1;
            }
            FloatBuffer buf = buffers[slot];
            try {
                buf.clear();
                run.readSnapshot(s, buf);
                buf.clear();
            } catch (RuntimeException e) {
                synchronized (this) {
                    failure = e instanceof UserInputException ? e
                            : new UserInputException("cannot read snapshot " + s + " of the run: " + e.getMessage(), e);
                    notifyAll();
                }
                return;
            }
            synchronized (this) {
                held[slot] = s;
                used[slot] = ++clock;
                notifyAll();
            }
        }
    }

    @Override public void close() {
        synchronized (this) {
            closed = true;
            notifyAll();
        }
        try {
            worker.join(5000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        for (FloatBuffer b : buffers) {
            MemoryUtil.memFree(b);
        }
    }
}
