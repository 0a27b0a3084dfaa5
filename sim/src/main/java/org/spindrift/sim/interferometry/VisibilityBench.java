package org.spindrift.sim.interferometry;

import java.util.Locale;
import java.util.SplittableRandom;
import org.hipparchus.util.FastMath;

/**
 * Timing of the direct Fourier sum for {@code spindrift bench light}: F frames of N x N pixels
 * (a synthetic blob with noise, fixed seed), each against P (u, v) points out to the grid's
 * Nyquist frequency, with one thread and with the given number of threads; checks that both give
 * the same bits.
 */
public final class VisibilityBench {
    private VisibilityBench() {
    }

    /** @return the report lines */
    public static String run(int frames, int pixels, int points, int threads) {
        SplittableRandom rng = new SplittableRandom(20261203L);
        float[][] images = new float[frames][pixels * pixels];
        for (float[] im : images) {
            double cx = pixels * (0.3 + 0.4 * rng.nextDouble()), cy = pixels * (0.3 + 0.4 * rng.nextDouble());
            for (int row = 0; row < pixels; row++) {
                for (int col = 0; col < pixels; col++) {
                    double r2 = (row - cy) * (row - cy) + (col - cx) * (col - cx);
                    im[row * pixels + col] = (float) (FastMath.exp(-r2 / 50.0) + 0.01 * rng.nextDouble());
                }
            }
        }
        double pix = 1e-11;
        double[] u = new double[frames * points], v = new double[frames * points];
        for (int k = 0; k < u.length; k++) {
            u[k] = (rng.nextDouble() - 0.5) / pix;
            v[k] = (rng.nextDouble() - 0.5) / pix;
        }
        int[] start = new int[frames + 1];
        for (int f = 0; f <= frames; f++) {
            start[f] = f * points;
        }
        double c = -(pixels - 1) / 2.0 * pix;
        DirectFourier grid = new DirectFourier(pixels, c, pix, c, pix, 1.0);
        double[] re1 = new double[u.length], im1 = new double[u.length], reN = new double[u.length],
                imN = new double[u.length];
        // warm-up (JIT), untimed
        FrameVisibilities.compute(java.util.Arrays.copyOf(images, Math.min(frames, 8)), grid, u, v, start, re1, im1,
                threads);
        java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
        long t0 = System.nanoTime();
        long c0 = mx.getCurrentThreadCpuTime();
        FrameVisibilities.compute(images, grid, u, v, start, re1, im1, 1);
        double s1 = (System.nanoTime() - t0) * 1e-9;
        double cpu1 = (mx.getCurrentThreadCpuTime() - c0) * 1e-9;
        t0 = System.nanoTime();
        FrameVisibilities.compute(images, grid, u, v, start, reN, imN, threads);
        double sN = (System.nanoTime() - t0) * 1e-9;
        boolean same = java.util.Arrays.equals(re1, reN) && java.util.Arrays.equals(im1, imN);
        double work = (double) frames * points * pixels * pixels;
        return String.format(Locale.ROOT, "  visibilities (direct Fourier sum): %d frames of %d x %d, %d (u, v) points per"
                        + " frame: 1 thread %.2f s (thread CPU %.2f s, %.2e pixel-points per CPU second), %d threads %.2f s (%.2e pixel-points/s),"
                        + " speed-up %.2f, bitwise identical: %s", frames, pixels, pixels, points, s1, cpu1, work / cpu1, threads, sN,
                work / sN, s1 / sN, same ? "yes" : "NO");
    }
}
