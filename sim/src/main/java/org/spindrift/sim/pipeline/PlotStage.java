package org.spindrift.sim.pipeline;

import java.io.IOException;
import java.util.List;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.history.Chunked;
import org.spindrift.sim.plot.PlotGuard;

/**
 * The figures of a run from its analysis, in {@code plots/}: {@link PositionsFigure},
 * {@link ShapeFigure}, {@link LagFigure}, {@link PeriodsFigure}. The figures are drawn and encoded
 * in memory on the run's threads, then written one after the other in that order, each under the
 * run's {@link RunNotes#guard guard}: one that cannot be drawn is recorded in the manifest (after
 * any of its files that were complete), the others and the data files stay.
 */
public final class PlotStage implements RunStage {
    private static final List<RunFigure> FIGURES = List.of(new PositionsFigure(), new ShapeFigure(), new LagFigure(),
            new PeriodsFigure());

    @Override public String name() {
        return "plots";
    }

    @Override public void run(RunContext ctx) throws IOException {
        AnalysisResult analysis = ctx.results().requireAnalysis("the plots");
        int n = FIGURES.size();
        FigureFiles[] files = new FigureFiles[n];
        Throwable[] failed = new Throwable[n];
        Chunked.forEach(n, ctx.threads(), i -> {
            files[i] = new FigureFiles();
            try {
                FIGURES.get(i).draw(ctx, analysis, files[i]);
            } catch (Throwable t) {
                // reported below, in the figure's turn, as if drawn there
                failed[i] = t;
            }
        });
        PlotGuard guard = RunNotes.guard(ctx);
        for (int i = 0; i < n; i++) {
            FigureFiles f = files[i];
            Throwable t = failed[i];
            guard.draw(FIGURES.get(i).file(), () -> {
                f.writeTo(ctx.archive());
                if (t instanceof Exception e) {
                    throw e;
                }
                if (t instanceof Error e) {
                    throw e;
                }
            });
        }
    }
}
