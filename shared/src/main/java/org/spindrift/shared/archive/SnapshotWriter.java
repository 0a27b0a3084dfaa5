package org.spindrift.shared.archive;

import io.jhdf.HdfFile;
import io.jhdf.WritableHdfFile;
import java.io.IOException;
import java.nio.file.Path;

/**
 * Collects the kept particles' snapshots and writes {@code snapshots.h5} in the layout of
 * DEVELOPERS.md (format version 1) with jhdf. Snapshots are added in time order; the file is
 * written once, through a temporary name, by {@link #write}. Memory: about
 * S x N x 88 bytes for S snapshots of N kept particles.
 */
public final class SnapshotWriter {
    private final int capacity;
    private final int n;
    private final int k;
    private final int[] sourceIndex;
    private final double spin;
    private final double massSolar;
    private final double distanceMpc;
    private final double[] time;
    private final double[][] r;
    private final double[][] theta;
    private final double[][] phi;
    private final double[][] x;
    private final double[][] y;
    private final double[][] z;
    private final double[][][] u;
    private final float[][] weight;
    private final byte[][] state;
    private final double[][][] centre;
    private final double[] xyz = new double[3];
    private int count;

    /**
     * @param snapshots maximum number of snapshots
     * @param sourceIndex source (0-based) of each kept particle; its length is N
     * @param sources number of sources K
     * @param spin spin a, for the Cartesian coordinates and the root attribute
     * @param massSolar root attribute
     * @param distanceMpc root attribute
     */
    public SnapshotWriter(int snapshots, int[] sourceIndex, int sources, double spin, double massSolar,
            double distanceMpc) {
        this.capacity = snapshots;
        this.n = sourceIndex.length;
        this.k = sources;
        this.sourceIndex = sourceIndex.clone();
        for (int s : this.sourceIndex) {
            if (s < 0 || s >= sources) {
                throw new IllegalArgumentException("source index " + s + " outside 0.." + (sources - 1));
            }
        }
        this.spin = spin;
        this.massSolar = massSolar;
        this.distanceMpc = distanceMpc;
        time = new double[snapshots];
        r = new double[snapshots][];
        theta = new double[snapshots][];
        phi = new double[snapshots][];
        x = new double[snapshots][];
        y = new double[snapshots][];
        z = new double[snapshots][];
        u = new double[snapshots][][];
        weight = new float[snapshots][];
        state = new byte[snapshots][];
        centre = new double[snapshots][][];
    }

    /** @return number of kept particles N */
    public int particles() {
        return n;
    }

    /** @return snapshots added so far */
    public int count() {
        return count;
    }

    /**
     * Adds one snapshot of the kept particles (arrays of length N, copied).
     *
     * @param t coordinate time, M
     * @param u4 contravariant 4-velocity components u^t, u^r, u^theta, u^phi, each of length N
     * @param centres Cartesian centre of mass of each source's alive particles, [K][3]
     *     (NaN when a source has none alive)
     */
    public void add(double t, double[] rr, double[] th, double[] ph, double[] ut, double[] ur, double[] uth,
            double[] uph, float[] w, byte[] st, double[][] centres) {
        if (count == capacity) {
            throw new IllegalStateException("more than " + capacity + " snapshots");
        }
        if (count > 0 && !(t > time[count - 1])) {
            throw new IllegalArgumentException("snapshot times must increase: " + t + " after " + time[count - 1]);
        }
        final int s = count;
        time[s] = t;
        r[s] = copy(rr);
        theta[s] = copy(th);
        phi[s] = copy(ph);
        x[s] = new double[n];
        y[s] = new double[n];
        z[s] = new double[n];
        u[s] = new double[n][4];
        for (int i = 0; i < n; i++) {
            ArchiveLayout.cartesian(rr[i], th[i], ph[i], spin, xyz);
            x[s][i] = xyz[0];
            y[s][i] = xyz[1];
            z[s][i] = xyz[2];
            u[s][i][0] = ut[i];
            u[s][i][1] = ur[i];
            u[s][i][2] = uth[i];
            u[s][i][3] = uph[i];
        }
        if (w.length != n || st.length != n) {
            throw new IllegalArgumentException("weight/state length differs from " + n);
        }
        weight[s] = w.clone();
        state[s] = st.clone();
        if (centres.length != k) {
            throw new IllegalArgumentException("centres for " + centres.length + " sources, expected " + k);
        }
        centre[s] = new double[k][];
        for (int j = 0; j < k; j++) {
            centre[s][j] = centres[j].clone();
        }
        count++;
    }

    private double[] copy(double[] a) {
        if (a.length != n) {
            throw new IllegalArgumentException("array of length " + a.length + ", expected " + n);
        }
        return a.clone();
    }

    /**
     * Writes {@code snapshots.h5} into folder (through {@code .snapshots.h5.partial}).
     *
     * @return the file written
     */
    public Path write(Path folder) throws IOException {
        if (count == 0) {
            throw new IllegalStateException("no snapshots to write");
        }
        Path target = folder.resolve(ArchiveLayout.SNAPSHOTS);
        AtomicFiles.write(target, tmp -> {
            try (WritableHdfFile f = HdfFile.write(tmp)) {
                f.putAttribute("format_version", ArchiveLayout.FORMAT_VERSION);
                f.putAttribute("spin", spin);
                f.putAttribute("mass_solar", massSolar);
                f.putAttribute("distance_Mpc", distanceMpc);
                f.putDataset(ArchiveLayout.D_TIME, java.util.Arrays.copyOf(time, count));
                f.putDataset(ArchiveLayout.D_SOURCE_INDEX, sourceIndex);
                f.putDataset(ArchiveLayout.D_R, trim(r));
                f.putDataset(ArchiveLayout.D_THETA, trim(theta));
                f.putDataset(ArchiveLayout.D_PHI, trim(phi));
                f.putDataset(ArchiveLayout.D_X, trim(x));
                f.putDataset(ArchiveLayout.D_Y, trim(y));
                f.putDataset(ArchiveLayout.D_Z, trim(z));
                f.putDataset(ArchiveLayout.D_U, java.util.Arrays.copyOf(u, count));
                f.putDataset(ArchiveLayout.D_WEIGHT, java.util.Arrays.copyOf(weight, count));
                f.putDataset(ArchiveLayout.D_STATE, java.util.Arrays.copyOf(state, count));
                f.putDataset(ArchiveLayout.D_CENTRE, java.util.Arrays.copyOf(centre, count));
            }
        });
        return target;
    }

    private double[][] trim(double[][] a) {
        return java.util.Arrays.copyOf(a, count);
    }
}
