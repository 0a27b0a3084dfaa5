package org.spindrift.sim.interferometry;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Trig;

/**
 * Complex visibility of a pixel image at arbitrary (u, v) by a direct Fourier sum,
 * V(u, v) = A sum_p I_p exp(-2 pi i (u x_p + v y_p)) (van Cittert-Zernike theorem in the
 * small-field form, Thompson, Moran &amp; Swenson 2017, eq. 3.7 with w terms dropped; x east,
 * y north, in radians; A the pixel solid angle).
 *
 * <p>The pixel grid is regular, x_col = x0 + col dx and y_row = y0 + row dy, so the kernel
 * separates: exp(-2 pi i u x_col) and exp(-2 pi i v y_row) are tabulated per (u, v) by the
 * angle-addition recurrence (re-seeded with direct sin/cos of {@link Trig} every {@value #RESEED} steps, so the
 * rounding stays near 1e-15 relative), and the sum runs row by row over the image. Four (u, v)
 * points share each pass over the image. When the columns are symmetric about x = 0 (the
 * camera's grid), cos is even and sin odd in x, so a row's sum pairs column k with column
 * n - 1 - k: sum I cos = sum (I_k + I_{n-1-k}) cos_k and sum I sin = sum (I_k - I_{n-1-k}) sin_k
 * over the left half (half the multiplications). Every point's sum runs in the same order whatever its
 * block mates, so the result does not depend on how points are grouped or threaded. No
 * allocation after construction.
 */
public final class DirectFourier {
    /** Points handled per pass over the image. */
    static final int BLOCK = 4;
    /** Recurrence steps between direct sin/cos evaluations. */
    static final int RESEED = 32;

    private final int n;
    private final double x0, dx, y0, dy, area;
    /** Whether the columns are symmetric about x = 0 (x_{n-1-k} = -x_k), as on the camera grid. */
    private final boolean symmetric;
    /** Per block member b: cos and sin tables along x (cx[b], sx[b]) and y (cy[b], sy[b]). */
    private final double[][] cx, sx, cy, sy;

    /**
     * @param n pixels per side (image index row * n + col)
     * @param x0 x of column 0, rad; dx its step, rad
     * @param y0 y of row 0, rad; dy its step, rad
     * @param area pixel solid angle times the intensity unit's flux per unit intensity (the factor A)
     */
    public DirectFourier(int n, double x0, double dx, double y0, double dy, double area) {
        this.n = n;
        this.x0 = x0;
        this.dx = dx;
        this.y0 = y0;
        this.dy = dy;
        this.area = area;
        symmetric = FastMath.abs(x0 + 0.5 * (n - 1) * dx) <= 1e-9 * FastMath.abs(dx);
        cx = new double[BLOCK][n];
        sx = new double[BLOCK][n];
        cy = new double[BLOCK][n];
        sy = new double[BLOCK][n];
    }

    /** @return a new instance with the same grid (one per worker thread) */
    public DirectFourier copy() {
        return new DirectFourier(n, x0, dx, y0, dy, area);
    }

    /** Fills c[0..n) and s[0..n) with cos and sin of 2 pi (a + k d), k = 0..n-1. */
    private void table(double a, double d, double[] c, double[] s) {
        double ca = 0, sa = 0;
        double cd = Trig.cos(2 * FastMath.PI * d), sd = Trig.sin(2 * FastMath.PI * d);
        for (int k = 0; k < n; k++) {
            if (k % RESEED == 0) {
                double ang = 2 * FastMath.PI * (a + k * d);
                ca = Trig.cos(ang);
                sa = Trig.sin(ang);
            } else {
                double t = ca * cd - sa * sd;
                sa = sa * cd + ca * sd;
                ca = t;
            }
            c[k] = ca;
            s[k] = sa;
        }
    }

    /**
     * Visibilities of one image at points from..to-1 of (u, v).
     *
     * @param image n x n intensities, row-major
     * @param u u in wavelengths; v likewise
     * @param re receives the real parts at the same indices; im the imaginary parts
     */
    public void transform(float[] image, double[] u, double[] v, int from, int to, double[] re, double[] im) {
        for (int p = from; p < to; p += BLOCK) {
            int m = FastMath.min(BLOCK, to - p);
            for (int b = 0; b < BLOCK; b++) {
                int q = p + FastMath.min(b, m - 1);   // pad a short block with its last point
                table(u[q] * x0, u[q] * dx, cx[b], sx[b]);
                table(v[q] * y0, v[q] * dy, cy[b], sy[b]);
            }
            block(image, p, m, re, im);
        }
    }

    private void block(float[] image, int p, int m, double[] re, double[] im) {
        final int n2 = n;
        final double[] c0 = cx[0], s0 = sx[0], c1 = cx[1], s1 = sx[1], c2 = cx[2], s2 = sx[2], c3 = cx[3], s3 = sx[3];
        double r0 = 0, i0 = 0, r1 = 0, i1 = 0, r2 = 0, i2 = 0, r3 = 0, i3 = 0;
        for (int row = 0; row < n2; row++) {
            int base = row * n2;
            double a0 = 0, b0 = 0, a1 = 0, b1 = 0, a2 = 0, b2 = 0, a3 = 0, b3 = 0;
            if (symmetric) {
                int half = n2 / 2;
                int mirror = base + n2 - 1;
                for (int col = 0; col < half; col++) {
                    double lo = image[base + col], hi = image[mirror - col];
                    double sum = lo + hi, diff = lo - hi;
                    a0 += sum * c0[col];
                    b0 += diff * s0[col];
                    a1 += sum * c1[col];
                    b1 += diff * s1[col];
                    a2 += sum * c2[col];
                    b2 += diff * s2[col];
                    a3 += sum * c3[col];
                    b3 += diff * s3[col];
                }
                if ((n2 & 1) == 1) {   // the middle column, x = 0
                    double val = image[base + half];
                    a0 += val * c0[half];
                    b0 += val * s0[half];
                    a1 += val * c1[half];
                    b1 += val * s1[half];
                    a2 += val * c2[half];
                    b2 += val * s2[half];
                    a3 += val * c3[half];
                    b3 += val * s3[half];
                }
            } else {
                for (int col = 0; col < n2; col++) {
                    double val = image[base + col];
                    a0 += val * c0[col];
                    b0 += val * s0[col];
                    a1 += val * c1[col];
                    b1 += val * s1[col];
                    a2 += val * c2[col];
                    b2 += val * s2[col];
                    a3 += val * c3[col];
                    b3 += val * s3[col];
                }
            }
            // (a - i b)(cy - i sy) = (a cy - b sy) - i (a sy + b cy)
            r0 += a0 * cy[0][row] - b0 * sy[0][row];
            i0 -= a0 * sy[0][row] + b0 * cy[0][row];
            r1 += a1 * cy[1][row] - b1 * sy[1][row];
            i1 -= a1 * sy[1][row] + b1 * cy[1][row];
            r2 += a2 * cy[2][row] - b2 * sy[2][row];
            i2 -= a2 * sy[2][row] + b2 * cy[2][row];
            r3 += a3 * cy[3][row] - b3 * sy[3][row];
            i3 -= a3 * sy[3][row] + b3 * cy[3][row];
        }
        re[p] = area * r0;
        im[p] = area * i0;
        if (m > 1) {
            re[p + 1] = area * r1;
            im[p + 1] = area * i1;
        }
        if (m > 2) {
            re[p + 2] = area * r2;
            im[p + 2] = area * i2;
        }
        if (m > 3) {
            re[p + 3] = area * r3;
            im[p + 3] = area * i3;
        }
    }
}
