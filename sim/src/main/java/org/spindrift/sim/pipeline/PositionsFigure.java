package org.spindrift.sim.pipeline;

import static org.spindrift.sim.pipeline.Charts.RAMP;
import static org.spindrift.sim.pipeline.Charts.add;
import static org.spindrift.sim.pipeline.Charts.chart;
import static org.spindrift.sim.pipeline.Charts.circle;
import static org.spindrift.sim.pipeline.Charts.fmt;

import java.awt.Color;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.analysis.ShearAnalysis;
import org.spindrift.sim.analysis.Stats;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.history.Subsample;

/**
 * {@code plots/positions.png}: kept particles in the orbital plane of the first source at four
 * times, coloured by r, with the capture radius (or horizon), the ISCO and the Omega-maximum radius.
 */
final class PositionsFigure implements RunFigure {
    /** Panel size, chosen so that the plot area is square with the legend at the right. */
    static final int PANEL_W = 700;
    static final int PANEL_H = 540;

    @Override public String file() {
        return "plots/positions.png";
    }

    @Override public void draw(RunContext ctx, AnalysisResult analysis, FigureFiles out) throws IOException {
        Charts.save(out, file(), positions(ctx), 2, 2);
    }

    private static List<XYChart> positions(RunContext ctx) {
        ParticleHistory h = ctx.history();
        Scenario sc = ctx.scenario();
        int[] idx = Subsample.keptIndices(sc, ctx.placed().firstIndex());
        int s = h.snapshots();
        // orbital plane of the first source (from its centre-of-mass track)
        double[][] com = h.centres().centre()[0];
        double[] xyz = new double[3];
        double[] nrm = ShearAnalysis.planeNormal(com);
        double[] e1 = new double[3];
        double[] e2 = new double[3];
        if (Math.abs(nrm[2]) > 0.999) {
            // equatorial: keep the display x, y axes
            e1 = new double[] {1, 0, 0};
            e2 = new double[] {0, Math.signum(nrm[2]), 0};
        } else {
            ShearAnalysis.basis(nrm, e1, e2);
        }
        // colour classes of r: quantiles of the kept particles' radii over the whole run, open at both ends
        double[] allR = new double[idx.length * s];
        int na = 0;
        double extent = 0;
        for (int q = 0; q < s; q++) {
            for (int i : idx) {
                if (h.state(q)[i] == 0) {
                    allR[na++] = h.r(q)[i];
                    extent = Math.max(extent, h.r(q)[i]);
                }
            }
        }
        // the finite radii (all of them, as a sort would keep), their largest, and the class quantiles by selection
        int nf = 0;
        double maxR = Double.NaN;
        for (int j = 0; j < na; j++) {
            if (Double.isFinite(allR[j])) {
                allR[nf++] = allR[j];
                maxR = nf == 1 ? allR[j] : Math.max(maxR, allR[j]);
            }
        }
        double[] edges = classEdges(allR, nf, RAMP.length);
        int nb = Math.max(0, edges.length - 1);
        String[] labels = classLabels(edges);
        extent = Math.max(extent * 1.08, 1.3 * ctx.landmark(ArchiveLayout.LM_ISCO_PROGRADE));
        if (!(extent > 0) || !Double.isFinite(extent)) {
            // no ISCO and no particle left: a field a few capture radii wide
            extent = nf > 0 ? 1.1 * maxR
                    : Math.max(10.0, 3 * ctx.landmark(ArchiveLayout.LM_CAPTURE_RADIUS));
        }
        List<XYChart> charts = new ArrayList<>();
        int[] at = {0, (s - 1) / 3, 2 * (s - 1) / 3, s - 1};
        double spm = ctx.secondsPerM();
        for (int q : at) {
            XYChart c = chart(PANEL_W, PANEL_H, String.format(Locale.ROOT, "t = %.1f M (%.1f min)", h.time(q),
                    h.time(q) * spm / 60), "x in the orbital plane (M)", "y in the orbital plane (M)");
            c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
            c.getStyler().setMarkerSize(3);
            c.getStyler().setXAxisMin(-extent);
            c.getStyler().setXAxisMax(extent);
            c.getStyler().setYAxisMin(-extent);
            c.getStyler().setYAxisMax(extent);
            c.getStyler().setXAxisDecimalPattern("0.#");
            c.getStyler().setYAxisDecimalPattern("0.#");
            List<List<Double>> xs = new ArrayList<>();
            List<List<Double>> ys = new ArrayList<>();
            for (int b = 0; b < nb; b++) {
                xs.add(new ArrayList<>());
                ys.add(new ArrayList<>());
            }
            for (int i : idx) {
                if (h.state(q)[i] != 0) {
                    continue;
                }
                Coordinates.cartesian(h.r(q)[i], h.theta(q)[i], h.phi(q)[i], h.spin(), xyz);
                int b = 0;
                while (b < nb - 1 && h.r(q)[i] >= edges[b + 1]) {
                    b++;
                }
                xs.get(b).add(ShearAnalysis.dot(xyz, e1));
                ys.get(b).add(ShearAnalysis.dot(xyz, e2));
            }
            for (int b = 0; b < nb; b++) {
                if (xs.get(b).isEmpty()) {
                    xs.get(b).add(Double.NaN);
                    ys.get(b).add(Double.NaN);
                }
                XYSeries ser = add(c, labels[b], xs.get(b), ys.get(b));
                ser.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                ser.setMarker(SeriesMarkers.CIRCLE);
                ser.setMarkerColor(RAMP[nb == 1 ? RAMP.length / 2 : (int) Math.round(b * (RAMP.length - 1.0) / (nb - 1))]);
            }
            if (nb == 0) {
                XYSeries none = add(c, "no particle left (all captured or escaped)", new double[] {Double.NaN},
                        new double[] {Double.NaN});
                none.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                none.setMarker(SeriesMarkers.NONE);
            }
            double rh = ctx.landmark(ArchiveLayout.LM_HORIZON_OUTER);
            double inner = Double.isFinite(rh) ? rh : ctx.landmark(ArchiveLayout.LM_CAPTURE_RADIUS);
            circle(c, (Double.isFinite(rh) ? "horizon " : "surface (capture radius) ") + fmt(inner) + " M", inner,
                    Color.BLACK, false, extent);
            circle(c, "ISCO " + fmt(ctx.landmark(ArchiveLayout.LM_ISCO_PROGRADE)) + " M", ctx.landmark(ArchiveLayout.LM_ISCO_PROGRADE), Color.GRAY, true, extent);
            circle(c, "Omega max " + fmt(ctx.landmark(ArchiveLayout.LM_OMEGA_MAX_RADIUS)) + " M", ctx.landmark(ArchiveLayout.LM_OMEGA_MAX_RADIUS),
                    new Color(214, 39, 40), true, extent);
            charts.add(c);
        }
        return charts;
    }

    /**
     * Edges of the colour classes of r: quantiles at equal steps of probability, with equal edges
     * merged, so a compact spot, a thin ring or a single particle give fewer (at least one)
     * classes; none when there is no value.
     *
     * @param values the first n are the (finite) values; they are reordered
     * @return ascending edges, classes = length - 1 (a single class of one value has two equal edges)
     */
    static double[] classEdges(double[] values, int n, int classes) {
        if (n == 0) {
            return new double[0];
        }
        double[] qs = new double[classes + 1];
        for (int b = 0; b <= classes; b++) {
            qs[b] = (double) b / classes;
        }
        double[] quantiles = new double[classes + 1];
        Stats.quantiles(values, n, qs, quantiles);
        double[] e = new double[classes + 1];
        int m = 0;
        for (double q : quantiles) {
            if (m == 0 || q > e[m - 1]) {
                e[m++] = q;
            }
        }
        if (m == 1) {
            return new double[] {e[0], e[0]};
        }
        return java.util.Arrays.copyOf(e, m);
    }

    /** @return one label per class, with as many decimals as it takes to tell the edges apart (at most 6) */
    static String[] classLabels(double[] edges) {
        int nb = Math.max(0, edges.length - 1);
        String[] out = new String[nb];
        if (nb == 0) {
            return out;
        }
        if (nb == 1) {
            out[0] = edges[0] == edges[1] ? "r = " + decimals(edges[0], 2) + " M"
                    : "r " + decimals(edges[0], 2) + " - " + decimals(edges[1], 2) + " M";
            return out;
        }
        int d = 2;
        while (d < 6 && !distinct(edges, d)) {
            d++;
        }
        for (int b = 0; b < nb; b++) {
            out[b] = b == 0 ? "r < " + decimals(edges[1], d) + " M"
                    : b == nb - 1 ? "r > " + decimals(edges[nb - 1], d) + " M"
                    : "r " + decimals(edges[b], d) + " - " + decimals(edges[b + 1], d) + " M";
        }
        return out;
    }

    private static boolean distinct(double[] edges, int d) {
        java.util.Set<String> seen = new java.util.HashSet<>();
        for (double e : edges) {
            if (!seen.add(decimals(e, d))) {
                return false;
            }
        }
        return true;
    }

    private static String decimals(double v, int d) {
        return String.format(Locale.ROOT, "%." + d + "f", v);
    }
}
