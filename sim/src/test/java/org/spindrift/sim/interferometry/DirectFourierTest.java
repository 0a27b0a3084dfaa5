package org.spindrift.sim.interferometry;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import org.hipparchus.special.BesselJ;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * Visibilities of simple images against their analytic Fourier transforms (Bracewell 2000, The
 * Fourier Transform and its Applications, 3rd ed.: shift theorem, Gaussian pair, the Hankel
 * transform of a ring; Thompson, Moran &amp; Swenson 2017, ch. 3 sign convention
 * V = sum I exp(-2 pi i (u x + v y))).
 */
class DirectFourierTest {
    /** Pixel size of the synthetic grids, rad (about 2 micro-arcseconds). */
    static final double PIX = 1.0e-11;

    /** Odd grid: pixel (n-1)/2 sits at x = 0; x grows with the column, y with the row. */
    static DirectFourier grid(int n) {
        double c = -(n - 1) / 2.0 * PIX;
        return new DirectFourier(n, c, PIX, c, PIX, 1.0);
    }

    /** (u, v) points on a spiral up to qmax (wavelengths), several position angles. */
    static double[][] spiral(int count, double qmax) {
        double[] u = new double[count], v = new double[count];
        for (int k = 0; k < count; k++) {
            double q = qmax * (k + 1) / count;
            double a = 2.4 * k;
            u[k] = q * FastMath.cos(a);
            v[k] = q * FastMath.sin(a);
        }
        return new double[][] {u, v};
    }

    static double[][] transform(DirectFourier ft, float[] img, double[][] uv) {
        int m = uv[0].length;
        double[] re = new double[m], im = new double[m];
        ft.transform(img, uv[0], uv[1], 0, m, re, im);
        return new double[][] {re, im};
    }

    @Test void pointAtTheOriginHasVisibilityEqualToItsFlux() {
        int n = 33;
        float[] img = new float[n * n];
        img[16 * n + 16] = 2.5f;
        double[][] uv = spiral(37, 0.45 / PIX);
        double[][] vis = transform(grid(n), img, uv);
        for (int k = 0; k < uv[0].length; k++) {
            assertEquals(2.5, vis[0][k], 1e-12, "Re V = flux");
            assertEquals(0.0, vis[1][k], 1e-12, "Im V = 0");
        }
    }

    @Test void offsetPointFollowsTheShiftTheorem() {
        // point at (x, y) = (+7, -4) pixels: V = F exp(-2 pi i (u x + v y)) (Bracewell 2000, shift theorem)
        int n = 33;
        float[] img = new float[n * n];
        img[(16 - 4) * n + 16 + 7] = 1.0f;
        double x = 7 * PIX, y = -4 * PIX;
        double[][] uv = spiral(41, 0.45 / PIX);
        double[][] vis = transform(grid(n), img, uv);
        for (int k = 0; k < uv[0].length; k++) {
            double ph = -2 * FastMath.PI * (uv[0][k] * x + uv[1][k] * y);
            assertEquals(FastMath.cos(ph), vis[0][k], 1e-11);
            assertEquals(FastMath.sin(ph), vis[1][k], 1e-11);
        }
        // the same on a grid not symmetric about x = 0 (general path): columns shifted by 0.3 pixel
        double c = -(n - 1) / 2.0 * PIX;
        double[][] shifted = transform(new DirectFourier(n, c + 0.3 * PIX, PIX, c, PIX, 1.0), img, uv);
        for (int k = 0; k < uv[0].length; k++) {
            double ph = -2 * FastMath.PI * (uv[0][k] * (x + 0.3 * PIX) + uv[1][k] * y);
            assertEquals(FastMath.cos(ph), shifted[0][k], 1e-11);
            assertEquals(FastMath.sin(ph), shifted[1][k], 1e-11);
        }
    }

    @Test void circularGaussianMatchesItsAnalyticTransform() {
        // I = F / (2 pi s^2) exp(-r^2 / 2 s^2) -> V = F exp(-2 pi^2 s^2 q^2) (Gaussian Fourier pair)
        int n = 95;
        double s = 5.0;   // pixels
        float[] img = new float[n * n];
        double c = (n - 1) / 2.0;
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                double r2 = (row - c) * (row - c) + (col - c) * (col - c);
                img[row * n + col] = (float) (FastMath.exp(-r2 / (2 * s * s)) / (2 * FastMath.PI * s * s));
            }
        }
        double[][] uv = spiral(50, 0.15 / PIX);
        double[][] vis = transform(grid(n), img, uv);
        for (int k = 0; k < uv[0].length; k++) {
            double q = FastMath.hypot(uv[0][k], uv[1][k]) * PIX;   // cycles per pixel
            double expected = FastMath.exp(-2 * FastMath.PI * FastMath.PI * s * s * q * q);
            // float pixels: relative rounding ~1e-7 of the total flux
            assertEquals(expected, vis[0][k], 2e-6, "q = " + q);
            assertEquals(0.0, vis[1][k], 2e-6);
        }
    }

    @Test void thinRingMatchesTheBesselFunction() {
        // ring of radius R smoothed by a Gaussian of width w: V = F J0(2 pi R q) exp(-2 pi^2 w^2 q^2)
        // (Hankel transform of a ring, Bracewell 2000; convolution theorem); J0 from Hipparchus
        int n = 81;
        double rad = 20.0, w = 1.2;
        int points = 720;
        double c = (n - 1) / 2.0;
        double[] acc = new double[n * n];
        for (int p = 0; p < points; p++) {
            double a = 2 * FastMath.PI * p / points;
            double px = c + rad * FastMath.cos(a), py = c + rad * FastMath.sin(a);
            for (int row = 0; row < n; row++) {
                for (int col = 0; col < n; col++) {
                    double r2 = (row - py) * (row - py) + (col - px) * (col - px);
                    acc[row * n + col] += FastMath.exp(-r2 / (2 * w * w)) / (2 * FastMath.PI * w * w * points);
                }
            }
        }
        float[] img = new float[n * n];
        for (int i = 0; i < img.length; i++) {
            img[i] = (float) acc[i];
        }
        double[][] uv = spiral(60, 0.2 / PIX);
        double[][] vis = transform(grid(n), img, uv);
        double minJ = 1;
        for (int k = 0; k < uv[0].length; k++) {
            double q = FastMath.hypot(uv[0][k], uv[1][k]) * PIX;
            double j0 = BesselJ.value(0, 2 * FastMath.PI * rad * q);
            minJ = FastMath.min(minJ, j0);
            double expected = j0 * FastMath.exp(-2 * FastMath.PI * FastMath.PI * w * w * q * q);
            assertEquals(expected, vis[0][k], 2e-6, "q = " + q);
            assertEquals(0.0, vis[1][k], 2e-6);
        }
        assertTrue(minJ < -0.3, "the points reach the first negative lobe of J0");
    }

    @Test void resultDoesNotDependOnThreadsAndTransformDoesNotAllocate() {
        int n = 48, frames = 9;
        float[][] images = new float[frames][n * n];
        java.util.SplittableRandom rng = new java.util.SplittableRandom(3);
        for (float[] im : images) {
            for (int i = 0; i < im.length; i++) {
                im[i] = (float) rng.nextDouble();
            }
        }
        int per = 13;
        double[][] uv = spiral(frames * per, 0.4 / PIX);
        int[] start = new int[frames + 1];
        for (int f = 0; f <= frames; f++) {
            start[f] = f * per;
        }
        double[] re1 = new double[frames * per], im1 = new double[frames * per];
        double[] re3 = new double[frames * per], im3 = new double[frames * per];
        DirectFourier g = new DirectFourier(n, -3e-10, PIX, -2e-10, 1.3 * PIX, 0.7);
        FrameVisibilities.compute(images, g, uv[0], uv[1], start, re1, im1, 1);
        FrameVisibilities.compute(images, g, uv[0], uv[1], start, re3, im3, 3);
        assertArrayEquals(re1, re3, 0.0, "bitwise the same with 1 and 3 threads");
        assertArrayEquals(im1, im3, 0.0);
        // the same point alone (other block mates) gives the same bits
        double[] r = new double[frames * per], i = new double[frames * per];
        g.copy().transform(images[2], uv[0], uv[1], 2 * per + 5, 2 * per + 6, r, i);
        assertEquals(re1[2 * per + 5], r[2 * per + 5], 0.0);
        // allocation: a short and a 20x longer run differ by (almost) nothing (common practice, no source)
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        DirectFourier ft = g.copy();
        long id = Thread.currentThread().getId();
        ft.transform(images[0], uv[0], uv[1], 0, per, re1, im1);
        long a0 = mx.getThreadAllocatedBytes(id);
        ft.transform(images[0], uv[0], uv[1], 0, per, re1, im1);
        long a1 = mx.getThreadAllocatedBytes(id);
        for (int rep = 0; rep < 20; rep++) {
            ft.transform(images[rep % frames], uv[0], uv[1], 0, per, re1, im1);
        }
        long a2 = mx.getThreadAllocatedBytes(id);
        assertTrue((a2 - a1) - (a1 - a0) < 4096, "transform allocates: " + (a1 - a0) + " then " + (a2 - a1) + " bytes");
    }
}
