package org.spindrift.sim.analysis;

import org.spindrift.sim.motion.TurningPoints;
import org.spindrift.sim.history.Chunked;
import org.spindrift.sim.history.ParticleHistory;

/**
 * Orbital periods of each particle from its sampled trajectory, in
 * coordinate time (M):
 * <ul>
 *   <li>radial period T_r: mean interval between successive periapsis passages, the minima of
 *       r(t), each located by a parabola through the three samples around it;</li>
 *   <li>vertical period T_theta: mean interval between successive maxima of theta(t), likewise;</li>
 *   <li>azimuthal period T_phi = 2 pi / |Omega_phi| with Omega_phi the mean dphi/dt: between the
 *       first and last periapsis when there are at least two (an orbit average), otherwise the
 *       least-squares slope of phi(t) over the samples where the particle is alive;</li>
 *   <li>periastron advance per radial period: Omega_phi T_r - 2 pi (radians), the extra azimuth
 *       swept between two periapses.</li>
 * </ul>
 * With the integrator's turning points ({@link TurningPoints}: p_r and p_theta rising through
 * zero, located on the dense output) the passages are exact to the integration tolerance; without
 * them (a history built elsewhere) extrema are detected on the snapshots, so the cadence must
 * resolve the period (at least 8 samples per period; common practice). Near-circular orbits have tiny radial excursions, where
 * detection is ill-conditioned: an oscillation below {@link #MIN_RELATIVE_AMPLITUDE} of r gives
 * NaN for T_r (and theta likewise, in radians).
 */
public final class ParticlePeriods {
    /** Smallest relative oscillation amplitude treated as a real oscillation. */
    public static final double MIN_RELATIVE_AMPLITUDE = 1e-7;

    /** Particles gathered from the snapshots at a time. */
    private static final int BLOCK = 64;

    /** Chunks of blocks the particles are cut into (fixed, so that nothing depends on the thread count). */
    private static final int CHUNKS = 32;

    private final double[] periodPhi;
    private final double[] periodR;
    private final double[] periodTheta;
    private final double[] advance;
    private final double[] meanR;

    private ParticlePeriods(int n) {
        periodPhi = new double[n];
        periodR = new double[n];
        periodTheta = new double[n];
        advance = new double[n];
        meanR = new double[n];
    }

    /** Measures every particle of the history from the snapshots alone. */
    public static ParticlePeriods of(ParticleHistory h) {
        return of(h, null);
    }

    /**
     * Measures every particle, with the turning points recorded during the integration when given
     * (one per particle, or null to use the snapshots).
     */
    public static ParticlePeriods of(ParticleHistory h, TurningPoints[] turning) {
        return of(h, turning, 1);
    }

    /**
     * As {@link #of(ParticleHistory, TurningPoints[])}, blocks of particles on up to threads
     * threads (each particle is measured on its own: the same values for any count).
     */
    public static ParticlePeriods of(ParticleHistory h, TurningPoints[] turning, int threads) {
        int n = h.particles();
        ParticlePeriods p = new ParticlePeriods(n);
        int blocks = (n + BLOCK - 1) / BLOCK;
        int chunks = Math.min(CHUNKS, blocks);
        Chunked.forEach(chunks, threads, c -> {
            int b0 = Chunked.start(c, chunks, blocks);
            int b1 = Chunked.start(c + 1, chunks, blocks);
            p.measureParticles(h, turning, b0 * BLOCK, Math.min(n, b1 * BLOCK));
        });
        return p;
    }

    /** Measures particles from..to-1, gathered from the snapshots in blocks. */
    private void measureParticles(ParticleHistory h, TurningPoints[] turning, int from, int to) {
        int s = h.snapshots();
        double[] t = h.times();
        // particles in blocks: each snapshot's arrays are read in runs of BLOCK neighbours, not one
        // element per snapshot per particle
        int block = Math.min(BLOCK, Math.max(1, to - from));
        double[][] r = new double[block][s];
        double[][] th = new double[block][s];
        double[][] ph = new double[block][s];
        int[] alive = new int[block];
        double[] ext = new double[s];
        double[] extPhi = new double[s];
        for (int i0 = from; i0 < to; i0 += block) {
            int nb = Math.min(block, to - i0);
            // alive[j]: snapshots before the first where particle i0 + j is not alive (-1: none yet)
            java.util.Arrays.fill(alive, 0, nb, -1);
            for (int k = 0; k < s; k++) {
                byte[] st = h.state(k);
                double[] rk = h.r(k);
                double[] thk = h.theta(k);
                double[] phk = h.phi(k);
                for (int j = 0; j < nb; j++) {
                    if (alive[j] >= 0) {
                        continue;
                    }
                    int i = i0 + j;
                    if (st[i] != 0) {
                        alive[j] = k;
                        continue;
                    }
                    r[j][k] = rk[i];
                    th[j][k] = thk[i];
                    ph[j][k] = phk[i];
                }
            }
            for (int j = 0; j < nb; j++) {
                int i = i0 + j;
                int m = alive[j] < 0 ? s : alive[j];
                measure(i, t, r[j], th[j], ph[j], m, ext, extPhi, turning == null ? null : turning[i]);
            }
        }
    }

    /**
     * Measures particle i from its m alive samples; with its turning points (tp not null) the
     * passages come from them, and the snapshots' extrema are searched only where those cannot be
     * used (for the azimuthal period of a near-circular orbit).
     */
    private void measure(int i, double[] t, double[] r, double[] th, double[] ph, int m, double[] ext,
            double[] extPhi, TurningPoints tp) {
        periodPhi[i] = Double.NaN;
        periodR[i] = Double.NaN;
        periodTheta[i] = Double.NaN;
        advance[i] = Double.NaN;
        meanR[i] = Double.NaN;
        if (m < 3) {
            return;
        }
        double sum = 0;
        for (int k = 0; k < m; k++) {
            sum += r[k];
        }
        meanR[i] = sum / m;
        // near-circular / near-equatorial orbits: the passages are ill-conditioned (see TurningPoints)
        if (tp != null && amplitude(r, m) > meanR[i] * MIN_RELATIVE_AMPLITUDE && tp.periapsisCount() >= 2) {
            int c = tp.periapsisCount();
            double dt = tp.periapsisTime(c - 1) - tp.periapsisTime(0);
            double om = (tp.periapsisPhi(c - 1) - tp.periapsisPhi(0)) / dt;
            periodR[i] = dt / (c - 1);
            periodPhi[i] = 2.0 * Math.PI / Math.abs(om);
            advance[i] = Math.abs(om) * periodR[i] - 2.0 * Math.PI;
        } else {
            int nr = extrema(t, r, ph, m, -1, meanR[i] * MIN_RELATIVE_AMPLITUDE, ext, extPhi);
            double omega = nr >= 2 ? (extPhi[nr - 1] - extPhi[0]) / (ext[nr - 1] - ext[0]) : slope(t, ph, m);
            periodPhi[i] = 2.0 * Math.PI / Math.abs(omega);
            // with turning points, snapshot extrema of an ill-conditioned orbit give no radial period
            if (tp == null && nr >= 2) {
                periodR[i] = (ext[nr - 1] - ext[0]) / (nr - 1);
                advance[i] = Math.abs(omega) * periodR[i] - 2.0 * Math.PI;
            }
        }
        if (tp != null) {
            if (amplitude(th, m) > MIN_RELATIVE_AMPLITUDE && tp.polarCount() >= 2) {
                int c = tp.polarCount();
                periodTheta[i] = (tp.polarTime(c - 1) - tp.polarTime(0)) / (c - 1);
            }
        } else {
            int nt = extrema(t, th, ph, m, +1, MIN_RELATIVE_AMPLITUDE, ext, extPhi);
            if (nt >= 2) {
                periodTheta[i] = (ext[nt - 1] - ext[0]) / (nt - 1);
            }
        }
    }

    private static double amplitude(double[] y, int m) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < m; k++) {
            lo = Math.min(lo, y[k]);
            hi = Math.max(hi, y[k]);
        }
        return hi - lo;
    }

    /**
     * Interior extrema (sign -1: minima, +1: maxima) of y(t), refined by a parabola through the
     * three samples (vertex of the interpolating quadratic; unequal spacing allowed).
     *
     * @return number found; times into et, interpolated phi into ephi
     */
    static int extrema(double[] t, double[] y, double[] ph, int m, int sign, double minAmplitude, double[] et,
            double[] ephi) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < m; k++) {
            lo = Math.min(lo, y[k]);
            hi = Math.max(hi, y[k]);
        }
        if (!(hi - lo > minAmplitude)) {
            return 0;
        }
        int c = 0;
        for (int k = 1; k + 1 < m; k++) {
            double a = sign * y[k - 1];
            double b = sign * y[k];
            double d = sign * y[k + 1];
            if (b > a && b >= d) {
                // vertex of the parabola through (t0,a), (t1,b), (t2,d)
                double t0 = t[k - 1];
                double t1 = t[k];
                double t2 = t[k + 1];
                double num = (t1 - t0) * (t1 - t0) * (b - d) - (t1 - t2) * (t1 - t2) * (b - a);
                double den = (t1 - t0) * (b - d) - (t1 - t2) * (b - a);
                double tv = den != 0 ? t1 - 0.5 * num / den : t1;
                tv = Math.max(t0, Math.min(t2, tv));
                et[c] = tv;
                ephi[c] = tv <= t1 ? ph[k - 1] + (ph[k] - ph[k - 1]) * (tv - t0) / (t1 - t0)
                        : ph[k] + (ph[k + 1] - ph[k]) * (tv - t1) / (t2 - t1);
                c++;
            }
        }
        return c;
    }

    /** Least-squares slope of y(t). */
    static double slope(double[] t, double[] y, int m) {
        double mt = 0;
        double my = 0;
        for (int k = 0; k < m; k++) {
            mt += t[k];
            my += y[k];
        }
        mt /= m;
        my /= m;
        double sxy = 0;
        double sxx = 0;
        for (int k = 0; k < m; k++) {
            sxy += (t[k] - mt) * (y[k] - my);
            sxx += (t[k] - mt) * (t[k] - mt);
        }
        return sxy / sxx;
    }

    /** @return azimuthal period of particle i, M (NaN if not measurable) */
    public double periodPhi(int i) {
        return periodPhi[i];
    }

    /** @return radial period, M */
    public double periodR(int i) {
        return periodR[i];
    }

    /** @return vertical period, M */
    public double periodTheta(int i) {
        return periodTheta[i];
    }

    /** @return periastron advance per radial period, radians */
    public double advance(int i) {
        return advance[i];
    }

    /** @return mean r while alive, M */
    public double meanR(int i) {
        return meanR[i];
    }

    /** @return the azimuthal period of every particle, M (NaN where not measured) (the stored array: read only) */
    public double[] periodPhi() {
        return periodPhi;
    }

    /** @return the radial period of every particle, M (NaN where not measured) (the stored array: read only) */
    public double[] periodR() {
        return periodR;
    }

    /** @return the vertical period of every particle, M (NaN where not measured) (the stored array: read only) */
    public double[] periodTheta() {
        return periodTheta;
    }

    /** @return the periastron advance of every particle per radial period, rad (NaN where not measured) (the stored array: read only) */
    public double[] advance() {
        return advance;
    }
}
