package org.spindrift.sim.light;

import java.util.Arrays;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;
import org.spindrift.sim.spacetime.Trig;

/**
 * The emitting particles at one emission time tau, interpolated from the two snapshots around it,
 * with a uniform-grid cell list for neighbour search. Positions come from cubic Hermite
 * interpolation of (r, theta, phi) with the snapshot values and their coordinate-time derivatives
 * u^i / u^t (cubic Hermite spline, e.g. de Boor 1978, A Practical Guide to Splines, ch. IV);
 * u^t is re-normalised from g_{mu nu} u^mu u^nu = -1 at the interpolated point, and the weight
 * (flare envelope included) is interpolated linearly and divided by u^t, so that the kernel sum
 * estimates the emitter-frame density (a point source then brightens as g^(3+alpha)). The Cartesian velocity is kept so that a
 * sample at a nearby time t_e moves the particle by v (t_e - tau).
 *
 * <p>Particles are stored sorted by cell (counting sort); a query visits the cells overlapping the
 * box of half-width R = 2h + (largest drift within half a slice spacing), cells being R/2 wide.
 */
final class EmissionSlice {
    final double tau;
    final int count;
    final int[] cellStart;
    final double ox, oy, oz, cell, invCell;
    final int nx, ny, nz;
    /** search radius the cells are sized for: kernel support plus the largest drift within half a slice spacing */
    final double reach;
    /** Values per particle record in {@link #pos} and in {@link #att}. */
    static final int REC = 6;
    /**
     * Records sorted by cell, for locality, split so that the distance test reads only the first:
     * pos = x, y, z, vx, vy, vz; att = u^t, u^r, u^theta, u^phi, weight / u^t, exponent 2 + alpha.
     * pos holds the float-rounded values in doubles: the same numbers as before, but the
     * distance test (the hottest loop of rendering) needs no float-to-double conversions.
     */
    private final double[] pos;
    private final float[] att;
    /** largest particle speed |dx/dt| in the slice (bounds the drift over |t_e - tau|) */
    final double vmax;
    /**
     * Per (x, y) column of cells: true when a particle lies in a column at most {@link #NEAR}
     * cells away in x and y (any z). A query with search radius rc &lt; NEAR cells reaches at most
     * NEAR cells from the sample's cell (rc is at most 2 plus rounding: cells are half the reach),
     * so a sample whose column is false sees no particle: an exact early exit for the many samples
     * away from the gas.
     */
    private final boolean[] nearColumn;
    /** Dilation of {@link #nearColumn} in cells. */
    static final int NEAR = 3;
    /**
     * Per cell: the smallest squared gap, in cell units, between this cell and an occupied cell
     * (gap per axis max(|offset| - 1, 0), offsets up to {@link #NEAR}; {@link #FAR} when there is
     * none). It bounds from below the distance from any point of the cell to any particle, so a
     * sample whose cell has a gap beyond its search radius sees no particle.
     */
    private final byte[] gap2;
    /**
     * Per (x, y) column of cells: the lowest and highest occupied z cell ({@code zLo > zHi} when
     * the column is empty). Small enough to stay in cache, so a query skips empty columns and
     * columns whose particles are all too far in z without reading the cell list.
     */
    private final byte[] zLo, zHi;
    /** Value of {@link #gap2} for cells with no occupied cell within {@link #NEAR} cells. */
    private static final byte FAR = 100;

    /** the arrays this slice lives in, handed back for the next slice when this one is dropped */
    final Storage storage;

    private EmissionSlice(double tau, int count, Storage st, double ox, double oy,
                          double oz, double cell, int nx, int ny, int nz, double reach, double vmax,
                          boolean shortcuts) {
        this.storage = st;
        int[] cellStart = st.cellStart;
        this.tau = tau;
        this.count = count;
        this.cellStart = cellStart;
        this.ox = ox;
        this.oy = oy;
        this.oz = oz;
        this.cell = cell;
        this.invCell = 1.0 / cell;
        this.nx = nx;
        this.ny = ny;
        this.nz = nz;
        this.reach = reach;
        this.vmax = vmax;
        this.pos = st.pos;
        this.att = st.att;
        if (!shortcuts) {
            nearColumn = null;
            gap2 = null;
            zLo = null;
            zHi = null;
            return;
        }
        nearColumn = st.nearColumn = columns(st, nx, ny, nz);
        gap2 = gaps(st, nx, ny, nz);
        zLo = st.zLo = grow(st.zLo, nx * ny);
        zHi = st.zHi = grow(st.zHi, nx * ny);
        for (int c = 0; c < nx * ny; c++) {
            int lo = nz, hi = -1;
            for (int k = 0; k < nz; k++) {
                if (cellStart[c * nz + k + 1] > cellStart[c * nz + k]) {
                    lo = Math.min(lo, k);
                    hi = k;
                }
            }
            zLo[c] = (byte) lo;
            zHi[c] = (byte) hi;
        }
    }

    /**
     * The arrays of one slice and the work arrays of its building, reused from slice to slice
     * (a slice dropped by the renderer hands its storage to the next one built), so that slices
     * are built without allocating once the arrays have grown to the largest slice. Arrays may be
     * longer than the slice needs.
     */
    static final class Storage {
        double[] pos = new double[0];
        float[] att = new float[0];
        int[] cellStart = new int[0];
        byte[] gap2 = new byte[0], gapWork = new byte[0], zLo = new byte[0], zHi = new byte[0];
        boolean[] nearColumn = new boolean[0], columnWork = new boolean[0], occupied = new boolean[0];
        float[][] work = new float[2 * REC][0];
        int[] cellOf = new int[0], fill = new int[0];
    }

    private static byte[] grow(byte[] a, int n) {
        return a.length >= n ? a : new byte[Math.max(n, a.length + a.length / 4)];
    }

    private static boolean[] grow(boolean[] a, int n) {
        return a.length >= n ? a : new boolean[Math.max(n, a.length + a.length / 4)];
    }

    private static int[] grow(int[] a, int n) {
        return a.length >= n ? a : new int[Math.max(n, a.length + a.length / 4)];
    }

    private static float[] grow(float[] a, int n) {
        return a.length >= n ? a : new float[Math.max(n, a.length + a.length / 4)];
    }

    private static double[] grow(double[] a, int n) {
        return a.length >= n ? a : new double[Math.max(n, a.length + a.length / 4)];
    }

    /** @return the particle records x, y, z, vx, vy, vz ({@link #REC} per particle, {@link #count} used) */
    double[] positions() {
        return pos;
    }

    /** @return the particle records u^t, u^r, u^theta, u^phi, weight / u^t, 2 + alpha ({@link #REC} per particle) */
    float[] attributes() {
        return att;
    }

    /** Occupied (x, y) columns dilated by NEAR cells in x and y (two one-dimensional passes). */
    private static boolean[] columns(Storage st, int nx, int ny, int nz) {
        int[] cellStart = st.cellStart;
        boolean[] occ = st.occupied = grow(st.occupied, nx * ny);
        for (int c = 0; c < nx * ny; c++) {
            occ[c] = cellStart[(c + 1) * nz] > cellStart[c * nz];
        }
        boolean[] tmp = st.columnWork = grow(st.columnWork, nx * ny);
        for (int ix = 0; ix < nx; ix++) {
            for (int iy = 0; iy < ny; iy++) {
                boolean any = false;
                for (int j = Math.max(0, iy - NEAR); j <= Math.min(ny - 1, iy + NEAR) && !any; j++) {
                    any = occ[ix * ny + j];
                }
                tmp[ix * ny + iy] = any;
            }
        }
        boolean[] out = grow(st.nearColumn, nx * ny);
        for (int ix = 0; ix < nx; ix++) {
            for (int iy = 0; iy < ny; iy++) {
                boolean any = false;
                for (int i = Math.max(0, ix - NEAR); i <= Math.min(nx - 1, ix + NEAR) && !any; i++) {
                    any = tmp[i * ny + iy];
                }
                out[ix * ny + iy] = any;
            }
        }
        return out;
    }

    /**
     * Squared gaps to the nearest occupied cell: the minimum over offsets of the sum of squared
     * per-axis gaps separates into three one-dimensional minimum passes (z, then y, then x), as
     * in separable distance transforms (e.g. Felzenszwalb &amp; Huttenlocher 2012, Theory of
     * Computing 8, 415), here over offsets of at most {@link #NEAR} cells.
     */
    private static byte[] gaps(Storage st, int nx, int ny, int nz) {
        int[] cellStart = st.cellStart;
        int cells = nx * ny * nz;
        byte[] a = st.gap2 = grow(st.gap2, cells);
        byte[] b = st.gapWork = grow(st.gapWork, cells);
        Arrays.fill(a, 0, cells, FAR);
        for (int c = 0; c < cells; c++) {            // along z: from the occupied cells
            if (cellStart[c + 1] > cellStart[c]) {
                stamp(a, c, 0, c % nz, nz, 1);
            }
        }
        Arrays.fill(b, 0, cells, FAR);
        for (int c = 0; c < cells; c++) {            // along y
            if (a[c] < FAR) {
                stamp(b, c, a[c], (c / nz) % ny, ny, nz);
            }
        }
        Arrays.fill(a, 0, cells, FAR);
        for (int c = 0; c < cells; c++) {            // along x
            if (b[c] < FAR) {
                stamp(a, c, b[c], c / (ny * nz), nx, ny * nz);
            }
        }
        return a;
    }

    /**
     * out[c + d * stride] = min(out[..], v + g(d)^2) for |d| &lt;= NEAR inside the line, g(d) =
     * max(|d| - 1, 0); i is the cell's index along its line of len cells.
     */
    private static void stamp(byte[] out, int c, int v, int i, int len, int stride) {
        for (int d = Math.max(-NEAR, -i); d <= Math.min(NEAR, len - 1 - i); d++) {
            int g = Math.max(Math.abs(d) - 1, 0);
            int k = c + d * stride;
            int w = v + g * g;
            if (w < out[k]) {
                out[k] = (byte) w;
            }
        }
    }

    /**
     * Builds the slice at time tau.
     *
     * @param support the kernel support radius 2h, M
     * @param halfSpacing half the spacing of slices in time, M (largest |t_e - tau|)
     * @param rMax particles beyond this radius are left out (they cannot reach any sample)
     * @return the slice, or null when tau is outside the snapshots or no particle emits
     */
    static EmissionSlice build(EmitterHistory h, Spacetime st, double tau, double support, double halfSpacing,
                               double rMax) {
        return build(h, st, tau, support, halfSpacing, rMax, new Storage());
    }

    /**
     * {@link #build(EmitterHistory, Spacetime, double, double, double, double)} into the arrays of
     * {@code store} (grown where too short); the slice keeps them until it is dropped.
     */
    static EmissionSlice build(EmitterHistory h, Spacetime st, double tau, double support, double halfSpacing,
                               double rMax, Storage store) {
        return build(h, st, tau, support, halfSpacing, rMax, store, true);
    }

    /**
     * @param shortcuts false: the slice keeps its records and cell list only (enough for
     *     {@link #mayReach} and the records; the queries need the column maps and gap field)
     */
    static EmissionSlice build(EmitterHistory h, Spacetime st, double tau, double support, double halfSpacing,
                               double rMax, Storage store, boolean shortcuts) {
        int ns = h.snapshots();
        if (ns < 2 || tau < h.time(0) || tau > h.time(ns - 1)) {
            return null;
        }
        int k = 0;
        int hi = ns - 1;
        while (hi - k > 1) {                       // bisection for t_k <= tau < t_{k+1}
            int mid = (k + hi) >>> 1;
            if (h.time(mid) <= tau) {
                k = mid;
            } else {
                hi = mid;
            }
        }
        final double t0 = h.time(k);
        final double dt = h.time(k + 1) - t0;
        final double s = (tau - t0) / dt;
        final double s2 = s * s, s3 = s2 * s;
        // cubic Hermite basis and its derivative in s
        final double h00 = 2 * s3 - 3 * s2 + 1, h10 = s3 - 2 * s2 + s, h01 = -2 * s3 + 3 * s2, h11 = s3 - s2;
        final double d00 = 6 * s2 - 6 * s, d10 = 3 * s2 - 4 * s + 1, d01 = -6 * s2 + 6 * s, d11 = 3 * s2 - 2 * s;
        final double a2 = st.spin() * st.spin();
        final int n = h.particles();
        float[][] tmp = store.work;
        for (int q = 0; q < tmp.length; q++) {
            tmp[q] = grow(tmp[q], n);
        }
        double[] g = new double[Spacetime.SIZE];
        int m = 0;
        double vmax = 0.0;
        double minX = Double.POSITIVE_INFINITY, minY = minX, minZ = minX;
        double maxX = Double.NEGATIVE_INFINITY, maxY = maxX, maxZ = maxX;
        for (int p = 0; p < n; p++) {
            if (h.state(k, p) != EmitterHistory.ALIVE || h.state(k + 1, p) != EmitterHistory.ALIVE) {
                continue;
            }
            double wgt = (1 - s) * h.weight(k, p) + s * h.weight(k + 1, p);
            if (!(wgt > 0)) {
                continue;
            }
            double ut0 = h.u(k, p, 0), ut1 = h.u(k + 1, p, 0);
            double r0 = h.r(k, p), r1 = h.r(k + 1, p);
            double q0 = h.theta(k, p), q1 = h.theta(k + 1, p);
            double f0 = h.phi(k, p), f1 = h.phi(k + 1, p);
            double dr0 = h.u(k, p, 1) / ut0, dr1 = h.u(k + 1, p, 1) / ut1;
            double dq0 = h.u(k, p, 2) / ut0, dq1 = h.u(k + 1, p, 2) / ut1;
            double df0 = h.u(k, p, 3) / ut0, df1 = h.u(k + 1, p, 3) / ut1;
            // unwrap phi: choose the 2 pi branch nearest to the mean angular velocity times dt
            double jump = f1 - f0 - 0.5 * (df0 + df1) * dt;
            f1 -= 2 * FastMath.PI * Math.rint(jump / (2 * FastMath.PI));   // Math.rint: the same value, an instruction
            double r = h00 * r0 + h10 * dt * dr0 + h01 * r1 + h11 * dt * dr1;
            if (r > rMax) {
                continue;
            }
            double th = h00 * q0 + h10 * dt * dq0 + h01 * q1 + h11 * dt * dq1;
            double ph = h00 * f0 + h10 * dt * df0 + h01 * f1 + h11 * dt * df1;
            double rd = (d00 * r0 + d10 * dt * dr0 + d01 * r1 + d11 * dt * dr1) / dt;
            double thd = (d00 * q0 + d10 * dt * dq0 + d01 * q1 + d11 * dt * dq1) / dt;
            double phd = (d00 * f0 + d10 * dt * df0 + d01 * f1 + d11 * dt * df1) / dt;
            // u^t from the normalisation g_{mu nu} u^mu u^nu = -1 with u^i = u^t dx^i/dt
            st.covariant(r, th, g);
            double norm = g[Spacetime.TT] + 2 * g[Spacetime.TP] * phd + g[Spacetime.PP] * phd * phd
                    + g[Spacetime.RR] * rd * rd + g[Spacetime.HH] * thd * thd;
            double uT = norm < 0 ? 1.0 / FastMath.sqrt(-norm) : (1 - s) * ut0 + s * ut1;
            double sth = Trig.sin(th), cth = Trig.cos(th);
            double sph = Trig.sin(ph), cph = Trig.cos(ph);
            double big = FastMath.sqrt(r * r + a2);
            // Cartesian display map x = sqrt(r^2 + a^2) sin(theta) cos(phi), ... and its time derivative
            double px = big * sth * cph, py = big * sth * sph, pz = r * cth;
            double dBig = r * rd / big;
            double vxx = dBig * sth * cph + big * cth * cph * thd - big * sth * sph * phd;
            double vyy = dBig * sth * sph + big * cth * sph * thd + big * sth * cph * phd;
            double vzz = rd * cth - r * sth * thd;
            vmax = FastMath.max(vmax, FastMath.sqrt(vxx * vxx + vyy * vyy + vzz * vzz));
            tmp[0][m] = (float) px;
            tmp[1][m] = (float) py;
            tmp[2][m] = (float) pz;
            tmp[3][m] = (float) vxx;
            tmp[4][m] = (float) vyy;
            tmp[5][m] = (float) vzz;
            tmp[6][m] = (float) uT;
            tmp[7][m] = (float) (uT * rd);
            tmp[8][m] = (float) (uT * thd);
            tmp[9][m] = (float) (uT * phd);
            // rest-frame density n = rho_coord / (u^t sqrt(-g)) from the number current N^mu = n u^mu
            // (MTW 1973, sect. 22.3); sqrt(-g) = 1 in the Cartesian map for the Kerr-like families
            tmp[10][m] = (float) (wgt / uT);
            tmp[11][m] = (float) (2.0 + h.spectralIndex(p));  // exponent of g in I = int g^(2+alpha) rho dlambda
            minX = FastMath.min(minX, px);
            minY = FastMath.min(minY, py);
            minZ = FastMath.min(minZ, pz);
            maxX = FastMath.max(maxX, px);
            maxY = FastMath.max(maxY, py);
            maxZ = FastMath.max(maxZ, pz);
            m++;
        }
        if (m == 0) {
            return null;
        }
        // search radius: kernel support plus the largest drift within half a slice spacing;
        // cells of half that size: a query box covers about (2.5 R)^3 instead of (3 R)^3 of candidates
        // (measured: cells as wide as R, 3 x 3 columns per query instead of 5 x 5, gained nothing
        // beyond noise)
        double reach = support + vmax * halfSpacing;
        double cell = 0.5 * reach;
        // cap the grid at 96^3 cells; bigger cells only cost more candidates
        double span = FastMath.max(maxX - minX, FastMath.max(maxY - minY, maxZ - minZ));
        cell = FastMath.max(cell, span / 96.0);
        int gx = (int) ((maxX - minX) / cell) + 1;
        int gy = (int) ((maxY - minY) / cell) + 1;
        int gz = (int) ((maxZ - minZ) / cell) + 1;
        int cells = gx * gy * gz;
        int[] cellOf = store.cellOf = grow(store.cellOf, m);
        int[] start = store.cellStart = grow(store.cellStart, cells + 1);
        Arrays.fill(start, 0, cells + 1, 0);
        for (int p = 0; p < m; p++) {
            int cx = FastMath.min(gx - 1, (int) ((tmp[0][p] - minX) / cell));
            int cy = FastMath.min(gy - 1, (int) ((tmp[1][p] - minY) / cell));
            int cz = FastMath.min(gz - 1, (int) ((tmp[2][p] - minZ) / cell));
            int c = (cx * gy + cy) * gz + cz;
            cellOf[p] = c;
            start[c + 1]++;
        }
        for (int c = 0; c < cells; c++) {
            start[c + 1] += start[c];
        }
        int[] fill = store.fill = grow(store.fill, cells);
        Arrays.fill(fill, 0, cells, 0);
        double[] pos = store.pos = grow(store.pos, REC * m);
        float[] att = store.att = grow(store.att, REC * m);
        for (int p = 0; p < m; p++) {              // stable counting sort by cell
            int c = cellOf[p];
            int dst = REC * (start[c] + fill[c]++);
            for (int q = 0; q < REC; q++) {
                pos[dst + q] = tmp[q][p];
                att[dst + q] = tmp[REC + q][p];
            }
        }
        return new EmissionSlice(tau, m, store, minX, minY, minZ, cell, gx, gy, gz, reach, vmax, shortcuts);
    }

    /**
     * Emissivity sum over the particles near a sample: sum_p w_p W(|x - x_p(t_e)|, h) g_p^(2+alpha_p)
     * with x_p(t_e) = x_p(tau) + v_p (t_e - tau). The query of the per-sample reference renderer.
     */
    double emissivity(double sx, double sy, double sz, double dtE, double pr, double pth, double pphi,
                      double invH, double norm, double support2) {
        return query(false, sx, sy, sz, dtE, pr, pth, pphi, invH, norm, support2);
    }

    /**
     * The same sum as {@link #emissivity} (the same particles in the same order, so the same
     * number bit for bit), with exact shortcuts: a sample whose cell is farther than its search
     * radius from every occupied cell ({@link #gap2}) returns at once, and columns of cells whose
     * (x, y) gap from the sample, or whose occupied z range, is beyond the search radius are not
     * visited.
     */
    double emissivityNear(double sx, double sy, double sz, double dtE, double pr, double pth, double pphi,
                          double invH, double norm, double support2) {
        return query(true, sx, sy, sz, dtE, pr, pth, pphi, invH, norm, support2);
    }

    private double query(boolean near, double sx, double sy, double sz, double dtE, double pr, double pth,
                         double pphi, double invH, double norm, double support2) {
        // a particle within the support at t_e is within 2h + vmax |t_e - tau| of the sample at tau
        double rs = Math.sqrt(support2) + vmax * Math.abs(dtE);
        double fx = (sx - ox) * invCell, fy = (sy - oy) * invCell, fz = (sz - oz) * invCell;
        // search radius in cell units, widened by a relative 1e-6 against float/double rounding
        // of the stored positions and velocities (never narrower than needed)
        double rc = rs * invCell * (1.0 + 1e-6) + 1e-6;
        double rc2 = rc * rc;
        int x0 = (int) Math.floor(fx - rc);
        int x1 = (int) Math.floor(fx + rc);
        int y0 = (int) Math.floor(fy - rc);
        int y1 = (int) Math.floor(fy + rc);
        int z0 = (int) Math.floor(fz - rc);
        int z1 = (int) Math.floor(fz + rc);
        if (x1 < 0 || y1 < 0 || z1 < 0 || x0 >= nx || y0 >= ny || z0 >= nz) {
            return 0.0;
        }
        int cx = (int) Math.floor(fx), cy = (int) Math.floor(fy), cz = (int) Math.floor(fz);
        if (cx >= 0 && cy >= 0 && cx < nx && cy < ny && rc < NEAR && (near
                ? cz >= 0 && cz < nz && gap2[(cx * ny + cy) * nz + cz] > rc2
                : !nearColumn[cx * ny + cy])) {
            return 0.0;
        }
        x0 = Math.max(0, x0);
        y0 = Math.max(0, y0);
        z0 = Math.max(0, z0);
        x1 = Math.min(nx - 1, x1);
        y1 = Math.min(ny - 1, y1);
        z1 = Math.min(nz - 1, z1);
        double sum = 0.0;
        for (int ix = x0; ix <= x1; ix++) {
            // gap from the sample to the column's x interval [ix, ix + 1), cell units
            double gx = ix > fx ? ix - fx : fx - (ix + 1) > 0 ? fx - (ix + 1) : 0.0;
            double gx2 = gx * gx;
            for (int iy = y0; iy <= y1; iy++) {
                int col = ix * ny + iy;
                int za = z0, zb = z1;
                if (near) {
                    double gy = iy > fy ? iy - fy : fy - (iy + 1) > 0 ? fy - (iy + 1) : 0.0;
                    int lo = zLo[col], hi = zHi[col];
                    // gap from the sample to the column's occupied z cells [lo, hi + 1)
                    double gz = lo > fz ? lo - fz : fz - (hi + 1) > 0 ? fz - (hi + 1) : 0.0;
                    if (lo > z1 || hi < z0 || gx2 + gy * gy + gz * gz > rc2) {
                        continue;
                    }
                    za = Math.max(z0, lo);
                    zb = Math.min(z1, hi);
                }
                // cells along z are contiguous
                int base = col * nz;
                sum = sumCells(sum, cellStart[base + za], cellStart[base + zb + 1], sx, sy, sz, dtE, pr, pth, pphi,
                        invH, norm, support2);
            }
        }
        return sum;
    }

    /**
     * @return true when some particle of the slice may lie within the reach of a sample in the box
     * [x0, x1] x [y0, y1] x [z0, z1] (conservative: widened by 1e-3 relative and 1e-2 cells; exact
     * when false, since every sample query then visits only empty cells)
     */
    boolean mayReach(double x0, double y0, double z0, double x1, double y1, double z1) {
        double r = reach * invCell * 1.001 + 0.01;
        int a0 = FastMath.max(0, (int) FastMath.floor((x0 - ox) * invCell - r));
        int a1 = FastMath.min(nx - 1, (int) FastMath.floor((x1 - ox) * invCell + r));
        int b0 = FastMath.max(0, (int) FastMath.floor((y0 - oy) * invCell - r));
        int b1 = FastMath.min(ny - 1, (int) FastMath.floor((y1 - oy) * invCell + r));
        int c0 = FastMath.max(0, (int) FastMath.floor((z0 - oz) * invCell - r));
        int c1 = FastMath.min(nz - 1, (int) FastMath.floor((z1 - oz) * invCell + r));
        for (int ix = a0; ix <= a1; ix++) {
            for (int iy = b0; iy <= b1; iy++) {
                int base = (ix * ny + iy) * nz;
                if (c0 <= c1 && cellStart[base + c1 + 1] > cellStart[base + c0]) {
                    return true;
                }
            }
        }
        return false;
    }

    /**
     * The kernel sum straight from its definition, over every particle of the slice with no cell
     * list (in record order, so the same number as the queries bit for bit): what the queries
     * and their shortcuts are checked against.
     */
    double emissivityAllParticles(double sx, double sy, double sz, double dtE, double pr, double pth, double pphi,
                                  double invH, double norm, double support2) {
        return sumCells(0.0, 0, count, sx, sy, sz, dtE, pr, pth, pphi, invH, norm, support2);
    }

    /** @return sum plus the kernel sum over the particle records from..to-1 (contiguous cells along z) */
    private double sumCells(double sum, int from, int to, double sx, double sy, double sz, double dtE, double pr,
                            double pth, double pphi, double invH, double norm, double support2) {
        for (int p = from; p < to; p++) {
            int q = REC * p;
            double ddx = sx - (pos[q] + pos[q + 3] * dtE);
            double ddy = sy - (pos[q + 1] + pos[q + 4] * dtE);
            double ddz = sz - (pos[q + 2] + pos[q + 5] * dtE);
            double d2 = ddx * ddx + ddy * ddy + ddz * ddz;
            if (d2 >= support2) {
                continue;
            }
            double gInv = Redshift.inverse(pr, pth, pphi, att[q], att[q + 1], att[q + 2], att[q + 3]);
            if (!(gInv > 0)) {
                continue;
            }
            double e = att[q + 5];
            // g^(2+alpha); the common alpha = 1 (e = 3) avoids pow
            double gp = e == 3.0 ? 1.0 / (gInv * gInv * gInv) : FastMath.pow(gInv, -e);
            sum += att[q + 4] * Kernel.w(d2, invH, norm) * gp;
        }
        return sum;
    }
}
