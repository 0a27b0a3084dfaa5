package org.spindrift.sim.analysis;

import java.awt.Color;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import org.hipparchus.util.FastMath;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.motion.InitialState;
import org.spindrift.sim.motion.OrbitElements;
import org.spindrift.sim.motion.OrbitMeasurement;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * PNG of one orbit in its initial plane: Cartesian positions (display map
 * x = sqrt(r^2+a^2) sin(theta) cos(phi), ...) projected on the plane spanned by the direction
 * to the first periapsis and the initial direction of motion; periapsis passages marked.
 */
public final class OrbitPlot {
    private OrbitPlot() {
    }

    /** Writes the plot to file (via a temporary name, renamed when complete). */
    public static void write(Spacetime st, OrbitElements.Solution sol, OrbitMeasurement.Result m, Path file,
                             String title) throws IOException {
        double a = st.spin();
        InitialState s0 = sol.start();
        // initial direction of motion: dphi/dt and dtheta/dt from Hamilton's equations
        double[] y = {s0.r(), s0.theta(), s0.phi(), s0.pR(), s0.pTheta()};
        double[] dy = new double[5];
        new GeodesicEquations(st).coordinateTime(s0.pT(), s0.pPhi(), y, 0, dy, 0);
        double rho = FastMath.sqrt(s0.r() * s0.r() + a * a);
        double vy = rho * dy[GeodesicEquations.PH];
        double vz = -s0.r() * dy[GeodesicEquations.TH];
        double vn = FastMath.hypot(vy, vz);
        double[] e2 = {0, vy / vn, vz / vn};
        double[][] smp = m.samples();
        double[] xs = new double[smp[0].length + 1];
        double[] ys = new double[smp[0].length + 1];
        project(a, s0.r(), s0.theta(), s0.phi(), e2, xs, ys, 0);
        for (int k = 0; k < smp[0].length; k++) {
            project(a, smp[1][k], smp[2][k], smp[3][k], e2, xs, ys, k + 1);
        }
        double[][] per = m.periapses();
        double[] px = new double[per[0].length];
        double[] py = new double[per[0].length];
        for (int k = 0; k < px.length; k++) {
            project(a, per[1][k], per[2][k], per[3][k], e2, px, py, k);
        }
        XYChart chart = new XYChartBuilder().width(800).height(800).title(title)
                .xAxisTitle("x in orbit plane (M)").yAxisTitle("y in orbit plane (M)").build();
        chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideNE);
        XYSeries orbit = chart.addSeries("orbit", xs, ys);
        orbit.setMarker(SeriesMarkers.NONE);
        orbit.setLineColor(new Color(40, 90, 170));
        orbit.setLineWidth(1f);
        XYSeries peri = chart.addSeries("periapsis passages", px, py);
        peri.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        peri.setMarker(SeriesMarkers.CIRCLE);
        peri.setMarkerColor(new Color(200, 40, 40));
        XYSeries hole = chart.addSeries("centre", new double[] {0}, new double[] {0});
        hole.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        hole.setMarker(SeriesMarkers.DIAMOND);
        hole.setMarkerColor(Color.BLACK);
        double lim = 1.1 * sol.apoapsis();
        chart.getStyler().setXAxisMin(-lim).setXAxisMax(lim).setYAxisMin(-lim).setYAxisMax(lim);
        Path abs = file.toAbsolutePath();
        if (abs.getParent() != null) {
            Files.createDirectories(abs.getParent());
        }
        Path tmp = abs.resolveSibling("." + abs.getFileName() + ".partial.png");
        BitmapEncoder.saveBitmap(chart, tmp.toString(), BitmapEncoder.BitmapFormat.PNG);
        Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    }

    private static void project(double a, double r, double th, double ph, double[] e2, double[] xs, double[] ys,
                                int k) {
        double rho = FastMath.sqrt(r * r + a * a);
        double x = rho * FastMath.sin(th) * FastMath.cos(ph);
        double y = rho * FastMath.sin(th) * FastMath.sin(ph);
        double z = r * FastMath.cos(th);
        xs[k] = x;
        ys[k] = y * e2[1] + z * e2[2];
    }
}
