package org.spindrift.sim.motion;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The zero-angular-momentum observer's orthonormal frame (the locally non-rotating frame of
 * Bardeen, Press &amp; Teukolsky 1972, ApJ 178, 347, eq. 3.2-3.3) at (r, theta), for any
 * {@link Spacetime}:
 *
 * <pre>
 *   omega = -g_tphi / g_phiphi,   alpha^2 = -1 / g^tt = -(g_tt - g_tphi^2 / g_phiphi)
 *   e_(t) = (d_t + omega d_phi) / alpha,   e_(r) = d_r / sqrt(g_rr),
 *   e_(theta) = d_theta / sqrt(g_thth),    e_(phi) = d_phi / sqrt(g_phiphi)
 * </pre>
 *
 * A test mass with local 3-velocity v (components along e_(r), e_(theta), e_(phi), |v| &lt; 1)
 * has u = gamma (e_(t) + v^i e_(i)), gamma = 1 / sqrt(1 - v^2); lowering with g gives p_mu
 * (unit rest mass). The converse gives v from p_mu. One instance holds a scratch buffer: not
 * thread-safe, give each thread its own.
 */
public final class ZamoFrame {
    private final Spacetime spacetime;
    private final double[] g = new double[Spacetime.SIZE];

    public ZamoFrame(Spacetime spacetime) {
        this.spacetime = spacetime;
    }

    /** @return the frame-dragging angular velocity omega = -g_tphi / g_phiphi at (r, theta) */
    public double omega(double r, double theta) {
        spacetime.covariant(r, theta, g);
        return -g[Spacetime.TP] / g[Spacetime.PP];
    }

    /** @return the lapse alpha = sqrt(-(g_tt - g_tphi^2 / g_phiphi)) at (r, theta) */
    public double lapse(double r, double theta) {
        spacetime.covariant(r, theta, g);
        return FastMath.sqrt(-(g[Spacetime.TT] - g[Spacetime.TP] * g[Spacetime.TP] / g[Spacetime.PP]));
    }

    /**
     * Covariant 4-momentum (per unit rest mass) of a test mass at (r, theta) moving with local
     * velocity (vr, vtheta, vphi) in the ZAMO frame.
     *
     * @param out receives p_t, p_r, p_theta, p_phi
     * @throws IllegalArgumentException when |v| &gt;= 1 or the point is not outside the
     *     ZAMO's domain (alpha^2 &lt;= 0, inside a horizon)
     */
    public void momentum(double r, double theta, double vr, double vtheta, double vphi, double[] out) {
        final double v2 = vr * vr + vtheta * vtheta + vphi * vphi;
        if (!(v2 < 1.0)) {
            throw new IllegalArgumentException("local speed must be below 1 (c), got " + FastMath.sqrt(v2));
        }
        spacetime.covariant(r, theta, g);
        final double gtt = g[Spacetime.TT];
        final double gtp = g[Spacetime.TP];
        final double gpp = g[Spacetime.PP];
        final double alpha2 = -(gtt - gtp * gtp / gpp);
        if (!(alpha2 > 0.0) || !(gpp > 0.0)) {
            throw new IllegalArgumentException("no ZAMO frame at r = " + r + ", theta = " + theta);
        }
        final double alpha = FastMath.sqrt(alpha2);
        final double om = -gtp / gpp;
        final double gamma = 1.0 / FastMath.sqrt(1.0 - v2);
        // u^mu = gamma (e_(t) + v^i e_(i))  (Bardeen, Press & Teukolsky 1972, eq. 3.2)
        final double ut = gamma / alpha;
        final double uphi = gamma * (om / alpha + vphi / FastMath.sqrt(gpp));
        final double ur = gamma * vr / FastMath.sqrt(g[Spacetime.RR]);
        final double uth = gamma * vtheta / FastMath.sqrt(g[Spacetime.HH]);
        out[0] = gtt * ut + gtp * uphi;
        out[1] = g[Spacetime.RR] * ur;
        out[2] = g[Spacetime.HH] * uth;
        out[3] = gtp * ut + gpp * uphi;
    }

    /** @return {@link #momentum} at (r, theta, phi) as an {@link InitialState} */
    public InitialState initialState(double r, double theta, double phi, double vr, double vtheta, double vphi) {
        double[] p = new double[4];
        momentum(r, theta, vr, vtheta, vphi, p);
        return new InitialState(r, theta, phi, p[0], p[1], p[2], p[3]);
    }

    /**
     * Local ZAMO-frame 3-velocity of a particle with covariant momentum p_mu at (r, theta):
     * E_loc = -p_mu e_(t)^mu = -(p_t + omega p_phi) / alpha, p_(i) = p_i / sqrt(g_ii),
     * v^i = p_(i) / E_loc.
     *
     * @param out receives v_r, v_theta, v_phi
     */
    public void localVelocity(double r, double theta, double pT, double pR, double pTheta, double pPhi,
                              double[] out) {
        spacetime.covariant(r, theta, g);
        final double gtp = g[Spacetime.TP];
        final double gpp = g[Spacetime.PP];
        final double alpha = FastMath.sqrt(-(g[Spacetime.TT] - gtp * gtp / gpp));
        final double om = -gtp / gpp;
        final double eLoc = -(pT + om * pPhi) / alpha;
        out[0] = pR / FastMath.sqrt(g[Spacetime.RR]) / eLoc;
        out[1] = pTheta / FastMath.sqrt(g[Spacetime.HH]) / eLoc;
        out[2] = pPhi / FastMath.sqrt(gpp) / eLoc;
    }

    /**
     * Relativistic velocity addition: the velocity, in a frame F, of a body moving with w in the
     * rest frame of an observer who moves with v in F (axes of the observer's frame obtained from
     * F's by the pure boost). u = [v + w/gamma + (gamma/(1+gamma)) (v.w) v] / (1 + v.w),
     * gamma = 1/sqrt(1 - v^2) (Jackson 1999, Classical Electrodynamics, 3rd ed., eq. 11.31 in
     * vector form; Moller 1952). Used to compose a member's velocity relative to a hot spot's
     * centre with the centre's ZAMO velocity.
     *
     * @param v observer velocity in F, |v| &lt; 1
     * @param w body velocity relative to the observer, |w| &lt; 1
     * @param out receives u (may not alias v or w)
     */
    public static void addVelocities(double[] v, double[] w, double[] out) {
        final double v2 = v[0] * v[0] + v[1] * v[1] + v[2] * v[2];
        final double gamma = 1.0 / FastMath.sqrt(1.0 - v2);
        final double vw = v[0] * w[0] + v[1] * w[1] + v[2] * w[2];
        final double c = gamma / (1.0 + gamma) * vw;
        final double den = 1.0 + vw;
        for (int i = 0; i < 3; i++) {
            out[i] = (v[i] + w[i] / gamma + c * v[i]) / den;
        }
    }
}
