package org.spindrift.validation;

import java.awt.Color;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.Version;
import org.spindrift.sim.motion.Predictions;

/** Writes {@code report.md} and the plots of a validation run (each file via a temporary name). */
public final class ValidationReport {
    /** Name of the advance-vs-p plot. */
    public static final String ADVANCE_PLOT = "advance_vs_p.png";
    /** Name of the residual plot. */
    public static final String RESIDUAL_PLOT = "pn_residuals_vs_p.png";

    private ValidationReport() {
    }

    /** Writes everything into dir (created if needed). */
    public static void write(Path dir, List<Check> checks, MotionChecks.Series series) throws IOException {
        Files.createDirectories(dir);
        StringBuilder md = new StringBuilder();
        long failed = checks.stream().filter(c -> !c.passed()).count();
        md.append("# Spindrift validation report\n\n");
        md.append(String.format(Locale.ROOT, "Code version %s. %d checks, %d passed, %d failed.%n%n", Version.get(),
                checks.size(), checks.size() - failed, failed));
        md.append("Geometric units G = c = M = 1; times are coordinate time in M, angles in radians. Each check"
                + " passes when |measured - reference| <= tolerance.\n\n");
        String group = null;
        for (Check c : checks) {
            if (!c.group().equals(group)) {
                group = c.group();
                md.append("\n## ").append(group).append("\n\n");
                md.append("| quantity | reference | source | measured | difference | tolerance | result |\n");
                md.append("|---|---|---|---|---|---|---|\n");
            }
            md.append(String.format(Locale.ROOT, "| %s | %.15g | %s | %.15g | %.3e | %.3e | %s |%n", cell(c.quantity()),
                    c.reference(), cell(c.source()), c.measured(), c.difference(), c.tolerance(),
                    c.passed() ? "pass" : "**FAIL**"));
        }
        md.append("\n## Plots\n\n");
        md.append("- `").append(ADVANCE_PLOT).append("`: Schwarzschild periastron advance vs p at e = ")
                .append(series.e()).append(", measured points and the exact, 1PN and 2PN curves.\n");
        md.append("- `").append(RESIDUAL_PLOT).append("`: |measured - 1PN| and |measured - 2PN| vs p with the"
                + " p^-2 and p^-3 laws.\n");
        writeText(dir.resolve("report.md"), md.toString());
        advancePlot(dir.resolve(ADVANCE_PLOT), series);
        residualPlot(dir.resolve(RESIDUAL_PLOT), series);
    }

    private static void advancePlot(Path file, MotionChecks.Series s) throws IOException {
        int n = 200;
        double p0 = s.p()[0];
        double p1 = s.p()[s.p().length - 1];
        double[] p = new double[n];
        double[] ex = new double[n];
        double[] pn1 = new double[n];
        double[] pn2 = new double[n];
        for (int i = 0; i < n; i++) {
            p[i] = p0 * Math.pow(p1 / p0, i / (n - 1.0));
            ex[i] = SchwarzschildPrecession.exact(p[i], s.e());
            pn1[i] = Predictions.advance1pn(p[i]);
            pn2[i] = Predictions.advance2pn(p[i], s.e());
        }
        XYChart c = new XYChartBuilder().width(900).height(650)
                .title(String.format(Locale.ROOT, "Schwarzschild periastron advance per radial period, e = %s", s.e()))
                .xAxisTitle("semi-latus rectum p (M)").yAxisTitle("advance (rad)").build();
        c.getStyler().setXAxisLogarithmic(true).setYAxisLogarithmic(true);
        line(c, "exact (Cutler, Kennefick & Poisson 1994)", p, ex, Color.BLACK);
        line(c, "1PN: 6 pi / p", p, pn1, new Color(60, 120, 200));
        line(c, "2PN: + (3/2)(18 + e^2) pi / p^2", p, pn2, new Color(220, 120, 30));
        XYSeries m = c.addSeries("measured (orbit integration)", s.p(), s.measured());
        m.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        m.setMarker(SeriesMarkers.CIRCLE);
        m.setMarkerColor(new Color(200, 30, 30));
        save(c, file);
    }

    private static void residualPlot(Path file, MotionChecks.Series s) throws IOException {
        int k = s.p().length;
        double[] r1 = new double[k];
        double[] r2 = new double[k];
        for (int i = 0; i < k; i++) {
            r1[i] = Math.abs(s.measured()[i] - Predictions.advance1pn(s.p()[i]));
            r2[i] = Math.abs(s.measured()[i] - Predictions.advance2pn(s.p()[i], s.e()));
        }
        XYChart c = new XYChartBuilder().width(900).height(650)
                .title("Residuals of the post-Newtonian predictions (Schwarzschild, e = " + s.e() + ")")
                .xAxisTitle("semi-latus rectum p (M)").yAxisTitle("|measured - prediction| (rad)").build();
        c.getStyler().setXAxisLogarithmic(true).setYAxisLogarithmic(true);
        java.util.List<double[]> f1 = new java.util.ArrayList<>();
        java.util.List<double[]> f2 = new java.util.ArrayList<>();
        for (int i = 0; i < k; i++) {
            if (s.p()[i] >= MotionChecks.SLOPE_FROM_P) {
                f1.add(new double[] {Math.log(s.p()[i]), Math.log(r1[i])});
                f2.add(new double[] {Math.log(s.p()[i]), Math.log(r2[i])});
            }
        }
        String l1 = String.format(Locale.ROOT, "|measured - 1PN|, fitted slope %.3f (p >= %.0f)", MotionChecks.slope(f1),
                MotionChecks.SLOPE_FROM_P);
        String l2 = String.format(Locale.ROOT, "|measured - 2PN|, fitted slope %.3f (p >= %.0f)", MotionChecks.slope(f2),
                MotionChecks.SLOPE_FROM_P);
        XYSeries a = c.addSeries(l1, s.p(), r1);
        a.setMarker(SeriesMarkers.CIRCLE);
        a.setLineColor(new Color(60, 120, 200));
        a.setMarkerColor(new Color(60, 120, 200));
        XYSeries b = c.addSeries(l2, s.p(), r2);
        b.setMarker(SeriesMarkers.SQUARE);
        b.setLineColor(new Color(220, 120, 30));
        b.setMarkerColor(new Color(220, 120, 30));
        double pl = s.p()[k - 1];
        double[] pp = {s.p()[0], pl};
        line(c, "p^-2 law", pp, new double[] {r1[k - 1] * Math.pow(pl / pp[0], 2), r1[k - 1]}, Color.GRAY);
        line(c, "p^-3 law", pp, new double[] {r2[k - 1] * Math.pow(pl / pp[0], 3), r2[k - 1]}, Color.DARK_GRAY);
        save(c, file);
    }

    private static void line(XYChart c, String name, double[] x, double[] y, Color col) {
        XYSeries s = c.addSeries(name, x, y);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(col);
    }

    private static void save(XYChart c, Path file) throws IOException {
        Path tmp = file.resolveSibling("." + file.getFileName() + ".partial.png");
        BitmapEncoder.saveBitmap(c, tmp.toString(), BitmapEncoder.BitmapFormat.PNG);
        Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    }

    private static void writeText(Path file, String text) throws IOException {
        Path tmp = file.resolveSibling("." + file.getFileName() + ".partial");
        Files.writeString(tmp, text, StandardCharsets.UTF_8);
        Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    }

    /** Escapes the table separator inside a Markdown cell (CommonMark/GFM tables). */
    private static String cell(String text) {
        return text.replace("|", "\\|");
    }
}
