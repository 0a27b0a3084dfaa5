package org.spindrift.sim.light;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Renders frames from a {@link RayTable} and the particles' history with slow light: for an
 * observer time t_o a sample with delay d sees the particles at emission time t_e = t_o - d.
 * Optically thin transfer with p_t = -1 at infinity (Rybicki &amp; Lightman 1979, Radiative
 * Processes in Astrophysics, sect. 1.4 and 4.9: I_nu / nu^3 invariant, j_nu ~ nu^-alpha):
 * I_obs = integral g^(2+alpha) rho d(lambda), rho the kernel-smoothed particle density. The emission times are served by {@link EmissionSlice}s spaced
 * {@code sliceSpacing} apart, each built once and kept while frames need it, so frames should be
 * rendered in increasing observer time for the cache to slide.
 *
 * <p>The samples are kept sorted by delay, so consecutive samples see the same slice and its
 * particles stay in cache. A frame's samples are split into a fixed number of equal blocks (the
 * boundaries depend on the frame only), each block adds into its own image, and the block images
 * are summed in block order, so images do not depend on the thread count. The per-sample loop
 * allocates nothing.
 */
public final class EmissionRenderer implements AutoCloseable {
    /** Fixed number of blocks of samples per frame (independent of the thread count). */
    private static final int BLOCKS = 16;
    /**
     * Grid spacing of {@link GriddedEmission} in units of h: sqrt(0.9), so that the deposit-and-read
     * kernel's second moment per axis, spacing^2 / 3, equals the cubic spline's 0.3 h^2 (the
     * integral of q^4 W over the kernel of Monaghan &amp; Lattanzio 1985, A&amp;A 149, 135, eq. 2.4)
     */
    public static final double GRID_SPACING = Math.sqrt(0.9);
    /** Spacing in time of gridded emission slices in units of h. */
    static final double GRID_SLICE_SPACING = 2.0;

    private final EmitterHistory history;
    private final Spacetime spacetime;
    private final int pixels;
    private final double h;
    private final double invH;
    private final double norm;
    private final double support2;
    private final double sliceSpacing;
    private final double sliceOrigin;
    /** time of the last snapshot: emission times outside [sliceOrigin, lastTime] see no gas */
    private final double lastTime;
    private final double rMax;
    private final ForkJoinPool pool;
    private final Map<Long, EmissionSlice> cache = new HashMap<>();
    /** arrays of dropped slices, for the next slices built */
    private final ArrayDeque<EmissionSlice.Storage> spare = new ArrayDeque<>();
    private final double[] delays;
    // samples sorted by delay (structure of arrays) and the pixel each belongs to
    private final float[] sx, sy, sz, sd, spr, spth, spph, sdl;
    private final int[] pix;
    /** first sorted sample of each delay bin (bins one slice spacing wide from binOrigin) */
    private final int[] binStart;
    private final double binOrigin;
    private final List<double[]> chunkImages = new ArrayList<>();
    /** Consecutive sorted samples per group of the group test. */
    private static final int GROUP = 32;
    /** per group of GROUP sorted samples: bounding box (x, y, z lower then upper) and delay range */
    private final float[] gBox;
    private final float[] gDelay;
    /** true: every sample queries its slice with the bounding-box search of earlier versions */
    private final boolean reference;
    /** true: samples read each slice's {@link GriddedEmission} instead of summing its particles */
    private final boolean gridded;
    /** grids of the cached slices (null where a slice falls back to its particles) */
    private final Map<Long, GriddedEmission> grids = new HashMap<>();
    private final ArrayDeque<GriddedEmission> spareGrids = new ArrayDeque<>();
    private final GriddedEmission.Scratch[] scratch = new GriddedEmission.Scratch[BLOCKS];
    private int slicesBuilt;
    /** wall time spent building slices and summing samples, ns (for benchmarks) */
    private long buildNanos, sumNanos;

    /**
     * @param smoothingLength kernel smoothing length h, M (support 2h)
     * @param threads worker threads (results do not depend on it)
     */
    public EmissionRenderer(RayTable table, EmitterHistory history, Spacetime spacetime, double smoothingLength,
                            int threads) {
        this(table, history, spacetime, smoothingLength, threads, false, false);
    }

    /**
     * @param reference true: no group test, every sample is queried (particles only; the renderer of
     *     earlier versions, kept for benchmarks and tests; the images are the same bit for bit)
     * @param gridded true: each slice's particles are deposited on a grid
     *     ({@link GriddedEmission}) and samples read the grid; when the particles have different
     *     spectral indices the particles are summed as with false
     */
    public EmissionRenderer(RayTable table, EmitterHistory history, Spacetime spacetime, double smoothingLength,
                            int threads, boolean reference, boolean gridded) {
        // one grid serves one spectral index; with several the particles are summed
        this.gridded = gridded && oneSpectralIndex(history);
        this.reference = reference && !this.gridded;
        for (int b = 0; b < BLOCKS; b++) {
            scratch[b] = new GriddedEmission.Scratch();
        }
        this.history = history;
        this.spacetime = spacetime;
        this.pixels = table.camera().pixels();
        this.h = smoothingLength;
        this.invH = 1.0 / h;
        this.norm = Kernel.norm(h);
        this.support2 = 4.0 * h * h;
        // particle sums: slices h apart, so a sample's emission time is within h/2 of its slice, over
        // which the particles are moved linearly (the search reach grows by |v| h/2 only); grids:
        // slices 2h apart (the drift of the gas within h of the slice follows the grid's mean velocity;
        // measured against h apart: building time halved, frame fluxes unchanged within 0.3 %)
        this.sliceSpacing = this.gridded ? GRID_SLICE_SPACING * h : h;
        this.sliceOrigin = history.time(0);
        this.lastTime = history.time(history.snapshots() - 1);
        this.rMax = table.settings().emissionRadius() + 2.0 * h;
        this.delays = table.delayRange();
        this.pool = new ForkJoinPool(Math.max(1, threads));
        int m = table.samples();
        int[] owner = new int[m];
        for (int k = 0; k < table.rays(); k++) {
            Arrays.fill(owner, table.firstSample(k), table.endSample(k), k);
        }
        // stable sort of sample indices by delay (ties keep table order: deterministic)
        long[] keys = new long[m];
        for (int i = 0; i < m; i++) {
            keys[i] = ((long) sortable(table.delay[i]) << 32) | i;
        }
        Arrays.sort(keys);
        // delay bins one slice spacing wide: a frame sees each bin through at most two adjacent
        // slices. Within a bin the samples go in Morton (Z-order) of their position, so that
        // consecutive samples query neighbouring cells of the same slice (cache locality).
        binOrigin = m == 0 ? 0.0 : table.delay[(int) (keys[0] & 0xffffffffL)];
        int bins = m == 0 ? 0 : binOf(table.delay[(int) (keys[m - 1] & 0xffffffffL)]) + 1;
        binStart = new int[bins + 1];
        for (int j = 0; j < m; j++) {
            binStart[binOf(table.delay[(int) (keys[j] & 0xffffffffL)]) + 1]++;
        }
        for (int b = 0; b < bins; b++) {
            binStart[b + 1] += binStart[b];
        }
        // Morton grid over the sample cloud, cells at least h wide, 10 bits per axis
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < m; i++) {
            lo = Math.min(lo, Math.min(table.x[i], Math.min(table.y[i], table.z[i])));
            hi = Math.max(hi, Math.max(table.x[i], Math.max(table.y[i], table.z[i])));
        }
        double mc = Math.max(h, (hi - lo) / 1023.0);
        long[] local = new long[0];
        for (int b = 0; b < bins; b++) {
            int b0 = binStart[b], n = binStart[b + 1] - b0;
            if (local.length < n) {
                local = new long[Math.max(n, 2 * local.length)];
            }
            for (int k = 0; k < n; k++) {
                int i = (int) (keys[b0 + k] & 0xffffffffL);
                long code = morton(cellIndex(table.x[i], lo, mc), cellIndex(table.y[i], lo, mc),
                        cellIndex(table.z[i], lo, mc));
                local[k] = (code << 32) | i;          // ties (same cell) keep table order
            }
            Arrays.sort(local, 0, n);
            System.arraycopy(local, 0, keys, b0, n);
        }
        sx = new float[m];
        sy = new float[m];
        sz = new float[m];
        sd = new float[m];
        spr = new float[m];
        spth = new float[m];
        spph = new float[m];
        sdl = new float[m];
        pix = new int[m];
        for (int j = 0; j < m; j++) {
            int i = (int) (keys[j] & 0xffffffffL);
            sx[j] = table.x[i];
            sy[j] = table.y[i];
            sz[j] = table.z[i];
            sd[j] = table.delay[i];
            spr[j] = table.pr[i];
            spth[j] = table.pth[i];
            spph[j] = table.pph[i];
            sdl[j] = table.dl[i];
            pix[j] = owner[i];
        }
        int groups = (m + GROUP - 1) / GROUP;
        gBox = new float[6 * groups];
        gDelay = new float[2 * groups];
        for (int g = 0; g < groups; g++) {
            float dLo = Float.POSITIVE_INFINITY, dHi = Float.NEGATIVE_INFINITY;
            float x0 = dLo, y0 = dLo, z0 = dLo, x1 = dHi, y1 = dHi, z1 = dHi;
            for (int j = g * GROUP; j < Math.min(m, (g + 1) * GROUP); j++) {
                x0 = Math.min(x0, sx[j]);
                y0 = Math.min(y0, sy[j]);
                z0 = Math.min(z0, sz[j]);
                x1 = Math.max(x1, sx[j]);
                y1 = Math.max(y1, sy[j]);
                z1 = Math.max(z1, sz[j]);
                dLo = Math.min(dLo, sd[j]);
                dHi = Math.max(dHi, sd[j]);
            }
            float[] box = {x0, y0, z0, x1, y1, z1};
            System.arraycopy(box, 0, gBox, 6 * g, 6);
            gDelay[2 * g] = dLo;
            gDelay[2 * g + 1] = dHi;
        }
    }

    /** @return whether every particle has the same spectral index (a grid can then sum them) */
    public static boolean oneSpectralIndex(EmitterHistory history) {
        for (int p = 1; p < history.particles(); p++) {
            if (history.spectralIndex(p) != history.spectralIndex(0)) {
                return false;
            }
        }
        return true;
    }

    /** @return the delay bin (one slice spacing wide) of delay d; monotone in d */
    private int binOf(double d) {
        return (int) Math.floor((d - binOrigin) / sliceSpacing);
    }

    private static int cellIndex(double v, double lo, double cell) {
        return Math.min(1023, Math.max(0, (int) ((v - lo) / cell)));
    }

    /** @return the 30-bit Morton code interleaving three 10-bit cell indices */
    private static long morton(int x, int y, int z) {
        return spread(x) | (spread(y) << 1) | (spread(z) << 2);
    }

    private static long spread(int v) {
        long x = v & 0x3ff;
        x = (x | (x << 16)) & 0x30000ffL;
        x = (x | (x << 8)) & 0x300f00fL;
        x = (x | (x << 4)) & 0x30c30c3L;
        x = (x | (x << 2)) & 0x9249249L;
        return x;
    }

    /** @return an int whose signed order is the order of the float (IEEE 754 trick) */
    private static int sortable(float f) {
        int b = Float.floatToIntBits(f);
        return b >= 0 ? b : b ^ 0x7fffffff;
    }

    /** @return the smallest and largest sample delay of the table, M */
    public double[] delayRange() {
        return delays.clone();
    }

    /** @return how many emission slices have been built so far */
    public int slicesBuilt() {
        return slicesBuilt;
    }

    /**
     * Renders the intensity image (row-major, {@link Camera} layout) at observer time tObs.
     *
     * @param image out, length N^2
     */
    public void render(double tObs, float[] image) {
        long jLo = sliceIndex(tObs - delays[1]);
        long jHi = sliceIndex(tObs - delays[0]);
        // slices no longer needed hand their arrays to the slices built next
        cache.entrySet().removeIf(e -> {
            if (e.getKey() < jLo && e.getValue() != null) {
                spare.push(e.getValue().storage);
            }
            return e.getKey() < jLo;
        });
        grids.entrySet().removeIf(e -> {
            if (e.getKey() < jLo && e.getValue() != null) {
                spareGrids.push(e.getValue());
            }
            return e.getKey() < jLo;
        });
        List<Long> missing = new ArrayList<>();
        for (long j = jLo; j <= jHi; j++) {
            if (!cache.containsKey(j)) {
                missing.add(j);
            }
        }
        long t0 = System.nanoTime();
        EmissionSlice[] built = new EmissionSlice[missing.size()];
        EmissionSlice.Storage[] stores = new EmissionSlice.Storage[built.length];
        for (int i = 0; i < stores.length; i++) {
            stores[i] = spare.isEmpty() ? new EmissionSlice.Storage() : spare.pop();
        }
        GriddedEmission[] gs = new GriddedEmission[gridded ? built.length : 0];
        for (int i = 0; i < gs.length; i++) {
            gs[i] = spareGrids.isEmpty() ? new GriddedEmission() : spareGrids.pop();
        }
        run(() -> IntStream.range(0, built.length).parallel().forEach(i -> {
            // the last slice may lie past the last snapshot (by less than half a spacing for any
            // emission time served): it is built at the last snapshot, and its samples drift from there
            built[i] = EmissionSlice.build(history, spacetime,
                    Math.min(lastTime, sliceOrigin + missing.get(i) * sliceSpacing), 2.0 * h,
                    0.5 * sliceSpacing, rMax, stores[i], !gridded);
            if (gridded && built[i] != null) {
                gs[i].fill(built[i], GRID_SPACING * h, 0.5 * sliceSpacing);
            }
        }));
        for (int i = 0; i < built.length; i++) {
            cache.put(missing.get(i), built[i]);
            if (built[i] == null) {
                spare.push(stores[i]);
            }
            if (gridded) {
                grids.put(missing.get(i), built[i] != null ? gs[i] : null);
                if (built[i] == null) {
                    spareGrids.push(gs[i]);
                }
            }
        }
        slicesBuilt += built.length;
        long t1 = System.nanoTime();
        buildNanos += t1 - t0;
        int count = (int) (jHi - jLo + 1);
        EmissionSlice[] window = new EmissionSlice[count];
        GriddedEmission[] gridWindow = new GriddedEmission[count];
        for (int i = 0; i < count; i++) {
            window[i] = cache.get(jLo + i);
            gridWindow[i] = gridded ? grids.get(jLo + i) : null;
        }
        // the samples that see any slice of the window, split into BLOCKS equal blocks
        // (whole delay bins: a superset; samples outside the window are skipped per sample)
        int from = binFloor(tObs - sliceOrigin - (jHi + 0.5) * sliceSpacing);
        int to = binCeil(tObs - sliceOrigin - (jLo - 0.5) * sliceSpacing);
        int size = (to - from + BLOCKS - 1) / BLOCKS;
        while (chunkImages.size() < BLOCKS) {
            chunkImages.add(new double[pixels * pixels]);
        }
        run(() -> IntStream.range(0, BLOCKS).parallel().forEach(b -> {
            double[] acc = chunkImages.get(b);
            Arrays.fill(acc, 0.0);
            int i0 = from + b * size;
            int i1 = Math.min(to, i0 + size);
            renderSamples(i0, i1, tObs, jLo, window, gridWindow, scratch[b], acc);
        }));
        for (int k = 0; k < image.length; k++) {
            double v = 0.0;
            for (int b = 0; b < BLOCKS; b++) {
                v += chunkImages.get(b)[k];
            }
            image[k] = (float) v;
        }
        sumNanos += System.nanoTime() - t1;
    }

    /** @return wall seconds spent so far building emission slices and summing samples (two numbers) */
    public double[] sectionSeconds() {
        return new double[] {buildNanos * 1e-9, sumNanos * 1e-9};
    }

    /**
     * Adds the emission seen by sorted samples i0..i1-1 (each from the slice its emission time rounds
     * to). Samples go in groups of {@link #GROUP} consecutive ones: a group none of whose slices has
     * a particle within reach of the group's bounding box is skipped whole (exact: each of its
     * samples would find no particle), which spares the per-sample set-up on the many samples away
     * from the gas at the frame's emission times.
     */
    private void renderSamples(int i0, int i1, double tObs, long jLo, EmissionSlice[] window,
                               GriddedEmission[] gridWindow, GriddedEmission.Scratch sc, double[] acc) {
        if (reference) {
            renderRange(i0, i1, tObs, jLo, window, acc);
            return;
        }
        for (int g = i0 / GROUP; g * GROUP < i1; g++) {
            int a = Math.max(i0, g * GROUP), b = Math.min(i1, (g + 1) * GROUP);
            int w0 = (int) Math.max(0, sliceIndex(tObs - gDelay[2 * g + 1]) - jLo);
            int w1 = (int) Math.min(window.length - 1, sliceIndex(tObs - gDelay[2 * g]) - jLo);
            boolean any = false;
            for (int w = w0; w <= w1 && !any; w++) {
                EmissionSlice sl = window[w];
                any = sl != null && sl.mayReach(gBox[6 * g], gBox[6 * g + 1], gBox[6 * g + 2], gBox[6 * g + 3],
                        gBox[6 * g + 4], gBox[6 * g + 5]);
            }
            if (any) {
                renderNear(a, b, tObs, jLo, window, gridWindow, sc, acc);
            }
        }
    }

    private void renderRange(int i0, int i1, double tObs, long jLo, EmissionSlice[] window, double[] acc) {
        for (int i = i0; i < i1; i++) {
            double tE = tObs - sd[i];
            if (tE < sliceOrigin || tE > lastTime) {
                continue;                          // before the first or after the last snapshot: no gas
            }
            int w = (int) (sliceIndex(tE) - jLo);
            if (w < 0 || w >= window.length) {
                continue;
            }
            EmissionSlice sl = window[w];
            if (sl == null) {
                continue;
            }
            double e = sl.emissivity(sx[i], sy[i], sz[i], tE - sl.tau, spr[i], spth[i], spph[i], invH, norm, support2);
            if (e != 0.0) {
                acc[pix[i]] += sdl[i] * e;
            }
        }
    }

    /** {@link #renderRange} with the slices' exact shortcuts ({@link EmissionSlice#emissivityNear}). */
    private void renderNear(int i0, int i1, double tObs, long jLo, EmissionSlice[] window,
                            GriddedEmission[] gridWindow, GriddedEmission.Scratch sc, double[] acc) {
        for (int i = i0; i < i1; i++) {
            double tE = tObs - sd[i];
            if (tE < sliceOrigin || tE > lastTime) {
                continue;                          // before the first or after the last snapshot: no gas
            }
            // Math.rint: the same correctly rounded value as FastMath.rint, as a processor instruction
            int w = (int) ((long) Math.rint((tE - sliceOrigin) / sliceSpacing) - jLo);
            if (w < 0 || w >= window.length) {
                continue;
            }
            EmissionSlice sl = window[w];
            if (sl == null) {
                continue;
            }
            GriddedEmission gr = gridWindow[w];
            double e = gr != null
                    ? gr.emissivity(sx[i], sy[i], sz[i], tE - sl.tau, spr[i], spth[i], spph[i], sc)
                    : sl.emissivityNear(sx[i], sy[i], sz[i], tE - sl.tau, spr[i], spth[i], spph[i], invH, norm,
                            support2);
            if (e != 0.0) {
                acc[pix[i]] += sdl[i] * e;
            }
        }
    }

    /** @return the start of the bin holding delay d: no sample before it has a delay above d */
    private int binFloor(double d) {
        int bins = binStart.length - 1;
        double b = Math.floor((d - binOrigin) / sliceSpacing);
        return binStart[(int) Math.max(0, Math.min(bins, b))];
    }

    /** @return the end of the bin holding delay d: no sample after it has a delay at or below d */
    private int binCeil(double d) {
        int bins = binStart.length - 1;
        double b = Math.floor((d - binOrigin) / sliceSpacing) + 1;
        return binStart[(int) Math.max(0, Math.min(bins, b))];
    }

    private long sliceIndex(double t) {
        return (long) FastMath.rint((t - sliceOrigin) / sliceSpacing);
    }

    private void run(Runnable job) {
        try {
            pool.submit(job).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("rendering interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("rendering failed: " + e.getCause(), e.getCause());
        }
    }

    @Override public void close() {
        pool.shutdown();
    }
}
