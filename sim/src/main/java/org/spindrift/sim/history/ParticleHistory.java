package org.spindrift.sim.history;

/**
 * Every particle of a run at every snapshot, structure of arrays: for snapshot s the arrays
 * {@code r(s)}, {@code theta(s)}, {@code phi(s)}, the contravariant 4-velocity
 * {@code ut(s)}, {@code ur(s)}, {@code uTheta(s)}, {@code uPhi(s)}, the emission weight (flare
 * envelope applied) and the state code (0 alive, 1 captured, 2 escaped, 3 failed), each indexed by
 * particle 0..N-1, plus the snapshot times (coordinate time, M) and the source of each particle.
 * phi is continuous (not wrapped to 2 pi), as integrated.
 *
 * <p>Consumers: the analysis (periods, shear shapes) and the light stage (emission density at
 * the emission time, cubic Hermite in time from positions and velocities: dx^i/dt = u^i/u^t).
 * Accessors return the stored arrays without copying, for speed: treat them as read-only.
 * Particles that ended keep the state at which they ended.
 */
public final class ParticleHistory {
    private final double[] times;
    private final double[][] r;
    private final double[][] theta;
    private final double[][] phi;
    private final double[][] ut;
    private final double[][] ur;
    private final double[][] uTheta;
    private final double[][] uPhi;
    private final float[][] weight;
    private final byte[][] state;
    private final int[] sourceIndex;
    private final double spin;
    private CentreTracks centres;

    /**
     * @param times S snapshot times, increasing (M)
     * @param r [S][N], likewise theta, phi, ut, ur, uTheta, uPhi, weight, state
     * @param sourceIndex [N] source of each particle (0-based, order of the scenario's sources)
     * @param spin spin a of the metric (for Cartesian coordinates)
     */
    public ParticleHistory(double[] times, double[][] r, double[][] theta, double[][] phi, double[][] ut,
            double[][] ur, double[][] uTheta, double[][] uPhi, float[][] weight, byte[][] state, int[] sourceIndex,
            double spin) {
        int s = times.length;
        int n = sourceIndex.length;
        for (Object[] a : new Object[][] {r, theta, phi, ut, ur, uTheta, uPhi, weight, state}) {
            if (a.length != s) {
                throw new IllegalArgumentException("every array needs " + s + " snapshots, one has " + a.length);
            }
        }
        for (int k = 0; k < s; k++) {
            if (r[k].length != n || theta[k].length != n || phi[k].length != n || ut[k].length != n
                    || ur[k].length != n || uTheta[k].length != n || uPhi[k].length != n || weight[k].length != n
                    || state[k].length != n) {
                throw new IllegalArgumentException("snapshot " + k + ": arrays must have " + n + " particles");
            }
            if (k > 0 && !(times[k] > times[k - 1])) {
                throw new IllegalArgumentException("times must increase");
            }
        }
        this.times = times;
        this.r = r;
        this.theta = theta;
        this.phi = phi;
        this.ut = ut;
        this.ur = ur;
        this.uTheta = uTheta;
        this.uPhi = uPhi;
        this.weight = weight;
        this.state = state;
        this.sourceIndex = sourceIndex;
        this.spin = spin;
    }

    /** @return number of snapshots S */
    public int snapshots() {
        return times.length;
    }

    /** @return number of particles N */
    public int particles() {
        return sourceIndex.length;
    }

    /** @return the spin a */
    public double spin() {
        return spin;
    }

    /** @return all snapshot times (M) */
    public double[] times() {
        return times;
    }

    /** @return time of snapshot s (M) */
    public double time(int s) {
        return times[s];
    }

    /** @return the source of each particle */
    public int[] sourceIndex() {
        return sourceIndex;
    }

    public double[] r(int s) {
        return r[s];
    }

    public double[] theta(int s) {
        return theta[s];
    }

    /** @return phi at snapshot s, continuous in time per particle */
    public double[] phi(int s) {
        return phi[s];
    }

    /** @return u^t at snapshot s */
    public double[] ut(int s) {
        return ut[s];
    }

    /** @return u^r at snapshot s */
    public double[] ur(int s) {
        return ur[s];
    }

    /** @return u^theta at snapshot s */
    public double[] uTheta(int s) {
        return uTheta[s];
    }

    /** @return u^phi at snapshot s */
    public double[] uPhi(int s) {
        return uPhi[s];
    }

    /** @return emission weight at snapshot s (flare envelope applied; 0 once a particle has ended) */
    public float[] weight(int s) {
        return weight[s];
    }

    /** @return state codes at snapshot s */
    public byte[] state(int s) {
        return state[s];
    }

    /**
     * @return the centre of mass of each source's alive particles at every snapshot, computed on
     *     the first call and kept (the arrays are shared: read only)
     */
    public CentreTracks centres() {
        return centres(1);
    }

    /** As {@link #centres()}, computed (on the first call) on up to threads threads; the same values for any count. */
    public synchronized CentreTracks centres(int threads) {
        if (centres == null) {
            centres = CentreTracks.of(this, threads);
        }
        return centres;
    }
}
