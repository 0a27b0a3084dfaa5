package org.spindrift.sim.pipeline;

import static org.spindrift.sim.pipeline.Charts.LINES;
import static org.spindrift.sim.pipeline.Charts.add;
import static org.spindrift.sim.pipeline.Charts.chart;
import static org.spindrift.sim.pipeline.Charts.fmt;
import static org.spindrift.sim.pipeline.Charts.vline;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.analysis.ParticlePeriods;
import org.spindrift.sim.analysis.Stats;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.history.Subsample;
import org.spindrift.sim.spacetime.CircularOrbits;

/**
 * {@code plots/periods.png}: histograms of the azimuthal and radial periods per source, with the
 * metric's prediction at the reference radius (azimuthal period against radius when no radial
 * period was measured).
 */
final class PeriodsFigure implements RunFigure {
    @Override public String file() {
        return "plots/periods.png";
    }

    @Override public void draw(RunContext ctx, AnalysisResult analysis, FigureFiles out) throws IOException {
        Charts.save(out, file(), periods(ctx, analysis.periods()), 1, 2);
    }

    private static List<XYChart> periods(RunContext ctx, ParticlePeriods p) {
        List<XYChart> out = new ArrayList<>();
        out.add(histogram(ctx, p.periodPhi(), "Azimuthal periods", "azimuthal period (min)", 0));
        if (Stats.finiteSorted(p.periodR(), p.periodR().length).length > 0) {
            out.add(histogram(ctx, p.periodR(), "Radial periods", "radial period (min)", 1));
        } else {
            out.add(periodAgainstRadius(ctx, p));
        }
        return out;
    }

    /** Azimuthal period against mean radius, with the circular-orbit curve 2 pi / |Omega(r)| of the metric. */
    private static XYChart periodAgainstRadius(RunContext ctx, ParticlePeriods p) {
        ParticleHistory h = ctx.history();
        Scenario sc = ctx.scenario();
        double spm = ctx.secondsPerM();
        XYChart c = chart(620, 480, "Azimuthal period against radius (no radial periods measured)", "mean r (M)",
                "azimuthal period (min)");
        c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideS);
        c.getStyler().setMarkerSize(3);
        int[] idx = Subsample.keptIndices(sc, ctx.placed().firstIndex());
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        List<List<Double>> allX = new ArrayList<>();
        List<List<Double>> allY = new ArrayList<>();
        for (int k = 0; k < sc.sources().size(); k++) {
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (int i : idx) {
                if (h.sourceIndex()[i] == k && Double.isFinite(p.periodPhi(i)) && Double.isFinite(p.meanR(i))) {
                    xs.add(p.meanR(i));
                    ys.add(p.periodPhi(i) * spm / 60);
                    lo = Math.min(lo, p.meanR(i));
                    hi = Math.max(hi, p.meanR(i));
                }
            }
            allX.add(xs);
            allY.add(ys);
        }
        if (hi > lo) {
            // drawn first, under the measured points
            int m = 100;
            double[] x = new double[m];
            double[] y = new double[m];
            for (int j = 0; j < m; j++) {
                x[j] = lo + (hi - lo) * j / (m - 1);
                y[j] = 2 * Math.PI / Math.abs(CircularOrbits.omega(ctx.spacetime(), x[j], true))
                        * spm / 60;
            }
            XYSeries curve = add(c, "metric: circular prograde orbit, 2 pi / Omega(r)", x, y);
            curve.setMarker(SeriesMarkers.NONE);
            curve.setLineColor(new Color(120, 120, 120));
            curve.setLineStyle(new BasicStroke(5f));
        }
        for (int k = 0; k < allX.size(); k++) {
            if (allX.get(k).isEmpty()) {
                continue;
            }
            XYSeries ser = add(c, sc.sources().get(k).name() + " (measured, kept particles)", allX.get(k), allY.get(k));
            ser.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            ser.setMarker(SeriesMarkers.CIRCLE);
            ser.setMarkerColor(LINES[k % LINES.length]);
        }
        return c;
    }

    private static XYChart histogram(RunContext ctx, double[] v, String title, String xTitle, int which) {
        ParticleHistory h = ctx.history();
        Scenario sc = ctx.scenario();
        double spm = ctx.secondsPerM();
        XYChart c = chart(620, 480, title, xTitle, "particles");
        c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideS);
        c.getStyler().setLegendLayout(Styler.LegendLayout.Vertical);
        int[] first = ctx.placed().firstIndex();
        boolean any = false;
        for (int k = 0; k < sc.sources().size(); k++) {
            int from = first[k];
            int n = sc.sources().get(k).particles();
            double[] vals = Stats.finiteSorted(java.util.Arrays.copyOfRange(v, from, from + n), n);
            String name = sc.sources().get(k).name();
            Color col = LINES[k % LINES.length];
            if (vals.length == 0) {
                continue;
            }
            any = true;
            double lo = Stats.quantile(vals, 0.01) * spm / 60;
            double hi = Stats.quantile(vals, 0.99) * spm / 60;
            if (!(hi > lo)) {
                hi = lo * 1.001 + 1e-9;
                lo = lo * 0.999;
            }
            int nb = Math.max(5, Math.min(40, (int) Math.sqrt(vals.length)));
            int[] cnt = new int[nb];
            for (double x : vals) {
                double m = x * spm / 60;
                int b = (int) Math.floor((m - lo) / (hi - lo) * nb);
                if (b >= 0 && b < nb) {
                    cnt[b]++;
                } else if (m == hi) {
                    cnt[nb - 1]++;
                }
            }
            double[] xs = new double[2 * nb + 2];
            double[] ys = new double[2 * nb + 2];
            for (int b = 0; b < nb; b++) {
                double x0 = lo + (hi - lo) * b / nb;
                double x1 = lo + (hi - lo) * (b + 1) / nb;
                xs[2 * b + 1] = x0;
                ys[2 * b + 1] = cnt[b];
                xs[2 * b + 2] = x1;
                ys[2 * b + 2] = cnt[b];
            }
            xs[0] = lo;
            ys[0] = 0;
            xs[2 * nb + 1] = hi;
            ys[2 * nb + 1] = 0;
            int top = 0;
            for (int x : cnt) {
                top = Math.max(top, x);
            }
            XYSeries ser = add(c, name + String.format(Locale.ROOT, " (%d measured)", vals.length), xs, ys);
            ser.setMarker(SeriesMarkers.NONE);
            ser.setLineColor(col);
            ser.setLineStyle(new BasicStroke(2f));
            org.spindrift.sim.scenario.SourceSetup.Prediction pr = ctx.placed().centres()[k].prediction();
            double pred = which == 0 ? pr.azimuthal() : which == 1 ? pr.radial() : pr.vertical();
            if (Double.isFinite(pred)) {
                vline(c, name + ": metric prediction " + fmt(pred * spm / 60) + " min", pred * spm / 60, 0, top * 1.05,
                        col.darker());
            }
        }
        if (!any) {
            XYSeries e = add(c, "no particle completed two turning points", new double[] {0, 1}, new double[] {0, 0});
            e.setMarker(SeriesMarkers.NONE);
            e.setLineColor(Color.LIGHT_GRAY);
        }
        return c;
    }
}
