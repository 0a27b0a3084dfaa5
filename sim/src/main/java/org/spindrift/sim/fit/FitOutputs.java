package org.spindrift.sim.fit;

import com.fasterxml.jackson.databind.node.ObjectNode;
import io.jhdf.HdfFile;
import io.jhdf.WritableHdfFile;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import javax.imageio.ImageIO;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.shared.scenario.ScenarioJson;
import org.spindrift.sim.scenario.FitFile;

/**
 * Files of a fit folder: fit.json, posterior.csv, samples.h5 (sampling), plots/fit_*.png, and the
 * manifest last (temporary names, renamed when complete; a failure removes what was written).
 */
final class FitOutputs {
    private FitOutputs() {
    }

    static void write(FitRun.Prepared pr, FitRun.Result r, FitModel.Prediction best, List<FitModel.Prediction> band,
                      LeastSquaresFit.Result ls, boolean overwrite) throws IOException {
        RunArchiveWriter archive = RunArchiveWriter.create(r.folder(), overwrite);
        Thread cleanup = new Thread(archive::abandon, "spindrift-fit-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
        boolean done = false;
        try {
            archive.writeJson("fit.json", FitRun.json(r, pr.fit(), ls));
            archive.write("posterior.csv", tmp -> posterior(tmp, r, pr.fit().method().burnIn()));
            if (r.chain() != null) {
                archive.write("samples.h5", tmp -> samples(tmp, r));
            }
            chart(archive, "fit_track.png", track(pr.data(), best));
            image(archive, "fit_offsets.png", offsets(pr.data(), best, band));
            if (r.chain() != null) {
                image(archive, "fit_corner.png", corner(r, pr.fit()));
                image(archive, "fit_chains.png", chains(r));
            }
            ObjectNode m = RunArchiveWriter.json().createObjectNode();
            m.put("kind", "fit");
            m.put("fit_name", pr.fit().name());
            m.put("fit_file", pr.fit().file().toString());
            m.set("scenario", ScenarioJson.toJson(pr.fit().scenario().load().scenario()));
            m.put("tables_traced", pr.cache().tablesTraced());
            archive.finish(m);
            done = true;
        } finally {
            if (!done) {
                archive.abandon();
            }
            try {
                Runtime.getRuntime().removeShutdownHook(cleanup);
            } catch (IllegalStateException e) {
                // shutting down
            }
        }
    }

    /** posterior.csv: per parameter the best value, sigma and the 16/50/84 percentiles (sampling) or best -+ sigma. */
    private static void posterior(java.nio.file.Path tmp, FitRun.Result r, int burn) throws IOException {
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(tmp, StandardCharsets.UTF_8))) {
            w.println("key,value,sigma,p16,p50,p84");
            double[][] flat = r.chain() == null ? null : FitRun.flat(r.chain(), burn);
            for (int i = 0; i < r.names().size(); i++) {
                double p16, p50, p84;
                if (flat != null) {
                    p16 = FitRun.percentile(flat[i], 16);
                    p50 = FitRun.percentile(flat[i], 50);
                    p84 = FitRun.percentile(flat[i], 84);
                } else {
                    p16 = r.best()[i] - r.sigma()[i];
                    p50 = r.best()[i];
                    p84 = r.best()[i] + r.sigma()[i];
                }
                w.printf(Locale.ROOT, "%s,%.10g,%.6g,%.10g,%.10g,%.10g%n", r.names().get(i), r.best()[i], r.sigma()[i],
                        p16, p50, p84);
            }
        }
    }

    private static void samples(java.nio.file.Path tmp, FitRun.Result r) {
        double[][][] c = r.chain().chain();
        try (WritableHdfFile f = HdfFile.write(tmp)) {
            f.putDataset("chain", c);
            f.putDataset("log_probability", r.chain().logProb());
            f.putDataset("autocorrelation_time", r.tau());
            f.putAttribute("parameters", r.names().toArray(new String[0]));
            f.putAttribute("acceptance_fraction", r.chain().acceptance());
        }
    }

    private static void chart(RunArchiveWriter a, String name, XYChart c) throws IOException {
        image(a, name, BitmapEncoder.getBufferedImage(c));
    }

    private static void image(RunArchiveWriter a, String name, BufferedImage img) throws IOException {
        a.write(ArchiveLayout.PLOTS + "/" + name, tmp -> ImageIO.write(img, "png", tmp.toFile()));
    }

    private static XYChart base(String title, String x, String y, int w, int h) {
        XYChart c = new XYChartBuilder().width(w).height(h).title(title).xAxisTitle(x).yAxisTitle(y).build();
        c.getStyler().setChartBackgroundColor(Color.WHITE);
        c.getStyler().setLegendPosition(Styler.LegendPosition.InsideNE);
        c.getStyler().setMarkerSize(5);
        return c;
    }

    /** Sky track: data with error bars, model at the epochs; x axis east decreasing to the right. */
    private static XYChart track(FitData d, FitModel.Prediction p) {
        XYChart c = base("centroid track (north up, east left)", "east offset (uas, east to the left)", "north offset (uas)",
                800, 700);
        double[] negX = Arrays.stream(d.x()).map(v -> -v).toArray();
        XYSeries s = c.addSeries("data", negX, d.y(), d.sy());
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(SeriesMarkers.CIRCLE);
        XYSeries m = c.addSeries("model", Arrays.stream(p.x()).map(v -> -v).toArray(), p.y());
        m.setMarker(SeriesMarkers.NONE);
        m.setLineColor(Color.RED);
        // residual vectors data -> model
        for (int i = 0; i < d.x().length; i += Math.max(1, d.x().length / 60)) {
            XYSeries rv = c.addSeries("r" + i, new double[] {-d.x()[i], -p.x()[i]}, new double[] {d.y()[i], p.y()[i]});
            rv.setMarker(SeriesMarkers.NONE);
            rv.setLineColor(new Color(120, 120, 120));
            rv.setShowInLegend(false);
        }
        c.getStyler().setxAxisTickLabelsFormattingFunction(v -> String.format(Locale.ROOT, "%.0f", -v));
        return c;
    }

    /** x(t), y(t), flux(t): data, best model, 68 % band of the posterior draws; plus residuals. */
    private static BufferedImage offsets(FitData d, FitModel.Prediction best, List<FitModel.Prediction> band) {
        List<BufferedImage> panels = new ArrayList<>();
        panels.add(BitmapEncoder.getBufferedImage(series("x(t) east offset", "uas", d.timeMin(), d.x(), d.sx(), best.x(),
                bandOf(band, 0))));
        panels.add(BitmapEncoder.getBufferedImage(series("y(t) north offset", "uas", d.timeMin(), d.y(), d.sy(), best.y(),
                bandOf(band, 1))));
        if (d.flux().length > 0) {
            panels.add(BitmapEncoder.getBufferedImage(series("flux(t)", "flux", d.fluxTimeMin(), d.flux(), d.sflux(),
                    best.flux(), bandOf(band, 2))));
        }
        double[] res = new double[d.timeMin().length];
        for (int i = 0; i < res.length; i++) {
            res[i] = Math.hypot((d.x()[i] - best.x()[i]) / d.sx()[i], (d.y()[i] - best.y()[i]) / d.sy()[i]);
        }
        XYChart rc = base("astrometric residual |data - model| / sigma", "observer time (min)", "sigma", 900, 250);
        rc.addSeries("residual", d.timeMin(), res).setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        panels.add(BitmapEncoder.getBufferedImage(rc));
        int h = panels.stream().mapToInt(BufferedImage::getHeight).sum();
        BufferedImage out = new BufferedImage(900, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = out.createGraphics();
        int y = 0;
        for (BufferedImage p : panels) {
            g.drawImage(p, 0, y, null);
            y += p.getHeight();
        }
        g.dispose();
        return out;
    }

    /** @return [0] 16th and [1] 84th percentile per epoch of quantity q (0 x, 1 y, 2 flux), or null */
    private static double[][] bandOf(List<FitModel.Prediction> band, int q) {
        if (band.size() < 5) {
            return null;
        }
        int n = (q == 0 ? band.get(0).x() : q == 1 ? band.get(0).y() : band.get(0).flux()).length;
        double[][] out = new double[2][n];
        double[] v = new double[band.size()];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < band.size(); j++) {
                FitModel.Prediction p = band.get(j);
                v[j] = (q == 0 ? p.x() : q == 1 ? p.y() : p.flux())[i];
            }
            out[0][i] = FitRun.percentile(v, 16);
            out[1][i] = FitRun.percentile(v, 84);
        }
        return out;
    }

    private static XYChart series(String title, String unit, double[] t, double[] v, double[] s, double[] model,
                                  double[][] band) {
        XYChart c = base(title, "observer time (min)", unit, 900, 300);
        if (band != null) {
            XYSeries lo = c.addSeries("model 68 % band", t, band[1]);
            lo.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            lo.setMarker(SeriesMarkers.NONE);
            lo.setLineColor(new Color(255, 170, 170));
            XYSeries hi = c.addSeries("band low", t, band[0]);
            hi.setMarker(SeriesMarkers.NONE);
            hi.setLineColor(new Color(255, 170, 170));
            hi.setShowInLegend(false);
        }
        XYSeries d = c.addSeries("data", t, v, s);
        d.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        d.setMarker(SeriesMarkers.CIRCLE);
        XYSeries m = c.addSeries("best model", t, model);
        m.setMarker(SeriesMarkers.NONE);
        m.setLineColor(Color.RED);
        return c;
    }

    /** Chain traces, one panel per parameter, every walker. */
    private static BufferedImage chains(FitRun.Result r) {
        int k = r.names().size();
        double[][][] c = r.chain().chain();
        int steps = c.length, w = c[0].length;
        double[] t = new double[steps];
        for (int s = 0; s < steps; s++) {
            t[s] = s;
        }
        BufferedImage out = new BufferedImage(900, 200 * k, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = out.createGraphics();
        for (int i = 0; i < k; i++) {
            XYChart ch = base(r.names().get(i), "step", "value", 900, 200);
            ch.getStyler().setLegendVisible(false);
            for (int j = 0; j < w; j += Math.max(1, w / 16)) {
                double[] v = new double[steps];
                for (int s = 0; s < steps; s++) {
                    v[s] = c[s][j][i];
                }
                XYSeries se = ch.addSeries("w" + j, t, v);
                se.setMarker(SeriesMarkers.NONE);
                se.setLineWidth(0.6f);
            }
            g.drawImage(BitmapEncoder.getBufferedImage(ch), 0, 200 * i, null);
        }
        g.dispose();
        return out;
    }

    /**
     * Pairwise posterior grid: 1-D histograms on the diagonal, and below it 2-D histograms (40 x 40
     * bins) shaded where they lie inside the highest-density regions holding 68 % (dark) and 95 %
     * (light) of the samples, i.e. the areas within the 68/95 % contours (common practice).
     */
    private static BufferedImage corner(FitRun.Result r, FitFile fit) {
        int k = r.names().size();
        int cell = Math.max(120, Math.min(220, 900 / k));
        int pad = 30;
        BufferedImage out = new BufferedImage(k * cell + pad, k * cell + pad, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = out.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, out.getWidth(), out.getHeight());
        double[][] flat = FitRun.flat(r.chain(), fit.method().burnIn());
        double[] lo = new double[k], hi = new double[k];
        for (int i = 0; i < k; i++) {
            lo[i] = FitRun.percentile(flat[i], 0.5);
            hi[i] = FitRun.percentile(flat[i], 99.5);
            if (!(hi[i] > lo[i])) {
                hi[i] = lo[i] + 1e-12;
            }
        }
        int bins = 40;
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
        for (int i = 0; i < k; i++) {
            for (int j = 0; j <= i; j++) {
                int x0 = pad + j * cell, y0 = i * cell;
                g.setColor(Color.GRAY);
                g.drawRect(x0 + 2, y0 + 2, cell - 4, cell - 4);
                if (i == j) {
                    int[] hgm = new int[bins];
                    for (double v : flat[i]) {
                        int b = (int) ((v - lo[i]) / (hi[i] - lo[i]) * bins);
                        if (b >= 0 && b < bins) {
                            hgm[b]++;
                        }
                    }
                    int max = Arrays.stream(hgm).max().orElse(1);
                    g.setColor(new Color(40, 70, 140));
                    for (int b = 0; b < bins; b++) {
                        int hh = (int) ((cell - 20) * hgm[b] / (double) Math.max(1, max));
                        g.fillRect(x0 + 4 + b * (cell - 8) / bins, y0 + cell - 4 - hh, Math.max(1, (cell - 8) / bins), hh);
                    }
                    g.setColor(Color.BLACK);
                    g.drawString(shortName(r.names().get(i)), x0 + 6, y0 + 14);
                } else {
                    double[] h2 = new double[bins * bins];
                    for (int t = 0; t < flat[0].length; t++) {
                        int bx = (int) ((flat[j][t] - lo[j]) / (hi[j] - lo[j]) * bins);
                        int by = (int) ((flat[i][t] - lo[i]) / (hi[i] - lo[i]) * bins);
                        if (bx >= 0 && bx < bins && by >= 0 && by < bins) {
                            h2[by * bins + bx]++;
                        }
                    }
                    double[] sorted = h2.clone();
                    Arrays.sort(sorted);
                    double total = Arrays.stream(h2).sum(), acc = 0, l68 = 0, l95 = 0;
                    for (int b = sorted.length - 1; b >= 0; b--) {
                        acc += sorted[b];
                        if (acc <= 0.68 * total) {
                            l68 = sorted[b];
                        }
                        if (acc <= 0.95 * total) {
                            l95 = sorted[b];
                        }
                    }
                    int px = (cell - 8) / bins;
                    for (int by = 0; by < bins; by++) {
                        for (int bx = 0; bx < bins; bx++) {
                            double v = h2[by * bins + bx];
                            if (v <= 0) {
                                continue;
                            }
                            g.setColor(v >= l68 && l68 > 0 ? new Color(40, 70, 140) : v >= l95 && l95 > 0
                                    ? new Color(140, 165, 215) : new Color(225, 230, 240));
                            g.fillRect(x0 + 4 + bx * px, y0 + cell - 4 - (by + 1) * px, px, px);
                        }
                    }
                }
            }
        }
        g.setStroke(new BasicStroke(1f));
        g.setColor(Color.BLACK);
        g.drawString("dark: 68 %, light: 95 % of the posterior; axes: 0.5-99.5 percentiles", pad, k * cell + 20);
        g.dispose();
        return out;
    }

    private static String shortName(String key) {
        int i = key.lastIndexOf('.');
        String s = i >= 0 ? key.substring(Math.max(0, key.lastIndexOf('.', i - 1) + 1)) : key;
        return s.length() > 30 ? s.substring(s.length() - 30) : s;
    }
}
