package org.spindrift.sim.analysis;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.internal.chartpart.Chart;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.run.ParticleHistory;
import org.spindrift.sim.run.RunContext;
import org.spindrift.sim.run.RunNotes;
import org.spindrift.sim.run.RunStage;
import org.spindrift.sim.run.SnapshotStage;

/**
 * PNG plots of a run (XChart), in {@code plots/}:
 * <ul>
 *   <li>{@code positions.png}: kept particles in the orbital plane of the first source at four
 *       times, coloured by r, with the capture radius, the ISCO and the Omega-maximum radius;</li>
 *   <li>{@code shape.png}: aspect ratio and azimuthal extent of every source against time;</li>
 *   <li>{@code lag.png}: lag profiles dphi(r) of every source at several times, Omega-maximum and
 *       ISCO radii marked;</li>
 *   <li>{@code periods.png}: histograms of the azimuthal and radial periods per source, with the
 *       metric's prediction at the reference radius.</li>
 * </ul>
 */
public final class PlotStage implements RunStage {
    /** Six ordered colours from the project's sequential ramp (up to 0.8 of it: visible on white). */
    static final Color[] RAMP = new Color[6];

    static {
        for (int i = 0; i < RAMP.length; i++) {
            RAMP[i] = new Color(ColourRamp.SKY.rgb(0.8 * i / (RAMP.length - 1)));
        }
    }
    /** Distinct colours for lines (times, sources). */
    static final Color[] LINES = {new Color(31, 119, 180), new Color(255, 127, 14), new Color(44, 160, 44),
        new Color(214, 39, 40), new Color(148, 103, 189), new Color(140, 86, 75), new Color(23, 190, 207)};

    /** Panel size of the position plots, chosen so that the plot area is square with the legend at the right. */
    static final int PANEL_W = 700;
    static final int PANEL_H = 540;

    @Override public String name() {
        return "plots";
    }

    @Override @SuppressWarnings("unchecked") public void run(RunContext ctx) throws IOException {
        List<ShearShape> shapes = (List<ShearShape>) ctx.products().get(AnalysisStage.SHAPES);
        ParticlePeriods periods = ctx.product(AnalysisStage.PERIODS, ParticlePeriods.class);
        if (shapes == null || periods == null) {
            throw new IllegalStateException("the plots need the analysis stage first");
        }
        // each plot on its own: one that cannot be drawn is recorded, the others and the data stay
        RunNotes.Guard guard = RunNotes.guard(ctx);
        guard.draw("plots/positions.png", () -> save(ctx, "plots/positions.png", positions(ctx), 2, 2));
        guard.draw("plots/shape.png", () -> save(ctx, "plots/shape.png", List.of(shape(ctx, shapes)), 1, 1));
        guard.draw("plots/lag.png", () -> save(ctx, "plots/lag.png", lag(ctx, shapes), 1,
                ctx.scenario().sources().size()));
        guard.draw("plots/periods.png", () -> save(ctx, "plots/periods.png", periods(ctx, periods), 1, 2));
    }

    private static void save(RunContext ctx, String name, List<? extends Chart<?, ?>> charts, int rows, int cols)
            throws IOException {
        ctx.archive().writeStream(name, out -> {
            if (charts.size() == 1) {
                BitmapEncoder.saveBitmap(charts.get(0), out, BitmapEncoder.BitmapFormat.PNG);
            } else {
                BitmapEncoder.saveBitmap(new ArrayList<>(charts), rows, cols, out, BitmapEncoder.BitmapFormat.PNG);
            }
        });
        if (charts.size() == 1) {
            // a vector twin where XChart offers one (single-panel charts)
            ctx.archive().writeStream(name.replaceFirst("\\.png$", ".svg"), out -> VectorGraphicsEncoder
                    .saveVectorGraphic(charts.get(0), out, VectorGraphicsEncoder.VectorGraphicsFormat.SVG));
        }
    }

    /**
     * Adds a series under a name no other series of the chart has (XChart refuses a repeated
     * name; degenerate data such as equal class edges or equal times can give repeated labels).
     */
    static XYSeries add(XYChart c, String name, List<? extends Number> x, List<? extends Number> y) {
        return c.addSeries(unique(c, name), x, y);
    }

    static XYSeries add(XYChart c, String name, double[] x, double[] y) {
        return c.addSeries(unique(c, name), x, y);
    }

    private static String unique(XYChart c, String name) {
        String n = name;
        for (int k = 2; c.getSeriesMap().containsKey(n); k++) {
            n = name + " (" + k + ")";
        }
        return n;
    }

    private static XYChart chart(int w, int h, String title, String x, String y) {
        XYChart c = new XYChartBuilder().width(w).height(h).title(title).xAxisTitle(x).yAxisTitle(y)
                .theme(Styler.ChartTheme.Matlab).build();
        c.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        c.getStyler().setChartBackgroundColor(Color.WHITE);
        c.getStyler().setPlotGridLinesVisible(true);
        c.getStyler().setToolTipsEnabled(false);
        c.getStyler().setChartTitleFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.BOLD, 14));
        c.getStyler().setLegendFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, 11));
        c.getStyler().setAxisTitleFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, 12));
        return c;
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, Math.abs(v) >= 100 ? "%.0f" : Math.abs(v) >= 10 ? "%.1f" : "%.2f", v);
    }

    private static void circle(XYChart c, String name, double radius, Color color, boolean dashed) {
        if (!(radius > 0) || !Double.isFinite(radius)) {
            return;
        }
        int m = 181;
        double[] x = new double[m];
        double[] y = new double[m];
        for (int j = 0; j < m; j++) {
            double a = 2 * Math.PI * j / (m - 1);
            x[j] = radius * Math.cos(a);
            y[j] = radius * Math.sin(a);
        }
        XYSeries s = add(c, name, x, y);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(color);
        s.setLineStyle(dashed ? new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {6f, 4f}, 0f) : new BasicStroke(1.5f));
    }

    private static List<XYChart> positions(RunContext ctx) {
        ParticleHistory h = ctx.history();
        Scenario sc = ctx.scenario();
        int[] idx = SnapshotStage.keptIndices(sc, ctx.placed().firstIndex());
        int s = h.snapshots();
        // orbital plane of the first source (from its centre-of-mass track)
        int n0 = sc.sources().get(0).particles();
        double[][] com = new double[s][3];
        double[] xyz = new double[3];
        for (int q = 0; q < s; q++) {
            int m = 0;
            for (int i = 0; i < n0; i++) {
                if (h.state(q)[i] == 0) {
                    Coordinates.cartesian(h.r(q)[i], h.theta(q)[i], h.phi(q)[i], h.spin(), xyz);
                    for (int c = 0; c < 3; c++) {
                        com[q][c] += xyz[c];
                    }
                    m++;
                }
            }
            for (int c = 0; c < 3; c++) {
                com[q][c] = m > 0 ? com[q][c] / m : Double.NaN;
            }
        }
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
        double[] sortedR = Stats.finiteSorted(allR, na);
        double[] edges = classEdges(sortedR, RAMP.length);
        int nb = Math.max(0, edges.length - 1);
        String[] labels = classLabels(edges);
        extent = Math.max(extent * 1.08, 1.3 * ctx.landmark("isco_prograde"));
        if (!(extent > 0) || !Double.isFinite(extent)) {
            // no ISCO and no particle left: a field a few capture radii wide
            extent = sortedR.length > 0 ? 1.1 * sortedR[sortedR.length - 1]
                    : Math.max(10.0, 3 * ctx.landmark("capture_radius"));
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
            double rh = ctx.landmark("horizon_outer");
            double inner = Double.isFinite(rh) ? rh : ctx.landmark("capture_radius");
            circle(c, (Double.isFinite(rh) ? "horizon " : "surface (capture radius) ") + fmt(inner) + " M", inner,
                    Color.BLACK, false);
            circle(c, "ISCO " + fmt(ctx.landmark("isco_prograde")) + " M", ctx.landmark("isco_prograde"), Color.GRAY, true);
            circle(c, "Omega max " + fmt(ctx.landmark("omega_max_radius")) + " M", ctx.landmark("omega_max_radius"),
                    new Color(214, 39, 40), true);
            charts.add(c);
        }
        return charts;
    }

    /**
     * Edges of the colour classes of r: quantiles at equal steps of probability, with equal edges
     * merged, so a compact spot, a thin ring or a single particle give fewer (at least one)
     * classes; none when there is no value.
     *
     * @return ascending edges, classes = length - 1 (a single class of one value has two equal edges)
     */
    static double[] classEdges(double[] sorted, int classes) {
        if (sorted.length == 0) {
            return new double[0];
        }
        double[] e = new double[classes + 1];
        int m = 0;
        for (int b = 0; b <= classes; b++) {
            double q = Stats.quantile(sorted, (double) b / classes);
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

    private static List<XYChart> lag(RunContext ctx, List<ShearShape> shapes) {
        ParticleHistory h = ctx.history();
        int s = h.snapshots();
        double spm = ctx.secondsPerM();
        List<XYChart> out = new ArrayList<>();
        int k = ctx.scenario().sources().size();
        double omr = ctx.landmark("omega_max_radius");
        double isco = ctx.landmark("isco_prograde");
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

    private static void vline(XYChart c, String name, double x, double y0, double y1, Color col) {
        XYSeries s = add(c, name, new double[] {x, x}, new double[] {y0, y1});
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(col);
        s.setLineStyle(new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f));
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
        int[] idx = SnapshotStage.keptIndices(sc, ctx.placed().firstIndex());
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
                y[j] = 2 * Math.PI / Math.abs(org.spindrift.sim.spacetime.CircularOrbits.omega(ctx.spacetime(), x[j], true))
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
