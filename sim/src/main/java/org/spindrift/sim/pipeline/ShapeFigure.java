package org.spindrift.sim.pipeline;

import static org.spindrift.sim.pipeline.Charts.LINES;
import static org.spindrift.sim.pipeline.Charts.add;
import static org.spindrift.sim.pipeline.Charts.chart;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.analysis.ShearShape;
import org.spindrift.sim.history.ParticleHistory;

/**
 * {@code plots/shape.png} (and its SVG twin): aspect ratio and azimuthal extent of every source
 * against time.
 */
final class ShapeFigure implements RunFigure {
    @Override public String file() {
        return "plots/shape.png";
    }

    @Override public void draw(RunContext ctx, AnalysisResult analysis, FigureFiles out) throws IOException {
        Charts.save(out, file(), List.of(shape(ctx, analysis.shapes())), 1, 1);
    }

    private static XYChart shape(RunContext ctx, List<ShearShape> shapes) {
        ParticleHistory h = ctx.history();
        int s = h.snapshots();
        double spm = ctx.secondsPerM();
        XYChart c = chart(900, 520, "Shape of each source against time", "time (min)", "aspect ratio (major / minor axis)");
        c.setYAxisGroupTitle(1, "azimuthal extent, 5-95 % (deg)");
        c.getStyler().setYAxisGroupPosition(1, Styler.YAxisPosition.Right);
        c.getStyler().setLegendPosition(Styler.LegendPosition.InsideNW);
        int k = ctx.scenario().sources().size();
        for (int src = 0; src < k; src++) {
            double[] t = new double[s];
            double[] ar = new double[s];
            double[] ext = new double[s];
            for (int q = 0; q < s; q++) {
                ShearShape sh = shapes.get(src * s + q);
                t[q] = sh.time() * spm / 60;
                ar[q] = Double.isFinite(sh.aspectRatio()) ? sh.aspectRatio() : Double.NaN;
                ext[q] = sh.azimuthalExtentDeg();
            }
            String name = ctx.scenario().sources().get(src).name();
            Color col = LINES[src % LINES.length];
            XYSeries a = add(c, name + ": aspect ratio (left axis)", t, ar);
            a.setMarker(SeriesMarkers.NONE);
            a.setLineColor(col);
            a.setLineStyle(new BasicStroke(2f));
            XYSeries e = add(c, name + ": azimuthal extent (right axis)", t, ext);
            e.setMarker(SeriesMarkers.NONE);
            e.setLineColor(LINES[(src + 1) % LINES.length]);
            e.setLineStyle(new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {7f, 4f}, 0f));
            e.setYAxisGroup(1);
        }
        return c;
    }
}
