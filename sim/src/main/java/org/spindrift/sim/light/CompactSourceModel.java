package org.spindrift.sim.light;

import java.util.Arrays;
import java.util.function.DoubleUnaryOperator;
import org.hipparchus.util.FastMath;

/**
 * A fast light model of compact sources, for fitting: each source is a small Gaussian blob about
 * its centre's geodesic ({@link CentreTrack}); its sky images (primary, secondary and higher, with
 * their positions, magnifications, redshifts and delays) come from the ray table's samples that
 * pass through the blob, without rendering images. For an observer time t_o every sample with
 * delay d sees the blob at emission time t_e = t_o - d; its emission is, as in
 * {@link EmissionRenderer}, I = sum g^(2+alpha) n d(lambda) over the samples of a pixel, with the
 * emitter-frame density n = w f(t_e) / u^t x G(|x - x_c(t_e)|) (weight, flare envelope, the centre's
 * u^t) and g from {@link Redshift}. Flux and centroid are the image moments of
 * {@link FrameMoments} (pixel centres, pixel area), the steady source and the frame grid are
 * {@link LightStage}'s, and data epochs are read off the frames by the same linear interpolation as
 * the mock data of a run.
 *
 * <p>G is a normalised 3-D Gaussian of variance sigma^2 + 0.3 h^2 per axis: the spot's Gaussian
 * ball convolved with the renderer's cubic-spline kernel of smoothing length h, whose per-axis
 * variance is 0.3 h^2 (second moment of the M4 kernel of Monaghan &amp; Lattanzio 1985, integrated
 * here: <r^2> = 0.9 h^2), cut at 4 sigma (a 3-D Gaussian keeps 99.9 % of its mass there).
 *
 * <p>The table is traced once at position angle 0: another position angle rotates the sky
 * offsets ({@link Camera#east}, {@link Camera#north}); mass and distance only rescale the angles
 * and times, so they never need a new table. Samples are kept in cells of a cubic grid, sorted by
 * delay within each cell; a frame visits the emission times of its delay window in steps short
 * enough that the blob moves at most a quarter cell, and in each step only the cells near the
 * blob and the samples whose delay maps into that step; within a step the centre is the
 * second-order expansion of its track about mid-step ({@link CentreTrack#expansion}). One instance
 * per thread (scratch buffers, sized once per table); {@link Index} is shared read-only.
 * Evaluation allocates only its result arrays.
 */
public final class CompactSourceModel {
    /** Gaussian cut-off in standard deviations. */
    public static final double CUT_SIGMAS = 4.0;
    /** Per-axis variance of the cubic-spline kernel in units of h^2 (see the class comment). */
    public static final double KERNEL_VARIANCE = 0.3;

    /**
     * A ray table prepared for compact sources.
     */
    public static final class Index {
        final RayTable table;
        final Camera camera;
        final int m;
        final float[] x, y, z, d, pr, pth, pph, dl, east, north;
        final int[] cellStart;
        final double lo, cell, inv;
        final int n;
        final double dmin, dmax;
        final float[] byDelay, rByDelay;
        final double area;
        final double smoothing;

        /**
         * @param table a ray table traced with a camera at position angle 0
         * @param cell cell size of the sample grid, M (about the largest blob cut-off radius)
         */
        public Index(RayTable table, double cell) {
            this.table = table;
            this.camera = table.camera();
            this.smoothing = LightStage.smoothingLength(camera);
            this.area = camera.pixelSize() * camera.pixelSize();
            m = table.samples();
            double half = 0;
            for (int i = 0; i < m; i++) {
                half = FastMath.max(half, FastMath.max(FastMath.abs(table.x[i]),
                        FastMath.max(FastMath.abs(table.y[i]), FastMath.abs(table.z[i]))));
            }
            half += 1e-6;
            int cells = (int) FastMath.min(160, FastMath.max(1, FastMath.ceil(2 * half / cell)));
            this.n = cells;
            this.lo = -half;
            this.cell = 2 * half / cells;
            this.inv = 1.0 / this.cell;
            int[] owner = new int[m];
            for (int k = 0; k < table.rays(); k++) {
                Arrays.fill(owner, table.firstSample(k), table.endSample(k), k);
            }
            // sort indices by (cell, delay): pack the cell and an order-preserving delay key
            Integer[] order = new Integer[m];
            for (int i = 0; i < m; i++) {
                order[i] = i;
            }
            final float[] del = table.delay;
            Arrays.sort(order, (a, b) -> {
                int c = Long.compare(cellOf(table.x[a], table.y[a], table.z[a]), cellOf(table.x[b], table.y[b], table.z[b]));
                if (c != 0) {
                    return c;
                }
                c = Float.compare(del[a], del[b]);
                return c != 0 ? c : Integer.compare(a, b);
            });
            x = new float[m];
            y = new float[m];
            z = new float[m];
            d = new float[m];
            pr = new float[m];
            pth = new float[m];
            pph = new float[m];
            dl = new float[m];
            east = new float[m];
            north = new float[m];
            cellStart = new int[n * n * n + 1];
            int pixels = camera.pixels();
            double dLo = Double.POSITIVE_INFINITY, dHi = Double.NEGATIVE_INFINITY;
            for (int j = 0; j < m; j++) {
                int i = order[j];
                x[j] = table.x[i];
                y[j] = table.y[i];
                z[j] = table.z[i];
                d[j] = table.delay[i];
                pr[j] = table.pr[i];
                pth[j] = table.pth[i];
                pph[j] = table.pph[i];
                dl[j] = table.dl[i];
                int k = owner[i];
                east[j] = (float) camera.skyX(k % pixels);
                north[j] = (float) camera.skyY(k / pixels);
                cellStart[(int) cellOf(x[j], y[j], z[j]) + 1]++;
                dLo = FastMath.min(dLo, d[j]);
                dHi = FastMath.max(dHi, d[j]);
            }
            for (int c = 0; c < n * n * n; c++) {
                cellStart[c + 1] += cellStart[c];
            }
            double[] range = table.delayRange();
            dmin = range[0];
            dmax = range[1];
            // delays sorted, with the radius of each sample, for the frame-grid quantiles
            long[] dk = new long[m];
            for (int i = 0; i < m; i++) {
                dk[i] = ((long) sortable(table.delay[i]) << 32) | i;
            }
            Arrays.sort(dk);
            byDelay = new float[m];
            rByDelay = new float[m];
            for (int j = 0; j < m; j++) {
                int i = (int) (dk[j] & 0xffffffffL);
                byDelay[j] = table.delay[i];
                rByDelay[j] = (float) FastMath.sqrt(table.x[i] * table.x[i] + table.y[i] * table.y[i]
                        + table.z[i] * table.z[i]);
            }
        }

        private long cellOf(double px, double py, double pz) {
            int ix = clamp((int) ((px - lo) * inv));
            int iy = clamp((int) ((py - lo) * inv));
            int iz = clamp((int) ((pz - lo) * inv));
            return (ix * (long) n + iy) * n + iz;
        }

        private int clamp(int i) {
            return FastMath.max(0, FastMath.min(n - 1, i));
        }

        /** @return the ray table */
        public RayTable table() {
            return table;
        }

        /** @return the kernel smoothing length of a run with this table, M */
        public double smoothingLength() {
            return smoothing;
        }

        /**
         * The same quantiles as {@link RayTable#delayQuantiles} (delays of the samples with
         * radius in [rLo, rHi]) from the delay-sorted copy, without sorting.
         */
        double[] delayQuantiles(double rLo, double rHi, double qLo, double qHi) {
            int count = 0;
            for (int j = 0; j < m; j++) {
                if (rByDelay[j] >= rLo && rByDelay[j] <= rHi) {
                    count++;
                }
            }
            if (count == 0) {
                return new double[] {dmin, dmax};
            }
            int a = (int) FastMath.floor(qLo * (count - 1));
            int b = (int) FastMath.ceil(qHi * (count - 1));
            double va = Double.NaN, vb = Double.NaN;
            int seen = 0;
            for (int j = 0; j < m && Double.isNaN(vb); j++) {
                if (rByDelay[j] >= rLo && rByDelay[j] <= rHi) {
                    if (seen == a) {
                        va = byDelay[j];
                    }
                    if (seen == b) {
                        vb = byDelay[j];
                    }
                    seen++;
                }
            }
            return new double[] {va, vb};
        }

        /** @return the smallest and largest delay of the samples with radius in [rLo, rHi] ({dmin, dmax} when none) */
        double[] delayRange(double rLo, double rHi) {
            double lo = Double.NaN, hi = Double.NaN;
            for (int j = 0; j < m; j++) {
                if (rByDelay[j] >= rLo && rByDelay[j] <= rHi) {
                    lo = byDelay[j];
                    break;
                }
            }
            for (int j = m - 1; j >= 0; j--) {
                if (rByDelay[j] >= rLo && rByDelay[j] <= rHi) {
                    hi = byDelay[j];
                    break;
                }
            }
            return Double.isNaN(lo) ? new double[] {dmin, dmax} : new double[] {lo, hi};
        }

        private static int sortable(float f) {
            int b = Float.floatToIntBits(f);
            return b >= 0 ? b : b ^ 0x7fffffff;
        }
    }

    /**
     * One compact source.
     *
     * @param sigmaM Gaussian size of the source per axis, M (before the kernel is added)
     * @param weight emission weight
     * @param flare flare envelope against emitter time (M), peak 1
     */
    public record Spot(double sigmaM, double weight, DoubleUnaryOperator flare) {
    }

    /**
     * The model's frames.
     *
     * @param timesM observer times, M (the run's frame grid)
     * @param flux flare flux per frame (units of the run's light curve)
     * @param x centroid east offset without the steady source, M (NaN without flux), and y north
     * @param steadyX centroid with the steady source, M, and steadyY
     * @param steadyFlux the steady source's flux
     * @param coveredFrom first fully covered observer time, M (and coveredTo the last)
     */
    public record Frames(double[] timesM, double[] flux, double[] x, double[] y, double[] steadyX, double[] steadyY,
                         double steadyFlux, double coveredFrom, double coveredTo) {
        /** @return flux with the steady source, linearly interpolated at observer time t (M), as mock data are */
        public double fluxWithSteadyAt(double t) {
            return LightStage.interpolate(timesM, flux, t) + steadyFlux;
        }

        /** @return the east offset with the steady source at t (M), linearly interpolated */
        public double xAt(double t) {
            return LightStage.interpolate(timesM, steadyX, t);
        }

        /** @return the north offset with the steady source at t (M), linearly interpolated */
        public double yAt(double t) {
            return LightStage.interpolate(timesM, steadyY, t);
        }
    }

    private final double[] c = new double[17];
    private final double[] cs = new double[7];
    /**
     * Per cell of the last index: the first sample above the previous step's delay window, valid
     * while {@link #stamp} holds the current (frame, source) pass (steps are walked towards larger
     * delays, so a cell's position only moves forward and one binary search per pass suffices).
     */
    private int[] cursor = new int[0];
    private int[] stamp = new int[0];
    private int pass;
    private Index stamped;
    /** Delay quantiles of the last radial range (the frame grid while the orbit's radii do not change). */
    private double qLo = Double.NaN, qHi = Double.NaN;
    private double[] lastQ;
    private Index quantiled;

    /**
     * Frames of the sources on the run's frame grid.
     *
     * @param index the table (position angle 0)
     * @param track the centres' geodesics, from t = 0 to the run's duration
     * @param spots one per source of the track
     * @param positionAngleDeg position angle of the projected spin axis, deg
     * @param frameCadenceM frame cadence, M
     * @param steadyRatio steady point-source flux over the mean flare flux
     */
    public Frames frames(Index index, CentreTrack track, Spot[] spots, double positionAngleDeg, double frameCadenceM,
                         double steadyRatio) {
        double h = index.smoothing;
        double[] rr = track.radialRange();
        double spread = 0;
        for (Spot s : spots) {
            spread = FastMath.max(spread, 3.0 * s.sigmaM());
        }
        double lo = rr[0] - spread - 2 * h, hi = rr[1] + spread + 2 * h;
        if (quantiled != index || lo != qLo || hi != qHi) {
            lastQ = index.delayQuantiles(lo, hi, 0.02, 0.98);
            quantiled = index;
            qLo = lo;
            qHi = hi;
        }
        double[] q = lastQ;
        return frames(index, track, spots, positionAngleDeg, LightStage.frameTimes(track, q, frameCadenceM), steadyRatio);
    }

    /**
     * Frames of the sources at given observer times (M), for example a run's own frame times.
     *
     * @see #frames(Index, CentreTrack, Spot[], double, double, double)
     */
    public Frames frames(Index index, CentreTrack track, Spot[] spots, double positionAngleDeg, double[] times,
                         double steadyRatio) {
        double h = index.smoothing;
        int nf = times.length;
        double[] flux = new double[nf], fx = new double[nf], fy = new double[nf];
        double[] sig2 = new double[spots.length], cut2 = new double[spots.length], norm = new double[spots.length];
        double cutMax = 0;
        for (int k = 0; k < spots.length; k++) {
            double s2 = spots[k].sigmaM() * spots[k].sigmaM() + KERNEL_VARIANCE * h * h;
            sig2[k] = s2;
            cut2[k] = CUT_SIGMAS * CUT_SIGMAS * s2;
            cutMax = FastMath.max(cutMax, CUT_SIGMAS * FastMath.sqrt(s2));
            // normalised 3-D Gaussian (2 pi sigma^2)^(-3/2)
            norm[k] = FastMath.pow(2 * FastMath.PI * s2, -1.5);
        }
        // only samples within reach of the centres' radial range can see a blob: their delays bound the window
        double[] rr = track.radialRange();
        double[] near = index.delayRange(rr[0] - cutMax - 1e-3, rr[1] + cutMax + 1e-3);
        double v = FastMath.max(1e-3, track.maxSpeed());
        double step = FastMath.max(1e-3, 0.5 * index.cell / v);   // the blob moves at most a quarter cell per half step
        double tEnd = track.time(track.snapshots() - 1);
        int cells = index.cellStart.length - 1;
        if (stamped != index) {
            if (cursor.length < cells) {
                cursor = new int[cells];
                stamp = new int[cells];
            }
            java.util.Arrays.fill(stamp, 0);
            pass = 0;
            stamped = index;
        }
        for (int f = 0; f < nf; f++) {
            double to = times[f];
            double e0 = FastMath.max(0.0, to - near[1]);
            double e1 = FastMath.min(tEnd, to - near[0]);
            if (!(e1 > e0)) {
                continue;
            }
            int steps = (int) FastMath.ceil((e1 - e0) / step);
            double sf = 0, sx = 0, sy = 0;
            for (int k = 0; k < spots.length; k++) {
                if (++pass == Integer.MAX_VALUE) {
                    java.util.Arrays.fill(stamp, 0);
                    pass = 1;
                }
                // towards larger delays (earlier emission): each cell's first sample above the window only moves forward
                for (int j = steps - 1; j >= 0; j--) {
                    double a = e0 + j * step;
                    double b = j == steps - 1 ? e1 : a + step;
                    double mid = 0.5 * (a + b);
                    if (!track.expansion(k, mid, c)) {
                        continue;
                    }
                    // alive through the step: the centre from its expansion about mid-step, else per sample
                    boolean smooth = track.aliveThrough(k, a, b);
                    // samples whose delay maps into [a, b): d in (to - b, to - a]
                    double reach = FastMath.sqrt(cut2[k]) + v * 0.5 * (b - a) + 1e-6;
                    double reach2 = reach * reach;
                    int x0 = index.clamp((int) FastMath.floor((c[0] - reach - index.lo) * index.inv));
                    int x1 = index.clamp((int) FastMath.floor((c[0] + reach - index.lo) * index.inv));
                    int y0 = index.clamp((int) FastMath.floor((c[1] - reach - index.lo) * index.inv));
                    int y1 = index.clamp((int) FastMath.floor((c[1] + reach - index.lo) * index.inv));
                    int z0 = index.clamp((int) FastMath.floor((c[2] - reach - index.lo) * index.inv));
                    int z1 = index.clamp((int) FastMath.floor((c[2] + reach - index.lo) * index.inv));
                    double dLo = to - b, dHi = to - a;
                    for (int ix = x0; ix <= x1; ix++) {
                        for (int iy = y0; iy <= y1; iy++) {
                            for (int iz = z0; iz <= z1; iz++) {
                                int cellIdx = (ix * index.n + iy) * index.n + iz;
                                int from = index.cellStart[cellIdx], until = index.cellStart[cellIdx + 1];
                                if (from == until) {
                                    continue;
                                }
                                int i;
                                if (stamp[cellIdx] == pass) {
                                    i = cursor[cellIdx];
                                    while (i < until && index.d[i] <= dLo) {
                                        i++;
                                    }
                                } else {
                                    i = firstAbove(index.d, from, until, dLo);
                                    stamp[cellIdx] = pass;
                                }
                                for (; i < until && index.d[i] <= dHi; i++) {
                                    // cheap test against the blob at mid-step before interpolating at t_e
                                    double qx = index.x[i] - c[0], qy = index.y[i] - c[1], qz = index.z[i] - c[2];
                                    if (qx * qx + qy * qy + qz * qz > reach2) {
                                        continue;
                                    }
                                    double te = to - index.d[i];
                                    double ddx, ddy, ddz;
                                    double dt = te - mid;
                                    if (smooth) {
                                        ddx = index.x[i] - (c[0] + dt * (c[3] + 0.5 * dt * c[6]));
                                        ddy = index.y[i] - (c[1] + dt * (c[4] + 0.5 * dt * c[7]));
                                        ddz = index.z[i] - (c[2] + dt * (c[5] + 0.5 * dt * c[8]));
                                    } else {
                                        if (!track.at(k, te, cs)) {
                                            continue;
                                        }
                                        ddx = index.x[i] - cs[0];
                                        ddy = index.y[i] - cs[1];
                                        ddz = index.z[i] - cs[2];
                                    }
                                    double d2 = ddx * ddx + ddy * ddy + ddz * ddz;
                                    if (d2 >= cut2[k]) {
                                        continue;
                                    }
                                    if (smooth) {
                                        cs[3] = c[9] + dt * c[13];
                                        cs[4] = c[10] + dt * c[14];
                                        cs[5] = c[11] + dt * c[15];
                                        cs[6] = c[12] + dt * c[16];
                                    }
                                    double gInv = Redshift.inverse(index.pr[i], index.pth[i], index.pph[i], cs[3], cs[4],
                                            cs[5], cs[6]);
                                    if (!(gInv > 0)) {
                                        continue;
                                    }
                                    double e = 2.0 + track.spectralIndex(k);
                                    double gp = e == 3.0 ? 1.0 / (gInv * gInv * gInv) : FastMath.pow(gInv, -e);
                                    // emitter-frame density: weight x envelope / u^t (MTW 1973, sect. 22.3), Gaussian profile
                                    double dens = spots[k].weight() * spots[k].flare().applyAsDouble(te) / cs[3] * norm[k]
                                            * FastMath.exp(-0.5 * d2 / sig2[k]);
                                    double val = index.dl[i] * dens * gp;
                                    sf += val;
                                    sx += val * index.east[i];
                                    sy += val * index.north[i];
                                }
                                cursor[cellIdx] = i;
                            }
                        }
                    }
                }
            }
            // pixel values are float in the renderer's images; the moments use double sums
            flux[f] = sf * index.area;
            double e0s = sf > 0 ? sx / sf : Double.NaN, n0s = sf > 0 ? sy / sf : Double.NaN;
            // sky offsets of a PA = 0 screen point: alpha = -east0, beta = north0; rotate to the position angle
            fx[f] = e0s;
            fy[f] = n0s;
        }
        Camera pa = new Camera(FastMath.toDegrees(index.camera.inclination()), positionAngleDeg,
                index.camera.fieldOfView(), index.camera.pixels(), index.camera.distance());
        for (int f = 0; f < nf; f++) {
            double al = -fx[f], be = fy[f];
            fx[f] = pa.east(al, be);
            fy[f] = pa.north(al, be);
        }
        double coveredFrom = track.time(0) + index.dmax;
        double coveredTo = tEnd + index.dmin;
        double fs = steadyRatio * LightStage.meanCoveredFlux(times, flux, coveredFrom, coveredTo);
        double[] sxo = new double[nf], syo = new double[nf];
        LightStage.withSteadySource(flux, fx, fy, fs, sxo, syo);
        return new Frames(times, flux, fx, fy, sxo, syo, fs, coveredFrom, coveredTo);
    }

    /** @return the first index in [from, until) whose value is above v (values sorted) */
    private static int firstAbove(float[] a, int from, int until, double v) {
        int lo = from, hi = until;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] <= v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
