package org.spindrift.sim.run;

import java.io.IOException;

/**
 * One stage of a run after the particles have been evolved: analysis, plots, and the light stage
 * (ray table, images, centroid, light curve). Stages run in order on the {@link RunContext}; each
 * writes its files through {@link RunContext#archive()} (temporary name, rename, registered for
 * the manifest) and may add keys to the manifest and the summary.
 *
 * <p>The list of stages is built in {@link ScenarioRun#stages}; the light stage is added there.
 */
public interface RunStage {
    /** @return a short name for progress messages, for example {@code analysis} */
    String name();

    /** Runs the stage. */
    void run(RunContext context) throws IOException;
}
