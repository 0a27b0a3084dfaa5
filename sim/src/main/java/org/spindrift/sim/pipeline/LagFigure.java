package org.spindrift.sim.pipeline;

import static org.spindrift.sim.pipeline.Charts.LINES;
import static org.spindrift.sim.pipeline.Charts.add;
import static org.spindrift.sim.pipeline.Charts.chart;
import static org.spindrift.sim.pipeline.Charts.fmt;
import static org.spindrift.sim.pipeline.Charts.vline;

import java.awt.Color;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.analysis.LagProfile;
import org.spindrift.sim.analysis.ShearShape;
import org.spindrift.sim.history.ParticleHistory;

/**
 * {@code plots/lag.png} (and its SVG twin for one source): lag profiles dphi(r) of every source at
 * several times, Omega-maximum and ISCO radii marked.
 */
final class LagFigure implements RunFigure {
    @Override public String file() {
        return "plots/lag.png";
    }

    @Override public void draw(RunContext ctx, AnalysisResult analysis, FigureFiles out) throws IOException {
        Charts.save(out, file(), lag(ctx, analysis.shapes()), 1, ctx.scenario().sources().size());
    }

    private static List<XYChart> lag(RunContext ctx, List<ShearShape> shapes) {
        ParticleHistory h = ctx.history();
        int s = h.snapshots();
        double spm = ctx.secondsPerM();
        List<XYChart> out = new ArrayList<>();
        int k = ctx.scenario().sources().size();
        double omr = ctx.landmark(ArchiveLayout.LM_OMEGA_MAX_RADIUS);
        double isco = ctx.landmark(ArchiveLayout.LM_ISCO_PROGRADE);
        for (int src = 0; src < k; src++) {
            String name = ctx.scenario().sources().get(src).name();
            XYChart c = chart(k == 1 ? 900 : 620, 560, "Azimuthal lag profile, " + name,
                    "r (M)", "lag = phi_centre - phi_mean(r) (deg)");
            c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            double rlo = Double.POSITIVE_INFINITY;
            double rhi = Double.NEGATIVE_INFINITY;
            int line = 0;
            for (int q : AnalysisStage.profileSnapshots(s)) {
                LagProfile lp = shapes.get(src * s + q).lag();
                if (lp.r().length == 0) {
                    continue;
                }
                double[] deg = new double[lp.lag().length];
                for (int b = 0; b < deg.length; b++) {
                    deg[b] = Math.toDegrees(lp.lag()[b]);
                    lo = Math.min(lo, deg[b]);
                    hi = Math.max(hi, deg[b]);
                    rlo = Math.min(rlo, lp.r()[b]);
                    rhi = Math.max(rhi, lp.r()[b]);
                }
                XYSeries ser = add(c, String.format(Locale.ROOT, "t = %.1f min", h.time(q) * spm / 60), lp.r(), deg);
                ser.setMarker(SeriesMarkers.CIRCLE);
                ser.setMarkerColor(LINES[line % LINES.length]);
                ser.setLineColor(LINES[line % LINES.length]);
                line++;
            }
            if (line == 0) {
                add(c, "too few particles for a profile", new double[] {0}, new double[] {0});
            } else {
                double pad = 0.05 * Math.max(1e-6, hi - lo);
                if (omr > rlo - 0.5 * (rhi - rlo) && omr < rhi + 0.5 * (rhi - rlo)) {
                    vline(c, "Omega max, r = " + fmt(omr), omr, lo - pad, hi + pad, new Color(214, 39, 40));
                }
                if (isco > rlo - 0.5 * (rhi - rlo) && isco < rhi + 0.5 * (rhi - rlo)) {
                    vline(c, "ISCO, r = " + fmt(isco), isco, lo - pad, hi + pad, Color.GRAY);
                }
            }
            out.add(c);
        }
        return out;
    }
}
