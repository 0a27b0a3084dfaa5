package org.spindrift.sim.pipeline;

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
import org.spindrift.shared.colour.ColourRamp;

/** The look shared by the run's figures (XChart): colours, chart style, series, files. */
final class Charts {
    private Charts() {
    }

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

    /** Writes a figure as PNG (panels in rows x cols) and, for one panel, its SVG twin. */
    static void save(FigureFiles files, String name, List<? extends Chart<?, ?>> charts, int rows, int cols)
            throws IOException {
        files.write(name, out -> {
            if (charts.size() == 1) {
                BitmapEncoder.saveBitmap(charts.get(0), out, BitmapEncoder.BitmapFormat.PNG);
            } else {
                BitmapEncoder.saveBitmap(new ArrayList<>(charts), rows, cols, out, BitmapEncoder.BitmapFormat.PNG);
            }
        });
        if (charts.size() == 1) {
            // a vector twin where XChart offers one (single-panel charts)
            files.write(name.replaceFirst("\\.png$", ".svg"), out -> VectorGraphicsEncoder
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

    static XYChart chart(int w, int h, String title, String x, String y) {
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

    static String fmt(double v) {
        return String.format(Locale.ROOT, Math.abs(v) >= 100 ? "%.0f" : Math.abs(v) >= 10 ? "%.1f" : "%.2f", v);
    }

    /**
     * A circle about the origin. XChart draws a line series segment by segment, each starting the
     * dash pattern afresh, so a dashed circle uses segments about one dash period long (a
     * sixteenth of the half-width {@code extent} of the plotted field: about 13 pixels on a
     * 430-pixel panel) and shows dashes; a solid one uses 180 segments.
     */
    static void circle(XYChart c, String name, double radius, Color color, boolean dashed, double extent) {
        if (!(radius > 0) || !Double.isFinite(radius)) {
            return;
        }
        int m = dashed && extent > 0 ? (int) Math.max(13, Math.min(181, Math.ceil(2 * Math.PI * radius / (extent / 16)) + 1))
                : 181;
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
                new float[] {7f, 5f}, 0f) : new BasicStroke(1.5f));
    }

    static void vline(XYChart c, String name, double x, double y0, double y1, Color col) {
        XYSeries s = add(c, name, new double[] {x, x}, new double[] {y0, y1});
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(col);
        s.setLineStyle(new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f));
    }
}
