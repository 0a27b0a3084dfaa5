package org.spindrift.sim.pipeline;

import java.io.IOException;

/**
 * One stage of a run after the particles have been evolved: snapshots, analysis, light,
 * interferometry, plots. Stages run in order on the {@link RunContext}; each writes its files
 * through {@link RunContext#archive()} (temporary name, rename, registered for the manifest), may
 * add keys to the manifest and the summary, and hands its product to later stages through
 * {@link RunContext#results()}.
 *
 * <p>The standard list is {@link Stages#standard()}.
 */
public interface RunStage {
    /** @return a short name for progress messages, for example {@code analysis} */
    String name();

    /** Runs the stage. */
    void run(RunContext context) throws IOException;
}
