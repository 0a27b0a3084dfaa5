package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * The peak of a beam-convolved image against closed forms for two point sources and the two
 * limits (wide beam: flux centroid; narrow beam: brightest image). The independent root finder is
 * Hipparchus' BrentSolver on the analytic derivative of the sum of Gaussians.
 */
class BeamAstrometryTest {
    private static final BrentSolver BRENT = new BrentSolver(1e-14, 1e-14);

    /**
     * The sum of two equal Gaussians of standard deviation s whose centres are d apart has a single
     * peak, at the midpoint, for d &lt;= 2 s and two symmetric peaks beyond (common practice, no
     * source: B''(mid) = 0 at d = 2 s).
     */
    @Test
    void equalPairCloserThanTwoSigmaPeaksAtTheMidpoint() {
        double s = 1.3;
        BeamAstrometry beam = new BeamAstrometry(s);
        double[] out = new double[2];
        for (double ratio : new double[] {0.1, 0.8, 1.5, 1.9}) {
            double d = ratio * s;
            // along a slanted line through (0.4, -0.2), so both axes are exercised
            double ux = FastMath.cos(0.7), uy = FastMath.sin(0.7);
            double[] x = {0.4 - 0.5 * d * ux, 0.4 + 0.5 * d * ux};
            double[] y = {-0.2 - 0.5 * d * uy, -0.2 + 0.5 * d * uy};
            assertTrue(beam.peak(x, y, new double[] {2.0, 2.0}, 2, out));
            // near d = 2 s the peak is flat (B'' -> 0), so convergence is slower: a looser tolerance there
            double tol = ratio < 1.8 ? 1e-7 * s : 2e-3 * s;
            assertEquals(0.4, out[0], tol, "d = " + ratio + " s");
            assertEquals(-0.2, out[1], tol, "d = " + ratio + " s");
        }
    }

    /**
     * Beyond d = 2 s the two peaks of equal Gaussians at +-a lie at +-x* with x* = a tanh(a x* / s^2)
     * (setting B'(x) = 0 for B = exp(-(x - a)^2 / 2s^2) + exp(-(x + a)^2 / 2s^2); common practice,
     * no source); x* from Brent's method.
     */
    @Test
    void equalPairFartherThanTwoSigmaPeaksAtTheTanhRoot() {
        double s = 0.5;
        BeamAstrometry beam = new BeamAstrometry(s);
        double[] out = new double[2];
        for (double ratio : new double[] {2.2, 3.0, 6.0}) {
            double a = 0.5 * ratio * s;
            double xs = BRENT.solve(200, x -> x - a * FastMath.tanh(a * x / (s * s)), 1e-9 * a, a);
            assertTrue(beam.peak(new double[] {-a, a}, new double[] {0, 0}, new double[] {1, 1}, 2, out));
            assertEquals(xs, FastMath.abs(out[0]), 1e-7 * s, "d = " + ratio + " s");
            assertEquals(0.0, out[1], 1e-12);
            assertTrue(xs < a && xs > 0.5 * a, "the peaks are pulled towards each other but stay apart: " + xs);
        }
    }

    /**
     * Unequal fluxes: the highest peak is the zero of B'(x) = -sum f_i (x - x_i) / s^2 exp(-(x - x_i)^2
     * / 2s^2) next to the brighter source (found by Brent), which is neither the flux centroid nor
     * the brighter position; with a third, faint point off the axis the peak leaves the axis.
     */
    @Test
    void unequalPairPeakIsTheRootOfTheDerivativeNextToTheBrighter() {
        double s = 1.0;
        BeamAstrometry beam = new BeamAstrometry(s);
        double[] out = new double[2];
        // separated (3 s): two peaks, the higher one near the brighter source at 0
        double[] x = {0.0, 3.0};
        double[] f = {1.0, 0.6};
        double root = BRENT.solve(200, t -> derivative(x, f, s, t), 0.0, 1.0);
        assertTrue(beam.peak(x, new double[] {0, 0}, f, 2, out));
        assertEquals(root, out[0], 1e-7);
        assertTrue(root > 0.0 && root < 0.1, "pulled slightly towards the fainter source: " + root);
        // close (1.5 s): one peak between them, not at the flux centroid
        double[] xc = {0.0, 1.5};
        double[] fc = {1.0, 0.5};
        double rc = BRENT.solve(200, t -> derivative(xc, fc, s, t), 0.0, 1.5);
        assertTrue(beam.peak(xc, new double[] {0, 0}, fc, 2, out));
        assertEquals(rc, out[0], 1e-7);
        assertTrue(FastMath.abs(rc - 0.5) > 0.05, "differs from the flux centroid 0.5: " + rc);
        // a faint third point off the axis moves the peak off the axis
        assertTrue(beam.peak(new double[] {0, 3, 0.5}, new double[] {0, 0, 1}, new double[] {1, 0.6, 0.1}, 3, out));
        assertTrue(out[1] > 1e-3, "north offset " + out[1]);
    }

    private static double derivative(double[] x, double[] f, double s, double t) {
        double d = 0;
        for (int i = 0; i < x.length; i++) {
            d -= f[i] * (t - x[i]) / (s * s) * FastMath.exp(-(t - x[i]) * (t - x[i]) / (2 * s * s));
        }
        return d;
    }

    /**
     * Limits: a beam 1000 times wider than the structure peaks at the flux centroid (the convolved
     * image is one broad Gaussian about it; the offset is of order r^3 / s^2); one 1000 times narrower
     * than the separations peaks on the brightest point (common practice, no source).
     */
    @Test
    void wideBeamGivesTheFluxCentroidNarrowBeamTheBrightestImage() {
        double[] x = {0.3, -0.8, 0.1, 0.9, -0.4};
        double[] y = {0.2, 0.5, -0.7, -0.1, 0.0};
        double[] f = {1.0, 0.4, 2.5, 0.7, 1.6};
        double ft = 0, cx = 0, cy = 0;
        for (int i = 0; i < x.length; i++) {
            ft += f[i];
            cx += f[i] * x[i];
            cy += f[i] * y[i];
        }
        double[] out = new double[2];
        new BeamAstrometry(1000.0).peak(x, y, f, x.length, out);
        assertEquals(cx / ft, out[0], 1e-5);
        assertEquals(cy / ft, out[1], 1e-5);
        new BeamAstrometry(1e-3).peak(x, y, f, x.length, out);
        assertEquals(0.1, out[0], 1e-12);
        assertEquals(-0.7, out[1], 1e-12);
        // a bright point far from the centroid still wins for a narrow beam
        double[] f2 = f.clone();
        f2[1] = 5.0;
        new BeamAstrometry(0.05).peak(x, y, f2, x.length, out);
        assertEquals(-0.8, out[0], 1e-9);
        assertEquals(0.5, out[1], 1e-9);
    }

    /**
     * Pixel images: a single lit pixel and a steady point source of the same flux at the origin,
     * closer than two beam sigmas, peak at their midpoint; with the steady source three times
     * brighter and 3 sigma away, the peak is the derivative's root next to the origin. Pixel
     * centres follow the camera's sky offsets (east to the left).
     */
    @Test
    void pixelImageWithSteadySource() {
        Camera cam = new Camera(30, 0, 10.0, 20, 1000.0);
        int n = cam.pixels();
        float[] img = new float[n * n];
        int row = 13, col = 4;
        img[row * n + col] = 2.0f;
        double ex = cam.skyX(col), ny = cam.skyY(row);
        double dist = FastMath.hypot(ex, ny);
        double[] out = new double[2];
        BeamAstrometry wide = new BeamAstrometry(0.6 * dist);
        assertTrue(wide.peak(img, cam, 2.0, out));
        assertEquals(0.5 * ex, out[0], 1e-7 * dist);
        assertEquals(0.5 * ny, out[1], 1e-7 * dist);
        double s = dist / 3.0;
        BeamAstrometry narrow = new BeamAstrometry(s);
        assertTrue(narrow.peak(img, cam, 6.0, out));
        double root = BRENT.solve(200, t -> derivative(new double[] {0, dist}, new double[] {6.0, 2.0}, s, t), 0, s);
        assertEquals(root * ex / dist, out[0], 1e-7 * dist);
        assertEquals(root * ny / dist, out[1], 1e-7 * dist);
        assertFalse(narrow.peak(new float[n * n], cam, 0.0, out), "no flux: no position");
        assertTrue(Double.isNaN(out[0]));
    }
    /**
     * The light stage's beam positions: a frame of a few lit pixels with a steady source of the
     * same flux (flux units: intensity sum times pixel area). A beam 1000 times the field gives the
     * flux-weighted centroid with the steady source, F c / (F + F_s) (common practice, no source);
     * a narrow beam gives the brightest pixel, since the steady source is fainter than it.
     */
    @Test
    void lightStageBeamPeaksMatchTheLimits() {
        Camera cam = new Camera(30, 0, 12.0, 16, 1000.0);
        int n = cam.pixels();
        float[] img = new float[n * n];
        img[3 * n + 4] = 1.0f;
        img[3 * n + 5] = 3.0f;
        img[10 * n + 12] = 2.0f;
        FrameMoments m = FrameMoments.of(img, cam);
        double fs = 0.4 * m.flux();
        double[] sx = new double[1], sy = new double[1];
        LightStage.withSteadySource(new double[] {m.flux()}, new double[] {m.x()}, new double[] {m.y()}, fs, sx, sy);
        double[] x = new double[2], y = new double[2];
        LightStage.beamPeaks(new float[][] {img, new float[n * n]}, cam, 1000 * cam.fieldOfView(), fs, x, y);
        assertEquals(sx[0], x[0], 1e-6 * cam.pixelSize());
        assertEquals(sy[0], y[0], 1e-6 * cam.pixelSize());
        assertEquals(0.0, x[1], 1e-12, "a frame without flare flux: the steady source at the hole");
        LightStage.beamPeaks(new float[][] {img}, cam, 0.05 * cam.pixelSize(), fs, x, y);
        assertEquals(cam.skyX(5), x[0], 1e-12);
        assertEquals(cam.skyY(3), y[0], 1e-12);
        // frames on 1 and 3 threads (chunks of frames, one search each): the same positions bit for bit
        java.util.Random rng = new java.util.Random(8);
        float[][] frames = new float[40][n * n];
        for (float[] f : frames) {
            for (int k = 0; k < 6; k++) {
                f[rng.nextInt(n * n)] = (float) rng.nextDouble();
            }
        }
        double[] x1 = new double[40], y1 = new double[40], x3 = new double[40], y3 = new double[40];
        LightStage.beamPeaks(frames, cam, 2 * cam.pixelSize(), fs, x1, y1, 1);
        LightStage.beamPeaks(frames, cam, 2 * cam.pixelSize(), fs, x3, y3, 3);
        assertArrayEquals(x1, x3);
        assertArrayEquals(y1, y3);
    }
}
