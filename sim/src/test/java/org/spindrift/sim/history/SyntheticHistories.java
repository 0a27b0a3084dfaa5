package org.spindrift.sim.history;

/**
 * Particle histories built in memory from closed-form orbits, for testing the analysis and light
 * layers without evolving anything.
 */
public final class SyntheticHistories {
    private SyntheticHistories() {
    }

    /**
     * Prograde circular equatorial Kerr orbits: r constant, phi = phi0 + Omega t with
     * Omega = 1 / (r^1.5 + a) (Bardeen, Press &amp; Teukolsky 1972, ApJ 178, 347, eq. 2.16),
     * u^t = (r^1.5 + a) / (r^0.75 sqrt(r^1.5 - 3 r^0.5 + 2 a)) (the normalisation u.u = -1 for that
     * Omega; recalled from memory, it gives 1 / sqrt(1 - 3/r) at a = 0) and u^phi = Omega u^t; every particle alive,
     * weight 1, one source.
     *
     * @param r radius of each particle, M
     * @param phi0 azimuth of each particle at t = 0
     * @param a spin
     * @param times snapshot times, M, increasing
     */
    public static ParticleHistory circularKerr(double[] r, double[] phi0, double a, double[] times) {
        int n = r.length;
        int s = times.length;
        double[][] rr = new double[s][n];
        double[][] th = new double[s][n];
        double[][] ph = new double[s][n];
        double[][] ut = new double[s][n];
        double[][] ur = new double[s][n];
        double[][] uth = new double[s][n];
        double[][] uph = new double[s][n];
        float[][] w = new float[s][n];
        byte[][] st = new byte[s][n];
        for (int i = 0; i < n; i++) {
            double om = 1.0 / (Math.pow(r[i], 1.5) + a);
            double u0 = (Math.pow(r[i], 1.5) + a)
                    / (Math.pow(r[i], 0.75) * Math.sqrt(Math.pow(r[i], 1.5) - 3 * Math.sqrt(r[i]) + 2 * a));
            for (int k = 0; k < s; k++) {
                rr[k][i] = r[i];
                th[k][i] = 0.5 * Math.PI;
                ph[k][i] = phi0[i] + om * times[k];
                ut[k][i] = u0;
                uph[k][i] = om * u0;
                w[k][i] = 1f;
            }
        }
        return new ParticleHistory(times.clone(), rr, th, ph, ut, ur, uth, uph, w, st, new int[n], a);
    }

    /** @return times 0, cadence, ..., up to duration */
    public static double[] grid(double duration, double cadence) {
        int s = (int) Math.floor(duration / cadence + 1e-9) + 1;
        double[] t = new double[s];
        for (int k = 0; k < s; k++) {
            t[k] = k * cadence;
        }
        return t;
    }
}
