package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.hipparchus.analysis.integration.SimpsonIntegrator;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.Coordinates;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The gridded emission of a slice: cloud-in-cell deposit and trilinear read (Hockney &amp;
 * Eastwood 1988, Computer Simulation Using Particles, ch. 5), the mean-velocity redshift, and the
 * gridded renderer against the particle renderer.
 */
class GriddedEmissionTest {
    /** Eight products per particle, each rounded once: relative rounding of the sum of 1000 deposits. */
    private static final double SUM_ROUNDING = 1e-13;
    /** A handful of products and sums of O(1) numbers: rounding only. */
    private static final double KERNEL_ROUNDING = 1e-12;
    /** Averaging identical 4-velocities: rounding only. */
    private static final double SAME_G = 1e-12;
    /** Simpson quadrature of piecewise polynomials held to 1e-12 relative on each smooth piece. */
    private static final double QUADRATURE = 1e-9;

    /**
     * The deposit conserves the total weight: exactly for positions and weights on a dyadic lattice
     * (every product exact), to rounding for random ones (partition of unity of the tents; Hockney
     * &amp; Eastwood 1988, sect. 5-2; common practice, no source for the tolerance).
     */
    @Test
    void depositConservesTheTotalWeight() {
        Random rnd = new Random(11L);
        GriddedEmission g = new GriddedEmission();
        g.begin(0.25, -2.0, -2.0, -1.0, 2.0, 2.0, 1.0);
        double exact = 0;
        for (int p = 0; p < 1000; p++) {
            // positions on multiples of h / 64 and weights on multiples of 1/16: all products exact
            double x = -2.0 + rnd.nextInt(4 * 4 * 64) * 0.25 / 64, y = -2.0 + rnd.nextInt(4 * 4 * 64) * 0.25 / 64;
            double z = -1.0 + rnd.nextInt(2 * 4 * 64) * 0.25 / 64;
            double w = (1 + rnd.nextInt(64)) / 16.0;
            g.deposit(x, y, z, 0, 0, 0, w, 1, 0, 0, 0, 3.0);
            exact += w;
        }
        assertEquals(exact, g.totalWeight(), 0.0, "dyadic positions and weights: exact");
        g.begin(0.3, -2.0, -2.0, -1.0, 2.0, 2.0, 1.0);
        double sum = 0;
        for (int p = 0; p < 1000; p++) {
            double w = rnd.nextDouble();
            g.deposit(-2 + 4 * rnd.nextDouble(), -2 + 4 * rnd.nextDouble(), -1 + 2 * rnd.nextDouble(), 0, 0, 0, w, 1,
                    0, 0, 0, 3.0);
            sum += w;
        }
        assertEquals(sum, g.totalWeight(), SUM_ROUNDING * sum, "random positions and weights: to rounding");
    }

    /**
     * One particle read back at random points: the tensor product over the axes of
     * sum_n Lambda((x - x_n)/h) Lambda((x_p - x_n)/h) / h with the tent Lambda(u) = max(0, 1 - |u|)
     * (CIC assignment followed by CIC interpolation, Hockney &amp; Eastwood 1988, sect. 5-2 and 5-3),
     * written out here from the node positions.
     */
    @Test
    void singleParticleGivesTheTentProductKernel() {
        Random rnd = new Random(5L);
        double h = 0.4, ox = -1.0, oy = -0.6, oz = -0.8;
        GriddedEmission g = new GriddedEmission();
        double[] work = new double[GriddedEmission.NV];
        for (int trial = 0; trial < 20; trial++) {
            double px = ox + 1.6 * rnd.nextDouble(), py = oy + 1.2 * rnd.nextDouble(), pz = oz + 1.6 * rnd.nextDouble();
            double w = 0.5 + rnd.nextDouble();
            g.begin(h, ox, oy, oz, ox + 1.6, oy + 1.2, oz + 1.6);
            g.deposit(px, py, pz, 0, 0, 0, w, 1, 0, 0, 0, 3.0);
            for (int k = 0; k < 50; k++) {
                double x = px + 5 * h * (rnd.nextDouble() - 0.5), y = py + 5 * h * (rnd.nextDouble() - 0.5);
                double z = pz + 5 * h * (rnd.nextDouble() - 0.5);
                double expected = w * axis(x, px, ox, h) * axis(y, py, oy, h) * axis(z, pz, oz, h);
                assertEquals(expected, g.density(x, y, z, work), KERNEL_ROUNDING * w / (h * h * h),
                        "density at trial " + trial + ", point " + k);
            }
        }
    }

    /** sum over the nodes n of Lambda((x - x_n)/h) Lambda((p - x_n)/h) / h, nodes at o + n h. */
    private static double axis(double x, double p, double o, double h) {
        double s = 0;
        for (int n = -2; n < 20; n++) {
            double xn = o + n * h;
            s += FastMath.max(0, 1 - FastMath.abs(x - xn) / h) * FastMath.max(0, 1 - FastMath.abs(p - xn) / h);
        }
        return s / h;
    }

    /**
     * Averaged over the particle's offset from the nodes, the deposit-and-read kernel along one axis
     * is the tent convolved with itself: the cubic B-spline B(u) = 2/3 - u^2 + |u|^3 / 2 for |u| &lt; 1,
     * (2 - |u|)^3 / 6 for 1 &lt;= |u| &lt; 2, divided by h (Hockney &amp; Eastwood 1988, sect. 5-3;
     * de Boor 1978, A Practical Guide to Splines, ch. IX), whose second moment is h^2 / 3 against
     * 0.3 h^2 per axis for the cubic-spline kernel of {@link Kernel} (quadrature by Hipparchus'
     * Simpson integrator over the offset).
     */
    @Test
    void offsetAveragedKernelIsTheCubicBSpline() {
        double h = 0.5, o = 0.0;
        GriddedEmission g = new GriddedEmission();
        double[] work = new double[GriddedEmission.NV];
        SimpsonIntegrator simpson = new SimpsonIntegrator(1e-12, 1e-14, 3, 30);
        for (double u : new double[] {0.0, 0.3, 0.77, 1.0, 1.4, 1.9, 2.2}) {
            // particle at o + (4 + s) h, s in [0, 1): read at a distance u h along x (y and z on the
            // particle, whose factors ((1 - s)^2 + s^2) / h each are divided out exactly); the integrand
            // is a polynomial in s on each side of the offset where the read point crosses a node
            org.hipparchus.analysis.UnivariateFunction kx = s -> {
                double p = o + (4 + s) * h;
                g.begin(h, o, o, o, o + 10 * h, o + 10 * h, o + 10 * h);
                g.deposit(p, p, p, 0, 0, 0, 1.0, 1, 0, 0, 0, 3.0);
                double f = ((1 - s) * (1 - s) + s * s) / h;
                return g.density(p + u * h, p, p, work) / (f * f);
            };
            double b = Math.ceil(u) - u;
            double avg = b > 0 && b < 1 ? simpson.integrate(1_000_000, kx, 0, b) + simpson.integrate(1_000_000, kx, b, 1)
                    : simpson.integrate(1_000_000, kx, 0, 1);
            double a = Math.abs(u);
            double bspline = a < 1 ? 2.0 / 3 - a * a + a * a * a / 2 : a < 2 ? (2 - a) * (2 - a) * (2 - a) / 6 : 0.0;
            assertEquals(bspline / h, avg, QUADRATURE / h, "offset-averaged kernel at u = " + u);
        }
    }

    /**
     * A cloud whose particles all move with one 4-velocity gives, at a sample inside it, the redshift
     * g = 1 / (-p_mu u^mu) of that velocity (Cunningham &amp; Bardeen 1973, ApJ 183, 237), the factor
     * the particle renderer applies to each particle: averaging equal vectors changes nothing and
     * their variance vanishes. The particles lie on a circle of constant r in the equatorial
     * plane, the sample on the same circle.
     */
    @Test
    void uniformVelocityCloudGivesTheParticlesRedshift() {
        double a = 0.5, r = 8.0, th = 0.5 * Math.PI;
        Spacetime st = LightTestSupport.kerr(a);
        double[] gm = new double[Spacetime.SIZE];
        st.covariant(r, th, gm);
        double ur = 0.01, uth = 0.002, uph = 0.03;
        // u^t from g_tt ut^2 + 2 g_tphi ut uphi + (g_phiphi uphi^2 + g_rr ur^2 + g_thth uth^2) = -1
        double qa = gm[Spacetime.TT], qb = 2 * gm[Spacetime.TP] * uph;
        double qc = gm[Spacetime.PP] * uph * uph + gm[Spacetime.RR] * ur * ur + gm[Spacetime.HH] * uth * uth + 1;
        double ut = (-qb - Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa);
        assertTrue(ut > 1, "future-pointing u^t: " + ut);
        GriddedEmission g = new GriddedEmission();
        double[] xyz = new double[3];
        double big = Math.sqrt(r * r + a * a);
        g.begin(0.2, -big, -big, -0.1, big, big, 0.1);
        Random rnd = new Random(3L);
        for (int p = 0; p < 4000; p++) {
            Coordinates.cartesian(r, th, 2 * Math.PI * rnd.nextDouble(), a, xyz);
            g.deposit(xyz[0], xyz[1], xyz[2], 0, 0, 0, 0.5 + rnd.nextDouble(), ut, ur, uth, uph, 3.0);
        }
        GriddedEmission.Scratch sc = new GriddedEmission.Scratch();
        double[] work = new double[GriddedEmission.NV];
        int seen = 0;
        for (int k = 0; k < 20; k++) {
            Coordinates.cartesian(r, th, 2 * Math.PI * rnd.nextDouble(), a, xyz);
            double pr = 0.5 * (rnd.nextDouble() - 0.5), pth = 2 * (rnd.nextDouble() - 0.5), pph = 4 * (rnd.nextDouble() - 0.5);
            double expected = Redshift.g(pr, pth, pph, ut, ur, uth, uph);
            double rho = g.density(xyz[0], xyz[1], xyz[2], work);
            double e = g.emissivity(xyz[0], xyz[1], xyz[2], 0.0, pr, pth, pph, sc);
            if (rho > 0 && expected > 0) {
                seen++;
                assertEquals(expected, Math.cbrt(e / rho), SAME_G * expected, "g at sample " + k);
            }
        }
        assertTrue(seen >= 15, "samples inside the cloud: " + seen);
    }

    /**
     * Two velocities u0 + du and u0 - du in equal pairs at each place: the gridded value of the
     * mean of g^3 = D^-3 (D = -p.u) is the second-order expansion mean^-3 (1 + 6 var / mean^2) about
     * the mean D, whose error is the next even term, 15 (dD / D)^4 relative (Taylor series of
     * D^-3; common practice, no source); g^3 of the mean velocity alone is off by 6 (dD / D)^2.
     */
    @Test
    void velocitySpreadIsCarriedToSecondOrder() {
        GriddedEmission g = new GriddedEmission();
        g.begin(0.25, -1, -1, -1, 1, 1, 1);
        double[] u0 = {1.3, 0.1, -0.02, 0.05}, du = {0.02, 0.03, 0.004, -0.006};
        Random rnd = new Random(9L);
        for (int p = 0; p < 500; p++) {
            double x = 2 * rnd.nextDouble() - 1, y = 2 * rnd.nextDouble() - 1, z = 2 * rnd.nextDouble() - 1;
            for (int sgn = -1; sgn <= 1; sgn += 2) {
                g.deposit(x, y, z, 0, 0, 0, 1.0, u0[0] + sgn * du[0], u0[1] + sgn * du[1], u0[2] + sgn * du[2],
                        u0[3] + sgn * du[3], 3.0);
            }
        }
        GriddedEmission.Scratch sc = new GriddedEmission.Scratch();
        double[] work = new double[GriddedEmission.NV];
        double pr = 0.4, pth = -1.5, pph = 2.5;
        double d1 = Redshift.inverse(pr, pth, pph, u0[0] + du[0], u0[1] + du[1], u0[2] + du[2], u0[3] + du[3]);
        double d2 = Redshift.inverse(pr, pth, pph, u0[0] - du[0], u0[1] - du[1], u0[2] - du[2], u0[3] - du[3]);
        double d0 = 0.5 * (d1 + d2), dd = 0.5 * Math.abs(d1 - d2) / d0;
        double exact = 0.5 * (Math.pow(d1, -3) + Math.pow(d2, -3));
        assertTrue(6 * dd * dd > 1e-3, "the spread matters at first order: " + dd);
        for (int k = 0; k < 10; k++) {
            double x = 1.6 * rnd.nextDouble() - 0.8, y = 1.6 * rnd.nextDouble() - 0.8, z = 1.6 * rnd.nextDouble() - 0.8;
            double mean3 = g.emissivity(x, y, z, 0.0, pr, pth, pph, sc) / g.density(x, y, z, work);
            assertEquals(exact, mean3, 2 * 15 * Math.pow(dd, 4) * exact, "mean of g^3 at point " + k);
            assertTrue(Math.abs(Math.pow(d0, -3) - exact) > 0.5 * 6 * dd * dd * exact, "without the spread term");
        }
    }

    /**
     * Frames of a spot (a = 0.5, i = 60 deg, 48 x 48) from the gridded renderer: the same bit for bit
     * on 1 and 2 threads, and within a few per cent of the particle renderer in flux and in centroid
     * (relative to the track's extent): both estimate the same emission with kernels of the same
     * width (measured differences about 1 % and 2 %; the bounds are the tolerances the light tests
     * use for steady flux, common practice, no source).
     */
    @Test
    void gridFramesAreThreadIndependentAndCloseToTheParticleFrames() {
        int frames = 8;
        LightTestSupport.SpotScene sc = LightTestSupport.SpotScene.of(1.0, frames);
        Camera cam = sc.camera();
        float[][] g1, g2, pa;
        try (EmissionRenderer r1 = sc.renderer(1, false, true);
             EmissionRenderer r2 = sc.renderer(2, false, true);
             EmissionRenderer rp = sc.renderer(2, false, false)) {
            g1 = sc.frames(r1);
            g2 = sc.frames(r2);
            pa = sc.frames(rp);
        }
        double peak = 0, xs = 0, ys = 0;
        FrameMoments[] mp = new FrameMoments[frames];
        for (int f = 0; f < frames; f++) {
            assertArrayEquals(g1[f], g2[f], "frame " + f + " independent of the thread count");
            mp[f] = FrameMoments.of(pa[f], cam);
            peak = Math.max(peak, mp[f].flux());
            xs += mp[f].x() / frames;
            ys += mp[f].y() / frames;
        }
        double track = 0;
        for (int f = 0; f < frames; f++) {
            track = Math.max(track, Math.hypot(mp[f].x() - xs, mp[f].y() - ys));
        }
        assertTrue(peak > 0 && track > 1.0, "the spot is seen and moves: track " + track);
        for (int f = 0; f < frames; f++) {
            FrameMoments mg = FrameMoments.of(g1[f], cam);
            assertEquals(mp[f].flux(), mg.flux(), HistoryEmittersTest.STEADY_TOLERANCE * 3 * mp[f].flux(),
                    "flux of frame " + f);
            assertEquals(0.0, Math.hypot(mg.x() - mp[f].x(), mg.y() - mp[f].y()),
                    HistoryEmittersTest.STEADY_TOLERANCE * 3 * track, "centroid of frame " + f);
        }
    }
}
