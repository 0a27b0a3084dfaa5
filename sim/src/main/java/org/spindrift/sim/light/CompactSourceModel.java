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
 * <p>A spot on a circular equatorial orbit with the run's shear velocity model is sheared as its
 * members are: its Gaussian lives in curvilinear offsets from the centre (radial, along the orbit,
 * vertical), with the azimuthal offset growing linearly with the radial one ({@link #shearRate}).
 * Such a spot (which shears into an arc and then a ring) is summed from the table's samples binned
 * once about its orbit ({@link RingProfile}: per bin of radius, orbital phase and delay, the
 * frame-independent weight and mean position), so a frame costs a pass over a few thousand bins
 * instead of every sample of the annulus; other spots (unsheared, or on non-circular orbits) are
 * summed sample by sample as below. The flare envelope is linear within each emission-time step
 * (as a run's weights are between snapshots). The table's stretched pixels are refined so that
 * neighbouring sub-rays pass the emission region at most about one blob width apart
 * ({@link #refinement}): a thin, demagnified image sampled more coarsely than that is summed badly.
 *
 * <p>The table is traced once at position angle 0: another position angle rotates the sky
 * offsets ({@link Camera#east}, {@link Camera#north}); mass and distance only rescale the angles
 * and times, so they never need a new table. Samples are kept in cells of a cubic grid, sorted by
 * delay within each cell; a frame visits the emission times of its delay window in steps short
 * enough that the blob moves at most a quarter cell, and in each step only the cells near the
 * blob and the samples whose delay maps into that step; within a step the centre is the
 * second-order expansion of its track about mid-step ({@link CentreTrack#expansion}).
 *
 * <p>Threads: one instance per worker thread (it holds scratch buffers and the binned samples,
 * sized once per table and reused); {@link Index} is shared read-only. Results do not depend on
 * which instance computed them: the bins are laid on fixed grids and never depend on the orbits
 * summed before. An evaluation allocates only its result arrays and a few small ones.
 */
public final class CompactSourceModel {
    /** Gaussian cut-off in standard deviations. */
    public static final double CUT_SIGMAS = 4.0;
    /** Per-axis variance of the cubic-spline kernel in units of h^2 (see the class comment). */
    public static final double KERNEL_VARIANCE = 0.3;
    private static final double TWO_PI = 2 * FastMath.PI;
    private static final double INV_TWO_PI_15 = FastMath.pow(2 * FastMath.PI, -1.5);
    /** Width of the radius bins of the delay quantiles, M. */
    static final double R_BIN = 0.25;

    /**
     * A ray table prepared for compact sources.
     */
    public static final class Index {
        final RayTable table;
        final Camera camera;
        final int m;
        final float[] x, y, z, d, pr, pth, pph, dl, east, north;
        /** Cylindrical radius of each sample (for sheared spots). */
        final double[] rho;
        final int[] cellStart;
        final double lo, cell, inv;
        final int n;
        final double dmin, dmax;
        /** Radius bins of width R_BIN: samples by bin, delay-sorted within a bin (delays and radii). */
        final float[] dByR, rByR;
        final int[] rStart;
        final int rBins;
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
            // order the samples by (cell, delay, index): a counting pass by cell, then each cell's samples
            // sorted by an order-preserving delay key packed with the index
            int cellsTotal = cells * cells * cells;
            int[] cellOfSample = new int[m];
            int[] cellFrom = new int[cellsTotal + 1];
            for (int i = 0; i < m; i++) {
                int ci = (int) cellOf(table.x[i], table.y[i], table.z[i]);
                cellOfSample[i] = ci;
                cellFrom[ci + 1]++;
            }
            for (int ci = 0; ci < cellsTotal; ci++) {
                cellFrom[ci + 1] += cellFrom[ci];
            }
            long[] keys = new long[m];
            int[] next = Arrays.copyOf(cellFrom, cellsTotal);
            for (int i = 0; i < m; i++) {
                keys[next[cellOfSample[i]]++] = ((long) sortable(table.delay[i]) << 32) | i;
            }
            for (int ci = 0; ci < cellsTotal; ci++) {
                if (cellFrom[ci + 1] - cellFrom[ci] > 1) {
                    Arrays.sort(keys, cellFrom[ci], cellFrom[ci + 1]);
                }
            }
            int[] order = new int[m];
            for (int j = 0; j < m; j++) {
                order[j] = (int) (keys[j] & 0xffffffffL);
            }
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
            rho = new double[m];
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
                rho[j] = FastMath.sqrt((double) x[j] * x[j] + (double) y[j] * y[j]);
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
            // the samples by radius bin (radius as the table's quantiles compute it), in (delay, index) order
            // within each bin: a counting pass by bin, then a sort of each bin's packed delay keys
            float[] radius = new float[m];
            float rMaxAll = 0;
            for (int i = 0; i < m; i++) {
                radius[i] = (float) FastMath.sqrt(table.x[i] * table.x[i] + table.y[i] * table.y[i]
                        + table.z[i] * table.z[i]);
                rMaxAll = FastMath.max(rMaxAll, radius[i]);
            }
            rBins = (int) (rMaxAll / R_BIN) + 1;
            rStart = new int[rBins + 1];
            for (int i = 0; i < m; i++) {
                rStart[(int) (radius[i] / R_BIN) + 1]++;
            }
            for (int bin = 0; bin < rBins; bin++) {
                rStart[bin + 1] += rStart[bin];
            }
            int[] nextInBin = Arrays.copyOf(rStart, rBins);
            for (int i = 0; i < m; i++) {
                keys[nextInBin[(int) (radius[i] / R_BIN)]++] = ((long) sortable(table.delay[i]) << 32) | i;
            }
            dByR = new float[m];
            rByR = new float[m];
            for (int bin = 0; bin < rBins; bin++) {
                Arrays.sort(keys, rStart[bin], rStart[bin + 1]);
                for (int j = rStart[bin]; j < rStart[bin + 1]; j++) {
                    int i = (int) (keys[j] & 0xffffffffL);
                    dByR[j] = table.delay[i];
                    rByR[j] = radius[i];
                }
            }
        }

        private long cellOf(double px, double py, double pz) {
            int ix = clamp((int) ((px - lo) * inv));
            int iy = clamp((int) ((py - lo) * inv));
            int iz = clamp((int) ((pz - lo) * inv));
            return (ix * (long) n + iy) * n + iz;
        }

        int clamp(int i) {
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
         * radius in [rLo, rHi]), without sorting: the k-th smallest delay is found by bisection
         * over the ordered float values, counting with the radius bins (delay-sorted within each
         * bin, so a count is one binary search per bin). The samples of the two partly covered end
         * bins that lie in the range are first copied, still delay-sorted, into the caller's
         * scratch (one per thread; the index itself stays read-only).
         *
         * @param scratch two arrays, grown as needed (the caller keeps them)
         */
        double[] delayQuantiles(double rLo, double rHi, double qLo, double qHi, float[][] scratch) {
            int b0 = FastMath.max(0, (int) FastMath.floor(rLo / R_BIN));
            int b1 = FastMath.min(rBins - 1, (int) FastMath.floor(rHi / R_BIN));
            if (b0 > b1) {
                return new double[] {dmin, dmax};
            }
            int[] ends = new int[2];
            ends[0] = partial(b0, rLo, rHi, scratch, 0);
            ends[1] = b1 > b0 ? partial(b1, rLo, rHi, scratch, 1) : 0;
            int count = countBelow(b0, b1, scratch, ends, Float.POSITIVE_INFINITY);
            if (count == 0) {
                return new double[] {dmin, dmax};
            }
            int a = (int) FastMath.floor(qLo * (count - 1));
            int b = (int) FastMath.ceil(qHi * (count - 1));
            return new double[] {kth(b0, b1, scratch, ends, a), kth(b0, b1, scratch, ends, b)};
        }

        /** Copies the delays of the samples of bin with radius in [rLo, rHi] (delay order) into scratch[slot]; returns their number. */
        private int partial(int bin, double rLo, double rHi, float[][] scratch, int slot) {
            int from = rStart[bin], until = rStart[bin + 1];
            if (scratch[slot] == null || scratch[slot].length < until - from) {
                scratch[slot] = new float[until - from];
            }
            float[] out = scratch[slot];
            int k = 0;
            for (int j = from; j < until; j++) {
                if (rByR[j] >= rLo && rByR[j] <= rHi) {
                    out[k++] = dByR[j];
                }
            }
            return k;
        }

        /** @return the (k+1)-th smallest delay of the samples counted by {@link #countBelow} */
        private float kth(int b0, int b1, float[][] scratch, int[] ends, int k) {
            long lo = sortable((float) dmin) - 1L, hi = sortable((float) dmax);
            // smallest key with more than k samples at or below it: an element's value
            while (hi - lo > 1) {
                int mid = (int) ((lo + hi) >> 1);
                if (countBelow(b0, b1, scratch, ends, Float.intBitsToFloat(unsortable(mid))) > k) {
                    hi = mid;
                } else {
                    lo = mid;
                }
            }
            return Float.intBitsToFloat(unsortable((int) hi));
        }

        /** @return the number of samples with radius in range and delay &lt;= v: inner bins whole, end bins from the scratch */
        private int countBelow(int b0, int b1, float[][] scratch, int[] ends, float v) {
            int count = firstAbove(scratch[0], 0, ends[0], v);
            if (b1 > b0) {
                count += firstAbove(scratch[1], 0, ends[1], v);
            }
            for (int bin = b0 + 1; bin < b1; bin++) {
                count += firstAbove(dByR, rStart[bin], rStart[bin + 1], v) - rStart[bin];
            }
            return count;
        }

        /**
         * @return the smallest and largest delay of the samples with radius in [rLo, rHi] ({dmin, dmax}
         *     when none): the ends of the inner radius bins, the end bins scanned from either end
         */
        double[] delayRange(double rLo, double rHi) {
            int b0 = FastMath.max(0, (int) FastMath.floor(rLo / R_BIN));
            int b1 = FastMath.min(rBins - 1, (int) FastMath.floor(rHi / R_BIN));
            double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (int bin = b0; bin <= b1; bin++) {
                int from = rStart[bin], until = rStart[bin + 1];
                for (int j = from; j < until; j++) {
                    if (rByR[j] >= rLo && rByR[j] <= rHi) {
                        lo = FastMath.min(lo, dByR[j]);
                        break;
                    }
                }
                for (int j = until - 1; j >= from; j--) {
                    if (rByR[j] >= rLo && rByR[j] <= rHi) {
                        hi = FastMath.max(hi, dByR[j]);
                        break;
                    }
                }
            }
            return lo > hi ? new double[] {dmin, dmax} : new double[] {lo, hi};
        }

        private static int sortable(float f) {
            int b = Float.floatToIntBits(f);
            return b >= 0 ? b : b ^ 0x7fffffff;
        }

        private static int unsortable(int k) {
            return k >= 0 ? k : k ^ 0x7fffffff;
        }
    }

    /**
     * One compact source.
     *
     * @param sigmaM Gaussian size of the source per axis, M (before the kernel is added)
     * @param weight emission weight
     * @param flare flare envelope against emitter time (M), peak 1
     * @param shearRate for a spot on a circular equatorial orbit whose members circle at their own
     *     radius: azimuthal offset per radial offset per unit time, 1/M (0: no shear; see
     *     {@link #shearRate})
     */
    public record Spot(double sigmaM, double weight, DoubleUnaryOperator flare, double shearRate) {
        /** A spot that keeps its shape (no shear). */
        public Spot(double sigmaM, double weight, DoubleUnaryOperator flare) {
            this(sigmaM, weight, flare, 0.0);
        }
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
     * @param astrometricX the position the instrument reports, M (and astrometricY): with a beam the
     *     peak of the beam-convolved image with the steady source ({@link BeamAstrometry}), without
     *     one the centroid with the steady source (the same arrays as steadyX, steadyY)
     */
    public record Frames(double[] timesM, double[] flux, double[] x, double[] y, double[] steadyX, double[] steadyY,
                         double steadyFlux, double coveredFrom, double coveredTo, double[] astrometricX,
                         double[] astrometricY) {
        /** @return flux with the steady source, linearly interpolated at observer time t (M), as mock data are */
        public double fluxWithSteadyAt(double t) {
            return LightStage.interpolate(timesM, flux, t) + steadyFlux;
        }

        /** @return the reported east offset (astrometricX) at t (M), linearly interpolated as mock data are */
        public double xAt(double t) {
            return LightStage.interpolate(timesM, astrometricX, t);
        }

        /** @return the reported north offset (astrometricY) at t (M), linearly interpolated */
        public double yAt(double t) {
            return LightStage.interpolate(timesM, astrometricY, t);
        }
    }

    /**
     * The table refinement for compact sources: neighbouring rays that pass the emission region
     * further apart than about the smallest blob's width sample its images badly (a Riemann sum
     * of a Gaussian is accurate while the spacing stays below about 1.5 sigma, and poor once it is
     * several sigma), so stretched pixels get k sub-rays per side with a spacing of about
     * sigma (common practice, no source), at least half a pixel.
     */
    public static RayTable.Refinement refinement(Camera camera, Spot[] spots) {
        double h = LightStage.smoothingLength(camera);
        double s = Double.POSITIVE_INFINITY;
        for (Spot sp : spots) {
            s = FastMath.min(s, FastMath.sqrt(sp.sigmaM() * sp.sigmaM() + KERNEL_VARIANCE * h * h));
        }
        double threshold = FastMath.max(0.5, FastMath.min(RayTable.STRETCH_THRESHOLD, SPACING_SIGMAS * s
                / camera.pixelSize()));
        // rounded to a power of sqrt(2), so that a fit of the spot's size does not trace a table per value
        threshold = FastMath.pow(2.0, FastMath.rint(2.0 * FastMath.log(threshold) / FastMath.log(2.0)) / 2.0);
        return new RayTable.Refinement(threshold, MAX_RAYS, RayTable.MAX_REFINE);
    }

    /**
     * Shear of a spot on a circular equatorial orbit at Boyer-Lindquist radius r whose members
     * circle at their own radius (the run's shear velocity model): a member placed a Cartesian
     * radial offset u from the centre has d r = u sqrt(r^2 + a^2) / r and falls behind by
     * d phi = Omega'(r) d r t, an azimuthal offset sqrt(r^2 + a^2) d phi, so offsets (u, w)
     * become (u, w + s t u) with s = (r^2 + a^2) Omega'(r) / r (linear differential rotation,
     * e.g. the kinematic shear of Bardeen, Press &amp; Teukolsky 1972, sec. II, with Omega' of
     * {@code CircularOrbits.omegaDerivative}).
     *
     * @param omegaDerivative dOmega/dr at r, 1/M^2
     */
    public static double shearRate(double r, double spin, double omegaDerivative) {
        return (r * r + spin * spin) * omegaDerivative / r;
    }

    /** Sub-ray spacing, in blob standard deviations, that stretched pixels are refined to. */
    static final double SPACING_SIGMAS = 1.0;
    /** Largest number of sub-rays per side of a stretched pixel. */
    static final int MAX_RAYS = 12;

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
    private final float[][] quantileScratch = new float[2][];
    private Index quantiled;
    /** Beam-peak scratch: one frame's pixel sums, the pixels touched, then every frame's pixels in a row. */
    private double[] pixelSum = new double[0];
    private int[] touched = new int[0];
    private int touchedCount;
    private double[] beamX = new double[0], beamY = new double[0], beamF = new double[0];
    private int[] frameStart = new int[0];
    private int beamUsed;
    private BeamAstrometry beam;
    /** Whether the current frames() call also sums samples per pixel (a beam is set). */
    private boolean summingPixels;

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
        return frames(index, track, spots, positionAngleDeg, frameCadenceM, steadyRatio, 0.0);
    }

    /**
     * As {@link #frames(Index, CentreTrack, Spot[], double, double, double)} for an instrument with
     * a circular Gaussian beam of standard deviation beamSigmaM (M; 0: none).
     */
    public Frames frames(Index index, CentreTrack track, Spot[] spots, double positionAngleDeg, double frameCadenceM,
                         double steadyRatio, double beamSigmaM) {
        double h = index.smoothing;
        double[] rr = track.radialRange();
        double spread = 0;
        for (Spot s : spots) {
            spread = FastMath.max(spread, 3.0 * s.sigmaM());
        }
        double lo = rr[0] - spread - 2 * h, hi = rr[1] + spread + 2 * h;
        if (quantiled != index || lo != qLo || hi != qHi) {
            lastQ = index.delayQuantiles(lo, hi, 0.02, 0.98, quantileScratch);
            quantiled = index;
            qLo = lo;
            qHi = hi;
        }
        double[] q = lastQ;
        return frames(index, track, spots, positionAngleDeg, LightStage.frameTimes(track, q, frameCadenceM), steadyRatio,
                beamSigmaM);
    }

    /**
     * Frames of the sources at given observer times (M), for example a run's own frame times.
     *
     * @see #frames(Index, CentreTrack, Spot[], double, double, double)
     */
    public Frames frames(Index index, CentreTrack track, Spot[] spots, double positionAngleDeg, double[] times,
                         double steadyRatio) {
        return frames(index, track, spots, positionAngleDeg, times, steadyRatio, 0.0);
    }

    /**
     * Frames at given observer times with a beam of standard deviation beamSigmaM (M; 0: none).
     * With a beam, each frame's samples are also summed per pixel, and the reported position is
     * the peak of the beam-convolved pixel image with the steady source ({@link BeamAstrometry};
     * pixels as points at their centres, as in a run's light stage).
     */
    public Frames frames(Index index, CentreTrack track, Spot[] spots, double positionAngleDeg, double[] times,
                         double steadyRatio, double beamSigmaM) {
        boolean beamed = beamSigmaM > 0;
        summingPixels = beamed;
        if (++framesCall == Integer.MAX_VALUE) {
            framesCall = 1;
            java.util.Arrays.fill(profileCall, 0);
        }
        if (beamed) {
            prepareBeam(index, times.length, beamSigmaM);
        }
        double h = index.smoothing;
        int nf = times.length;
        double[] flux = new double[nf], fx = new double[nf], fy = new double[nf];
        double[] sig2 = new double[spots.length], cut2 = new double[spots.length], norm = new double[spots.length];
        double cutMax = 0;
        double tEnd = track.time(track.snapshots() - 1);
        double[] blob2 = new double[spots.length], kern2 = new double[spots.length];
        for (int k = 0; k < spots.length; k++) {
            blob2[k] = spots[k].sigmaM() * spots[k].sigmaM();
            kern2[k] = KERNEL_VARIANCE * h * h;
            double s2 = spots[k].sigmaM() * spots[k].sigmaM() + KERNEL_VARIANCE * h * h;
            sig2[k] = s2;
            cut2[k] = CUT_SIGMAS * CUT_SIGMAS * s2;
            // a sheared spot keeps its radial and vertical widths (its arc lies along the orbit)
            cutMax = FastMath.max(cutMax, CUT_SIGMAS * FastMath.sqrt(s2));
            // normalised 3-D Gaussian (2 pi sigma^2)^(-3/2)
            norm[k] = FastMath.pow(2 * FastMath.PI * s2, -1.5);
        }
        // only samples within reach of the centres' radial range can see a blob: their delays bound the window
        double[] rr = track.radialRange();
        double[] near = index.delayRange(rr[0] - cutMax - 1e-3, rr[1] + cutMax + 1e-3);
        double v = FastMath.max(1e-3, track.maxSpeed());
        double step = FastMath.max(1e-3, 0.5 * index.cell / v);   // the blob moves at most a quarter cell per half step
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
            if (beamed) {
                frameStart[f] = beamUsed;
            }
            if (!(e1 > e0)) {
                continue;
            }
            int steps = (int) FastMath.ceil((e1 - e0) / step);
            double sf = 0, sx = 0, sy = 0;
            for (int k = 0; k < spots.length; k++) {
                if (spots[k].shearRate() != 0.0 && track.aliveThrough(k, 0.0, tEnd)) {
                    ring(index, track, spots[k], k, to, e0, e1, sig2[k], blob2[k], kern2[k]);
                    sf += acc[0];
                    sx += acc[1];
                    sy += acc[2];
                    continue;
                }
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
                    // the envelope linear over the step (as a run's weights are between snapshots), times weight and norm
                    double fa = spots[k].weight() * spots[k].flare().applyAsDouble(a);
                    double fSlope = (spots[k].weight() * spots[k].flare().applyAsDouble(b) - fa) / (b - a);
                    // samples whose delay maps into [a, b): d in (to - b, to - a]
                    double sRate = spots[k].shearRate();
                    boolean sheared = sRate != 0.0 && smooth;
                    double shMax = sRate * FastMath.max(FastMath.abs(a), FastMath.abs(b));
                    // the sheared ellipse's largest axis is below the square root of its trace
                    double reach = (sheared ? CUT_SIGMAS * FastMath.sqrt(sig2[k] * 2 + blob2[k] * shMax * shMax)
                            : FastMath.sqrt(cut2[k])) + v * 0.5 * (b - a) + 1e-6;
                    // circular frame of the centre at mid-step: cylindrical radius, azimuth, angular velocity
                    double rhoC = FastMath.hypot(c[0], c[1]);
                    double phiC = FastMath.atan2(c[1], c[0]);
                    double omC = (c[0] * c[4] - c[1] * c[3]) / (rhoC * rhoC);
                    double reach2 = reach * reach;
                    double dLo = to - b, dHi = to - a;
                    // cells to visit: a box about the centre, or for a sheared spot boxes along its arc
                    // (points cell/2 apart on the centre's circle, each box as wide as the radial and
                    // vertical reach; a cell met twice in a step adds nothing the second time, its
                    // cursor being past the step's delays)
                    int arcPts = 1;
                    double box = reach, arcFrom = 0, arcStep = 0;
                    if (sheared) {
                        double half = FastMath.min(FastMath.PI, reach / rhoC);
                        arcPts = 2 * (int) FastMath.ceil(half / (0.5 * index.cell / rhoC)) + 1;
                        arcFrom = phiC - half;
                        arcStep = 2 * half / (arcPts - 1);
                        box = FastMath.sqrt(cut2[k]) + v * 0.5 * (b - a) + 0.5 * index.cell + 1e-6;
                    }
                    for (int ap = 0; ap < arcPts; ap++) {
                        double bx = c[0], by = c[1];
                        if (sheared) {
                            bx = rhoC * FastMath.cos(arcFrom + ap * arcStep);
                            by = rhoC * FastMath.sin(arcFrom + ap * arcStep);
                        }
                        int x0 = index.clamp((int) FastMath.floor((bx - box - index.lo) * index.inv));
                        int x1 = index.clamp((int) FastMath.floor((bx + box - index.lo) * index.inv));
                        int y0 = index.clamp((int) FastMath.floor((by - box - index.lo) * index.inv));
                        int y1 = index.clamp((int) FastMath.floor((by + box - index.lo) * index.inv));
                        int z0 = index.clamp((int) FastMath.floor((c[2] - box - index.lo) * index.inv));
                        int z1 = index.clamp((int) FastMath.floor((c[2] + box - index.lo) * index.inv));
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
                                        double q;
                                        double nk = norm[k];
                                        if (sheared) {
                                            // curvilinear offsets from the centre on its circle: radial u, along
                                            // the orbit w, vertical ddz; sheared Gaussian plus the kernel
                                            double dphi = FastMath.atan2(index.y[i], index.x[i]) - phiC - omC * dt;
                                            dphi -= TWO_PI * FastMath.rint(dphi / TWO_PI);
                                            double u = index.rho[i] - rhoC, w = rhoC * dphi;
                                            double sh = sRate * te;
                                            double aa = blob2[k] + kern2[k], bb = blob2[k] * sh;
                                            double cc = blob2[k] * (1 + sh * sh) + kern2[k];
                                            double det = aa * cc - bb * bb;
                                            q = (cc * u * u - 2 * bb * u * w + aa * w * w) / det + ddz * ddz / aa;
                                            // (2 pi)^(-3/2) / sqrt(det aa)
                                            nk = INV_TWO_PI_15 / FastMath.sqrt(det * aa);
                                        } else {
                                            q = (ddx * ddx + ddy * ddy + ddz * ddz) / sig2[k];
                                        }
                                        if (q >= CUT_SIGMAS * CUT_SIGMAS) {
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
                                        double dens = (fa + (te - a) * fSlope) / cs[3] * nk * gaussian(0.5 * q);
                                        double val = index.dl[i] * dens * gp;
                                        sf += val;
                                        sx += val * index.east[i];
                                        sy += val * index.north[i];
                                        if (beamed) {
                                            addToPixel(index, index.east[i], index.north[i], val);
                                        }
                                    }
                                    cursor[cellIdx] = i;
                                }
                            }
                        }
                    }
                }
            }
            if (beamed) {
                keepFramePixels(index);
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
        double[] ax = sxo, ay = syo;
        if (beamed) {
            ax = new double[nf];
            ay = new double[nf];
            beamPeaks(nf, fs, pa, ax, ay);
        }
        return new Frames(times, flux, fx, fy, sxo, syo, fs, coveredFrom, coveredTo, ax, ay);
    }

    private void prepareBeam(Index index, int nf, double sigmaM) {
        int np = index.camera.pixels() * index.camera.pixels();
        if (pixelSum.length != np) {
            pixelSum = new double[np];
            touched = new int[np];
        }
        touchedCount = 0;
        if (frameStart.length < nf + 1) {
            frameStart = new int[nf + 1];
        }
        java.util.Arrays.fill(frameStart, 0, nf + 1, 0);
        beamUsed = 0;
        if (beam == null || beam.sigma() != sigmaM) {
            beam = new BeamAstrometry(sigmaM);
        }
    }

    /** Adds a sample's value to its pixel (the pixel of a PA = 0 sky offset, inverting {@link Camera#skyX}, skyY). */
    private void addToPixel(Index index, double east, double north, double val) {
        Camera cam = index.camera;
        int n = cam.pixels();
        int col = (int) FastMath.rint(0.5 * n - 0.5 - east / cam.pixelSize());
        int row = (int) FastMath.rint(north / cam.pixelSize() + 0.5 * n - 0.5);
        int p = row * n + col;
        if (pixelSum[p] == 0) {
            touched[touchedCount++] = p;
        }
        pixelSum[p] += val;
    }

    /** Appends the frame's pixels (flux units, PA = 0 offsets) after one slot for the steady source, and clears them. */
    private void keepFramePixels(Index index) {
        int need = beamUsed + touchedCount + 1;
        if (beamX.length < need) {
            int size = FastMath.max(need, 2 * beamX.length);
            beamX = java.util.Arrays.copyOf(beamX, size);
            beamY = java.util.Arrays.copyOf(beamY, size);
            beamF = java.util.Arrays.copyOf(beamF, size);
        }
        Camera cam = index.camera;
        int n = cam.pixels();
        beamUsed++;       // the steady source's slot, filled once its flux is known
        for (int t = 0; t < touchedCount; t++) {
            int p = touched[t];
            beamX[beamUsed] = cam.skyX(p % n);
            beamY[beamUsed] = cam.skyY(p / n);
            beamF[beamUsed++] = pixelSum[p] * index.area;
            pixelSum[p] = 0;
        }
        touchedCount = 0;
    }

    /** Beam peaks of the kept frames with the steady source of flux fs at the hole, rotated to the position angle. */
    private void beamPeaks(int nf, double fs, Camera pa, double[] ax, double[] ay) {
        double[] p = new double[2];
        for (int f = 0; f < nf; f++) {
            int from = frameStart[f];
            int to = f + 1 < nf ? frameStart[f + 1] : beamUsed;
            if (to == from) {
                ax[f] = 0;     // no light reached this frame's window: only the steady source
                ay[f] = 0;
                continue;
            }
            beamX[from] = 0;
            beamY[from] = 0;
            beamF[from] = fs;
            if (!beam.peak(beamX, beamY, beamF, from, to, p)) {
                ax[f] = 0;
                ay[f] = 0;
                continue;
            }
            // PA = 0 screen offsets (alpha = -east0, beta = north0) rotated to the position angle, as the centroid
            ax[f] = pa.east(-p[0], p[1]);
            ay[f] = pa.north(-p[0], p[1]);
        }
    }

    /** Sums of the last {@link #ring} call: flux, flux x east, flux x north. */
    private final double[] acc = new double[3];

    /** Binned samples about each sheared spot's orbit (per source), and the frames() call they were built in. */
    private RingProfile[] profiles = new RingProfile[0];
    private int[] profileCall = new int[0];
    private int framesCall;

    /**
     * A sheared spot on its circular orbit, one frame: the orbit's centre has constant cylindrical
     * radius, height, angular velocity and 4-velocity, so the samples of the annulus about it are
     * binned once per call of frames() ({@link RingProfile}) and every frame weighs the bins whose
     * delay maps into the emission window [e0, e1] by the sheared Gaussian and the envelope at their
     * own emission time. Sums into {@link #acc}.
     */
    private void ring(Index index, CentreTrack track, Spot spot, int k, double to, double e0, double e1, double sig2,
                      double blob2, double kern2) {
        acc[0] = 0;
        acc[1] = 0;
        acc[2] = 0;
        ringSinkIndex = index;
        RingProfile pf = profile(index, track, spot, k, sig2, blob2, kern2);
        if (pf == null) {
            return;
        }
        double sRate = spot.shearRate(), rhoC = pf.rhoC;
        // only phases within the arc's half-length (at the largest shear of the window) can be inside the
        // cut: the quadratic form is at least w^2 / cc for any radial offset
        double shMax = sRate * FastMath.max(FastMath.abs(e0), FastMath.abs(e1));
        double halfPhase = CUT_SIGMAS * FastMath.sqrt(blob2 * (1 + shMax * shMax) + kern2) / rhoC;
        int np = pf.phaseBins();
        int b0 = 0, b1 = np - 1;
        if (2 * halfPhase + 2 * pf.phaseStep() < TWO_PI) {
            double lo = pf.theta(to) - halfPhase;
            lo -= TWO_PI * FastMath.floor(lo / TWO_PI);
            b0 = FastMath.min(np - 1, (int) (lo / pf.phaseStep()));
            b1 = b0 + (int) FastMath.ceil(2 * halfPhase / pf.phaseStep()) + 1;
        }
        pf.sum(to, e0, e1, b0, b1, acc, summingPixels ? pixelSink : null);

    }

    /** @return the profile of sheared source k for the current frames() call (built on first use; null: no orbit) */
    private RingProfile profile(Index index, CentreTrack track, Spot spot, int k, double sig2, double blob2,
                                double kern2) {
        if (profiles.length <= k) {
            profiles = java.util.Arrays.copyOf(profiles, k + 1);
            profileCall = java.util.Arrays.copyOf(profileCall, k + 1);
        }
        if (profiles[k] == null) {
            profiles[k] = new RingProfile();
        }
        RingProfile pf = profiles[k];
        if (profileCall[k] == framesCall) {
            return pf.size >= 0 ? pf : null;
        }
        profileCall[k] = framesCall;
        double tEnd = track.time(track.snapshots() - 1);
        double tm = 0.5 * tEnd;
        if (!track.expansion(k, tm, c)) {
            pf.size = -1;
            return null;
        }
        double rhoC = FastMath.hypot(c[0], c[1]);
        double box = CUT_SIGMAS * FastMath.sqrt(sig2) + 1e-6;
        pf.prepare(index, sig2, box, rhoC, c[2], (c[0] * c[4] - c[1] * c[3]) / (rhoC * rhoC),
                FastMath.atan2(c[1], c[0]), tm, c[9], c[10], c[11], c[12], 2.0 + track.spectralIndex(k));
        pf.tabulate(spot, tEnd, spot.shearRate(), blob2, kern2);
        return pf;
    }

    /** Adds a group's value to its pixel. */
    private final RingProfile.PixelSink pixelSink = (e, n, v) -> addToPixel(this.ringSinkIndex, e, n, v);
    private Index ringSinkIndex;

    /** Entries per unit of the exponent in {@link #GAUSS}. */
    private static final int GAUSS_PER_UNIT = 512;
    /** exp(-u) at u = j / GAUSS_PER_UNIT up to the cut-off u = CUT_SIGMAS^2 / 2 (and one entry beyond). */
    private static final double[] GAUSS = new double[(int) (CUT_SIGMAS * CUT_SIGMAS / 2 * GAUSS_PER_UNIT) + 2];

    static {
        for (int j = 0; j < GAUSS.length; j++) {
            GAUSS[j] = FastMath.exp(-(double) j / GAUSS_PER_UNIT);
        }
    }

    /**
     * exp(-u) for 0 &lt;= u &lt;= CUT_SIGMAS^2 / 2 from the table, linearly interpolated: relative
     * error at most (du)^2 / 8 = 5e-7 for du = 1/512 (interpolation error of a linear interpolant,
     * h^2 max|f''| / 8, e.g. de Boor 1978, ch. II), far below the model's sampling error, and
     * about ten times cheaper than the library exponential in the sample loop.
     */
    static double gaussian(double u) {
        double f = u * GAUSS_PER_UNIT;
        int j = (int) f;
        if (j >= GAUSS.length - 1) {
            return 0.0;
        }
        double w = f - j;
        return GAUSS[j] + w * (GAUSS[j + 1] - GAUSS[j]);
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
