package org.spindrift.sim.light;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.imageio.ImageIO;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.lines.SeriesLines;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.colour.ColourRamp;
import org.spindrift.sim.plot.PlotGuard;

/**
 * Plots of the light stage (PNG): the centroid track on the sky (north up, east left, time
 * colour-coded, beam and black hole marked), x(t) and y(t), the light curve (XChart), and a
 * panel of a few image frames (drawn directly, since they are pixel maps).
 */
public final class LightPlots {
    /** Number of time bins of the colour-coded track. */
    private static final int TRACK_BINS = 8;

    private LightPlots() {
    }

    /** Writes the plots into plots/ of the run folder; @return their names relative to it */
    public static List<String> write(LightOutputs.Sink out, LightResult r) throws IOException {
        return write(out, r, PlotGuard.STRICT);
    }

    /**
     * Writes the plots into plots/ of the run folder, each through the guard (a run records a
     * plot that cannot be drawn and goes on).
     *
     * @return the names of the plots drawn, relative to the run folder
     */
    public static List<String> write(LightOutputs.Sink out, LightResult r, PlotGuard guard) throws IOException {
        List<String> names = new ArrayList<>();
        save(out, "light_track.png", () -> track(r), names, guard);
        save(out, "light_offsets.png", () -> xy(r), names, guard);
        save(out, "light_curve.png", () -> lightCurve(r), names, guard);
        String img = ArchiveLayout.PLOTS + "/light_images.png";
        if (guard.draw(img, () -> {
            BufferedImage panel = imagePanel(r);
            out.write(img, os -> ImageIO.write(panel, "png", os));
        })) {
            names.add(img);
        }
        return names;
    }

    private static void save(LightOutputs.Sink out, String name, java.util.function.Supplier<XYChart> chart,
                             List<String> names, PlotGuard guard) throws IOException {
        String path = ArchiveLayout.PLOTS + "/" + name;
        if (guard.draw(path, () -> {
            XYChart c = chart.get();
            out.write(path, os -> BitmapEncoder.saveBitmap(c, os, BitmapEncoder.BitmapFormat.PNG));
        })) {
            names.add(path);
        }
    }

    /**
     * Colour of fraction f in [0, 1] for lines on a white background: the project's sequential
     * ramp ({@link ColourRamp#SKY}) up to 0.8 of its length, so the lightest colour stays visible.
     */
    static Color ramp(double f) {
        return new Color(ColourRamp.SKY.rgb(0.8 * Math.max(0, Math.min(1, f))));
    }

    private static XYChart track(LightResult r) {
        LightSettings s = r.settings();
        double uas = s.uasPerM();
        double min = s.minutesPerM();
        double[] t = r.timesM();
        XYChart c = new XYChartBuilder().width(980).height(720)
                .title("Centroid track on the sky (north up, east left; frames below 1% of peak flux omitted)")
                .xAxisTitle("east offset (uas), east to the left").yAxisTitle("north offset (uas)").build();
        style(c);
        c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideE);
        // plotted abscissa is -x so that east is on the left; ticks show the true east offset
        c.getStyler().setxAxisTickLabelsFormattingFunction(v -> sig(v == 0 ? 0.0 : -v));
        // frames fainter than 1% of the peak flux are left out: their centroid is noise
        double peak = 0;
        for (FrameMoments m : r.moments()) {
            peak = Math.max(peak, m.flux());
        }
        double floor = 0.01 * peak;
        double ext = 0;
        for (int f = 0; f < t.length; f++) {
            FrameMoments m = r.moments().get(f);
            if (!Double.isNaN(m.x()) && m.flux() >= floor) {
                ext = Math.max(ext, Math.max(Math.abs(m.x()), Math.abs(m.y())) * uas);
                if (Double.isFinite(r.astrometricX()[f])) {
                    ext = Math.max(ext, Math.max(Math.abs(r.astrometricX()[f]), Math.abs(r.astrometricY()[f])) * uas);
                }
            }
        }
        double beam = s.beamFwhmUas();
        // room for the beam circle in the corner, clear of the track
        ext = ext * 1.1 + 1.2 * beam;
        if (!(ext > 0)) {
            ext = 1.0;     // nothing to show: any field will do
        }
        int bins = Math.min(TRACK_BINS, Math.max(1, t.length - 1));
        for (int b = 0; b < bins; b++) {
            int f0 = b * (t.length - 1) / bins;
            int f1 = (b + 1) * (t.length - 1) / bins;
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (int f = f0; f <= f1; f++) {
                FrameMoments m = r.moments().get(f);
                if (!Double.isNaN(m.x()) && m.flux() >= floor) {
                    xs.add(-m.x() * uas);
                    ys.add(m.y() * uas);
                }
            }
            if (xs.isEmpty()) {
                continue;
            }
            // as many decimals as the bin width needs (light black holes have bins of a fraction of a minute)
            double width = (t[f1] - t[f0]) * min;
            int decimals = width > 0 && width < 1 ? (int) Math.min(12, Math.ceil(-Math.log10(width)) + 1) : 0;
            String label = String.format(Locale.ROOT, "%." + decimals + "f-%." + decimals + "f min", t[f0] * min,
                    t[f1] * min);
            if (c.getSeriesMap().containsKey(label)) {
                label += " (" + (b + 1) + ")";
            }
            XYSeries ser = c.addSeries(label, xs, ys);
            ser.setLineColor(ramp(b / (double) Math.max(1, bins - 1)));
            ser.setMarker(SeriesMarkers.NONE);
            ser.setLineWidth(2.5f);
        }
        if (s.steadyFluxRatio() > 0) {
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (int f = 0; f < t.length; f++) {
                if (r.moments().get(f).flux() >= floor) {
                    xs.add(-r.steadyX()[f] * uas);
                    ys.add(r.steadyY()[f] * uas);
                }
            }
            XYSeries ser = c.addSeries(String.format(Locale.ROOT, "with steady source (f=%.2g)", s.steadyFluxRatio()),
                    xs, ys);
            ser.setLineColor(Color.GRAY);
            ser.setLineStyle(SeriesLines.DASH_DASH);
            ser.setMarker(SeriesMarkers.NONE);
        }
        if (beam > 0 && r.astrometricX() != r.steadyX()) {
            // with a beam the instrument reports the peak of the beam-convolved image, not a centroid
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (int f = 0; f < t.length; f++) {
                if (r.moments().get(f).flux() >= floor && Double.isFinite(r.astrometricX()[f])) {
                    xs.add(-r.astrometricX()[f] * uas);
                    ys.add(r.astrometricY()[f] * uas);
                }
            }
            if (!xs.isEmpty()) {
                XYSeries ser = c.addSeries("reported (beam peak)", xs, ys);
                ser.setLineColor(new Color(0.80f, 0.25f, 0.10f));
                ser.setLineStyle(SeriesLines.DOT_DOT);
                ser.setMarker(SeriesMarkers.NONE);
            }
        }
        XYSeries hole = c.addSeries("black hole", new double[] {0.0}, new double[] {0.0});
        hole.setMarker(SeriesMarkers.CROSS);
        hole.setMarkerColor(Color.BLACK);
        hole.setLineStyle(SeriesLines.NONE);
        if (beam > 0) {
            // beam FWHM circle in the lower-left (south-east) corner
            double cx = -(ext - 0.6 * beam), cy = -(ext - 0.6 * beam);
            double[] bx = new double[73];
            double[] by = new double[73];
            for (int i = 0; i < 73; i++) {
                double a = 2 * Math.PI * i / 72;
                bx[i] = -(cx + 0.5 * beam * Math.cos(a));
                by[i] = cy + 0.5 * beam * Math.sin(a);
            }
            XYSeries bs = c.addSeries(String.format(Locale.ROOT, "beam FWHM %.3g uas", beam), bx, by);
            bs.setLineColor(Color.DARK_GRAY);
            bs.setMarker(SeriesMarkers.NONE);
        }
        c.getStyler().setXAxisMin(-ext).setXAxisMax(ext).setYAxisMin(-ext).setYAxisMax(ext);
        return c;
    }

    private static XYChart xy(LightResult r) {
        LightSettings s = r.settings();
        double uas = s.uasPerM();
        double min = s.minutesPerM();
        XYChart c = new XYChartBuilder().width(900).height(450)
                .title("Centroid offsets versus observer time (frames below 1% of peak flux omitted)")
                .xAxisTitle("observer time (min)").yAxisTitle("offset (uas)").build();
        style(c);
        // frames fainter than 1% of the peak flux are left out: their centroid is noise
        double peak = 0;
        for (FrameMoments m : r.moments()) {
            peak = Math.max(peak, m.flux());
        }
        List<Integer> keep = new ArrayList<>();
        for (int f = 0; f < r.timesM().length; f++) {
            FrameMoments m = r.moments().get(f);
            if (m.flux() >= 0.01 * peak && !Double.isNaN(m.x())) {
                keep.add(f);
            }
        }
        int n = Math.max(1, keep.size());
        double[] t = new double[n], x = new double[n], y = new double[n];
        for (int i = 0; i < keep.size(); i++) {
            int f = keep.get(i);
            FrameMoments m = r.moments().get(f);
            t[i] = r.timesM()[f] * min;
            x[i] = m.x() * uas;
            y[i] = m.y() * uas;
        }
        XYSeries sx = c.addSeries("x (east)", t, x);
        sx.setMarker(SeriesMarkers.NONE);
        sx.setLineColor(new Color(0.80f, 0.25f, 0.10f));
        XYSeries sy = c.addSeries("y (north)", t, y);
        sy.setMarker(SeriesMarkers.NONE);
        sy.setLineColor(new Color(0.10f, 0.35f, 0.75f));
        if (s.steadyFluxRatio() > 0) {
            offsetPair(c, t, keep, uas, r.steadyX(), r.steadyY(), "with steady source", SeriesLines.DASH_DASH,
                    new Color(0.80f, 0.25f, 0.10f), new Color(0.10f, 0.35f, 0.75f));
        }
        if (s.beamFwhmUas() > 0 && r.astrometricX() != r.steadyX()) {
            // the position the instrument reports (beam-convolved peak), which mock epochs scatter about
            offsetPair(c, t, keep, uas, r.astrometricX(), r.astrometricY(), "reported (beam peak)", SeriesLines.DOT_DOT,
                    new Color(0.55f, 0.15f, 0.05f), new Color(0.05f, 0.20f, 0.50f));
        }
        if (r.mock() != null) {
            LightResult.MockAstrometry mk = r.mock();
            int m = mk.timesM().length;
            double[] tm = new double[m], mx = new double[m], my = new double[m];
            for (int i = 0; i < m; i++) {
                tm[i] = mk.timesM()[i] * min;
                mx[i] = mk.x()[i] * uas;
                my[i] = mk.y()[i] * uas;
            }
            XYSeries px = c.addSeries(String.format(Locale.ROOT, "mock x (noise %.3g uas)", mk.sigmaUas()), tm, mx);
            px.setLineStyle(SeriesLines.NONE);
            px.setMarker(SeriesMarkers.CIRCLE);
            px.setMarkerColor(new Color(0.80f, 0.25f, 0.10f, 0.5f));
            XYSeries py = c.addSeries(String.format(Locale.ROOT, "mock y (noise %.3g uas)", mk.sigmaUas()), tm, my);
            py.setLineStyle(SeriesLines.NONE);
            py.setMarker(SeriesMarkers.DIAMOND);
            py.setMarkerColor(new Color(0.10f, 0.35f, 0.75f, 0.5f));
        }
        niceTimeAxis(c, t);
        return c;
    }

    /** Adds x(t) and y(t) of the kept frames of one position series (M, drawn in uas) as two lines. */
    private static void offsetPair(XYChart c, double[] t, List<Integer> keep, double uas, double[] xM, double[] yM,
                                   String what, BasicStroke line, Color xColour, Color yColour) {
        double[] x = new double[t.length], y = new double[t.length];
        for (int i = 0; i < keep.size(); i++) {
            x[i] = xM[keep.get(i)] * uas;
            y[i] = yM[keep.get(i)] * uas;
        }
        XYSeries a = c.addSeries("x " + what, t, x);
        a.setMarker(SeriesMarkers.NONE);
        a.setLineStyle(line);
        a.setLineColor(xColour);
        XYSeries b = c.addSeries("y " + what, t, y);
        b.setMarker(SeriesMarkers.NONE);
        b.setLineStyle(line);
        b.setLineColor(yColour);
    }

    private static XYChart lightCurve(LightResult r) {
        double min = r.settings().minutesPerM();
        XYChart c = new XYChartBuilder().width(900).height(450).title("Light curve")
                .xAxisTitle("observer time (min)").yAxisTitle("flux / mean flare flux").build();
        style(c);
        int n = r.timesM().length;
        double mean = 0;
        for (FrameMoments m : r.moments()) {
            mean += m.flux() / n;
        }
        double[] t = new double[n], f = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = r.timesM()[i] * min;
            f[i] = mean > 0 ? r.moments().get(i).flux() / mean : 0;
        }
        XYSeries s = c.addSeries("flare", t, f);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(new Color(0.15f, 0.15f, 0.15f));
        if (r.steadyFlux() > 0) {
            double[] g = new double[n];
            for (int i = 0; i < n; i++) {
                g[i] = f[i] + r.steadyFlux() / mean;
            }
            XYSeries s2 = c.addSeries("flare + steady source", t, g);
            s2.setMarker(SeriesMarkers.NONE);
            s2.setLineColor(Color.GRAY);
            s2.setLineStyle(SeriesLines.DASH_DASH);
        }
        c.getStyler().setYAxisMin(0.0);
        niceTimeAxis(c, t);
        return c;
    }

    private static void style(XYChart c) {
        Styler st = c.getStyler();
        c.getStyler().setxAxisTickLabelsFormattingFunction(LightPlots::tick);
        st.setChartBackgroundColor(Color.WHITE);
        st.setPlotBackgroundColor(Color.WHITE);
        st.setLegendBorderColor(Color.LIGHT_GRAY);
        c.getStyler().setPlotGridLinesColor(new Color(0.9f, 0.9f, 0.9f));
        st.setChartTitleFont(new Font(Font.SANS_SERIF, Font.BOLD, 16));
        c.getStyler().setAxisTitleFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        c.getStyler().setAxisTickLabelsFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        c.getStyler().setLegendFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
    }

    /** Time axis from and to round values, so that the ticks fall on round numbers. */
    private static void niceTimeAxis(XYChart c, double[] t) {
        if (t.length < 2) {
            return;
        }
        double span = t[t.length - 1] - t[0];
        double step = Math.pow(10, Math.floor(Math.log10(Math.max(span, 1e-9) / 5)));
        c.getStyler().setXAxisMin(Math.floor(t[0] / step) * step);
        c.getStyler().setXAxisMax(Math.ceil(t[t.length - 1] / step) * step);
    }

    /**
     * @return v with three significant digits, trailing zeros dropped (angles on the sky span many
     *     decades: an invented nucleus at tens of Mpc subtends well below one micro-arcsecond)
     */
    static String sig(double v) {
        if (v == 0) {
            return "0";
        }
        String s = String.format(Locale.ROOT, "%.3g", v);
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }

    /** Tick label with as few decimals as the value needs (at most 2). */
    static String tick(Double v) {
        double a = Math.abs(v);
        if (Math.abs(a - Math.rint(a)) < 1e-6 * Math.max(1, a)) {
            return String.format(Locale.ROOT, "%.0f", v);
        }
        return String.format(Locale.ROOT, Math.abs(a * 10 - Math.rint(a * 10)) < 1e-6 ? "%.1f" : "%.2f", v);
    }

    /**
     * Four frames spread over the run on a common colour scale per row (square-root stretch):
     * the model images, and below them the images convolved with the beam when one is set.
     */
    static BufferedImage imagePanel(LightResult r) {
        int frames = r.images().length;
        int shown = Math.min(4, frames);
        boolean beamed = r.settings().beamFwhmUas() > 0;
        int rows = beamed ? 2 : 1;
        int cell = 340;
        int margin = 60;
        int rowH = cell + margin + 20;
        int w = shown * (cell + margin) + margin;
        int h = rows * rowH + margin + 30;
        BufferedImage out = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = out.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, w, h);
        int[] idx = new int[shown];
        for (int i = 0; i < shown; i++) {
            idx[i] = shown == 1 ? 0 : i * (frames - 1) / (shown - 1);
        }
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        for (int row = 0; row < rows; row++) {
            float[][] set = row == 0 ? r.rawImages() : r.images();
            drawRow(g, r, set, idx, margin, margin + row * rowH, cell, margin, row == 1);
        }
        LightSettings s = r.settings();
        double half = 0.5 * r.camera().fieldOfView() * s.uasPerM();
        g.setColor(Color.BLACK);
        g.drawString(String.format(Locale.ROOT, "Images (%s), square-root stretch, common scale per row; field %s uas = %s M;"
                + " north up, east left; + marks the black hole%s",
                s.lensing() ? "ray traced" : "straight lines", sig(2 * half), sig(r.camera().fieldOfView()),
                beamed ? String.format(Locale.ROOT, "; lower row convolved with the beam, FWHM %.3g uas (circle)",
                        s.beamFwhmUas()) : ""), margin, h - 14);
        g.dispose();
        return out;
    }

    private static void drawRow(Graphics2D g, LightResult r, float[][] set, int[] idx, int left, int y0, int cell,
                                int margin, boolean beamRow) {
        LightSettings s = r.settings();
        int n = r.camera().pixels();
        double half = 0.5 * r.camera().fieldOfView() * s.uasPerM();
        float peak = 0;
        for (int i : idx) {
            for (float v : set[i]) {
                peak = Math.max(peak, v);
            }
        }
        for (int i = 0; i < idx.length; i++) {
            int x0 = left + i * (cell + margin);
            float[] img = set[idx[i]];
            BufferedImage tile = new BufferedImage(n, n, BufferedImage.TYPE_INT_RGB);
            for (int row = 0; row < n; row++) {
                for (int col = 0; col < n; col++) {
                    double v = peak > 0 ? Math.sqrt(Math.max(0, img[row * n + col]) / peak) : 0;
                    // image row 0 is south: draw it at the bottom; column 0 is east: on the left
                    tile.setRGB(col, n - 1 - row, s.skyColours().rgb(v));
                }
            }
            g.drawImage(tile, x0, y0, cell, cell, null);
            g.setColor(Color.BLACK);
            g.drawRect(x0, y0, cell, cell);
            g.drawString(String.format(Locale.ROOT, "t = %.1f min%s", r.timesM()[idx[i]] * s.minutesPerM(),
                    beamRow ? ", with beam" : ""), x0, y0 - 10);
            g.drawString(sig(half), x0 - 8, y0 + cell + 18);
            g.drawString(sig(-half), x0 + cell - 30, y0 + cell + 18);
            g.drawString("east offset (uas)", x0 + cell / 2 - 50, y0 + cell + 18);
            g.drawString(sig(half), x0 - 40, y0 + 10);
            g.drawString(sig(-half), x0 - 44, y0 + cell);
            g.setColor(Color.CYAN);
            int cx = x0 + cell / 2, cy = y0 + cell / 2;
            g.drawLine(cx - 6, cy, cx + 6, cy);
            g.drawLine(cx, cy - 6, cx, cy + 6);
            g.setColor(Color.WHITE);
            g.drawString("N", x0 + 24, y0 + 18);
            g.drawString("E", x0 + 6, y0 + 36);
            g.drawLine(x0 + 28, y0 + 32, x0 + 28, y0 + 22);
            g.drawLine(x0 + 28, y0 + 32, x0 + 18, y0 + 32);
            if (beamRow) {
                double bpx = s.beamFwhmUas() / (2 * half) * cell;
                g.setStroke(new BasicStroke(1.5f));
                g.drawOval((int) (x0 + cell - 12 - bpx), (int) (y0 + cell - 12 - bpx), (int) bpx, (int) bpx);
            }
        }
    }

}
