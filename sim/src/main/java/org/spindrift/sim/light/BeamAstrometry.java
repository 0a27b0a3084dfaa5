package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;

/**
 * The position an instrument with a circular Gaussian beam reports: the peak of the
 * beam-convolved image. For point images (or pixels, taken as points at their centres) of flux
 * f_i at x_i the convolved image is B(x) = sum f_i exp(-|x - x_i|^2 / (2 s^2)) with s the beam's
 * standard deviation; at its peak grad B = 0, i.e. x = sum w_i f_i x_i / sum w_i f_i with
 * w_i = exp(-|x_i - x|^2 / (2 s^2)). Iterating this map is the mean-shift procedure, which climbs B
 * monotonically to a stationary point (Fukunaga &amp; Hostetler 1975, IEEE Trans. Inf. Theory 21, 32;
 * convergence for the Gaussian kernel: Comaniciu &amp; Meer 2002, IEEE Trans. PAMI 24, 603).
 *
 * <p>The climb starts from the flux centroid and from the brightest points (each at least one
 * beam sigma from the previous starts); the end point with the largest B is the peak. A beam
 * much wider than the structure gives the flux centroid (B is then one broad Gaussian about it);
 * a beam much narrower than the images' separations gives the brightest point. One instance per
 * thread (scratch buffers); only {@link #peak(float[], Camera, double, double[])} may grow them.
 */
public final class BeamAstrometry {
    /** Mean-shift steps are stopped when shorter than this many beam sigmas. */
    public static final double TOLERANCE_SIGMAS = 1.0e-9;
    /** Largest number of mean-shift steps per start (near a flat, just-merging peak they shrink slowly). */
    public static final int MAX_STEPS = 5000;
    /** Number of bright points tried as starts besides the flux centroid. */
    public static final int BRIGHT_STARTS = 4;
    /** Points farther than this many sigmas from the current position have weight below 1e-30 and are skipped. */
    static final double REACH_SIGMAS = 11.8;

    private final double sigma;
    private final double inv2s2;
    private final double reach2;
    private double[] px = new double[0], py = new double[0], pf = new double[0];
    private final double[] starts = new double[2 * (BRIGHT_STARTS + 1)];
    private final double[] at = new double[2];

    /** @param sigma beam standard deviation (&gt; 0), in the units of the positions */
    public BeamAstrometry(double sigma) {
        if (!(sigma > 0) || Double.isInfinite(sigma)) {
            throw new IllegalArgumentException("beam sigma must be positive and finite, got " + sigma);
        }
        this.sigma = sigma;
        this.inv2s2 = 0.5 / (sigma * sigma);
        this.reach2 = REACH_SIGMAS * REACH_SIGMAS * sigma * sigma;
    }

    /** @return the beam's standard deviation */
    public double sigma() {
        return sigma;
    }

    /**
     * Peak of the beam-convolved image of point images.
     *
     * @param x east offsets of the points (and y north), any consistent unit
     * @param f their fluxes (non-positive ones are ignored)
     * @param count number of points used from the arrays
     * @param out out: the peak (out[0] east, out[1] north); NaN when no point has positive flux
     * @return whether there was positive flux
     */
    public boolean peak(double[] x, double[] y, double[] f, int count, double[] out) {
        return peak(x, y, f, 0, count, out);
    }

    /**
     * As {@link #peak(double[], double[], double[], int, double[])} over the points from index
     * {@code from} (inclusive) to {@code to} (exclusive).
     */
    public boolean peak(double[] x, double[] y, double[] f, int from, int to, double[] out) {
        double tot = 0, cx = 0, cy = 0;
        for (int i = from; i < to; i++) {
            if (f[i] > 0) {
                tot += f[i];
                cx += f[i] * x[i];
                cy += f[i] * y[i];
            }
        }
        if (!(tot > 0)) {
            out[0] = Double.NaN;
            out[1] = Double.NaN;
            return false;
        }
        int ns = 1;
        starts[0] = cx / tot;
        starts[1] = cy / tot;
        // the brightest points, each at least one sigma from the starts chosen before it
        for (int k = 0; k < BRIGHT_STARTS; k++) {
            int best = -1;
            for (int i = from; i < to; i++) {
                if (f[i] > 0 && (best < 0 || f[i] > f[best]) && farFromStarts(x[i], y[i], ns)) {
                    best = i;
                }
            }
            if (best < 0) {
                break;
            }
            starts[2 * ns] = x[best];
            starts[2 * ns + 1] = y[best];
            ns++;
        }
        double bestValue = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < ns; k++) {
            climb(x, y, f, from, to, starts[2 * k], starts[2 * k + 1], at);
            double v = convolved(x, y, f, from, to, at[0], at[1]);
            if (v > bestValue) {
                bestValue = v;
                out[0] = at[0];
                out[1] = at[1];
            }
        }
        return true;
    }

    /**
     * Peak of the beam-convolved image of a pixel image (pixels as points at their centres, sky
     * offsets of {@link Camera#skyX}, {@link Camera#skyY}) plus a steady point source at the origin.
     *
     * @param image N x N row-major intensities (the camera's layout)
     * @param steadyFlux the steady point source's flux in image units (sum of pixel values; 0: none)
     * @param out out: the peak, M (east, north); NaN without flux
     * @return whether there was positive flux
     */
    public boolean peak(float[] image, Camera camera, double steadyFlux, double[] out) {
        int n = camera.pixels();
        int count = 0;
        for (float v : image) {
            if (v > 0) {
                count++;
            }
        }
        ensure(count + 1);
        int j = 0;
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                float v = image[row * n + col];
                if (v > 0) {
                    px[j] = camera.skyX(col);
                    py[j] = camera.skyY(row);
                    pf[j++] = v;
                }
            }
        }
        if (steadyFlux > 0) {
            px[j] = 0;
            py[j] = 0;
            pf[j++] = steadyFlux;
        }
        return peak(px, py, pf, j, out);
    }

    private void ensure(int size) {
        if (px.length < size) {
            px = new double[size];
            py = new double[size];
            pf = new double[size];
        }
    }

    private boolean farFromStarts(double x, double y, int ns) {
        for (int k = 0; k < ns; k++) {
            double dx = x - starts[2 * k], dy = y - starts[2 * k + 1];
            if (dx * dx + dy * dy < sigma * sigma) {
                return false;
            }
        }
        return true;
    }

    /** Mean-shift climb from (x0, y0) to a stationary point of B, written to end. */
    private void climb(double[] x, double[] y, double[] f, int from, int to, double x0, double y0, double[] end) {
        double ax = x0, ay = y0;
        double tol2 = TOLERANCE_SIGMAS * TOLERANCE_SIGMAS * sigma * sigma;
        for (int step = 0; step < MAX_STEPS; step++) {
            double sw = 0, swx = 0, swy = 0;
            for (int i = from; i < to; i++) {
                if (!(f[i] > 0)) {
                    continue;
                }
                double dx = x[i] - ax, dy = y[i] - ay;
                double d2 = dx * dx + dy * dy;
                if (d2 > reach2) {
                    continue;
                }
                double w = f[i] * FastMath.exp(-d2 * inv2s2);
                sw += w;
                swx += w * x[i];
                swy += w * y[i];
            }
            if (!(sw > 0)) {
                break;      // every point beyond reach: stay (B is flat to double precision here)
            }
            double nx = swx / sw, ny = swy / sw;
            double mx = nx - ax, my = ny - ay;
            ax = nx;
            ay = ny;
            if (mx * mx + my * my <= tol2) {
                break;
            }
        }
        end[0] = ax;
        end[1] = ay;
    }

    /** @return B at (ax, ay) (without the constant normalisation) */
    private double convolved(double[] x, double[] y, double[] f, int from, int to, double ax, double ay) {
        double b = 0;
        for (int i = from; i < to; i++) {
            if (f[i] > 0) {
                double dx = x[i] - ax, dy = y[i] - ay;
                b += f[i] * FastMath.exp(-(dx * dx + dy * dy) * inv2s2);
            }
        }
        return b;
    }
}
