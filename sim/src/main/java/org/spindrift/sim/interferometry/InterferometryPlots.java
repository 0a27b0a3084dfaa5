package org.spindrift.sim.interferometry;

import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Supplier;
import javax.imageio.ImageIO;
import org.hipparchus.util.FastMath;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.lines.SeriesLines;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.sim.light.LightOutputs;
import org.spindrift.sim.plot.PlotGuard;

/**
 * Plots of the interferometry stage (PNG, XChart): (u, v) coverage, visibility amplitude against
 * baseline length, and closure phase against time for the triangles observed longest (at most
 * {@value #TRIANGLES}), with the noise-free model and the steady (flare-free) source for comparison.
 */
public final class InterferometryPlots {
    /** Triangles drawn in the closure-phase plot. */
    static final int TRIANGLES = 6;
    private static final String DIR = "plots/";

    private InterferometryPlots() {
    }

    /** @return names of the plots written */
    public static List<String> write(LightOutputs.Sink out, InterferometryResult r, PlotGuard guard)
            throws IOException {
        List<String> names = new ArrayList<>();
        save(out, "uv_coverage.png", () -> toImage(coverage(r)), names, guard);
        save(out, "visibility_amplitude.png", () -> toImage(amplitude(r)), names, guard);
        save(out, "closure_phases.png", () -> closurePanel(r), names, guard);
        return names;
    }

    /** Draws and writes one plot through the guard (a run records a plot that fails and goes on). */
    private static void save(LightOutputs.Sink out, String name, Supplier<BufferedImage> img, List<String> names,
                             PlotGuard guard) throws IOException {
        String path = DIR + name;
        if (guard.draw(path, () -> {
            BufferedImage b = img.get();
            out.write(path, os -> ImageIO.write(b, "png", os));
        })) {
            names.add(path);
        }
    }

    private static BufferedImage toImage(XYChart c) {
        return BitmapEncoder.getBufferedImage(c);
    }

    private static void style(XYChart c) {
        c.getStyler().setChartBackgroundColor(Color.WHITE);
        c.getStyler().setPlotBackgroundColor(Color.WHITE);
        c.getStyler().setPlotGridLinesColor(new Color(225, 225, 225));
        c.getStyler().setLegendBorderColor(Color.WHITE);
        c.getStyler().setChartTitleFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
    }

    private static XYChart coverage(InterferometryResult r) {
        UvSampling s = r.sampling();
        XYChart c = new XYChartBuilder().width(760).height(720)
                .title("(u, v) coverage (both halves: (u, v) and (-u, -v))").xAxisTitle("u (G lambda), east")
                .yAxisTitle("v (G lambda), north").build();
        style(c);
        c.getStyler().setDefaultSeriesRenderStyle(org.knowm.xchart.XYSeries.XYSeriesRenderStyle.Scatter);
        c.getStyler().setMarkerSize(3);
        c.getStyler().setLegendVisible(false);
        double ext = FastMath.max(1e-3, s.maxBaseline() * 1.05e-9);
        double[] x = new double[2 * s.size() + 1], y = new double[2 * s.size() + 1];
        for (int k = 0; k < s.size(); k++) {
            x[2 * k] = s.u[k] * 1e-9;
            y[2 * k] = s.v[k] * 1e-9;
            x[2 * k + 1] = -s.u[k] * 1e-9;
            y[2 * k + 1] = -s.v[k] * 1e-9;
        }
        x[2 * s.size()] = Double.NaN;
        y[2 * s.size()] = Double.NaN;
        XYSeries ser = c.addSeries("samples", x, y);
        ser.setMarkerColor(new Color(40, 90, 160));
        c.getStyler().setXAxisMin(-ext).setXAxisMax(ext).setYAxisMin(-ext).setYAxisMax(ext);
        return c;
    }

    private static XYChart amplitude(InterferometryResult r) {
        UvSampling s = r.sampling();
        Observation o = r.observation();
        XYChart c = new XYChartBuilder().width(900).height(600)
                .title("Visibility amplitude against baseline length").xAxisTitle("baseline length (G lambda)")
                .yAxisTitle("|V| (Jy)").build();
        style(c);
        c.getStyler().setDefaultSeriesRenderStyle(org.knowm.xchart.XYSeries.XYSeriesRenderStyle.Scatter);
        c.getStyler().setMarkerSize(3);
        c.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        double[] q = new double[s.size() + 1], a = new double[s.size() + 1], m = new double[s.size() + 1];
        for (int k = 0; k < s.size(); k++) {
            q[k] = FastMath.hypot(s.u[k], s.v[k]) * 1e-9;
            a[k] = FastMath.hypot(o.re()[k], o.im()[k]);
            m[k] = FastMath.hypot(o.modelRe()[k], o.modelIm()[k]);
        }
        q[s.size()] = 0;
        a[s.size()] = Double.NaN;
        m[s.size()] = Double.NaN;
        XYSeries data = c.addSeries("recorded (gains and thermal noise)", q, a);
        data.setMarkerColor(new Color(40, 90, 160));
        data.setMarker(SeriesMarkers.CIRCLE);
        XYSeries model = c.addSeries("model (flare + steady source)", q, m);
        model.setMarkerColor(new Color(220, 120, 30));
        model.setMarker(SeriesMarkers.DIAMOND);
        return c;
    }

    /**
     * @return x and the curves with a NaN inserted where consecutive x are more than three median
     *     steps apart, so lines break between scans or nights instead of bridging them
     */
    static double[][] gaps(double[] x, double[]... ys) {
        int n = x.length;
        double[] d = new double[FastMath.max(1, n - 1)];
        for (int i = 1; i < n; i++) {
            d[i - 1] = x[i] - x[i - 1];
        }
        double[] sorted = d.clone();
        java.util.Arrays.sort(sorted);
        double limit = 3 * sorted[sorted.length / 2];
        List<double[]> rows = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            if (i > 0 && x[i] - x[i - 1] > limit) {
                double[] gap = new double[ys.length + 1];
                java.util.Arrays.fill(gap, Double.NaN);
                gap[0] = 0.5 * (x[i] + x[i - 1]);
                rows.add(gap);
            }
            double[] row = new double[ys.length + 1];
            row[0] = x[i];
            for (int k = 0; k < ys.length; k++) {
                row[k + 1] = ys[k][i];
            }
            rows.add(row);
        }
        double[][] out = new double[ys.length + 1][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            for (int k = 0; k <= ys.length; k++) {
                out[k][i] = rows.get(i)[k];
            }
        }
        return out;
    }

    /** A grid of closure-phase panels, one per triangle. */
    private static BufferedImage closurePanel(InterferometryResult r) {
        Closures.Phases p = r.phases();
        ArrayGeometry a = r.setup().array();
        Map<Long, List<Integer>> rows = new HashMap<>();
        for (int k = 0; k < p.size(); k++) {
            long key = ((long) p.station1()[k] << 40) | ((long) p.station2()[k] << 20) | p.station3()[k];
            rows.computeIfAbsent(key, x -> new ArrayList<>()).add(k);
        }
        List<List<Integer>> tri = new ArrayList<>(rows.values());
        // longest-observed first, ties by station order (reproducible)
        tri.sort(Comparator.<List<Integer>>comparingInt(List::size).reversed().thenComparingInt(l -> l.get(0)));
        int count = FastMath.min(TRIANGLES, tri.size());
        int w = 620, h = 380, cols = 2;
        int rowsN = FastMath.max(1, (count + cols - 1) / cols);
        BufferedImage img = new BufferedImage(cols * w, rowsN * h + 40, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        g.setColor(Color.BLACK);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 16));
        g.drawString(count == 0 ? "No triangle of stations observed together" : String.format(Locale.ROOT,
                "Closure phase against observer time: recorded (error bars), noise-free model, steady source alone"
                        + " (%d of %d triangles)", count, tri.size()), 12, 26);
        double min = r.minutesPerM();
        for (int t = 0; t < count; t++) {
            List<Integer> ks = tri.get(t);
            int k0 = ks.get(0);
            String label = a.name(p.station1()[k0]) + "-" + a.name(p.station2()[k0]) + "-" + a.name(p.station3()[k0]);
            XYChart c = new XYChartBuilder().width(w).height(h).title(label).xAxisTitle("observer time (min)")
                    .yAxisTitle("closure phase (deg)").build();
            style(c);
            c.getStyler().setLegendPosition(Styler.LegendPosition.InsideSE);
            c.getStyler().setMarkerSize(4);
            int n = ks.size();
            double[] x = new double[n], y = new double[n], e = new double[n], m = new double[n], st = new double[n];
            for (int i = 0; i < n; i++) {
                int k = ks.get(i);
                x[i] = r.sampling().timesM[p.frame()[k]] * min;
                y[i] = FastMath.toDegrees(p.value()[k]);
                e[i] = FastMath.min(180.0, FastMath.toDegrees(p.sigma()[k]));
                m[i] = FastMath.toDegrees(r.modelPhases().value()[k]);
                st[i] = r.steadyPhases() == null ? Double.NaN : FastMath.toDegrees(r.steadyPhases().value()[k]);
            }
            XYSeries d = c.addSeries("recorded", x, y, e);
            d.setLineStyle(SeriesLines.NONE);
            d.setMarker(SeriesMarkers.CIRCLE);
            d.setMarkerColor(new Color(40, 90, 160));
            double[][] mg = gaps(x, m, st);
            XYSeries ms = c.addSeries("model", mg[0], mg[1]);
            ms.setMarker(SeriesMarkers.NONE);
            ms.setLineColor(new Color(220, 120, 30));
            if (r.steadyPhases() != null) {
                XYSeries ss = c.addSeries("steady source", mg[0], mg[2]);
                ss.setMarker(SeriesMarkers.NONE);
                ss.setLineColor(Color.GRAY);
                ss.setLineStyle(SeriesLines.DASH_DASH);
            }
            // symmetric range around the model and the data, at least +-30 deg, at most +-180 deg
            double ext = 30;
            for (int i = 0; i < n; i++) {
                ext = FastMath.max(ext, 1.15 * FastMath.max(FastMath.abs(m[i]), FastMath.abs(y[i])));
            }
            ext = FastMath.min(180.0, 10 * FastMath.ceil(ext / 10));
            c.getStyler().setYAxisMin(-ext).setYAxisMax(ext);
            g.drawImage(BitmapEncoder.getBufferedImage(c), (t % cols) * w, 40 + (t / cols) * h, null);
        }
        g.dispose();
        return img;
    }
}
