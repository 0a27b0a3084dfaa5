package org.spindrift.sim.light;

import org.spindrift.sim.spacetime.MassFunction;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

/**
 * Separated photon equations for the Kerr-like metrics with a mass function (Kerr included) in
 * Mino time sigma, d(lambda) = Sigma d(sigma) (Carter 1968, Phys. Rev. 174, 1559; Mino 2003, Phys.
 * Rev. D 67, 084027), for a photon of energy E = 1, angular momentum L and Carter constant Q:
 * <pre>
 *   (dr/dsigma)^2 = R(r) = P^2 - Delta K,    P = r^2 + a^2 - a L,   K = Q + (L - a)^2
 *   (du/dsigma)^2 = U(u) = Q + (a^2 - Q - L^2) u^2 - a^2 u^4,        u = cos(theta)
 *   dt/dsigma = (r^2 + a^2) P / Delta + a L - a^2 + a^2 u^2
 *   dphi/dsigma = a P / Delta - a + L / (1 - u^2)
 * </pre>
 * (Misner, Thorne &amp; Wheeler 1973, eqs. 33.32 with E = 1; U = sin^2(theta) Theta(theta); the
 * derivation needs only that Delta depends on r alone, so it holds for every m(r).)
 *
 * <p>The square roots and their sign flips at the turning points are removed by differentiating
 * once more: d^2r/dsigma^2 = R'(r)/2 = 2 r P - Delta'(r) K / 2 and
 * d^2u/dsigma^2 = U'(u)/2 = (a^2 - Q - L^2) u - 2 a^2 u^3, which are regular through the turning
 * points; r and u decouple, and cos(theta) as variable needs no trigonometry. The state
 * (t, r, u, phi, w, v_u) (see below) runs backwards along the photon (the camera's backward
 * ray): v_r and v_u are the velocities of the backward motion, and t and phi decrease.
 *
 * <p>The independent variable is s with ds = (r^2 + a^2) d(sigma), a rescaling by a function of r
 * alone (so the r equation stays autonomous): far from the hole d(sigma) ~ d(lambda) / r^2 and
 * r(sigma) behaves like 1 / (sigma_0 - sigma), which an explicit step control crosses only in
 * many small steps, whereas r(s) is nearly linear as in the affine parameter; near the hole
 * d(lambda)/ds = Sigma / (r^2 + a^2) stays between r^2 / (r^2 + a^2) and 1. The state holds
 * w = dr/ds = v_r / (r^2 + a^2) (of order 1 like p_r, which keeps the error control's scales those
 * of the affine form; v_r itself grows as r^2) and v_u = du/dsigma. Since w^2 = R / (r^2 + a^2)^2,
 * dw/ds = (1/2) d(R / (r^2 + a^2)^2)/dr, again regular at the turning points; written out, its
 * large terms cancel analytically (below), not in floating point.
 *
 * <p>Not thread-safe (holds the constants of one ray); allocates nothing.
 */
final class MinoTimeEquations implements DormandPrince54.Rhs {
    private final MassFunction mass;
    private final boolean kerr;
    private final double a;
    private final double a2;
    private double l;
    private double k;
    private double uLin;

    MinoTimeEquations(MassFunctionSpacetime st) {
        this.mass = st.massFunction();
        this.kerr = mass.isConstant();
        this.a = st.spin();
        this.a2 = a * a;
    }

    /** Sets the ray constants: angular momentum L and Carter constant Q (E = 1). */
    void setConstants(double angularMomentum, double carter) {
        l = angularMomentum;
        k = carter + (l - a) * (l - a);
        uLin = a2 - carter - l * l;
    }

    /** @return m(r) */
    double mass(double r) {
        return kerr ? 1.0 : mass.value(r);
    }

    /** @return Delta(r) = r^2 - 2 m(r) r + a^2 */
    double delta(double r) {
        return r * r - 2.0 * mass(r) * r + a2;
    }

    @Override public void derivative(double[] y, double[] dy) {
        final double r = y[1];
        final double u = y[2];
        final double m = kerr ? 1.0 : mass.value(r);
        final double mr = kerr ? 0.0 : mass.derivative(r);
        final double rho = r * r + a2;
        final double del = rho - 2.0 * m * r;
        final double p = rho - a * l;
        final double pd = p / del;
        final double u2 = u * u;
        final double f = 1.0 / rho;
        dy[0] = -(rho * pd + a * l - a2 + a2 * u2) * f;
        dy[1] = y[4];
        dy[2] = y[5] * f;
        dy[3] = -(a * pd - a + l / (1.0 - u2)) * f;
        // (1/2) d(R / rho^2)/dr = (2 a L r P + K (2 r Delta - rho Delta' / 2)) / rho^3, with
        // 2 r Delta - rho Delta' / 2 = r rho - 4 m r^2 + rho (m + r m'): no cancellation far out
        dy[4] = (2.0 * a * l * r * p + k * (r * rho - 4.0 * m * r * r + rho * (m + r * mr))) * f * f * f;
        dy[5] = u * (uLin - 2.0 * a2 * u2) * f;
    }
}
