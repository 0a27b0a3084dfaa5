package org.spindrift.sim.pipeline;

import java.io.IOException;
import org.spindrift.sim.analysis.AnalysisResult;

/** One figure of a run, drawn from the run and its analysis into {@link #file()} (and maybe an SVG twin). */
interface RunFigure {
    /** @return the figure's file in the run folder, for example {@code plots/shape.png} */
    String file();

    /** Draws the figure and encodes its file(s) into out. */
    void draw(RunContext ctx, AnalysisResult analysis, FigureFiles out) throws IOException;
}
