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
 *   dt/dsigma = T = (r^2 + a^2) P / Delta + a L - a^2 + a^2 u^2
 *   dphi/dsigma = a P / Delta - a + L / (1 - u^2)
 * </pre>
 * (Misner, Thorne &amp; Wheeler 1973, eqs. 33.32 with E = 1; U = sin^2(theta) Theta(theta); the
 * derivation needs only that Delta depends on r alone, so it holds for every m(r).)
 *
 * <p>Radial variable x = 1/r: with D(x) = x^2 Delta = 1 - 2 m x + a^2 x^2 and c = a^2 - a L,
 * (dx/dsigma)^2 = X(x) = x^4 R = (1 + c x^2)^2 - K x^2 D(x), a polynomial for Kerr with X(0) = 1:
 * the photon comes in from infinity at unit speed in sigma, so the long approach from the camera
 * plane takes a few steps instead of one per tenth of r. The square roots and their sign flips at
 * the turning points are removed by differentiating once more: d^2x/dsigma^2 = X'(x)/2 and
 * d^2u/dsigma^2 = U'(u)/2 = (a^2 - Q - L^2) u - 2 a^2 u^3, regular through the turning points; x
 * and u decouple, and cos(theta) as variable needs no trigonometry.
 *
 * <p>t grows like r + 2 M ln r along the ray, which no polynomial step follows near x = 0, so the
 * state holds tau = t - s F(x) with F(x) = -1/x + 2 ln x (F' = 1/x^2 + 2/x, the leading terms of T)
 * and s = -sign(dx/dsigma) (the caller flips s, and tau with it, after the radial turning point):
 * dtau/dsigma = -T - s F'(x) dx/dsigma stays bounded on the way in (the backward ray has t
 * decreasing). The state (tau, x, u, phi, v_x, v_u), v = d/dsigma, runs backwards along the photon
 * (the camera's backward ray).
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
    private double c;
    private double uLin;
    private double s = -1.0;

    MinoTimeEquations(MassFunctionSpacetime st) {
        this.mass = st.massFunction();
        this.kerr = mass.isConstant();
        this.a = st.spin();
        this.a2 = a * a;
    }

    /** Sets the ray constants: angular momentum L and Carter constant Q (E = 1); s = -1 (incoming). */
    void setConstants(double angularMomentum, double carter) {
        l = angularMomentum;
        k = carter + (l - a) * (l - a);
        c = a2 - a * l;
        uLin = a2 - carter - l * l;
        s = -1.0;
    }

    /** @return the branch s of the time variable, -sign(dx/dsigma) when last set */
    double branch() {
        return s;
    }

    /** Sets the branch s of the time variable (the caller moves tau by (s_old - s) F(x)). */
    void setBranch(double branch) {
        s = branch;
    }

    /** @return F(x) = -1/x + 2 ln x, the part of t split off into the branch term */
    static double singularTime(double x) {
        return -1.0 / x + 2.0 * Math.log(x);
    }

    /** @return D(x) = x^2 Delta(1/x) = 1 - 2 m(1/x) x + a^2 x^2 */
    double d(double x) {
        return 1.0 - 2.0 * (kerr ? 1.0 : mass.value(1.0 / x)) * x + a2 * x * x;
    }

    /**
     * Whether the photon, moving inwards at x, certainly reaches x1 &gt; x without a radial turning
     * point, i.e. X &gt; 0 on [x, x1]; decided for Kerr only, where
     * X(x) = 1 + (2c - K) x^2 + 2 K x^3 + (c^2 - K a^2) x^4 is a quartic: X is evaluated on a grid
     * of spacing d and bounded below by the grid minimum minus max|X'| d / 2, with
     * |X'| &lt;= 2 |2c - K| x1 + 6 |K| x1^2 + 4 |c^2 - K a^2| x1^3 on the interval (a bound, no root finding).
     *
     * @return true only when certain (false for the other mass functions, or when the bound is not met)
     */
    boolean noTurningBefore(double x, double x1) {
        if (!kerr || !(x1 > x)) {
            return false;
        }
        final double c2 = 2.0 * c - k, c3 = 2.0 * k, c4 = c * c - k * a2;
        final double bound = 2.0 * Math.abs(c2) * x1 + 3.0 * Math.abs(c3) * x1 * x1 + 4.0 * Math.abs(c4) * x1 * x1 * x1;
        final int n = 64;
        final double d = (x1 - x) / n;
        double min = Double.POSITIVE_INFINITY;
        for (int i = 0; i <= n; i++) {
            double z = x + i * d;
            double z2 = z * z;
            min = Math.min(min, 1.0 + z2 * (c2 + z * (c3 + z * c4)));
        }
        return min - 0.5 * bound * d > 0.0;
    }

    @Override public void derivative(double[] y, double[] dy) {
        final double x = y[1];
        final double u = y[2];
        final double vx = y[4];
        final double m;
        final double rm;   // r m'(r)
        if (kerr) {
            m = 1.0;
            rm = 0.0;
        } else {
            double r = 1.0 / x;
            m = mass.value(r);
            rm = r * mass.derivative(r);
        }
        final double x2 = x * x;
        final double dd = 1.0 - 2.0 * m * x + a2 * x2;          // D(x)
        final double ddx = -2.0 * m + 2.0 * rm + 2.0 * a2 * x;    // D'(x), dm/dx = -r^2 m'(r)
        final double cp = 1.0 + c * x2;                           // x^2 P
        final double iD = 1.0 / dd;
        final double u2 = u * u;
        // T = (1 + a^2 x^2) (1 + c x^2) / (x^2 D) + a L - a^2 + a^2 u^2
        final double tt = (1.0 + a2 * x2) * cp * iD / x2 + a * l - a2 + a2 * u2;
        dy[0] = -tt - s * (1.0 / x2 + 2.0 / x) * vx;
        dy[1] = vx;
        dy[2] = y[5];
        // a P / Delta - a = a x (2 m - a L x) / D (no cancellation far out)
        dy[3] = -(a * x * (2.0 * m - a * l * x) * iD + l / (1.0 - u2));
        // X'/2 = 2 c x (1 + c x^2) - K (x D + x^2 D' / 2)
        dy[4] = 2.0 * c * x * cp - k * (x * dd + 0.5 * x2 * ddx);
        dy[5] = u * (uLin - 2.0 * a2 * u2);
    }
}
