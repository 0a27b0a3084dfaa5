package org.spindrift.sim.light;

import java.util.ArrayList;
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
 * I_obs = integral g^(2+alpha) rho d(lambda), rho the kernel-smoothed particle weight density
 * (DESIGN section 7). The emission times are served by {@link EmissionSlice}s spaced
 * {@code sliceSpacing} apart, built once each and kept while frames need them, so frames must be
 * rendered in increasing observer time for the cache to slide.
 *
 * <p>Rows of pixels are independent tasks; each pixel sums its samples in order, so images do
 * not depend on the thread count. The per-pixel loop allocates nothing.
 */
public final class EmissionRenderer implements AutoCloseable {
    private final RayTable table;
    private final EmitterHistory history;
    private final Spacetime spacetime;
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
    private int slicesBuilt;

    /**
     * @param smoothingLength kernel smoothing length h, M (support 2h)
     * @param threads worker threads (results do not depend on it)
     */
    public EmissionRenderer(RayTable table, EmitterHistory history, Spacetime spacetime, double smoothingLength,
                            int threads) {
        this.table = table;
        this.history = history;
        this.spacetime = spacetime;
        this.h = smoothingLength;
        this.invH = 1.0 / h;
        this.norm = Kernel.norm(h);
        this.support2 = 4.0 * h * h;
        // slices 2h apart: a particle drifts at most |v| h (|v| <= 1) from its slice position
        this.sliceSpacing = 2.0 * h;
        this.sliceOrigin = history.time(0);
        this.rMax = table.settings().emissionRadius() + 2.0 * h;
        this.delays = table.delayRange();
        this.pool = new ForkJoinPool(Math.max(1, threads));
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
        EmissionSlice[] window = new EmissionSlice[count];
        for (int i = 0; i < count; i++) {
            window[i] = cache.get(jLo + i);
        }
        int n = table.camera().pixels();
        run(() -> IntStream.range(0, n).parallel().forEach(row -> renderRow(row, tObs, jLo, window, image)));
    }

    private void renderRow(int row, double tObs, long jLo, EmissionSlice[] window, float[] image) {
        int n = table.camera().pixels();
        for (int col = 0; col < n; col++) {
            int k = row * n + col;
            double sum = 0.0;
            for (int i = table.firstSample(k), e = table.endSample(k); i < e; i++) {
                double tE = tObs - table.delay[i];
                long j = sliceIndex(tE);
                int w = (int) (j - jLo);
                if (w < 0 || w >= window.length) {
                    continue;
                }
                EmissionSlice sl = window[w];
                if (sl == null) {
                    continue;
                }
                sum += table.dl[i] * sl.emissivity(table.x[i], table.y[i], table.z[i], tE - sl.tau,
                        table.pr[i], table.pth[i], table.pph[i], invH, norm, support2);
            }
            image[k] = (float) sum;
        }
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
