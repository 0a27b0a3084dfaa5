package org.spindrift.sim.pipeline;

import java.io.IOException;
import java.util.List;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.plot.PlotGuard;

/**
 * The figures of a run from its analysis, in {@code plots/}: {@link PositionsFigure},
 * {@link ShapeFigure}, {@link LagFigure}, {@link PeriodsFigure}. Each is drawn on its own under the
 * run's {@link RunNotes#guard guard}: one that cannot be drawn is recorded in the manifest, the
 * others and the data files stay.
 */
public final class PlotStage implements RunStage {
    private static final List<RunFigure> FIGURES = List.of(new PositionsFigure(), new ShapeFigure(), new LagFigure(),
            new PeriodsFigure());

    @Override public String name() {
        return "plots";
    }

    @Override public void run(RunContext ctx) throws IOException {
        AnalysisResult analysis = ctx.results().requireAnalysis("the plots");
        PlotGuard guard = RunNotes.guard(ctx);
        for (RunFigure f : FIGURES) {
            guard.draw(f.file(), () -> f.draw(ctx, analysis));
        }
    }
}
