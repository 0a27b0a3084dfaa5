package org.spindrift.sim.motion;

import org.spindrift.sim.spacetime.Spacetime;

/**
 * Hamilton's equations for geodesics of a stationary, axisymmetric {@link Spacetime}:
 * H = 1/2 g^{mu nu} p_mu p_nu, dx^mu/dlambda = dH/dp_mu, dp_mu/dlambda = -dH/dx^mu
 * (Misner, Thorne & Wheeler 1973, eq. 25.19 and exercise 25.2). H = -1/2 for test masses and
 * 0 for photons; p_t = -E and p_phi = L are constants because the metric depends on neither t
 * nor phi, so they are parameters here, not state.
 *
 * <p>Two forms share one evaluation of the metric:
 * <ul>
 *   <li>{@link #coordinateTime}: test masses with coordinate time t as the independent variable,
 *       state (r, theta, phi, p_r, p_theta), each derivative divided by dt/dlambda, so a whole
 *       cloud advances on one time grid;</li>
 *   <li>{@link #affine}: photons in the affine parameter, state (t, r, theta, phi, p_r, p_theta).</li>
 * </ul>
 * One instance holds a scratch buffer and is therefore not thread-safe: give each thread its own.
 * Nothing is allocated per call.
 */
public final class GeodesicEquations {
    /** State index of r in the coordinate-time form. */
    public static final int R = 0;
    /** State index of theta in the coordinate-time form. */
    public static final int TH = 1;
    /** State index of phi in the coordinate-time form. */
    public static final int PH = 2;
    /** State index of p_r in the coordinate-time form. */
    public static final int PR = 3;
    /** State index of p_theta in the coordinate-time form. */
    public static final int PTH = 4;
    /** Dimension of the coordinate-time state. */
    public static final int DIM_T = 5;
    /** Dimension of the affine state (t first, then as the coordinate-time state). */
    public static final int DIM_AFFINE = 6;

    private final Spacetime spacetime;
    private final double[] g = new double[Spacetime.SIZE];

    public GeodesicEquations(Spacetime spacetime) {
        this.spacetime = spacetime;
    }

    /** @return the spacetime */
    public Spacetime spacetime() {
        return spacetime;
    }

    /**
     * Right-hand side with coordinate time as the independent variable.
     *
     * @param pt the conserved p_t = -E
     * @param pphi the conserved p_phi = L
     * @param y state array, read from {@code y[yOff .. yOff+4]}
     * @param dy derivative d/dt written to {@code dy[dyOff .. dyOff+4]}
     * @return dt/dlambda, the factor the affine derivatives were divided by (its sign flips
     *     only inside an ergoregion's unphysical branch; callers treat non-positive as failure)
     */
    public double coordinateTime(double pt, double pphi, double[] y, int yOff, double[] dy, int dyOff) {
        final double r = y[yOff + R];
        final double th = y[yOff + TH];
        final double pr = y[yOff + PR];
        final double pth = y[yOff + PTH];
        spacetime.inverse(r, th, g);
        final double tDot = g[Spacetime.TT] * pt + g[Spacetime.TP] * pphi;
        final double inv = 1.0 / tDot;
        dy[dyOff + R] = g[Spacetime.RR] * pr * inv;
        dy[dyOff + TH] = g[Spacetime.HH] * pth * inv;
        dy[dyOff + PH] = (g[Spacetime.TP] * pt + g[Spacetime.PP] * pphi) * inv;
        dy[dyOff + PR] = -0.5 * quadratic(Spacetime.DR, pt, pphi, pr, pth) * inv;
        dy[dyOff + PTH] = -0.5 * quadratic(Spacetime.DTH, pt, pphi, pr, pth) * inv;
        return tDot;
    }

    /**
     * Right-hand side in the affine parameter, state (t, r, theta, phi, p_r, p_theta) read from
     * {@code y[yOff ..]}, derivative written to {@code dy[dyOff ..]}.
     */
    public void affine(double pt, double pphi, double[] y, int yOff, double[] dy, int dyOff) {
        final double r = y[yOff + 1];
        final double th = y[yOff + 2];
        final double pr = y[yOff + 4];
        final double pth = y[yOff + 5];
        spacetime.inverse(r, th, g);
        dy[dyOff] = g[Spacetime.TT] * pt + g[Spacetime.TP] * pphi;
        dy[dyOff + 1] = g[Spacetime.RR] * pr;
        dy[dyOff + 2] = g[Spacetime.HH] * pth;
        dy[dyOff + 3] = g[Spacetime.TP] * pt + g[Spacetime.PP] * pphi;
        dy[dyOff + 4] = -0.5 * quadratic(Spacetime.DR, pt, pphi, pr, pth);
        dy[dyOff + 5] = -0.5 * quadratic(Spacetime.DTH, pt, pphi, pr, pth);
    }

    /** @return H = 1/2 g^{mu nu} p_mu p_nu at (r, theta) */
    public double hamiltonian(double r, double theta, double pt, double pphi, double pr, double pth) {
        spacetime.inverse(r, theta, g);
        return 0.5 * quadratic(0, pt, pphi, pr, pth);
    }

    /** g^{mu nu}(offset) p_mu p_nu for the block of g starting at offset (value, d/dr or d/dtheta). */
    private double quadratic(int off, double pt, double pphi, double pr, double pth) {
        return g[off + Spacetime.TT] * pt * pt + 2.0 * g[off + Spacetime.TP] * pt * pphi
                + g[off + Spacetime.PP] * pphi * pphi + g[off + Spacetime.RR] * pr * pr
                + g[off + Spacetime.HH] * pth * pth;
    }
}
