package org.spindrift.sim.pipeline;

import java.io.IOException;
import org.spindrift.sim.analysis.AnalysisResult;

/** One figure of a run, drawn from the run and its analysis into {@link #file()} (and maybe an SVG twin). */
interface RunFigure {
    /** @return the figure's file in the run folder, for example {@code plots/shape.png} */
    String file();

    /** Draws the figure and writes its file(s) through the run's archive. */
    void draw(RunContext ctx, AnalysisResult analysis) throws IOException;
}
