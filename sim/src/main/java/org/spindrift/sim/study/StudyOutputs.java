package org.spindrift.sim.study;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.imageio.ImageIO;
import org.hipparchus.util.FastMath;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.shared.archive.AtomicFiles;

/** The study folder's files: per-cell records, distinguish.csv/json, plots, manifest. */
final class StudyOutputs {
    private StudyOutputs() {
    }

    static ObjectNode cellJson(StudyFile s, CellStudy.Result r, String sha) {
        ObjectNode o = StudyRun.JSON.createObjectNode();
        o.put("study_sha256", sha);
        o.put("cell", r.cell().index());
        o.put("deformation", r.cell().deformation());
        o.put("beam_fwhm_uas", r.cell().beamUas());
        o.put("sigma_uas", r.cell().sigmaUas());
        o.put("epochs", r.epochsMin().length);
        o.put("realisations", r.delta().length);
        o.put("extra_parameters", r.extra());
        o.put("null_on_boundary", r.boundary() ? 1 : 0);
        o.put("expected_delta_chi2", r.expected());
        o.put("expected_sigma", r.expectedSigma());
        o.put("delta_chi2_p16", r.deltaPercentile(16));
        o.put("delta_chi2_p50", r.deltaPercentile(50));
        o.put("delta_chi2_p84", r.deltaPercentile(84));
        o.put("median_sigma", r.medianSigma());
        o.put("model_evaluations", r.evaluations());
        ObjectNode ref = o.putObject("reference");
        for (int i = 0; i < s.free().size(); i++) {
            ObjectNode p = ref.putObject(s.free().get(i).key());
            p.put("truth", r.truthValues()[i]);
            p.put("best_noise_free", r.referenceBest()[i]);
            p.put("pull", r.referenceBest()[i] - r.truthValues()[i]);
            p.put("median_over_realisations", r.referenceMedian()[i]);
        }
        o.set("delta_chi2", StudyRun.array(r.delta()));
        ObjectNode tr = o.putObject("track");
        tr.set("t_obs_min", StudyRun.array(r.epochsMin()));
        tr.set("truth_x_uas", StudyRun.array(r.truthX()));
        tr.set("truth_y_uas", StudyRun.array(r.truthY()));
        tr.set("reference_x_uas", StudyRun.array(r.referenceX()));
        tr.set("reference_y_uas", StudyRun.array(r.referenceY()));
        return o;
    }

    private static final String[] NUMBERS = {"deformation", "beam_fwhm_uas", "sigma_uas", "epochs", "realisations",
        "extra_parameters", "expected_delta_chi2", "expected_sigma", "delta_chi2_p16", "delta_chi2_p50", "delta_chi2_p84",
        "median_sigma", "null_on_boundary"};

    static void write(StudyFile s, Path dir, JsonNode[] cells, String sha) throws IOException {
        Map<String, String> files = new LinkedHashMap<>();
        Path csv = dir.resolve(StudyRun.CSV);
        AtomicFiles.write(csv, tmp -> {
            try (PrintWriter w = StudyRun.writer(tmp)) {
                StringBuilder h = new StringBuilder("cell");
                for (String k : NUMBERS) {
                    h.append(',').append(k);
                }
                for (var f : s.free()) {
                    h.append(",best.").append(f.key()).append(",pull.").append(f.key());
                }
                w.println(h);
                for (JsonNode c : cells) {
                    StringBuilder b = new StringBuilder().append(c.path("cell").asInt());
                    for (String k : NUMBERS) {
                        b.append(',').append(Double.toString(c.path(k).asDouble()));
                    }
                    for (var f : s.free()) {
                        JsonNode p = c.path("reference").path(f.key());
                        b.append(',').append(Double.toString(p.path("best_noise_free").asDouble())).append(',')
                                .append(Double.toString(p.path("pull").asDouble()));
                    }
                    w.println(b);
                }
            }
        });
        files.put(StudyRun.CSV, AtomicFiles.sha256(csv));
        ObjectNode j = StudyRun.JSON.createObjectNode();
        j.put("kind", "study");
        j.put("name", s.name());
        j.put("study_file", s.file().toAbsolutePath().toString());
        j.put("study_sha256", sha);
        j.put("deformation_key", s.deformationKey());
        j.put("reference_deformation", s.referenceValue());
        j.put("model", "fast compact-source model of the fit engine (ray table per spacetime and inclination)");
        j.put("statistic", "Delta chi-square = chi-square(reference best fit) - chi-square(truth family best fit);"
                + " significance: Wilks' theorem with extra_parameters degrees of freedom, or where null_on_boundary is 1"
                + " (the reference deformation on the edge of the family's range) the 50:50 mixture of chi-square with"
                + " extra_parameters - 1 and extra_parameters degrees of freedom; two-sided normal equivalent");
        ArrayNode arr = j.putArray("cells");
        for (JsonNode c : cells) {
            ObjectNode cc = ((ObjectNode) c).deepCopy();
            cc.remove("study_sha256");
            arr.add(cc);
        }
        Path js = dir.resolve(StudyRun.JSON_FILE);
        AtomicFiles.write(js, tmp -> StudyRun.JSON.writeValue(tmp.toFile(), j));
        files.put(StudyRun.JSON_FILE, AtomicFiles.sha256(js));
        Files.createDirectories(dir.resolve("plots"));
        image(dir, "plots/significance_map.png", map(s, cells), files);
        image(dir, "plots/pulls.png", pulls(s, cells), files);
        image(dir, "plots/tracks.png", BitmapEncoder.getBufferedImage(tracks(s, cells)), files);
        for (JsonNode c : cells) {
            String name = StudyRun.CELLS + "/" + StudyRun.cellFile(dir, c.path("cell").asInt()).getFileName();
            files.put(name, AtomicFiles.sha256(dir.resolve(name)));
        }
        ObjectNode m = StudyRun.JSON.createObjectNode();
        m.put("kind", "study");
        m.put("study_name", s.name());
        m.put("cells", cells.length);
        ObjectNode f = m.putObject("files");
        files.forEach(f::put);
        AtomicFiles.write(dir.resolve(StudyRun.MANIFEST), tmp -> StudyRun.JSON.writeValue(tmp.toFile(), m));
    }

    private static void image(Path dir, String name, BufferedImage img, Map<String, String> files) throws IOException {
        Path p = dir.resolve(name);
        AtomicFiles.write(p, tmp -> ImageIO.write(img, "png", tmp.toFile()));
        files.put(name, AtomicFiles.sha256(p));
    }

    private static XYChart chart(String title, String x, String y) {
        XYChart c = new XYChartBuilder().width(640).height(520).title(title).xAxisTitle(x).yAxisTitle(y).build();
        c.getStyler().setChartBackgroundColor(Color.WHITE);
        c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideS);
        c.getStyler().setMarkerSize(8);
        return c;
    }

    /**
     * Significance map, one panel per beam: precision (log) against deformation; cells marked by
     * the median significance over the realisations (below 3, 3 to 5, above 5 sigma), and the 3 and
     * 5 sigma contours of the expected (noise-free) statistic. Since the expected Delta chi-square
     * scales as 1/sigma^2, each deformation's contour precision follows from one cell: the sigma
     * at which Wilks' significance of Delta chi^2(s0) s0^2 / sigma^2 equals 3 (or 5), found by
     * bisection in log sigma.
     */
    static BufferedImage map(StudyFile s, JsonNode[] cells) {
        List<BufferedImage> panels = new ArrayList<>();
        for (double beam : s.beamsUas()) {
            XYChart c = chart("beam FWHM " + beam + " uas", "astrometric one-sigma per epoch (uas, logarithmic)",
                    "deformation " + s.deformationKey());
            // log10(sigma) on a linear axis, labelled in uas: XChart's logarithmic axis labels decades only
            c.getStyler().setxAxisTickLabelsFormattingFunction(v -> String.format(java.util.Locale.ROOT, "%.3g",
                    FastMath.pow(10.0, v)));
            double xLo = Double.POSITIVE_INFINITY, xHi = Double.NEGATIVE_INFINITY;
            List<double[]> groups = List.of(new double[] {0, 3}, new double[] {3, 5}, new double[] {5, Double.POSITIVE_INFINITY});
            String[] labels = {"median < 3 sigma", "3-5 sigma", "> 5 sigma"};
            Color[] colours = {new Color(120, 120, 120), new Color(230, 150, 0), new Color(200, 0, 0)};
            for (int g = 0; g < 3; g++) {
                List<Double> xs = new ArrayList<>(), ys = new ArrayList<>();
                for (JsonNode n : cells) {
                    double sig = n.path("median_sigma").asDouble();
                    if (n.path("beam_fwhm_uas").asDouble() == beam && sig >= groups.get(g)[0] && sig < groups.get(g)[1]) {
                        xs.add(FastMath.log10(n.path("sigma_uas").asDouble()));
                        ys.add(n.path("deformation").asDouble());
                        xLo = FastMath.min(xLo, xs.get(xs.size() - 1));
                        xHi = FastMath.max(xHi, xs.get(xs.size() - 1));
                    }
                }
                if (xs.isEmpty()) {
                    // every panel lists every class, so the panels have equal legends and heights
                    xs.add(Double.NaN);
                    ys.add(Double.NaN);
                }
                XYSeries ser = c.addSeries(labels[g], xs, ys);
                ser.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                ser.setMarker(SeriesMarkers.CIRCLE);
                ser.setMarkerColor(colours[g]);
            }
            for (double level : new double[] {3, 5}) {
                List<Double> xs = new ArrayList<>(), ys = new ArrayList<>();
                for (double d : s.deformations()) {
                    JsonNode n = first(cells, d, beam);
                    if (n == null) {
                        continue;
                    }
                    double at = contour(n.path("expected_delta_chi2").asDouble(), n.path("sigma_uas").asDouble(),
                            n.path("extra_parameters").asInt(), n.path("null_on_boundary").asInt() == 1, level);
                    if (Double.isFinite(at)) {
                        xs.add(FastMath.log10(at));
                        ys.add(d);
                        xLo = FastMath.min(xLo, xs.get(xs.size() - 1));
                        xHi = FastMath.max(xHi, xs.get(xs.size() - 1));
                    }
                }
                if (xs.isEmpty()) {
                    xs.add(Double.NaN);
                    ys.add(Double.NaN);
                }
                XYSeries ser = c.addSeries("expected " + (int) level + " sigma", xs, ys);
                ser.setMarker(SeriesMarkers.DIAMOND);
                ser.setLineColor(level == 3 ? new Color(230, 150, 0) : new Color(200, 0, 0));
                ser.setMarkerColor(level == 3 ? new Color(230, 150, 0) : new Color(200, 0, 0));
            }
            if (xLo <= xHi) {
                double m = FastMath.max(0.1 * (xHi - xLo), 0.1);
                c.getStyler().setXAxisMin(xLo - m).setXAxisMax(xHi + m);
            }
            // the same deformation axis in every panel
            double dLo = java.util.Arrays.stream(s.deformations()).min().orElse(0.0);
            double dHi = java.util.Arrays.stream(s.deformations()).max().orElse(1.0);
            double dm = margin(dLo, dHi, 0.08);
            c.getStyler().setYAxisMin(dLo - dm).setYAxisMax(dHi + dm).setYAxisDecimalPattern("0.###");
            panels.add(BitmapEncoder.getBufferedImage(c));
        }
        return tile(panels);
    }

    private static JsonNode first(JsonNode[] cells, double d, double beam) {
        for (JsonNode n : cells) {
            if (n.path("deformation").asDouble() == d && n.path("beam_fwhm_uas").asDouble() == beam) {
                return n;
            }
        }
        return null;
    }

    /** @return the precision at which the expected statistic reaches the level (NaN when it never does) */
    static double contour(double expected, double sigma0, int k, boolean boundary, double level) {
        if (!(expected > 0)) {
            return Double.NaN;
        }
        double lo = FastMath.log(sigma0) - 30, hi = FastMath.log(sigma0) + 30;
        for (int it = 0; it < 200; it++) {
            double mid = 0.5 * (lo + hi);
            double sg = FastMath.exp(mid);
            double sig = Wilks.sigma(expected * sigma0 * sigma0 / (sg * sg), k, boundary);
            if (sig > level) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return FastMath.exp(0.5 * (lo + hi));
    }

    /** Pull of each reference parameter (noise-free best fit minus truth) against the deformation, one line per beam. */
    static BufferedImage pulls(StudyFile s, JsonNode[] cells) {
        List<BufferedImage> panels = new ArrayList<>();
        for (var f : s.free()) {
            XYChart c = chart("pull of " + f.key(), "deformation " + s.deformationKey(),
                    "best reference - truth" + unitOf(f.key()));
            double lo = 0.0, hi = 0.0;     // zero pull always in view
            for (double beam : s.beamsUas()) {
                List<Double> xs = new ArrayList<>(), ys = new ArrayList<>();
                for (double d : s.deformations()) {
                    JsonNode n = first(cells, d, beam);
                    if (n != null) {
                        xs.add(d);
                        ys.add(n.path("reference").path(f.key()).path("pull").asDouble());
                    }
                }
                XYSeries ser = c.addSeries("beam " + beam + " uas", xs, ys);
                ser.setMarker(SeriesMarkers.CIRCLE);
                lo = FastMath.min(lo, ys.stream().mapToDouble(Double::doubleValue).min().orElse(lo));
                hi = FastMath.max(hi, ys.stream().mapToDouble(Double::doubleValue).max().orElse(hi));
            }
            padded(c, s.deformations(), lo, hi);
            panels.add(BitmapEncoder.getBufferedImage(c));
        }
        return tile(panels);
    }

    /** @return " (unit)" for a key path whose name ends in a unit suffix (_M, _deg, _min, _uas), else "" */
    static String unitOf(String key) {
        for (String[] u : new String[][] {{"_M", "M"}, {"_deg", "deg"}, {"_min", "min"}, {"_uas", "uas"}}) {
            if (key.endsWith(u[0])) {
                return " (" + u[1] + ")";
            }
        }
        return "";
    }

    /**
     * Axis ranges with a margin, also when every value is the same (a single deformation or a zero
     * pull): XChart would otherwise collapse the axis onto one value and print it in full.
     */
    private static void padded(XYChart c, double[] xs, double yLo, double yHi) {
        double xLo = java.util.Arrays.stream(xs).min().orElse(0.0), xHi = java.util.Arrays.stream(xs).max().orElse(1.0);
        double xm = margin(xLo, xHi, 0.08), ym = margin(yLo, yHi, 0.1);
        c.getStyler().setXAxisMin(xLo - xm).setXAxisMax(xHi + xm).setYAxisMin(yLo - ym).setYAxisMax(yHi + ym);
        c.getStyler().setXAxisDecimalPattern("0.###").setYAxisDecimalPattern("0.###");
    }

    /** @return a fraction of the range as axis margin, or half the value (at least 0.5) when the range is empty */
    private static double margin(double lo, double hi, double fraction) {
        return hi > lo ? fraction * (hi - lo) : FastMath.max(0.5 * FastMath.abs(lo), 0.5);
    }

    /** Sky tracks at the epochs of the most deformed cell: truth and the best-fitting reference (noise-free). */
    static XYChart tracks(StudyFile s, JsonNode[] cells) {
        JsonNode best = cells[0];
        for (JsonNode n : cells) {
            if (FastMath.abs(n.path("deformation").asDouble() - s.referenceValue())
                    > FastMath.abs(best.path("deformation").asDouble() - s.referenceValue())) {
                best = n;
            }
        }
        JsonNode t = best.path("track");
        XYChart c = chart("deformation " + best.path("deformation").asDouble() + ": truth vs best reference",
                "east offset (uas, east to the left)", "north offset (uas)");
        XYSeries a = c.addSeries("truth", neg(t.path("truth_x_uas")), vals(t.path("truth_y_uas")));
        a.setMarker(SeriesMarkers.CIRCLE);
        XYSeries b = c.addSeries("best reference", neg(t.path("reference_x_uas")), vals(t.path("reference_y_uas")));
        b.setMarker(SeriesMarkers.DIAMOND);
        XYSeries hole = c.addSeries("black hole", new double[] {0.0}, new double[] {0.0});
        hole.setMarker(SeriesMarkers.CROSS);
        hole.setMarkerColor(Color.BLACK);
        hole.setLineStyle(org.knowm.xchart.style.lines.SeriesLines.NONE);
        // the abscissa is -x so that east is on the left; the tick labels show the true east offset
        c.getStyler().setxAxisTickLabelsFormattingFunction(v -> String.format(java.util.Locale.ROOT, "%.3g",
                v == 0 ? 0.0 : -v));
        double ext = 0.0;
        for (String k : new String[] {"truth_x_uas", "truth_y_uas", "reference_x_uas", "reference_y_uas"}) {
            for (double v : vals(t.path(k))) {
                ext = FastMath.max(ext, FastMath.abs(v));
            }
        }
        ext = ext > 0 ? 1.1 * ext : 1.0;
        // equal scales on both axes (a square field): the sky is not stretched
        c.getStyler().setXAxisMin(-ext).setXAxisMax(ext).setYAxisMin(-ext).setYAxisMax(ext);
        return c;
    }

    private static double[] vals(JsonNode a) {
        double[] v = new double[a.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = a.get(i).asDouble();
        }
        return v;
    }

    private static double[] neg(JsonNode a) {
        double[] v = vals(a);
        for (int i = 0; i < v.length; i++) {
            v[i] = -v[i];
        }
        return v;
    }

    private static BufferedImage tile(List<BufferedImage> panels) {
        int w = panels.get(0).getWidth(), h = panels.get(0).getHeight();
        int cols = FastMath.min(panels.size(), 3), rows = (panels.size() + cols - 1) / cols;
        BufferedImage img = new BufferedImage(cols * w, rows * h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, img.getWidth(), img.getHeight());
        for (int i = 0; i < panels.size(); i++) {
            g.drawImage(panels.get(i), (i % cols) * w, (i / cols) * h, null);
        }
        g.dispose();
        return img;
    }
}
