package org.spindrift.sim.light;

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
 * I_obs = integral g^(2+alpha) rho d(lambda), rho the kernel-smoothed particle density
 * (DESIGN section 7). The emission times are served by {@link EmissionSlice}s spaced
 * {@code sliceSpacing} apart, each built once and kept while frames need it, so frames should be
 * rendered in increasing observer time for the cache to slide.
 *
 * <p>Work is done slice by slice: the samples are kept sorted by delay, so the samples that see
 * one slice in a frame are one contiguous range, and one slice's particles stay in cache while
 * they are processed. Slices are grouped into fixed chunks (their boundaries depend on the frame
 * only), each chunk adds into its own image, and the chunk images are summed in chunk order, so
 * images do not depend on the thread count. The per-sample loop allocates nothing.
 */
public final class EmissionRenderer implements AutoCloseable {
    /** Slices per chunk of work. */
    private static final int SLICES_PER_CHUNK = 8;

    private final EmitterHistory history;
    private final Spacetime spacetime;
    private final int pixels;
    private final double h;
    private final double invH;
    private final double norm;
    private final double support2;
    private final double sliceSpacing;
    private final double sliceOrigin;
    private final double rMax;
    private final ForkJoinPool pool;
    private final Map<Long, EmissionSlice> cache = new HashMap<>();
    private final double[] delays;
    // samples sorted by delay (structure of arrays) and the pixel each belongs to
    private final float[] sx, sy, sz, sd, spr, spth, spph, sdl;
    private final int[] pix;
    private final List<double[]> chunkImages = new ArrayList<>();
    private int slicesBuilt;

    /**
     * @param smoothingLength kernel smoothing length h, M (support 2h)
     * @param threads worker threads (results do not depend on it)
     */
    public EmissionRenderer(RayTable table, EmitterHistory history, Spacetime spacetime, double smoothingLength,
                            int threads) {
        this.history = history;
        this.spacetime = spacetime;
        this.pixels = table.camera().pixels();
        this.h = smoothingLength;
        this.invH = 1.0 / h;
        this.norm = Kernel.norm(h);
        this.support2 = 4.0 * h * h;
        // slices h apart: a sample's emission time is within h/2 of its slice, over which the
        // particles are moved linearly; the search reach grows by |v| h/2 only
        this.sliceSpacing = h;
        this.sliceOrigin = history.time(0);
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
        cache.keySet().removeIf(j -> j < jLo);
        List<Long> missing = new ArrayList<>();
        for (long j = jLo; j <= jHi; j++) {
            if (!cache.containsKey(j)) {
                missing.add(j);
            }
        }
        EmissionSlice[] built = new EmissionSlice[missing.size()];
        run(() -> IntStream.range(0, built.length).parallel().forEach(i -> built[i] = EmissionSlice.build(
                history, spacetime, sliceOrigin + missing.get(i) * sliceSpacing, 2.0 * h, 0.5 * sliceSpacing, rMax)));
        for (int i = 0; i < built.length; i++) {
            cache.put(missing.get(i), built[i]);
        }
        slicesBuilt += built.length;
        int count = (int) (jHi - jLo + 1);
        int chunks = (count + SLICES_PER_CHUNK - 1) / SLICES_PER_CHUNK;
        while (chunkImages.size() < chunks) {
            chunkImages.add(new double[pixels * pixels]);
        }
        run(() -> IntStream.range(0, chunks).parallel().forEach(c -> {
            double[] acc = chunkImages.get(c);
            Arrays.fill(acc, 0.0);
            long from = jLo + (long) c * SLICES_PER_CHUNK;
            long to = FastMath.min(jHi, from + SLICES_PER_CHUNK - 1);
            for (long j = from; j <= to; j++) {
                EmissionSlice sl = cache.get(j);
                if (sl != null) {
                    renderSlice(sl, j, tObs, acc);
                }
            }
        }));
        for (int k = 0; k < image.length; k++) {
            double v = 0.0;
            for (int c = 0; c < chunks; c++) {
                v += chunkImages.get(c)[k];
            }
            image[k] = (float) v;
        }
    }

    /** Adds the emission of slice j to the samples whose emission time t_o - d rounds to it. */
    private void renderSlice(EmissionSlice sl, long j, double tObs, double[] acc) {
        // rint((tObs - d - origin) / spacing) == j  <=>  d in (tObs - origin - (j + 1/2) s, tObs - origin - (j - 1/2) s]
        double dHi = tObs - sliceOrigin - (j - 0.5) * sliceSpacing;
        double dLo = tObs - sliceOrigin - (j + 0.5) * sliceSpacing;
        int from = firstAbove(dLo);
        int to = firstAbove(dHi);
        for (int i = from; i < to; i++) {
            double tE = tObs - sd[i];
            double e = sl.emissivity(sx[i], sy[i], sz[i], tE - sl.tau, spr[i], spth[i], spph[i], invH, norm, support2);
            if (e != 0.0) {
                acc[pix[i]] += sdl[i] * e;
            }
        }
    }

    /** @return the first index of the sorted delays with value greater than d */
    private int firstAbove(double d) {
        int lo = 0, hi = sd.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sd[mid] > d) {
                hi = mid;
            } else {
                lo = mid + 1;
            }
        }
        return lo;
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
