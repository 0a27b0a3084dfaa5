package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Direct checks of the emission slices (interpolated emitters with a cell list) and the emission
 * mask on a spot of particles in rigid circular motion, whose positions and 4-velocities are
 * known in closed form at every time: Kerr metric in Boyer-Lindquist coordinates (Boyer &amp;
 * Lindquist 1967), circular orbits (Bardeen, Press &amp; Teukolsky 1972), the cubic-spline kernel
 * (Monaghan 1992) and the redshift of a photon with p_t = -1 (Cunningham 1975).
 */
class EmissionSliceAndMaskTest {
    private static final double A = 0.5;
    private static final double R0 = 8.0;
    /** Smoothing length h, M (kernel support 2h). */
    private static final double H = 0.3;
    /**
     * Positions and attributes are stored as floats: relative 6e-8 of r = 8 M is 5e-7 M, which moves
     * W by at most |dW/dd| 5e-7 ~ 5e-6 of its peak for h = 0.3 M; 1e-5 of the peak (our choice).
     */
    private static final double FLOAT_STORAGE = 1e-5;
    /** Closed-form quantities in double precision. */
    private static final double CLOSED_FORM = 1e-12;

    private final Spacetime st = LightTestSupport.kerr(A);

    /** Omega of the prograde circular equatorial Kerr orbit, 1 / (r^(3/2) + a) (BPT 1972, eq. 2.16). */
    private static double omega(double r) {
        return 1.0 / (Math.pow(r, 1.5) + A);
    }

    /**
     * u^t of a point at (r, theta) turning with angular velocity w: 1 / sqrt(-(g_tt + 2 g_tphi w + g_phiphi w^2))
     * with the Boyer-Lindquist Kerr metric g_tt = -(1 - 2r/Sigma), g_tphi = -2 a r sin^2/Sigma,
     * g_phiphi = (r^2 + a^2 + 2 a^2 r sin^2 / Sigma) sin^2, Sigma = r^2 + a^2 cos^2 (Boyer &amp; Lindquist 1967).
     */
    private static double ut(double r, double th, double w) {
        double s2 = Math.sin(th) * Math.sin(th);
        double sigma = r * r + A * A * Math.cos(th) * Math.cos(th);
        double gtt = -(1 - 2 * r / sigma);
        double gtp = -2 * A * r * s2 / sigma;
        double gpp = (r * r + A * A + 2 * A * A * r * s2 / sigma) * s2;
        return 1.0 / Math.sqrt(-(gtt + 2 * gtp * w + gpp * w * w));
    }

    /**
     * Cubic-spline kernel W(d, h) = (1 / (pi h^3)) {1 - 3/2 q^2 + 3/4 q^3; 1/4 (2 - q)^3; 0}, q = d/h
     * (Monaghan 1992, ARA&amp;A 30, 543).
     */
    private static double kernel(double d) {
        double q = d / H;
        double c = 1.0 / (Math.PI * H * H * H);
        return q < 1 ? c * (1 - 1.5 * q * q + 0.75 * q * q * q) : q < 2 ? c * 0.25 * Math.pow(2 - q, 3) : 0.0;
    }

    /** Display position of the emitter: x = sqrt(r^2 + a^2) sin(theta) cos(phi), y = ... sin(phi), z = r cos(theta). */
    private static double[] position(double r, double th, double ph) {
        double big = Math.sqrt(r * r + A * A);
        return new double[] {big * Math.sin(th) * Math.cos(ph), big * Math.sin(th) * Math.sin(ph), r * Math.cos(th)};
    }

    private EmissionSlice slice(CircularSpotHistory h, double tau) {
        return EmissionSlice.build(h, st, tau, 2 * H, 0.5 * (h.time(1) - h.time(0)), 100.0);
    }

    private static double emissivity(EmissionSlice s, double[] x, double dtE, double pphi) {
        return s.emissivity(x[0], x[1], x[2], dtE, 0.0, 0.0, pphi, 1.0 / H, Kernel.norm(H), 4 * H * H);
    }

    @Test
    void singleEmitterOnItsOrbitHasTheClosedFormEmissivity() {
        double w = omega(R0);
        double dt = 0.2 / w;   // 0.2 rad of orbit between snapshots
        CircularSpotHistory h = new CircularSpotHistory(st, R0, 0.4, 0.0, 1, 0.0, 10 * dt, 11, 1.0, 1L);
        assertEquals(w, h.omega(), CLOSED_FORM * w, "history's Omega is the BPT 1972 closed form");
        double tau = 3.5 * dt;     // between snapshots: (r, theta, phi) are cubic Hermite interpolated
        EmissionSlice s = slice(h, tau);
        assertEquals(1, s.count);
        double speed = Math.sqrt(R0 * R0 + A * A) * w;
        assertEquals(speed, s.vmax, FLOAT_STORAGE * speed, "speed sqrt(r^2 + a^2) Omega in the equator");
        double[] x = position(R0, 0.5 * Math.PI, 0.4 + w * tau);
        double ut = ut(R0, 0.5 * Math.PI, w);
        double lz = 2.0;
        // emissivity sum: weight / u^t x W(0) x g^(2 + alpha), alpha = 1, g = 1 / (u^t (1 - L Omega)) for p_t = -1
        double g = 1.0 / (ut * (1 - lz * w));
        double expected = kernel(0.0) / ut * g * g * g;
        assertEquals(expected, emissivity(s, x, 0.0, lz), FLOAT_STORAGE * expected, "at the emitter");
        // a sample at t_e = tau + dtE sees the emitter moved along its orbit (first order in dtE)
        double dtE = 0.01 / w;
        double[] moved = position(R0, 0.5 * Math.PI, 0.4 + w * (tau + dtE));
        double chord = 2 * Math.sqrt(R0 * R0 + A * A) * Math.sin(0.005) * Math.sin(0.005);  // second-order offset
        assertEquals(kernel(chord), emissivity(s, moved, dtE, 0.0) * ut * ut * ut * ut, FLOAT_STORAGE * kernel(0));
        // W(h) = W(0) / 4 and nothing beyond the support 2h (Monaghan 1992)
        double[] atH = {x[0], x[1], x[2] + H};
        assertEquals(0.25 * expected, emissivity(s, atH, 0.0, lz), FLOAT_STORAGE * expected);
        double[] beyond = {x[0], x[1], x[2] + 2.001 * H};
        assertEquals(0.0, emissivity(s, beyond, 0.0, lz), 0.0);
        assertNull(slice(h, -1.0), "before the first snapshot");
        assertNull(slice(h, 10 * dt + 1.0), "after the last snapshot");
    }

    @Test
    void cellListSumEqualsTheSumOverEveryParticle() {
        double w = omega(R0);
        double dt = 0.15 / w;
        int n = 400;
        CircularSpotHistory h = new CircularSpotHistory(st, R0, 1.0, 0.6, n, 0.0, 6 * dt, 7, 1.0, 5L);
        double tau = 2.3 * dt;
        EmissionSlice s = slice(h, tau);
        assertEquals(n, s.count);
        Random rng = new Random(9);
        double[] centre = position(R0, 0.5 * Math.PI, 1.0 + w * tau);
        double peak = 0;
        double worst = 0;
        for (int k = 0; k < 200; k++) {
            double[] x = {centre[0] + 2.5 * rng.nextGaussian(), centre[1] + 2.5 * rng.nextGaussian(),
                centre[2] + 1.5 * rng.nextGaussian()};
            double ref = 0;
            for (int p = 0; p < n; p++) {
                double r = h.r(0, p);
                double th = h.theta(0, p);
                // every particle turns rigidly with the centre's Omega: phi(tau) = phi(0) + Omega tau
                double[] xp = position(r, th, h.phi(0, p) + w * tau);
                double ut = ut(r, th, w);
                ref += kernel(Math.sqrt(sq(x[0] - xp[0]) + sq(x[1] - xp[1]) + sq(x[2] - xp[2]))) / Math.pow(ut, 4);
            }
            double got = emissivity(s, x, 0.0, 0.0);
            peak = Math.max(peak, ref);
            worst = Math.max(worst, Math.abs(got - ref));
        }
        assertTrue(peak > 0, "samples reach the spot");
        assertEquals(0.0, worst, FLOAT_STORAGE * peak, "no neighbour missed or counted twice");
    }

    private static double sq(double v) {
        return v * v;
    }

    @Test
    void maskCoversEveryEmitterWithinTheSupportAndLeavesEmptySpaceOut() {
        double w = omega(R0);
        double dt = 0.15 / w;
        CircularSpotHistory h = new CircularSpotHistory(st, R0, 0.0, 0.4, 200, 0.0, 8 * dt, 9, 1.0, 3L);
        double support = 2 * H;
        EmissionMask m = EmissionMask.of(h, A, 12.0, support);
        Random rng = new Random(4);
        double minD = Double.POSITIVE_INFINITY;
        double maxD = 0;
        double maxZ = 0;
        for (int s = 0; s < h.snapshots(); s++) {
            for (int p = 0; p < h.particles(); p++) {
                double[] x = position(h.r(s, p), h.theta(s, p), h.phi(s, p));
                assertTrue(m.occupied(x[0], x[1], x[2]), "emitter " + p + " at snapshot " + s);
                double d = Math.sqrt(x[0] * x[0] + x[1] * x[1] + x[2] * x[2]);
                minD = Math.min(minD, d);
                maxD = Math.max(maxD, d);
                maxZ = Math.max(maxZ, Math.abs(x[2]));
                // the dilation holds the Euclidean ball of the support around each emitter
                double[] u = {rng.nextGaussian(), rng.nextGaussian(), rng.nextGaussian()};
                double norm = Math.sqrt(u[0] * u[0] + u[1] * u[1] + u[2] * u[2]);
                assertTrue(m.occupied(x[0] + support * u[0] / norm, x[1] + support * u[1] / norm,
                        x[2] + support * u[2] / norm), "support around emitter " + p);
            }
        }
        assertTrue(m.innerRadius() <= minD && m.outerRadius() >= maxD && m.maxHeight() >= maxZ, "bounds hold");
        // the spot stays within a few M of the orbit r = 8: the centre and the far side of the box are empty
        assertFalse(m.occupied(0.0, 0.0, 0.0));
        assertFalse(m.occupied(0.0, 0.0, 11.0));
        assertTrue(m.filling() > 0 && m.filling() < 0.5, "filling " + m.filling());
        assertEquals(12.0, m.radius(), 0.0);
        // the same mask on 3 threads (snapshots in chunks): every cell and every bound alike
        EmissionMask m3 = EmissionMask.of(h, A, 12.0, support, 3);
        assertEquals(m.filling(), m3.filling(), 0.0);
        assertEquals(m.innerRadius(), m3.innerRadius(), 0.0);
        assertEquals(m.outerRadius(), m3.outerRadius(), 0.0);
        assertEquals(m.maxHeight(), m3.maxHeight(), 0.0);
        for (double x = -12; x <= 12; x += m.cellSize()) {
            for (double y = -12; y <= 12; y += m.cellSize()) {
                for (double z = -3; z <= 3; z += m.cellSize()) {
                    assertEquals(m.occupied(x, y, z), m3.occupied(x, y, z), "cell at " + x + ", " + y + ", " + z);
                }
            }
        }
    }
}
