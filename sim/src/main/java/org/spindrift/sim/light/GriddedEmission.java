package org.spindrift.sim.light;

import java.util.Arrays;
import org.hipparchus.util.FastMath;

/**
 * The emitting particles of one emission slice deposited onto a Cartesian grid of spacing h (the
 * smoothing length) with cloud-in-cell weights, and read back at a sample by trilinear
 * interpolation (Hockney &amp; Eastwood 1988, Computer Simulation Using Particles, ch. 5: CIC
 * assignment and CIC interpolation). Per node the grid holds the weight sum W = sum_p w_p
 * Lambda_p (w_p = weight / u^t, the rest-frame density weight of {@link EmissionSlice}; Lambda_p
 * the tensor product of one-dimensional tents 1 - |x - x_n| / h), the weighted sums of the
 * 4-velocity sum_p w_p Lambda_p u_p^mu, of its products u_p^mu u_p^nu and of the Cartesian
 * velocity sum_p w_p Lambda_p v_p.
 *
 * <p>Deposit then read is the kernel K(x, x_p) = h^-3 prod_axes sum_n Lambda((x - x_n) / h)
 * Lambda((x_p - x_n) / h): support 2h per axis, integral 1 over x for every x_p (the tents form a
 * partition of unity), and averaged over the particle's offset from the nodes the tensor product
 * of cubic B-splines (the tent convolved with itself), the same one-dimensional shape as the
 * cubic-spline kernel of {@link Kernel}. The density at a sample is the interpolated W / h^3.
 * The particle sum weights each particle by g_p^n = D_p^-n with D_p = -p_mu u_p^mu (n = 2 + alpha,
 * {@link Redshift}); D is linear in u, so its kernel-weighted mean and variance at the sample follow
 * from the interpolated first and second moments of u, and the mean of D^-n is taken to second
 * order about the mean D (no rescaling of the mean velocity: that would move the mean D at second
 * order away from the particles' mean). The particles'
 * drift v (t_e - tau) within half a slice spacing is followed by reading the grid at the
 * sample moved back by the interpolated mean Cartesian velocity times (t_e - tau) (one
 * semi-Lagrangian step, e.g. Staniforth &amp; Cote 1991, Mon. Weather Rev. 119, 2206).
 *
 * <p>Storage is block-sparse: blocks of 2 x 2 x 2 nodes over the particles' bounding box,
 * allocated on first touch in particle order (so the sums and their order do not depend on
 * anything but the slice). Arrays are kept and reused when the object is rebuilt for another
 * slice; reading allocates nothing.
 */
final class GriddedEmission {
    /**
     * Values per node: W, V^x, V^y, V^z, U^t, U^r, U^theta, U^phi, then the second moments
     * sum w Lambda u^mu u^nu for (mu, nu) = tt, tr, t theta, t phi, rr, r theta, r phi,
     * theta theta, theta phi, phi phi.
     */
    static final int NV = 18;
    private static final int SIDE = 2;
    private static final int SHIFT = 1;
    private static final int MASK = SIDE - 1;
    private static final int BLOCK = SIDE * SIDE * SIDE * NV;

    private double invH, invH3;
    private double ox, oy, oz;
    /** nodes per axis */
    private int nx, ny, nz;
    /** blocks per axis */
    private int bx, by, bz;
    /** block id of each block of the box, -1 when empty */
    private int[] blockOf = new int[0];
    /**
     * per block of the box: whether it or one of its 26 neighbours holds values; a cell whose lowest
     * node lies in a block without may read nothing, and nor may any cell within one node spacing
     */
    private boolean[] near = new boolean[0];
    /** whether the largest drift within the slice (speed times the largest |t_e - tau|) is at most one spacing */
    private boolean driftWithinSpacing;
    /** node values: first one node of zeros (what missing nodes read), then the blocks */
    private double[] val = new double[NV];
    private int blocks;
    /** the exponent 2 + alpha of the slice's particles (the renderer grids only slices with one index) */
    private double exponent;
    /** weighted mean Cartesian velocity of all the slice's particles */
    private double meanVx, meanVy, meanVz;

    /**
     * Starts a grid of spacing h covering particles in [min, max] per axis (nodes from min to one
     * node past max). Earlier contents are dropped; arrays are reused.
     */
    void begin(double spacing, double minX, double minY, double minZ, double maxX, double maxY, double maxZ) {
        invH = 1.0 / spacing;
        invH3 = invH * invH * invH;
        ox = minX;
        oy = minY;
        oz = minZ;
        nx = (int) ((maxX - minX) * invH) + 2;
        ny = (int) ((maxY - minY) * invH) + 2;
        nz = (int) ((maxZ - minZ) * invH) + 2;
        bx = (nx + MASK) >> SHIFT;
        by = (ny + MASK) >> SHIFT;
        bz = (nz + MASK) >> SHIFT;
        int nb = bx * by * bz;
        if (blockOf.length < nb) {
            blockOf = new int[Math.max(nb, blockOf.length + blockOf.length / 4)];
            near = new boolean[blockOf.length];
        }
        Arrays.fill(blockOf, 0, nb, -1);
        Arrays.fill(near, 0, nb, false);
        blocks = 0;
        meanVx = meanVy = meanVz = 0.0;
        driftWithinSpacing = false;
    }

    /**
     * Deposits one particle with cloud-in-cell weights onto the 8 nodes around it.
     *
     * @param w density weight (weight / u^t)
     * @param e exponent 2 + alpha of g
     */
    void deposit(double x, double y, double z, double vx, double vy, double vz, double w, double ut, double ur,
                 double uth, double uph, double e) {
        exponent = e;
        double fx = (x - ox) * invH, fy = (y - oy) * invH, fz = (z - oz) * invH;
        int i = Math.min(nx - 2, Math.max(0, (int) fx));
        int j = Math.min(ny - 2, Math.max(0, (int) fy));
        int k = Math.min(nz - 2, Math.max(0, (int) fz));
        double ax = fx - i, ay = fy - j, az = fz - k;
        // the lowest corner's node; a corner one step up an axis lies in the same block when the
        // lowest corner's index on that axis is even, at a fixed offset
        int q0 = nodeForWrite(i, j, k);
        boolean inX = (i & MASK) == 0, inY = (j & MASK) == 0, inZ = (k & MASK) == 0;
        for (int di = 0; di < 2; di++) {
            double wx = di == 0 ? 1.0 - ax : ax;
            for (int dj = 0; dj < 2; dj++) {
                double wxy = wx * (dj == 0 ? 1.0 - ay : ay);
                for (int dk = 0; dk < 2; dk++) {
                    double c = w * wxy * (dk == 0 ? 1.0 - az : az);
                    int q = (di == 0 || inX) && (dj == 0 || inY) && (dk == 0 || inZ)
                            ? q0 + ((di * SIDE + dj) * SIDE + dk) * NV
                            : nodeForWrite(i + di, j + dj, k + dk);
                    val[q] += c;
                    val[q + 1] += c * vx;
                    val[q + 2] += c * vy;
                    val[q + 3] += c * vz;
                    val[q + 4] += c * ut;
                    val[q + 5] += c * ur;
                    val[q + 6] += c * uth;
                    val[q + 7] += c * uph;
                    val[q + 8] += c * ut * ut;
                    val[q + 9] += c * ut * ur;
                    val[q + 10] += c * ut * uth;
                    val[q + 11] += c * ut * uph;
                    val[q + 12] += c * ur * ur;
                    val[q + 13] += c * ur * uth;
                    val[q + 14] += c * ur * uph;
                    val[q + 15] += c * uth * uth;
                    val[q + 16] += c * uth * uph;
                    val[q + 17] += c * uph * uph;
                }
            }
        }
    }

    private int nodeForWrite(int i, int j, int k) {
        int b = ((i >> SHIFT) * by + (j >> SHIFT)) * bz + (k >> SHIFT);
        int id = blockOf[b];
        if (id < 0) {
            id = blockOf[b] = blocks++;
            int bi = i >> SHIFT, bj = j >> SHIFT, bk = k >> SHIFT;
            for (int ci = Math.max(0, bi - 1); ci <= Math.min(bx - 1, bi + 1); ci++) {
                for (int cj = Math.max(0, bj - 1); cj <= Math.min(by - 1, bj + 1); cj++) {
                    for (int ck = Math.max(0, bk - 1); ck <= Math.min(bz - 1, bk + 1); ck++) {
                        near[(ci * by + cj) * bz + ck] = true;
                    }
                }
            }
            int need = NV + blocks * BLOCK;
            if (val.length < need) {
                val = Arrays.copyOf(val, Math.max(need, val.length + val.length / 2));
            }
            Arrays.fill(val, NV + id * BLOCK, need, 0.0);
        }
        return NV + id * BLOCK + (((i & MASK) * SIDE + (j & MASK)) * SIDE + (k & MASK)) * NV;
    }

    /** @return offset of node (i, j, k) in {@link #val}, or 0 (the zero node) when outside the box or in an empty block */
    private int node(int i, int j, int k) {
        if (i < 0 || j < 0 || k < 0 || i >= nx || j >= ny || k >= nz) {
            return 0;
        }
        int id = blockOf[((i >> SHIFT) * by + (j >> SHIFT)) * bz + (k >> SHIFT)];
        return id < 0 ? 0 : NV + id * BLOCK + (((i & MASK) * SIDE + (j & MASK)) * SIDE + (k & MASK)) * NV;
    }

    /**
     * Fills the slice's particles into this grid.
     *
     * @param spacing node spacing, M
     * @param maxDt the largest |t_e - tau| the slice serves, M
     * @return this
     */
    GriddedEmission fill(EmissionSlice s, double spacing, double maxDt) {
        double[] pos = s.positions();
        float[] att = s.attributes();
        int rec = EmissionSlice.REC;
        double minX = Double.POSITIVE_INFINITY, minY = minX, minZ = minX;
        double maxX = Double.NEGATIVE_INFINITY, maxY = maxX, maxZ = maxX;
        for (int p = 0; p < s.count; p++) {
            int q = rec * p;
            minX = Math.min(minX, pos[q]);
            minY = Math.min(minY, pos[q + 1]);
            minZ = Math.min(minZ, pos[q + 2]);
            maxX = Math.max(maxX, pos[q]);
            maxY = Math.max(maxY, pos[q + 1]);
            maxZ = Math.max(maxZ, pos[q + 2]);
        }
        begin(spacing, minX, minY, minZ, maxX, maxY, maxZ);
        double sw = 0, svx = 0, svy = 0, svz = 0, vmax = 0;
        for (int p = 0; p < s.count; p++) {
            int q = rec * p;
            deposit(pos[q], pos[q + 1], pos[q + 2], pos[q + 3], pos[q + 4], pos[q + 5], att[q + 4], att[q], att[q + 1],
                    att[q + 2], att[q + 3], att[q + 5]);
            sw += att[q + 4];
            vmax = Math.max(vmax, Math.sqrt(pos[q + 3] * pos[q + 3] + pos[q + 4] * pos[q + 4] + pos[q + 5] * pos[q + 5]));
            svx += att[q + 4] * pos[q + 3];
            svy += att[q + 4] * pos[q + 4];
            svz += att[q + 4] * pos[q + 5];
        }
        driftWithinSpacing = vmax * maxDt <= spacing;
        meanVx = sw > 0 ? svx / sw : 0.0;
        meanVy = sw > 0 ? svy / sw : 0.0;
        meanVz = sw > 0 ? svz / sw : 0.0;
        return this;
    }

    /** @return the sum of the node weights (equals the sum of the deposited weights) */
    double totalWeight() {
        double sum = 0.0;
        for (int b = 0; b < blocks; b++) {
            for (int q = NV + b * BLOCK; q < NV + (b + 1) * BLOCK; q += NV) {
                sum += val[q];
            }
        }
        return sum;
    }

    /**
     * Trilinear read of the first {@code count} node values at (x, y, z) into out[0..count-1].
     *
     * @return false when no node around the point holds a value (out then untouched)
     */
    boolean read(double x, double y, double z, int count, double[] out) {
        double fx = (x - ox) * invH, fy = (y - oy) * invH, fz = (z - oz) * invH;
        double flx = Math.floor(fx), fly = Math.floor(fy), flz = Math.floor(fz);
        if (flx < -1 || fly < -1 || flz < -1 || flx >= nx || fly >= ny || flz >= nz) {
            return false;
        }
        int i = (int) flx, j = (int) fly, k = (int) flz;
        // most samples lie away from the gas: one look-up tells whether any corner may hold values
        if (!near[((Math.max(0, i >> SHIFT) * by) + Math.max(0, j >> SHIFT)) * bz + Math.max(0, k >> SHIFT)]) {
            return false;
        }
        double ax = fx - flx, ay = fy - fly, az = fz - flz;
        double ex = 1.0 - ax, ey = 1.0 - ay, ez = 1.0 - az;
        // the 8 corners (missing ones read the zero node) and their trilinear weights
        int q0 = node(i, j, k), q1 = node(i, j, k + 1), q2 = node(i, j + 1, k), q3 = node(i, j + 1, k + 1);
        int q4 = node(i + 1, j, k), q5 = node(i + 1, j, k + 1), q6 = node(i + 1, j + 1, k), q7 = node(i + 1, j + 1, k + 1);
        if ((q0 | q1 | q2 | q3 | q4 | q5 | q6 | q7) == 0) {
            return false;
        }
        double c0 = ex * ey * ez, c1 = ex * ey * az, c2 = ex * ay * ez, c3 = ex * ay * az;
        double c4 = ax * ey * ez, c5 = ax * ey * az, c6 = ax * ay * ez, c7 = ax * ay * az;
        double[] a = val;
        for (int v = 0; v < count; v++) {
            out[v] = c0 * a[q0 + v] + c1 * a[q1 + v] + c2 * a[q2 + v] + c3 * a[q3 + v]
                    + c4 * a[q4 + v] + c5 * a[q5 + v] + c6 * a[q6 + v] + c7 * a[q7 + v];
        }
        return true;
    }

    /**
     * @return false when no block within one block of the cell holding (x, y, z) holds values: then
     *     nothing within one node spacing of the point can be read
     */
    private boolean near(double x, double y, double z) {
        double fx = Math.floor((x - ox) * invH), fy = Math.floor((y - oy) * invH), fz = Math.floor((z - oz) * invH);
        if (fx < -2 || fy < -2 || fz < -2 || fx > nx || fy > ny || fz > nz) {
            return false;
        }
        int bi = Math.min(bx - 1, Math.max(0, ((int) fx) >> SHIFT));
        int bj = Math.min(by - 1, Math.max(0, ((int) fy) >> SHIFT));
        int bk = Math.min(bz - 1, Math.max(0, ((int) fz) >> SHIFT));
        return near[(bi * by + bj) * bz + bk];
    }

    /** @return the grid density estimate sum_p w_p K(x, x_p) at (x, y, z) (no drift) */
    double density(double x, double y, double z, double[] work) {
        return read(x, y, z, 1, work) ? work[0] * invH3 : 0.0;
    }

    /** Scratch arrays of {@link #emissivity}, one per thread. */
    static final class Scratch {
        final double[] v = new double[NV];
    }

    /**
     * Emissivity at a sample: rho g^(2+alpha) with rho the grid density and g from the mean
     * 4-velocity (see the class comment), with the exponent of the last particle deposited.
     *
     * @param dtE t_e - tau, M
     */
    double emissivity(double sx, double sy, double sz, double dtE, double pr, double pth,
                      double pphi, Scratch s) {
        double[] v = s.v;
        double x = sx, y = sy, z = sz;
        if (driftWithinSpacing && !near(x, y, z)) {
            // no gas within one block of the sample, so none within the drift either: the reads
            // below would find nothing (an exact shortcut)
            return 0.0;
        }
        if (dtE != 0.0) {
            // the gas at the sample at t_e was at x - v (t_e - tau) at tau; where the grid holds
            // nothing at the sample itself (gas that has moved in since tau) the slice's mean velocity
            if (read(x, y, z, 4, v) && v[0] > 0) {
                double f = dtE / v[0];
                x -= v[1] * f;
                y -= v[2] * f;
                z -= v[3] * f;
            } else {
                x -= meanVx * dtE;
                y -= meanVy * dtE;
                z -= meanVz * dtE;
            }
        }
        if (!read(x, y, z, NV, v) || !(v[0] > 0)) {
            return 0.0;
        }
        double w = v[0];
        double iw = 1.0 / w;
        double ut = v[4] * iw, ur = v[5] * iw, uth = v[6] * iw, uph = v[7] * iw;
        // D = -p_mu u^mu = a_mu u^mu with a = (1, -p_r, -p_theta, -p_phi) (p_t = -1) is linear in u,
        // so its kernel-weighted mean over the particles is a.u_mean exactly, and its variance is
        // a_mu a_nu (<u^mu u^nu> - u_mean^mu u_mean^nu)
        double a1 = -pr, a2 = -pth, a3 = -pphi;
        double mean = Redshift.inverse(pr, pth, pphi, ut, ur, uth, uph);
        if (!(mean > 0)) {
            return 0.0;
        }
        double var = (v[8] * iw - ut * ut) + 2 * a1 * (v[9] * iw - ut * ur)
                + 2 * a2 * (v[10] * iw - ut * uth) + 2 * a3 * (v[11] * iw - ut * uph)
                + a1 * a1 * (v[12] * iw - ur * ur) + 2 * a1 * a2 * (v[13] * iw - ur * uth)
                + 2 * a1 * a3 * (v[14] * iw - ur * uph) + a2 * a2 * (v[15] * iw - uth * uth)
                + 2 * a2 * a3 * (v[16] * iw - uth * uph) + a3 * a3 * (v[17] * iw - uph * uph);
        // g^n = D^-n, n = 2 + alpha; the common alpha = 1 (n = 3) avoids pow
        double n = exponent;
        double gp = n == 3.0 ? 1.0 / (mean * mean * mean) : FastMath.pow(mean, -n);
        // mean of D^-n to second order about the mean of D (second-order Taylor expansion of an
        // expectation, the delta method; common practice, no source):
        // <D^-n> = mean^-n (1 + n (n + 1) / 2 var / mean^2)
        return w * invH3 * gp * (1.0 + 0.5 * n * (n + 1) * Math.max(0.0, var) / (mean * mean));
    }
}
