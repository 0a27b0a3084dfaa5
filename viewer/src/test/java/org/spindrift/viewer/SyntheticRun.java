package org.spindrift.viewer;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Random;
import org.spindrift.shared.Units;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.shared.archive.SnapshotWriter;

/**
 * Writes invented run folders with the shared archive writer, for the viewer's tests and
 * benchmark. Not physics: particles are put on prescribed paths so that the pictures are
 * predictable.
 *
 * <p>Benchmark archives: {@code java -cp ... org.spindrift.viewer.SyntheticRun DIR PARTICLES SNAPSHOTS}.
 */
public final class SyntheticRun {
    private SyntheticRun() {
    }

    /** Synthetic round values, as in every test: 1e6 solar masses at 1 kpc (= 1e-3 Mpc). */
    static final double MASS = 1.0e6;
    static final double DISTANCE = 1.0e-3;

    /**
     * A fixed layout: particle i sits at (x[s][i], y[s][i], 0) in snapshot s (equatorial plane),
     * one source, Schwarzschild landmarks (a = 0: horizon 2 M, ISCO 6 M, ergosurface 2 M at the
     * equator; Schwarzschild 1916 / Bardeen, Press &amp; Teukolsky 1972, values from memory).
     */
    static void writeLayout(Path dir, double[][] x, double[][] y, double[] times) throws IOException {
        writeLayout(dir, x, y, times, 0.0, 0.0);
    }

    /** As {@link #writeLayout(Path, double[][], double[][], double[])} with an observer at (i, PA), degrees. */
    static void writeLayout(Path dir, double[][] x, double[][] y, double[] times, double incl, double pa)
            throws IOException {
        int s = times.length;
        int n = x[0].length;
        RunArchiveWriter w = RunArchiveWriter.create(dir);
        SnapshotWriter sw = new SnapshotWriter(s, new int[n], 1, 0.0, MASS, DISTANCE);
        for (int k = 0; k < s; k++) {
            double[] r = new double[n];
            double[] th = new double[n];
            double[] ph = new double[n];
            double[] ut = new double[n];
            double[] zero = new double[n];
            float[] wt = new float[n];
            double cx = 0;
            double cy = 0;
            for (int i = 0; i < n; i++) {
                r[i] = Math.hypot(x[k][i], y[k][i]);
                th[i] = Math.PI / 2;
                ph[i] = Math.atan2(y[k][i], x[k][i]);
                ut[i] = 1.0 / Math.sqrt(1 - 3 / r[i]); // circular orbit, a = 0 (BPT 1972), for plausible colours
                wt[i] = 1f;
                cx += x[k][i] / n;
                cy += y[k][i] / n;
            }
            sw.add(times[k], r, th, ph, ut, zero, zero, zero, wt, new byte[n], new double[][] {{cx, cy, 0}});
        }
        sw.write(w.folder());
        w.register(ArchiveLayout.SNAPSHOTS);
        w.finish(manifest("layout test (invented)", 0.0, 2.0, 6.0, Double.NaN, 2.0, incl, pa, n, "probe"));
    }

    /**
     * A shearing hot spot: particles on circular equatorial-ish orbits around r0 with the Kerr
     * prograde angular velocity Omega = 1/(r^1.5 + a) (Bardeen, Press &amp; Teukolsky 1972, ApJ 178,
     * 347, eq. 2.16) and u^t of the same orbits (their eqs. 2.12-2.13, from memory), a Gaussian flare.
     */
    public static void writeHotSpot(Path dir, int particles, int snapshots, long seed) throws IOException {
        writeHotSpot(dir, particles, snapshots, seed, false);
    }

    /** @param sky also write invented centroid.csv and images.fits (see {@link SyntheticSky}) */
    public static void writeHotSpot(Path dir, int particles, int snapshots, long seed, boolean sky) throws IOException {
        double a = 0.7;
        double r0 = 8.0;
        double span = 600.0;
        Random rnd = new Random(seed);
        int sources = 2;
        int[] src = new int[particles];
        double[] rr = new double[particles];
        double[] ph0 = new double[particles];
        double[] dth = new double[particles];
        for (int i = 0; i < particles; i++) {
            src[i] = i < particles * 3 / 4 ? 0 : 1;
            double rc = src[i] == 0 ? r0 : 11.0;
            double sig = src[i] == 0 ? 0.6 : 0.9;
            rr[i] = rc + sig * rnd.nextGaussian();
            ph0[i] = (src[i] == 0 ? 0 : Math.PI) + sig / rc * rnd.nextGaussian();
            dth[i] = sig / rc * 0.6 * rnd.nextGaussian();
        }
        RunArchiveWriter w = RunArchiveWriter.create(dir);
        SnapshotWriter sw = new SnapshotWriter(snapshots, src, sources, a, MASS, DISTANCE);
        double[] r = new double[particles];
        double[] th = new double[particles];
        double[] ph = new double[particles];
        double[] ut = new double[particles];
        double[] up = new double[particles];
        double[] zero = new double[particles];
        float[] wt = new float[particles];
        byte[] st = new byte[particles];
        double[] xyz = new double[3];
        double incl = 60.0;
        double pa = 20.0;
        SyntheticSky skyOut = sky ? new SyntheticSky(incl, pa, Units.uasPerM(MASS, DISTANCE),
                Units.timeUnitSeconds(MASS)) : null;
        double[] xs = sky ? new double[particles] : null;
        double[] ys = sky ? new double[particles] : null;
        double[] zs = sky ? new double[particles] : null;
        for (int k = 0; k < snapshots; k++) {
            double t = span * k / Math.max(1, snapshots - 1);
            double[][] c = new double[sources][3];
            int[] count = new int[sources];
            for (int i = 0; i < particles; i++) {
                double om = 1.0 / (Math.pow(rr[i], 1.5) + a); // BPT 1972 eq. 2.16
                r[i] = rr[i];
                th[i] = Math.PI / 2 + dth[i];
                ph[i] = ph0[i] + om * t;
                double sr = Math.sqrt(rr[i]);
                ut[i] = (rr[i] * sr + a) / (Math.pow(rr[i], 0.75) * Math.sqrt(rr[i] * sr - 3 * sr + 2 * a));
                up[i] = om * ut[i];
                double env = Math.exp(-0.5 * Math.pow((t - 250.0) / 120.0, 2));
                wt[i] = (float) (env * Math.exp(-0.5 * Math.pow((rr[i] - r0) / 0.6, 2)));
                st[i] = rr[i] < 2.0 ? ArchiveLayout.CAPTURED : ArchiveLayout.ALIVE;
                ArchiveLayout.cartesian(r[i], th[i], ph[i], a, xyz);
                if (sky) {
                    xs[i] = xyz[0];
                    ys[i] = xyz[1];
                    zs[i] = xyz[2];
                }
                c[src[i]][0] += xyz[0];
                c[src[i]][1] += xyz[1];
                c[src[i]][2] += xyz[2];
                count[src[i]]++;
            }
            for (int j = 0; j < sources; j++) {
                for (int d = 0; d < 3; d++) {
                    c[j][d] /= Math.max(1, count[j]);
                }
            }
            sw.add(t, r, th, ph, ut, zero, zero, up, wt, st, c);
            if (sky) {
                skyOut.add(t, xs, ys, zs, wt, c[0], k % 3 == 0);
            }
        }
        sw.write(w.folder());
        w.register(ArchiveLayout.SNAPSHOTS);
        if (sky) {
            skyOut.write(w);
        }
        // Kerr a = 0.7 landmarks (BPT 1972 closed forms, evaluated from memory): horizon 1 + sqrt(1 - a^2)
        double horizon = 1 + Math.sqrt(1 - a * a);
        w.finish(manifest("synthetic hot spot (invented)", a, horizon, 3.393, Double.NaN, 2.0, incl, pa,
                particles, "spot", "companion"));
    }

    private static ObjectNode manifest(String name, double spin, double horizon, double isco, double omegaMax,
                                       double ergo, double incl, double pa, int n, String... sources) {
        ObjectNode body = RunArchiveWriter.json().createObjectNode();
        body.putObject("scenario").put("name", name);
        body.put("seed", 1);
        body.putObject("black_hole").put("mass_solar", MASS).put("distance_Mpc", DISTANCE).put("family", "kerr")
                .put("spin", spin).putObject("parameters");
        body.putObject("units").put("M_seconds", Units.timeUnitSeconds(MASS))
                .put("M_metres", Units.lengthUnitMetres(MASS)).put("M_uas", Units.uasPerM(MASS, DISTANCE));
        body.putObject("observer").put("inclination_deg", incl).put("position_angle_deg", pa);
        ObjectNode lm = body.putObject("landmarks").put("horizon_outer", horizon).put("isco_prograde", isco)
                .put("ergosurface_equator", ergo);
        if (Double.isFinite(omegaMax)) {
            lm.put("omega_max_radius", omegaMax);
        } else {
            lm.putNull("omega_max_radius");
        }
        ArrayNode arr = body.putArray("sources");
        int per = n / sources.length;
        for (int k = 0; k < sources.length; k++) {
            arr.addObject().put("name", sources[k]).put("kind", "hot_spot").put("particles", per)
                    .put("kept", per).put("first_index", k * per);
        }
        return body;
    }

    public static void main(String[] args) throws IOException {
        if (args.length < 3) {
            System.err.println("usage: SyntheticRun DIR PARTICLES SNAPSHOTS [sky]");
            System.exit(2);
        }
        writeHotSpot(Path.of(args[0]), Integer.parseInt(args[1]), Integer.parseInt(args[2]), 7,
                args.length > 3 && args[3].equals("sky"));
        System.out.println("wrote " + args[0]);
    }
}
