package org.spindrift.sim.light;

import java.util.Arrays;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The camera's rays, traced once per run (the observer is fixed and the metric stationary): for every pixel the photon's angular momentum L = p_phi, how the ray ended,
 * and its samples inside the emission region (packed, structure of arrays, each with its own
 * p_phi because refined pixels hold several sub-pixel rays; the samples of pixel k
 * are {@code start[k] .. start[k+1]-1}). Rows of pixels are traced as independent tasks whose
 * results are concatenated in row order, so the table does not depend on the thread count.
 */
public final class RayTable {
    private final Camera camera;
    private final TraceSettings settings;
    private final double[] angularMomentum;
    private final byte[] end;
    private final int[] start;
    final float[] x, y, z, delay, pr, pth, pph, dl;
    private final long steps;
    private int refinedPixels;
    private long subRays;

    private RayTable(Camera camera, TraceSettings settings, double[] angularMomentum, byte[] end, int[] start,
                     SampleBuffer[] rows, long steps) {
        this.camera = camera;
        this.settings = settings;
        this.angularMomentum = angularMomentum;
        this.end = end;
        this.start = start;
        int total = start[start.length - 1];
        x = new float[total];
        y = new float[total];
        z = new float[total];
        delay = new float[total];
        pr = new float[total];
        pth = new float[total];
        pph = new float[total];
        dl = new float[total];
        int n = camera.pixels();
        for (int row = 0; row < n; row++) {
            SampleBuffer b = rows[row];
            int off = start[row * n];
            System.arraycopy(b.x, 0, x, off, b.size);
            System.arraycopy(b.y, 0, y, off, b.size);
            System.arraycopy(b.z, 0, z, off, b.size);
            System.arraycopy(b.delay, 0, delay, off, b.size);
            System.arraycopy(b.pr, 0, pr, off, b.size);
            System.arraycopy(b.pth, 0, pth, off, b.size);
            System.arraycopy(b.pph, 0, pph, off, b.size);
            System.arraycopy(b.dl, 0, dl, off, b.size);
        }
        this.steps = steps;
    }

    /** Largest number of sub-pixel rays per side in refined pixels. */
    public static final int MAX_REFINE = 4;
    /** Neighbour separation of closest-approach points (in pixels) above which a pixel is refined. */
    static final double STRETCH_THRESHOLD = 3.0;

    /**
     * How stretched pixels are refined: k = min(maxRays, ceil(stretch / threshold)) sub-rays per
     * side where the stretch (pixels) is finite, edgeRays where neighbouring rays end differently.
     *
     * @param threshold stretch in pixels that one sub-ray spacing may cover
     * @param maxRays largest k for finite stretch
     * @param edgeRays k at the shadow edge
     */
    public record Refinement(double threshold, int maxRays, int edgeRays) {
        /** The run's refinement: threshold 3 pixels, at most {@link #MAX_REFINE} sub-rays per side. */
        public static final Refinement RUN = new Refinement(STRETCH_THRESHOLD, MAX_REFINE, MAX_REFINE);
    }

    /**
     * Traces the table in two passes. First one ray per pixel centre; then pixels where the map
     * from the screen to the hole's surroundings is strongly stretched (secondary images and the
     * photon ring, where a pixel-centre ray would sample a thin, demagnified image badly), or
     * where neighbouring rays end differently (the shadow edge), are traced again with k x k
     * sub-pixel rays, k = min(MAX_REFINE, ceil(stretch / 3)), each with weight 1 / k^2. The
     * stretch is the largest distance, in pixels, between the closest-approach points of a ray
     * and its four neighbours that also escape (adaptive supersampling, common practice, no source).
     *
     * @param threads worker threads (the result does not depend on it)
     */
    public static RayTable trace(Spacetime spacetime, Camera camera, TraceSettings settings, int threads) {
        return trace(spacetime, camera, settings, threads, Refinement.RUN);
    }

    /**
     * As {@link #trace(Spacetime, Camera, TraceSettings, int)} with another refinement rule.
     *
     * @param rule how stretched pixels are refined
     */
    public static RayTable trace(Spacetime spacetime, Camera camera, TraceSettings settings, int threads,
                                 Refinement rule) {
        final int n = camera.pixels();
        final double[] lz = new double[n * n];
        final byte[] ends = new byte[n * n];
        final int[] counts = new int[n * n];
        final long[] rowSteps = new long[n];
        final double[] closest = new double[3 * n * n];
        final SampleBuffer[] base = new SampleBuffer[n];
        final SampleBuffer[] rows = new SampleBuffer[n];
        final int[][] refineOut = new int[1][];
        ForkJoinPool pool = new ForkJoinPool(Math.max(1, threads));
        try {
            run(pool, () -> IntStream.range(0, n).parallel().forEach(row -> {
                SampleBuffer buf = new SampleBuffer(16 * n);
                if (settings.lensing()) {
                    rowSteps[row] = traceRow(spacetime, camera, settings, row, buf, lz, ends, counts, closest);
                } else {
                    straightRow(camera, settings, row, buf, lz, ends, counts);
                }
                base[row] = buf;
            }));
            if (settings.lensing()) {
                final int[] refine = refinement(camera, ends, closest, settings.generalPath() ? null : counts,
                        rule);
                refineOut[0] = refine;
                run(pool, () -> IntStream.range(0, n).parallel().forEach(row -> {
                    rows[row] = refineRow(spacetime, camera, settings, row, base[row], refine, counts, rowSteps);
                    base[row] = null;
                }));
            } else {
                System.arraycopy(base, 0, rows, 0, n);
            }
        } finally {
            pool.shutdown();
        }
        int[] start = new int[n * n + 1];
        for (int k = 0; k < n * n; k++) {
            start[k + 1] = start[k] + counts[k];
        }
        long total = Arrays.stream(rowSteps).sum();
        RayTable t = new RayTable(camera, settings, lz, ends, start, rows, total);
        if (refineOut[0] != null) {
            for (int k : refineOut[0]) {
                if (k > 1) {
                    t.refinedPixels++;
                    t.subRays += (long) k * k;
                }
            }
        }
        return t;
    }

    /** @return pixels traced again with sub-pixel rays */
    public int refinedPixels() {
        return refinedPixels;
    }

    /** @return sub-pixel rays traced in refined pixels */
    public long subRays() {
        return subRays;
    }

    private static void run(ForkJoinPool pool, Runnable job) {
        try {
            pool.submit(job).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("ray tracing interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("ray tracing failed: " + e.getCause(), e.getCause());
        }
    }

    /**
     * @param counts samples of each pixel's centre ray (where gas may be); null: refine stretched
     *     pixels also where no gas is seen (the general path)
     * @return sub-rays per side for every pixel (1: not refined)
     */
    static int[] refinement(Camera camera, byte[] ends, double[] closest, int[] counts) {
        return refinement(camera, ends, closest, counts, Refinement.RUN);
    }

    static int[] refinement(Camera camera, byte[] ends, double[] closest, int[] counts, Refinement rule) {
        int n = camera.pixels();
        double inv = 1.0 / camera.pixelSize();
        int[] k = new int[n * n];
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                int p = row * n + col;
                k[p] = 1;
                if (counts != null && !nearEmission(counts, n, row, col)) {
                    continue;
                }
                double stretch = 0;
                for (int d = 0; d < 4; d++) {
                    int r2 = row + (d == 0 ? 1 : d == 1 ? -1 : 0);
                    int c2 = col + (d == 2 ? 1 : d == 3 ? -1 : 0);
                    if (r2 < 0 || r2 >= n || c2 < 0 || c2 >= n) {
                        continue;
                    }
                    int q = r2 * n + c2;
                    if (ends[q] != ends[p]) {
                        stretch = Double.POSITIVE_INFINITY;
                        break;
                    }
                    if (ends[p] == RayEnd.CAPTURED.code()) {
                        continue;       // both end on the hole: no demagnified higher-order image between them
                    }
                    double dx = closest[3 * p] - closest[3 * q];
                    double dy = closest[3 * p + 1] - closest[3 * q + 1];
                    double dz = closest[3 * p + 2] - closest[3 * q + 2];
                    stretch = FastMath.max(stretch, FastMath.sqrt(dx * dx + dy * dy + dz * dz) * inv);
                }
                k[p] = stretch <= rule.threshold() ? 1 : stretch == Double.POSITIVE_INFINITY ? rule.edgeRays()
                        : (int) FastMath.min(rule.maxRays(), FastMath.ceil(stretch / rule.threshold()));
            }
        }
        return k;
    }

    /**
     * @return true when the centre ray of the pixel or of one of its eight neighbours passed
     *     where gas may be: refinement is spent only there (sub-rays of a pixel lie between these
     *     rays; a pixel whose whole neighbourhood sees no gas gains nothing from them)
     */
    static boolean nearEmission(int[] counts, int n, int row, int col) {
        for (int r = FastMath.max(0, row - 1); r <= FastMath.min(n - 1, row + 1); r++) {
            for (int c = FastMath.max(0, col - 1); c <= FastMath.min(n - 1, col + 1); c++) {
                if (counts[r * n + c] > 0) {
                    return true;
                }
            }
        }
        return false;
    }

    private static long traceRow(Spacetime spacetime, Camera camera, TraceSettings settings, int row,
                                 SampleBuffer buf, double[] lz, byte[] ends, int[] counts, double[] closest) {
        RayTracer tracer = new RayTracer(spacetime, settings);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        double[] p = new double[6];
        double[] c = new double[3];
        double offset = RayTracer.delayOffset(camera.distance());
        int n = camera.pixels();
        long steps = 0;
        for (int col = 0; col < n; col++) {
            int k = row * n + col;
            double east = camera.skyX(col);
            double north = camera.skyY(row);
            double al = camera.alpha(east, north);
            double be = camera.beta(east, north);
            camera.startPoint(al, be, p);
            double l = Camera.initialState(spacetime, p[0], p[1], p[2], p[3], p[4], p[5], y0, g);
            int before = buf.size;
            RayEnd e = tracer.trace(y0, l, offset, buf);
            steps += tracer.lastSteps();
            tracer.closestPoint(c);
            System.arraycopy(c, 0, closest, 3 * k, 3);
            lz[k] = l;
            ends[k] = e.code();
            counts[k] = buf.size - before;
        }
        return steps;
    }

    /** Second pass over a row: copies unrefined pixels' samples, traces sub-rays for refined ones. */
    private static SampleBuffer refineRow(Spacetime spacetime, Camera camera, TraceSettings settings, int row,
                                          SampleBuffer base, int[] refine, int[] counts, long[] rowSteps) {
        int n = camera.pixels();
        boolean any = false;
        for (int col = 0; col < n; col++) {
            any |= refine[row * n + col] > 1;
        }
        if (!any) {
            return base;
        }
        SampleBuffer out = new SampleBuffer(base.size + 16 * n);
        RayTracer tracer = new RayTracer(spacetime, settings);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        double[] p = new double[6];
        double offset = RayTracer.delayOffset(camera.distance());
        double px = camera.pixelSize();
        long steps = 0;
        int from = 0;
        for (int col = 0; col < n; col++) {
            int k = row * n + col;
            int kk = refine[k];
            int before = out.size;
            if (kk == 1) {
                out.append(base, from, from + counts[k]);
            } else {
                tracer.setWeightScale(1.0 / (kk * kk));
                for (int i = 0; i < kk; i++) {
                    for (int j = 0; j < kk; j++) {
                        // sub-pixel centres; sky x decreases with the column index
                        double east = camera.skyX(col) - ((j + 0.5) / kk - 0.5) * px;
                        double north = camera.skyY(row) + ((i + 0.5) / kk - 0.5) * px;
                        double al = camera.alpha(east, north);
                        double be = camera.beta(east, north);
                        camera.startPoint(al, be, p);
                        double l = Camera.initialState(spacetime, p[0], p[1], p[2], p[3], p[4], p[5], y0, g);
                        tracer.trace(y0, l, offset, out);
                        steps += tracer.lastSteps();
                    }
                }
            }
            from += counts[k];
            counts[k] = out.size - before;
        }
        rowSteps[row] += steps;
        return out;
    }

    /**
     * Straight-line rays (no lensing): the line through the pixel parallel to the line of sight,
     * sampled uniformly inside the emission region, stopped at the capture radius (the hole stays
     * opaque). Delays are the flat travel-time differences (Roemer delay), and p_mu is the flat
     * direction in spherical components, so Doppler factors are kept.
     */
    private static void straightRow(Camera camera, TraceSettings settings, int row,
                                    SampleBuffer buf, double[] lz, byte[] ends, int[] counts) {
        int n = camera.pixels();
        double[] p = new double[6];
        double rEm = settings.emissionRadius();
        double rStop = settings.captureRadius();
        double ds = settings.sampleSpacing();
        double d = camera.distance();
        for (int col = 0; col < n; col++) {
            int k = row * n + col;
            double east = camera.skyX(col);
            double north = camera.skyY(row);
            double al = camera.alpha(east, north);
            double be = camera.beta(east, north);
            camera.startPoint(al, be, p);
            double nx = p[3], ny = p[4], nz = p[5];
            double b2 = al * al + be * be;
            lz[k] = p[0] * ny - p[1] * nx;              // L_z = (x cross n)_z, constant on the line
            int before = buf.size;
            RayEnd e = RayEnd.ESCAPED;
            if (b2 < rEm * rEm) {
                // the line x(s) = x_plane - s n with s measured from the sky plane through the hole
                double half = FastMath.sqrt(rEm * rEm - b2);
                int m = (int) FastMath.ceil(2.0 * half / ds);
                double h = 2.0 * half / m;
                for (int j = 0; j <= m; j++) {
                    double s = -half + j * h;            // s > 0 behind the sky plane (farther from us)
                    double px = p[0] - (d + s) * nx;
                    double py = p[1] - (d + s) * ny;
                    double pz = p[2] - (d + s) * nz;
                    double r = FastMath.sqrt(px * px + py * py + pz * pz);
                    if (r < rStop) {
                        e = RayEnd.CAPTURED;
                        break;
                    }
                    if (settings.mask() != null && !settings.mask().occupied(px, py, pz)) {
                        continue;
                    }
                    double rho = FastMath.sqrt(px * px + py * py);
                    double st = rho / r, ct = pz / r;
                    double cp = rho > 0 ? px / rho : 1.0, sp = rho > 0 ? py / rho : 0.0;
                    double kr = st * cp * nx + st * sp * ny + ct * nz;
                    double kth = ct * cp * nx + ct * sp * ny - st * nz;
                    double w = (j == 0 || j == m) ? 0.5 * h : h;
                    // flat covariant spherical components: p_r = n.e_r, p_theta = r n.e_theta
                    buf.add(px, py, pz, s, kr, r * kth, lz[k], w);
                }
            }
            ends[k] = e.code();
            counts[k] = buf.size - before;
        }
    }

    /** @return the camera */
    public Camera camera() {
        return camera;
    }

    /** @return the settings the table was traced with */
    public TraceSettings settings() {
        return settings;
    }

    /** @return the number of pixels (N^2) */
    public int rays() {
        return end.length;
    }

    /** @return how ray k ended */
    public RayEnd end(int k) {
        return RayEnd.values()[end[k]];
    }

    /** @return the photon angular momentum L of the ray through the centre of pixel k */
    public double angularMomentum(int k) {
        return angularMomentum[k];
    }

    /** @return index of the first sample of ray k */
    public int firstSample(int k) {
        return start[k];
    }

    /** @return one past the last sample of ray k */
    public int endSample(int k) {
        return start[k + 1];
    }

    /** @return total number of samples */
    public int samples() {
        return start[start.length - 1];
    }

    /** @return total integration steps (accepted and rejected) */
    public long steps() {
        return steps;
    }

    /**
     * Quantiles of the delays of the samples whose radius |x| lies in [rLo, rHi] (where the gas
     * is), M; the full range when no sample lies there.
     */
    public double[] delayQuantiles(double rLo, double rHi, double qLo, double qHi) {
        int m = 0;
        float[] d = new float[delay.length];
        for (int i = 0; i < delay.length; i++) {
            double r = FastMath.sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
            if (r >= rLo && r <= rHi) {
                d[m++] = delay[i];
            }
        }
        if (m == 0) {
            return delayRange();
        }
        float[] v = Arrays.copyOf(d, m);
        Arrays.sort(v);
        return new double[] {v[(int) FastMath.floor(qLo * (m - 1))], v[(int) FastMath.ceil(qHi * (m - 1))]};
    }

    /** @return smallest and largest sample delay, M ({0, 0} if there are no samples) */
    public double[] delayRange() {
        if (delay.length == 0) {
            return new double[] {0.0, 0.0};
        }
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (float v : delay) {
            lo = FastMath.min(lo, v);
            hi = FastMath.max(hi, v);
        }
        return new double[] {lo, hi};
    }
}
