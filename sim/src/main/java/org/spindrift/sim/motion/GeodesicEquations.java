package org.spindrift.sim.motion;

import org.spindrift.sim.spacetime.MassFunction;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;
import org.spindrift.sim.spacetime.Trig;

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
 *
 * <p>For the Kerr-like {@link MassFunctionSpacetime} the coordinate-time form uses Carter's
 * separated Hamiltonian instead of the 15 metric components (same equations, about half the
 * arithmetic; see {@link #coordinateTimeSeparated}).
 *
 * <p>As {@link BatchEquations} (what the batch integrator sees) the equations are the
 * coordinate-time form with the constants (c0, c1) = (p_t, p_phi).
 */
public final class GeodesicEquations implements BatchEquations {
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
    /** Non-null when the separated form applies (Kerr-like metric with a mass function). */
    private final MassFunction mass;
    private final double a;

    public GeodesicEquations(Spacetime spacetime) {
        this(spacetime, true);
    }

    /** @param separated false forces the general form (tests compare the two) */
    GeodesicEquations(Spacetime spacetime, boolean separated) {
        this.spacetime = spacetime;
        this.mass = separated && spacetime instanceof MassFunctionSpacetime m ? m.massFunction() : null;
        this.a = spacetime.spin();
    }

    /** @return {@link #DIM_T}: the coordinate-time state (r, theta, phi, p_r, p_theta) */
    @Override public int dimension() {
        return DIM_T;
    }

    /** The coordinate-time form: {@link #coordinateTime} with c0 = p_t, c1 = p_phi. */
    @Override public double derivatives(double c0, double c1, double[] y, int yOff, double[] dy, int dyOff) {
        return coordinateTime(c0, c1, y, yOff, dy, dyOff);
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
        if (mass != null) {
            return coordinateTimeSeparated(pt, pphi, y, yOff, dy, dyOff);
        }
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
     * {@link #coordinateTime} for the Kerr-like metric with mass function m(r), from Carter's
     * separated form (Carter 1968, Phys. Rev. 174, 1559; Misner, Thorne &amp; Wheeler 1973, eq. 33.31
     * for Kerr; it holds for any m(r) because Delta depends on r alone):
     * <pre>
     *   2 Sigma H = Rt(r) + Tt(theta),  Rt = Delta p_r^2 - P^2 / Delta,  P = (r^2 + a^2) E - a L,
     *   Tt = p_theta^2 + U^2 / sin^2,   U = L - a E sin^2,   E = -p_t, L = p_phi.
     * </pre>
     * Then Sigma dt/dlambda = T = (r^2 + a^2) P / Delta + a U, Sigma dphi/dlambda = a P / Delta + U / sin^2,
     * Sigma dr/dlambda = Delta p_r, Sigma dtheta/dlambda = p_theta, and
     * -Sigma dH/dx = -(1/2) d(Rt + Tt)/dx + H dSigma/dx with H = (Rt + Tt) / (2 Sigma), exactly
     * (H is not set to -1/2, so the equations are those of the general form also off the mass shell).
     * Dividing by T, the factors Sigma cancel.
     */
    private double coordinateTimeSeparated(double pt, double pphi, double[] y, int yOff, double[] dy, int dyOff) {
        final double r = y[yOff + R];
        final double th = y[yOff + TH];
        final double pr = y[yOff + PR];
        final double pth = y[yOff + PTH];
        final double s = Trig.sin(th);
        final double c = Trig.cos(th);
        final double s2 = s * s;
        final double a2 = a * a;
        final double m = mass.value(r);
        final double mr = mass.derivative(r);
        final double e = -pt;
        final double rho = r * r + a2;
        final double sig = r * r + a2 * c * c;
        final double del = rho - 2.0 * m * r;
        final double delR = 2.0 * r - 2.0 * (m + r * mr);
        final double iDel = 1.0 / del;
        final double iS2 = 1.0 / s2;
        final double p = rho * e - a * pphi;
        final double u = pphi - a * e * s2;
        final double pd = p * iDel;
        final double rt = del * pr * pr - p * pd;
        final double tt = pth * pth + u * u * iS2;
        final double q = (rt + tt) / sig; // 2 H
        final double tSig = rho * pd + a * u;
        final double inv = 1.0 / tSig;
        // (1/2) dRt/dr = (1/2) Delta' p_r^2 - P P' / Delta + (1/2) P^2 Delta' / Delta^2, P' = 2 r E;
        // H dSigma/dr = r q
        final double halfRtR = 0.5 * delR * (pr * pr + pd * pd) - 2.0 * r * e * pd;
        // (1/2) dTt/dtheta = -(cos/sin) (2 a E U + U^2 / sin^2); H dSigma/dtheta = -a^2 sin cos q
        final double halfTtT = -c * s * iS2 * (2.0 * a * e * u + u * u * iS2);
        dy[dyOff + R] = del * pr * inv;
        dy[dyOff + TH] = pth * inv;
        dy[dyOff + PH] = (a * pd + u * iS2) * inv;
        dy[dyOff + PR] = (r * q - halfRtR) * inv;
        dy[dyOff + PTH] = -(halfTtT + a2 * s * c * q) * inv;
        return tSig / sig;
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
