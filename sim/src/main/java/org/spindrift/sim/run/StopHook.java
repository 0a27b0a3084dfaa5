package org.spindrift.sim.run;

import java.io.IOException;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;

/**
 * Stops a run cleanly on SIGINT/SIGTERM (a shutdown hook): during the evolution the main thread
 * writes a checkpoint at the next snapshot barrier and the hook waits for it; after the
 * evolution the hook writes the final one itself (the data no longer change). Either way one
 * line says how to resume. Also writes the checkpoints that fall due at barriers.
 */
final class StopHook extends Thread {
    /** Writes the checkpoint after snapshot k. */
    @FunctionalInterface
    interface Save {
        void after(int k) throws IOException;
    }

    private static final long WAIT_S = 300;
    private final Checkpoint cp;
    private final Save save;
    private final int snapshots;
    private final String resume;
    private final CountDownLatch saved = new CountDownLatch(1);
    private boolean requested;
    private boolean integrating = true;
    private boolean finished;
    private int savedAt = -1;

    /**
     * @param snapshots snapshots of the run
     * @param resume the command that continues the run, for the message
     */
    StopHook(Checkpoint cp, Save save, int snapshots, String resume) {
        super("spindrift-stop");
        this.cp = cp;
        this.save = save;
        this.snapshots = snapshots;
        this.resume = resume;
    }

    /** At the barrier after snapshot k (main thread): writes a checkpoint when due or asked to stop. */
    void barrier(int k, boolean due) {
        boolean stop;
        synchronized (this) {
            stop = requested;
        }
        if (due || stop) {
            save(k);
        }
        if (stop) {
            stopped(k);
            saved.countDown();
            while (true) { // the JVM is exiting: wait for it here, touching nothing more
                try {
                    Thread.sleep(60_000);
                } catch (InterruptedException e) {
                    // keep waiting
                }
            }
        }
    }

    private void save(int k) {
        try {
            save.after(k);
            synchronized (this) {
                savedAt = k;
            }
        } catch (IOException e) {
            System.err.println("spindrift: warning: cannot write the checkpoint in " + cp.folder() + " ("
                    + e.getMessage() + "); the run goes on");
        }
    }

    private void stopped(int k) {
        System.err.println("spindrift: stopped after snapshot " + (k + 1) + " of " + snapshots + "; checkpoint in "
                + cp.folder() + "; continue with: " + resume);
    }

    /** The evolution is over (main thread). */
    void integrated() {
        synchronized (this) {
            integrating = false;
        }
    }

    /** The run folder is complete: nothing to save any more. */
    synchronized void finished() {
        finished = true;
    }

    void remove() {
        try {
            Runtime.getRuntime().removeShutdownHook(this);
        } catch (IllegalStateException e) {
            // shutting down: this hook is running
        }
    }

    @Override public void run() {
        boolean during;
        synchronized (this) {
            if (finished) {
                return;
            }
            requested = true;
            during = integrating;
        }
        if (during) {
            try {
                saved.await(WAIT_S, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            return;
        }
        int last = snapshots - 1;
        synchronized (this) {
            if (savedAt != last) {
                save(last);
            }
        }
        stopped(last);
    }
}
