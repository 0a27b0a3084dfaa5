package org.spindrift.sim.light;

import java.util.Arrays;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.history.Chunked;
import org.spindrift.sim.spacetime.Trig;

/**
 * Where emission can possibly come from: a uniform grid over the cube [-R, R]^3 whose cells are
 * marked when any alive particle is in them at any snapshot, dilated by the kernel support plus
 * the largest drift between snapshots; and, for every cell, the Chebyshev (L-infinity) distance in
 * cells to the nearest marked cell, from a breadth-first sweep over the 26 neighbours, which gives
 * the dilation. Rays keep samples only where gas may be (empty-space skipping, common practice in
 * volume rendering, no source); the L-infinity dilation contains the Euclidean one.
 */
public final class EmissionMask {
    private final double half;
    private final double cell;
    private final double inv;
    private final int n;
    private final short[] dist;
    /** Cartesian distance from the centre of the nearest and farthest point of an occupied cell, M */
    private final double inner, outer;
    /** largest |z| of an occupied cell, M */
    private final double zMax;

    private EmissionMask(double half, double cell, int n, short[] dist) {
        this.half = half;
        this.cell = cell;
        this.inv = 1.0 / cell;
        this.n = n;
        this.dist = dist;
        double in = Double.POSITIVE_INFINITY, out = 0.0, zm = 0.0;
        for (int ix = 0; ix < n; ix++) {
            for (int iy = 0; iy < n; iy++) {
                for (int iz = 0; iz < n; iz++) {
                    if (dist[(ix * n + iy) * n + iz] != 0) {
                        continue;
                    }
                    double x0 = ix * cell - half, y0 = iy * cell - half, z0 = iz * cell - half;
                    double nx = near(x0, cell), ny = near(y0, cell), nz = near(z0, cell);
                    double fx = Math.max(Math.abs(x0), Math.abs(x0 + cell));
                    double fy = Math.max(Math.abs(y0), Math.abs(y0 + cell));
                    double fz = Math.max(Math.abs(z0), Math.abs(z0 + cell));
                    in = Math.min(in, Math.sqrt(nx * nx + ny * ny + nz * nz));
                    out = Math.max(out, Math.sqrt(fx * fx + fy * fy + fz * fz));
                    zm = Math.max(zm, fz);
                }
            }
        }
        // widened by a millionth of a cell against the rounding of the cell index in occupied()
        double eps = 1.0e-6 * cell;
        this.inner = Math.max(0.0, in - eps);
        this.outer = out + eps;
        this.zMax = zm + eps;
    }

    /** @return distance from 0 of the nearest point of [lo, lo + w] */
    private static double near(double lo, double w) {
        return lo > 0 ? lo : lo + w < 0 ? -(lo + w) : 0.0;
    }

    /** @return the Cartesian distance from the centre below which no cell is occupied, M (quick rejection) */
    public double innerRadius() {
        return inner;
    }

    /** @return the Cartesian distance from the centre beyond which no cell is occupied, M */
    public double outerRadius() {
        return outer;
    }

    /** @return the largest |z| of an occupied cell, M */
    public double maxHeight() {
        return zMax;
    }

    /**
     * @param radius half-width R of the cube, M
     * @param support kernel support 2h plus any extra dilation, M
     */
    public static EmissionMask of(EmitterHistory h, double spin, double radius, double support) {
        return of(h, spin, radius, support, 1);
    }

    /**
     * As {@link #of(EmitterHistory, double, double, double)} on the given number of threads (the
     * snapshots in fixed chunks; marks are set, never cleared, and the speed bound is a maximum, so
     * the mask is the same for any thread count).
     */
    public static EmissionMask of(EmitterHistory h, double spin, double radius, double support, int threads) {
        int n = (int) FastMath.min(160, FastMath.max(16, FastMath.ceil(2 * radius / 0.25)));
        double cell = 2 * radius / n;
        boolean[] mark = new boolean[n * n * n];
        double a2 = spin * spin;
        int ns = h.snapshots();
        int chunks = Math.min(ns, 64);
        double[] vmaxOf = new double[chunks];
        Chunked.forEach(chunks, threads, c -> {
            double vmax = 0;
            for (int s = Chunked.start(c, chunks, ns); s < Chunked.start(c + 1, chunks, ns); s++) {
                for (int p = 0; p < h.particles(); p++) {
                    if (h.state(s, p) != EmitterHistory.ALIVE) {
                        continue;
                    }
                    double r = h.r(s, p), th = h.theta(s, p), ph = h.phi(s, p);
                    // Trig: StrictMath's values without JNI or FastMath's allocation (millions of calls)
                    double rho = FastMath.sqrt(r * r + a2) * Trig.sin(th);
                    int ix = (int) FastMath.floor((rho * Trig.cos(ph) + radius) / cell);
                    int iy = (int) FastMath.floor((rho * Trig.sin(ph) + radius) / cell);
                    int iz = (int) FastMath.floor((r * Trig.cos(th) + radius) / cell);
                    if (ix >= 0 && iy >= 0 && iz >= 0 && ix < n && iy < n && iz < n) {
                        mark[(ix * n + iy) * n + iz] = true;
                    }
                    double ut = h.u(s, p, 0);
                    double v = (FastMath.abs(h.u(s, p, 1)) + r * (FastMath.abs(h.u(s, p, 2)) + FastMath.abs(h.u(s, p, 3))))
                            / ut;
                    vmax = FastMath.max(vmax, v);
                }
            }
            vmaxOf[c] = vmax;
        });
        double vmax = 0;
        for (double v : vmaxOf) {
            vmax = FastMath.max(vmax, v);
        }
        double dt = 0;
        for (int s = 1; s < h.snapshots(); s++) {
            dt = FastMath.max(dt, h.time(s) - h.time(s - 1));
        }
        // a particle is within v dt / 2 of a snapshot position at any time between snapshots
        double dilation = support + 0.5 * vmax * dt + cell;
        short[] d = distances(mark, n);
        int cells = (int) FastMath.ceil(dilation / cell);
        for (int i = 0; i < d.length; i++) {
            d[i] = (short) FastMath.max(0, d[i] - cells);
        }
        return new EmissionMask(radius, cell, n, d);
    }

    /** Breadth-first L-infinity distance (in cells, capped at 30000) to the nearest marked cell. */
    private static short[] distances(boolean[] mark, int n) {
        short[] d = new short[mark.length];
        Arrays.fill(d, Short.MAX_VALUE);
        int[] queue = new int[mark.length];
        int head = 0, tail = 0;
        for (int i = 0; i < mark.length; i++) {
            if (mark[i]) {
                d[i] = 0;
                queue[tail++] = i;
            }
        }
        while (head < tail) {
            int c = queue[head++];
            int ix = c / (n * n), iy = (c / n) % n, iz = c % n;
            short next = (short) FastMath.min(30000, d[c] + 1);
            for (int dx = -1; dx <= 1; dx++) {
                for (int dy = -1; dy <= 1; dy++) {
                    for (int dz = -1; dz <= 1; dz++) {
                        int jx = ix + dx, jy = iy + dy, jz = iz + dz;
                        if (jx < 0 || jy < 0 || jz < 0 || jx >= n || jy >= n || jz >= n) {
                            continue;
                        }
                        int j = (jx * n + jy) * n + jz;
                        if (d[j] > next) {
                            d[j] = next;
                            queue[tail++] = j;
                        }
                    }
                }
            }
        }
        return d;
    }

    /** @return true when the point may hold emission */
    public boolean occupied(double x, double y, double z) {
        int ix = (int) FastMath.floor((x + half) * inv);
        int iy = (int) FastMath.floor((y + half) * inv);
        int iz = (int) FastMath.floor((z + half) * inv);
        if (ix < 0 || iy < 0 || iz < 0 || ix >= n || iy >= n || iz >= n) {
            return false;
        }
        return dist[(ix * n + iy) * n + iz] == 0;
    }

    /** @return the half-width R of the cube, M */
    public double radius() {
        return half;
    }

    /** @return the cell size, M */
    public double cellSize() {
        return cell;
    }

    /** @return the fraction of cells that may hold emission */
    public double filling() {
        int c = 0;
        for (short v : dist) {
            if (v == 0) {
                c++;
            }
        }
        return c / (double) dist.length;
    }
}
