package org.spindrift.sim.light;

import java.util.Arrays;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Accuracy of a ray-tracing set-up against a reference set-up on the same camera: for every
 * k-th pixel centre both trace the ray, densely sampled, and the first {@link #CROSSINGS}
 * crossings of the equatorial plane inside the emission radius are compared: the crossing point
 * (Cartesian, M), the delay there (M), and the redshift factor g = 1 / (u^t (1 - Omega L)) that a
 * prograde circular equatorial orbit at the crossing radius would give (photon p_t = -1; the
 * orbit from {@link CircularOrbits}; only outside a given radius). Where a crossing point moves
 * by dx on the equator, its image moves on the screen by dx divided by the local stretch of the
 * screen-to-equator map, which is at least about 1 for the direct image (foreshortening and
 * lensing stretch it) and large for higher-order images: dx bounds the image-position error.
 * Rays whose crossings differ in number (at the capture boundary) are counted, not compared.
 */
public final class RayAccuracy {
    /** Equatorial crossings compared per ray (direct and first higher-order image). */
    public static final int CROSSINGS = 2;
    /** Sample spacing of the dense sampling, M: linear interpolation between samples errs by ~ (ds)^2 / (8 r). */
    private static final double SPACING = 0.01;

    /**
     * Differences at the n-th crossing (0: direct image, 1: the next one) over all compared rays:
     * maximum and 99th percentile.
     */
    public record Result(int rays, int mismatched, int[] crossings, double[] positionMax, double[] position99,
                         double[] delayMax, double[] delay99, double[] redshiftMax, double[] redshift99) {
    }

    private RayAccuracy() {
    }

    /**
     * @param test the settings compared (tolerance, path); its mask is ignored
     * @param reference the reference settings (for example the general path at a tight tolerance)
     * @param every every k-th pixel in both directions
     * @param gMinRadius g is compared only where the crossing radius is at least this (for example
     *     the ISCO: closer in, circular orbits are unstable and g of one falls steeply to zero at the
     *     photon orbit, so tiny position errors give large relative g errors that no gas shows)
     */
    public static Result compare(Spacetime st, Camera cam, TraceSettings test, TraceSettings reference, int every,
                                 double gMinRadius) {
        int n = cam.pixels();
        double rEm = test.emissionRadius();
        TraceSettings a = dense(test);
        TraceSettings b = dense(reference);
        RayTracer ta = new RayTracer(st, a);
        RayTracer tb = new RayTracer(st, b);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        double[] p = new double[6];
        double offset = RayTracer.delayOffset(cam.distance());
        SampleBuffer ba = new SampleBuffer(4096);
        SampleBuffer bb = new SampleBuffer(4096);
        double[] ca = new double[4 * CROSSINGS];
        double[] cb = new double[4 * CROSSINGS];
        int m = (n + every - 1) / every;
        double[][] dPos = new double[CROSSINGS][m * m];
        double[][] dDel = new double[CROSSINGS][m * m];
        double[][] dG = new double[CROSSINGS][m * m];
        int[] count = new int[CROSSINGS];
        int mismatched = 0, rays = 0;
        for (int row = every / 2; row < n; row += every) {
            for (int col = every / 2; col < n; col += every) {
                double al = cam.alpha(cam.skyX(col), cam.skyY(row));
                double be = cam.beta(cam.skyX(col), cam.skyY(row));
                cam.startPoint(al, be, p);
                double l = Camera.initialState(st, p[0], p[1], p[2], p[3], p[4], p[5], y0, g);
                ba.size = 0;
                bb.size = 0;
                ta.trace(y0, l, offset, ba);
                tb.trace(y0, l, offset, bb);
                rays++;
                int na = crossings(ba, rEm, ca);
                int nb = crossings(bb, rEm, cb);
                if (na != nb) {
                    mismatched++;
                }
                for (int c = 0; c < FastMath.min(na, nb); c++) {
                    int i = count[c]++;
                    double dx = ca[4 * c] - cb[4 * c], dy = ca[4 * c + 1] - cb[4 * c + 1];
                    dPos[c][i] = FastMath.sqrt(dx * dx + dy * dy);
                    dDel[c][i] = FastMath.abs(ca[4 * c + 2] - cb[4 * c + 2]);
                    double gb = redshift(st, cb[4 * c], cb[4 * c + 1], l);
                    double ga = redshift(st, ca[4 * c], ca[4 * c + 1], l);
                    boolean inside = FastMath.hypot(cb[4 * c], cb[4 * c + 1]) < gMinRadius;
                    dG[c][i] = !inside && Double.isFinite(ga) && Double.isFinite(gb) ? FastMath.abs(ga / gb - 1.0) : 0.0;
                }
            }
        }
        double[][] out = new double[6][CROSSINGS];
        for (int c = 0; c < CROSSINGS; c++) {
            out[0][c] = max(dPos[c], count[c]);
            out[1][c] = quantile(dPos[c], count[c], 0.99);
            out[2][c] = max(dDel[c], count[c]);
            out[3][c] = quantile(dDel[c], count[c], 0.99);
            out[4][c] = max(dG[c], count[c]);
            out[5][c] = quantile(dG[c], count[c], 0.99);
        }
        return new Result(rays, mismatched, count, out[0], out[1], out[2], out[3], out[4], out[5]);
    }

    private static TraceSettings dense(TraceSettings s) {
        return new TraceSettings(s.emissionRadius(), s.captureRadius(), s.endRadius(), SPACING, s.relativeTolerance(),
                s.absoluteTolerance(), s.maxSteps(), true, null, s.generalPath());
    }

    /** Equatorial crossings (x, y, delay, unused) by linear interpolation between samples; @return how many */
    private static int crossings(SampleBuffer b, double rEm, double[] out) {
        int c = 0;
        for (int i = 1; i < b.size && c < CROSSINGS; i++) {
            if ((b.z[i - 1] > 0) != (b.z[i] > 0)) {
                double f = b.z[i - 1] / (b.z[i - 1] - b.z[i]);
                double x = b.x[i - 1] + f * (b.x[i] - b.x[i - 1]);
                double y = b.y[i - 1] + f * (b.y[i] - b.y[i - 1]);
                if (FastMath.hypot(x, y) < rEm) {
                    out[4 * c] = x;
                    out[4 * c + 1] = y;
                    out[4 * c + 2] = b.delay[i - 1] + f * (b.delay[i] - b.delay[i - 1]);
                    c++;
                }
            }
        }
        return c;
    }

    /** g of a prograde circular equatorial orbit at the point (x, y) for a photon with p_t = -1, p_phi = L. */
    private static double redshift(Spacetime st, double x, double y, double l) {
        double rho = FastMath.hypot(x, y);
        double r = FastMath.sqrt(FastMath.max(0.0, rho * rho - st.spin() * st.spin()));
        double om = CircularOrbits.omega(st, r, true);
        double ut = CircularOrbits.ut(st, r, true);
        // -p.u = u^t (E - Omega L) with E = 1 (Cunningham & Bardeen 1973, ApJ 183, 237)
        return 1.0 / (ut * (1.0 - om * l));
    }

    private static double max(double[] v, int n) {
        double m = 0;
        for (int i = 0; i < n; i++) {
            m = FastMath.max(m, v[i]);
        }
        return m;
    }

    private static double quantile(double[] v, int n, double q) {
        if (n == 0) {
            return 0.0;
        }
        double[] s = Arrays.copyOf(v, n);
        Arrays.sort(s);
        return s[(int) FastMath.floor(q * (n - 1))];
    }
}
