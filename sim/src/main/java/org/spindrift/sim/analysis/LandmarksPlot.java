package org.spindrift.sim.analysis;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.imageio.ImageIO;
import org.hipparchus.util.FastMath;
import org.knowm.xchart.AnnotationText;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Two stacked panels over a logarithmic r axis: the circular-orbit angular velocity Omega(r)
 * (prograde, and |Omega| retrograde; solid where the orbits are stable, dashed where they are
 * unstable), and the shear rate r dOmega/dr of the prograde orbits; the landmarks are vertical
 * lines. Written to a temporary name and renamed when complete.
 */
public final class LandmarksPlot {
    private static final int WIDTH = 1000;
    private static final int HEIGHT = 430;
    private static final int SAMPLES = 500;
    /** Vertices kept on dashed lines: about 12 px apart, longer than one dash period. */
    private static final int DASH_STEP = 8;
    private static final BasicStroke DASHED = new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER,
            10f, new float[] {6f, 4f}, 0f);
    private static final BasicStroke SOLID = new BasicStroke(2.2f);
    private static final BasicStroke MARK = new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER,
            10f, new float[] {2f, 3f}, 0f);
    private static final Color PRO = new Color(30, 90, 180);
    private static final Color RETRO = new Color(200, 110, 20);

    private LandmarksPlot() {
    }

    /**
     * @param title first line of the title (the spacetime)
     * @param file the PNG to write
     */
    public static void write(Spacetime st, Landmarks l, String title, Path file) throws IOException {
        double inner = l.captureRadius();
        for (double x : new double[] {l.photonOrbit(true), l.isco(true), l.omegaMaxRadius()}) {
            if (Double.isFinite(x)) {
                inner = Double.isFinite(inner) ? FastMath.min(inner, x) : x;
            }
        }
        double rMin = Double.isFinite(inner) ? FastMath.min(1.0, 0.9 * inner) : 0.5;
        double rMax = FastMath.max(30.0, 2.0 * finiteOr(l.isco(false), 10.0));
        double[] r = new double[SAMPLES];
        for (int i = 0; i < SAMPLES; i++) {
            r[i] = rMin * FastMath.pow(rMax / rMin, i / (SAMPLES - 1.0));
        }

        XYChart top = chart(title, "Omega of circular equatorial orbits (1/M)");
        XYChart bottom = chart("shear rate of prograde circular orbits", "r dOmega/dr (1/M)");
        // legends inside, in corners the curves leave empty, so both plot areas have one width
        top.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        bottom.getStyler().setLegendVisible(false);      // one curve, named by the axis title
        // six-character tick labels in a monospaced font in both panels keep their r axes aligned
        top.getStyler().setyAxisTickLabelsFormattingFunction(v -> String.format(Locale.ROOT, "%.4f", v));
        bottom.getStyler().setyAxisTickLabelsFormattingFunction(v -> String.format(Locale.ROOT, "%+.3f", v));
        bottom.setXAxisTitle("r (M)");
        double yMax = 0.0;
        double[] shear = new double[SAMPLES];
        for (int k = 0; k < 2; k++) {
            boolean pro = k == 0;
            double[] w = new double[SAMPLES];
            boolean[] stable = new boolean[SAMPLES];
            for (int i = 0; i < SAMPLES; i++) {
                double ut = CircularOrbits.ut(st, r[i], pro);
                double om = CircularOrbits.omega(st, r[i], pro);
                w[i] = Double.isFinite(ut) && r[i] >= l.captureRadius() ? FastMath.abs(om) : Double.NaN;
                stable[i] = CircularOrbits.radialEpicyclicSquared(st, r[i], pro) > 0.0
                        && CircularOrbits.verticalEpicyclicSquared(st, r[i], pro) > 0.0;
                if (!Double.isNaN(w[i])) {
                    yMax = FastMath.max(yMax, w[i]);
                }
                if (pro) {
                    shear[i] = Double.isNaN(w[i]) ? Double.NaN : CircularOrbits.shearRate(st, r[i], true);
                }
            }
            Color c = pro ? PRO : RETRO;
            String name = pro ? "prograde" : "retrograde |Omega|";
            addRuns(top, name + ", stable", r, w, stable, true, c, SOLID);
            addRuns(top, name + ", unstable", r, w, stable, false, c, DASHED);
        }
        boolean[] all = new boolean[SAMPLES];
        java.util.Arrays.fill(all, true);
        double sMin = 0.0;
        double sMax = 0.0;
        for (double s : shear) {
            if (!Double.isNaN(s)) {
                sMin = FastMath.min(sMin, s);
                sMax = FastMath.max(sMax, s);
            }
        }
        // a steep rise where circular orbits end would flatten everything else: clip it
        if (sMax > 3.0 * -sMin && sMin < 0.0) {
            sMax = 3.0 * -sMin;
            for (int i = 0; i < SAMPLES; i++) {
                if (shear[i] > sMax * 1.05) {
                    shear[i] = Double.NaN;
                }
            }
        }
        double pad = 0.05 * (sMax - sMin + 1e-3);
        sMin -= pad;
        sMax += pad;
        addRuns(bottom, "r dOmega/dr, prograde", r, shear, all, true, PRO, SOLID);
        XYSeries zero = bottom.addSeries("zero", new double[] {rMin, rMax}, new double[] {0.0, 0.0});
        style(zero, Color.GRAY, new BasicStroke(0.8f));
        zero.setShowInLegend(false);

        yMax *= 1.08;
        top.getStyler().setYAxisMin(0.0).setYAxisMax(yMax);
        bottom.getStyler().setYAxisMin(sMin).setYAxisMax(sMax);
        for (XYChart c : new XYChart[] {top, bottom}) {
            c.getStyler().setXAxisMin(rMin).setXAxisMax(rMax);
        }
        // the logarithmic axis labels decades only: label a few values in between
        for (double v : new double[] {0.2, 0.3, 0.5, 2, 3, 5, 20, 30, 50}) {
            if (v > rMin * 1.05 && v < rMax / 1.05) {
                String t = v < 1 ? String.valueOf(v) : String.valueOf((int) v);
                top.addAnnotation(new AnnotationText(t, v, 0.03 * yMax, false));
                bottom.addAnnotation(new AnnotationText(t, v, sMin + 0.03 * (sMax - sMin), false));
            }
        }
        List<Mark> marks = marks(l);
        for (Mark m : marks) {
            if (m.r >= rMin && m.r <= rMax) {
                XYSeries a = top.addSeries(m.label, new double[] {m.r, m.r}, new double[] {0.0, yMax});
                style(a, m.color, MARK);
                XYSeries b = bottom.addSeries(m.label, new double[] {m.r, m.r}, new double[] {sMin, sMax});
                style(b, m.color, MARK);
                b.setShowInLegend(false);
            }
        }
        if (Double.isFinite(l.omegaMaxRadius())) {
            XYSeries p = top.addSeries("Omega maximum", new double[] {l.omegaMaxRadius()},
                    new double[] {l.omegaMaxValue()});
            p.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            p.setMarker(SeriesMarkers.CIRCLE);
            p.setMarkerColor(new Color(180, 20, 60));
        }

        BufferedImage a = BitmapEncoder.getBufferedImage(top);
        BufferedImage b = BitmapEncoder.getBufferedImage(bottom);
        BufferedImage img = new BufferedImage(WIDTH, a.getHeight() + b.getHeight(), BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.drawImage(a, 0, 0, null);
        g.drawImage(b, 0, a.getHeight(), null);
        g.dispose();
        Path abs = file.toAbsolutePath();
        if (abs.getParent() != null) {
            Files.createDirectories(abs.getParent());
        }
        Path tmp = abs.resolveSibling("." + abs.getFileName() + ".partial");
        try {
            if (!ImageIO.write(img, "png", tmp.toFile())) {
                throw new IOException("no PNG writer available");
            }
            Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    private record Mark(String label, double r, Color color) {
    }

    private static List<Mark> marks(Landmarks l) {
        List<Mark> m = new ArrayList<>();
        add(m, "horizon", l.horizonOuter(), Color.BLACK);
        add(m, "surface (capture radius)", l.hasHorizon() ? Double.NaN : l.captureRadius(), Color.DARK_GRAY);
        add(m, "ergosurface (equator)", l.ergosurfaceEquator(), new Color(120, 120, 120));
        add(m, "photon orbit, prograde", l.photonOrbit(true), new Color(140, 60, 170));
        add(m, "marginally bound, prograde", l.marginallyBoundPrograde(), new Color(30, 150, 140));
        add(m, "ISCO, prograde", l.isco(true), new Color(20, 140, 40));
        add(m, "ISCO, retrograde", l.isco(false), new Color(170, 140, 20));
        add(m, "Omega maximum", l.omegaMaxRadius(), new Color(180, 20, 60));
        return m;
    }

    private static void add(List<Mark> m, String label, double r, Color c) {
        if (Double.isFinite(r)) {
            m.add(new Mark(String.format(Locale.ROOT, "%s  r = %.4f", label, r), r, c));
        }
    }

    private static XYChart chart(String title, String yTitle) {
        XYChart c = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle("r (M)")
                .yAxisTitle(yTitle).build();
        org.knowm.xchart.style.XYStyler s = c.getStyler();
        c.getStyler().setXAxisLogarithmic(true);
        s.setAxisTickLabelsFont(new Font(Font.MONOSPACED, Font.PLAIN, 12));
        s.setLegendBackgroundColor(new Color(255, 255, 255, 220));
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotGridLinesVisible(true);
        s.setLegendBorderColor(Color.LIGHT_GRAY);
        c.getStyler().setMarkerSize(8);
        return c;
    }

    /** Adds the contiguous runs of finite y where flag[i] == want as separate line series. */
    private static void addRuns(XYChart c, String name, double[] x, double[] y, boolean[] flag, boolean want,
                                Color color, BasicStroke stroke) {
        int n = x.length;
        int i = 0;
        int run = 0;
        while (i < n) {
            while (i < n && (Double.isNaN(y[i]) || flag[i] != want)) {
                i++;
            }
            int j = i;
            while (j < n && !Double.isNaN(y[j]) && flag[j] == want) {
                j++;
            }
            // include the neighbour so that stable and unstable pieces join up
            int lo = i > 0 && !Double.isNaN(y[i - 1]) ? i - 1 : i;
            if (j - lo >= 2) {
                // dashes restart at every vertex: thin dashed runs out so the pattern shows
                int step = stroke.getDashArray() == null ? 1 : DASH_STEP;
                int m = (j - 1 - lo) / step + 1;
                boolean tail = (j - 1 - lo) % step != 0;
                double[] xs = new double[m + (tail ? 1 : 0)];
                double[] ys = new double[xs.length];
                for (int q = 0; q < m; q++) {
                    xs[q] = x[lo + q * step];
                    ys[q] = y[lo + q * step];
                }
                if (tail) {
                    xs[m] = x[j - 1];
                    ys[m] = y[j - 1];
                }
                XYSeries s = c.addSeries(run == 0 ? name : name + " " + run, xs, ys);
                style(s, color, stroke);
                s.setShowInLegend(run == 0);
                run++;
            }
            i = j;
        }
    }

    private static void style(XYSeries s, Color c, BasicStroke stroke) {
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(c);
        s.setLineStyle(stroke);
    }

    private static double finiteOr(double x, double fallback) {
        return Double.isFinite(x) ? x : fallback;
    }
}
