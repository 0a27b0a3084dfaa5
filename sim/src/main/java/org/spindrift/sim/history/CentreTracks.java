package org.spindrift.sim.history;

import java.util.Arrays;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.archive.ArchiveLayout;

/**
 * Centre of mass of each source's alive particles at every snapshot, in the Cartesian coordinates
 * of {@link Coordinates#cartesian} (equal weights), and how many were alive. Computed once per
 * history ({@link ParticleHistory#centres()}) for everything that needs it: the archive's
 * {@code /centre} dataset, the shear shapes and the orbital plane of the plots. Each sum runs over
 * the particles in index order, so the result does not depend on who asks first.
 *
 * @param centre [source][snapshot][x, y, z] in M; NaN when no particle of the source is alive
 * @param alive [source][snapshot] alive particles
 */
public record CentreTracks(double[][][] centre, int[][] alive) {
    /** Snapshot chunks the work is cut into (fixed, so that nothing depends on the thread count). */
    private static final int CHUNKS = 16;

    /**
     * Computes the tracks of every source that has a particle (sources numbered by the history's
     * source index), snapshots on up to threads threads.
     */
    static CentreTracks of(ParticleHistory h, int threads) {
        int n = h.particles();
        int s = h.snapshots();
        int[] src = h.sourceIndex();
        int k = 0;
        for (int i = 0; i < n; i++) {
            k = Math.max(k, src[i] + 1);
        }
        double[][][] c = new double[k][s][3];
        int[][] alive = new int[k][s];
        int sources = k;
        int chunks = Math.min(CHUNKS, s);
        Chunked.forEach(chunks, threads, chunk -> {
            double[] xyz = new double[3];
            for (int q = Chunked.start(chunk, chunks, s); q < Chunked.start(chunk + 1, chunks, s); q++) {
                snapshot(h, q, sources, c, alive, xyz);
            }
        });
        return new CentreTracks(c, alive);
    }

    private static void snapshot(ParticleHistory h, int q, int k, double[][][] c, int[][] alive, double[] xyz) {
        int n = h.particles();
        int[] src = h.sourceIndex();
        double spin = h.spin();
        double[] r = h.r(q);
        double[] th = h.theta(q);
        double[] ph = h.phi(q);
        byte[] st = h.state(q);
        for (int i = 0; i < n; i++) {
            if (st[i] == ArchiveLayout.ALIVE) {
                Coordinates.cartesian(r[i], th[i], ph[i], spin, xyz);
                double[] ck = c[src[i]][q];
                ck[0] += xyz[0];
                ck[1] += xyz[1];
                ck[2] += xyz[2];
                alive[src[i]][q]++;
            }
        }
        for (int j = 0; j < k; j++) {
            double[] cj = c[j][q];
            int m = alive[j][q];
            if (m > 0) {
                cj[0] /= m;
                cj[1] /= m;
                cj[2] /= m;
            } else {
                Arrays.fill(cj, Double.NaN);
            }
        }
    }

    /** @return number of sources with tracks */
    public int sources() {
        return alive.length;
    }
}
