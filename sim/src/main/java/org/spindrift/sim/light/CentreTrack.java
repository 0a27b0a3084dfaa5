package org.spindrift.sim.light;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.ZamoFrame;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The geodesics of the sources' centres (one test particle per source, started from given
 * positions and zero-angular-momentum-observer velocities and evolved by the motion engine's
 * {@link BatchIntegrator}), sampled at a fine cadence with positions, Cartesian velocities and
 * 4-velocities, for the compact-source light model. Between samples the position is a cubic
 * Hermite interpolant of the Cartesian position and velocity (e.g. de Boor 1978, A Practical Guide
 * to Splines, ch. IV), the 4-velocity linear. Also an {@link EmitterHistory} of those particles.
 */
public final class CentreTrack implements EmitterHistory {
    private final double[] t;
    /** [source][sample] */
    private final double[][] r, th, ph, ut, ur, uth, uph, x, y, z, vx, vy, vz;
    private final byte[][] state;
    private final double[] alpha;
    private final double dt;
    private final double vmax;

    private CentreTrack(double[] t, int k, double[] alpha) {
        this.t = t;
        int n = t.length;
        r = new double[k][n];
        th = new double[k][n];
        ph = new double[k][n];
        ut = new double[k][n];
        ur = new double[k][n];
        uth = new double[k][n];
        uph = new double[k][n];
        x = new double[k][n];
        y = new double[k][n];
        z = new double[k][n];
        vx = new double[k][n];
        vy = new double[k][n];
        vz = new double[k][n];
        state = new byte[k][n];
        this.alpha = alpha;
        this.dt = n > 1 ? t[1] - t[0] : 1.0;
        this.vmax = 0;
    }

    private CentreTrack(CentreTrack c, double vmax) {
        t = c.t;
        r = c.r;
        th = c.th;
        ph = c.ph;
        ut = c.ut;
        ur = c.ur;
        uth = c.uth;
        uph = c.uph;
        x = c.x;
        y = c.y;
        z = c.z;
        vx = c.vx;
        vy = c.vy;
        vz = c.vz;
        state = c.state;
        alpha = c.alpha;
        dt = c.dt;
        this.vmax = vmax;
    }

    /**
     * Evolves the centres of the sources from t = 0 to tEnd.
     *
     * @param starts per source its start: r, theta, phi (M, rad) and the velocity measured by the
     *     zero-angular-momentum observer there (v_r, v_theta, v_phi, units of c)
     * @param alpha per source the spectral index of its emission
     * @param captureRadius radius where the centres are stopped, M
     * @param cadence sample spacing, M
     * @param tolerance integration tolerance (absolute and relative)
     */
    public static CentreTrack of(double[][] starts, double[] alpha, Spacetime st, double captureRadius, double tEnd,
                                 double cadence, double tolerance) {
        int k = starts.length;
        int n = (int) FastMath.ceil(tEnd / cadence - 1e-9) + 1;
        double h = tEnd / (n - 1);
        double[] times = new double[n];
        for (int i = 0; i < n; i++) {
            times[i] = i * h;
        }
        CentreTrack tr = new CentreTrack(times, k, alpha.clone());
        ZamoFrame zamo = new ZamoFrame(st);
        ParticleBatch batch = new ParticleBatch(k);
        double[] p = new double[4];
        for (int s = 0; s < k; s++) {
            double[] c = starts[s];
            zamo.momentum(c[0], c[1], c[3], c[4], c[5], p);
            batch.set(s, 0.0, c[0], c[1], c[2], p[0], p[1], p[2], p[3]);
        }
        BatchIntegrator bi = new BatchIntegrator(st, BatchIntegrator.Config.of(captureRadius)
                .withTolerance(tolerance, tolerance));
        double[] g = new double[Spacetime.SIZE];
        double a2 = st.spin() * st.spin();
        double[] vm = new double[1];
        bi.integrate(batch, times, (idx, time, snap) -> {
            for (int s = 0; s < k; s++) {
                double rr = snap.r(s), tt = snap.theta(s), pp = snap.phi(s);
                st.inverse(rr, tt, g);
                double pt = snap.pT(s), pphi = snap.pPhi(s);
                double u0 = g[Spacetime.TT] * pt + g[Spacetime.TP] * pphi;
                double u1 = g[Spacetime.RR] * snap.pR(s);
                double u2 = g[Spacetime.HH] * snap.pTheta(s);
                double u3 = g[Spacetime.TP] * pt + g[Spacetime.PP] * pphi;
                tr.r[s][idx] = rr;
                tr.th[s][idx] = tt;
                tr.ph[s][idx] = pp;
                tr.ut[s][idx] = u0;
                tr.ur[s][idx] = u1;
                tr.uth[s][idx] = u2;
                tr.uph[s][idx] = u3;
                tr.state[s][idx] = snap.stateCode(s);
                // Cartesian map of Boyer-Lindquist coordinates, x = sqrt(r^2 + a^2) sin(theta) cos(phi), ...
                // (Boyer & Lindquist 1967, J. Math. Phys. 8, 265; from memory), and its coordinate-time derivative
                double big = FastMath.sqrt(rr * rr + a2);
                double sth = FastMath.sin(tt), cth = FastMath.cos(tt), sph = FastMath.sin(pp), cph = FastMath.cos(pp);
                double rd = u1 / u0, thd = u2 / u0, phd = u3 / u0;
                double dBig = rr * rd / big;
                tr.x[s][idx] = big * sth * cph;
                tr.y[s][idx] = big * sth * sph;
                tr.z[s][idx] = rr * cth;
                tr.vx[s][idx] = dBig * sth * cph + big * cth * cph * thd - big * sth * sph * phd;
                tr.vy[s][idx] = dBig * sth * sph + big * cth * sph * thd + big * sth * cph * phd;
                tr.vz[s][idx] = rd * cth - rr * sth * thd;
                if (snap.stateCode(s) == ALIVE) {
                    vm[0] = FastMath.max(vm[0], FastMath.sqrt(tr.vx[s][idx] * tr.vx[s][idx]
                            + tr.vy[s][idx] * tr.vy[s][idx] + tr.vz[s][idx] * tr.vz[s][idx]));
                }
            }
        });
        return new CentreTrack(tr, vm[0]);
    }

    /** @return number of sources */
    public int sources() {
        return r.length;
    }

    /** @return the largest Cartesian coordinate speed of any centre, M per M */
    public double maxSpeed() {
        return vmax;
    }

    /** @return the smallest and largest radius of the alive centres */
    public double[] radialRange() {
        return LightStage.radialRange(this);
    }

    /**
     * Position, Cartesian velocity and 4-velocity of centre s at time te (inside the track).
     *
     * @param out length 7: x, y, z, u^t, u^r, u^theta, u^phi; returns false when the centre has
     *     ended (captured, escaped) or te lies outside the track
     */
    public boolean at(int s, double te, double[] out) {
        int k = segment(s, te);
        if (k < 0) {
            return false;
        }
        double u = te / dt - k;
        double u2 = u * u, u3 = u2 * u;
        double h00 = 2 * u3 - 3 * u2 + 1, h10 = (u3 - 2 * u2 + u) * dt, h01 = -2 * u3 + 3 * u2, h11 = (u3 - u2) * dt;
        out[0] = h00 * x[s][k] + h10 * vx[s][k] + h01 * x[s][k + 1] + h11 * vx[s][k + 1];
        out[1] = h00 * y[s][k] + h10 * vy[s][k] + h01 * y[s][k + 1] + h11 * vy[s][k + 1];
        out[2] = h00 * z[s][k] + h10 * vz[s][k] + h01 * z[s][k + 1] + h11 * vz[s][k + 1];
        double w = 1 - u;
        out[3] = w * ut[s][k] + u * ut[s][k + 1];
        out[4] = w * ur[s][k] + u * ur[s][k + 1];
        out[5] = w * uth[s][k] + u * uth[s][k + 1];
        out[6] = w * uph[s][k] + u * uph[s][k + 1];
        return true;
    }

    /**
     * Second-order expansion of centre s about time te: position, velocity and acceleration of the
     * cubic Hermite interpolant of {@link #at} (its first and second derivatives), and the linear
     * 4-velocity with its slope, so that a caller can evaluate x(te + dt) = x + v dt + a dt^2 / 2
     * and u(te + dt) = u + u' dt near te without locating the segment per call (Taylor expansion of
     * the same spline; within a segment the position differs from {@link #at} by the third-order term).
     *
     * @param out length 17: x, y, z, vx, vy, vz, ax, ay, az, u^t, u^r, u^theta, u^phi and their slopes
     * @return false as {@link #at}
     */
    public boolean expansion(int s, double te, double[] out) {
        int k = segment(s, te);
        if (k < 0) {
            return false;
        }
        double u = te / dt - k, u2 = u * u, u3 = u2 * u;
        double h00 = 2 * u3 - 3 * u2 + 1, h10 = (u3 - 2 * u2 + u) * dt, h01 = -2 * u3 + 3 * u2, h11 = (u3 - u2) * dt;
        double d00 = (6 * u2 - 6 * u) / dt, d10 = 3 * u2 - 4 * u + 1, d01 = -d00, d11 = 3 * u2 - 2 * u;
        double e00 = (12 * u - 6) / (dt * dt), e10 = (6 * u - 4) / dt, e01 = -e00, e11 = (6 * u - 2) / dt;
        hermite(x[s], vx[s], k, h00, h10, h01, h11, d00, d10, d01, d11, e00, e10, e01, e11, out, 0);
        hermite(y[s], vy[s], k, h00, h10, h01, h11, d00, d10, d01, d11, e00, e10, e01, e11, out, 1);
        hermite(z[s], vz[s], k, h00, h10, h01, h11, d00, d10, d01, d11, e00, e10, e01, e11, out, 2);
        linear(ut[s], k, u, out, 0);
        linear(ur[s], k, u, out, 1);
        linear(uth[s], k, u, out, 2);
        linear(uph[s], k, u, out, 3);
        return true;
    }

    /** @return the segment [k, k + 1] holding te with both ends alive, or -1 */
    private int segment(int s, double te) {
        double f = te / dt;
        int k = (int) f;
        if (te < 0 || k >= t.length - 1) {
            if (k == t.length - 1 && f - k < 1e-9) {
                k = t.length - 2;
            } else {
                return -1;
            }
        }
        return state[s][k] == ALIVE && state[s][k + 1] == ALIVE ? k : -1;
    }

    private static void hermite(double[] p, double[] v, int k, double h00, double h10, double h01, double h11,
                                double d00, double d10, double d01, double d11, double e00, double e10, double e01,
                                double e11, double[] out, int c) {
        double p0 = p[k], p1 = p[k + 1], v0 = v[k], v1 = v[k + 1];
        out[c] = h00 * p0 + h10 * v0 + h01 * p1 + h11 * v1;
        out[3 + c] = d00 * p0 + d10 * v0 + d01 * p1 + d11 * v1;
        out[6 + c] = e00 * p0 + e10 * v0 + e01 * p1 + e11 * v1;
    }

    private void linear(double[] q, int k, double u, double[] out, int c) {
        out[9 + c] = (1 - u) * q[k] + u * q[k + 1];
        out[13 + c] = (q[k + 1] - q[k]) / dt;
    }

    /** @return true when centre s is alive over the whole interval [t0, t1] inside the track */
    public boolean aliveThrough(int s, double t0, double t1) {
        if (t0 < 0 || t1 > t[t.length - 1] + 1e-9 * dt) {
            return false;
        }
        int k0 = (int) (t0 / dt), k1 = FastMath.min(t.length - 1, (int) FastMath.ceil(t1 / dt));
        for (int k = k0; k <= k1; k++) {
            if (state[s][k] != ALIVE) {
                return false;
            }
        }
        return true;
    }

    @Override public int snapshots() {
        return t.length;
    }

    @Override public int particles() {
        return r.length;
    }

    @Override public double time(int s) {
        return t[s];
    }

    @Override public double r(int s, int n) {
        return r[n][s];
    }

    @Override public double theta(int s, int n) {
        return th[n][s];
    }

    @Override public double phi(int s, int n) {
        return ph[n][s];
    }

    @Override public double u(int s, int n, int mu) {
        return switch (mu) {
            case 0 -> ut[n][s];
            case 1 -> ur[n][s];
            case 2 -> uth[n][s];
            default -> uph[n][s];
        };
    }

    @Override public double weight(int s, int n) {
        return state[n][s] == ALIVE ? 1.0 : 0.0;
    }

    @Override public int state(int s, int n) {
        return state[n][s];
    }

    @Override public double spectralIndex(int n) {
        return alpha[n];
    }

    /** @return n: each particle is one source's centre */
    @Override public int source(int n) {
        return n;
    }
}
