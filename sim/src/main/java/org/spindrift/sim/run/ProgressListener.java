package org.spindrift.sim.run;

/**
 * Hears how far the evolution of a run has come (snapshots done of the total). The command line
 * attaches a progress bar; tests and library callers use {@link #NONE}.
 */
public interface ProgressListener {
    /** The evolution starts (or resumes after {@code done} snapshots). */
    void begin(String task, long total, long done);

    /** Snapshot {@code done} (1-based count) is finished. */
    void advance(long done);

    /** The evolution is over (also after a failure). */
    void end();

    /** Hears nothing. */
    ProgressListener NONE = new ProgressListener() {
        @Override public void begin(String task, long total, long done) {
        }

        @Override public void advance(long done) {
        }

        @Override public void end() {
        }
    };
}
