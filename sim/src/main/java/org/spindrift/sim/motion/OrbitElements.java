package org.spindrift.sim.motion;

import java.util.Locale;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Bound geodesics from orbit elements (semi-latus rectum p, eccentricity e, inclination iota)
 * in the separable spacetimes (Kerr and its mass-function relatives), by the method of
 * Schmidt 2002 (Class. Quantum Grav. 19, 2743, section 3): the radial potential
 *
 * <pre>
 *   R(r) = [E (r^2 + a^2) - a L]^2 - Delta(r) [r^2 + (L - a E)^2 + Q]     (Carter 1968)
 * </pre>
 *
 * vanishes at the turning points r_p = p / (1 + e) and r_a = p / (1 - e), and the polar motion
 * fixes L and Q through the inclination, cos(iota) = L / sqrt(L^2 + Q). Writing
 * L = J cos(iota), Q = J^2 sin^2(iota) with J &gt;= 0 makes R quadratic in (E, J):
 * R = alpha E^2 + beta E J + gamma J^2 - delta with alpha = rho^2 - a^2 Delta,
 * beta = 2 a cos(iota) (Delta - rho), gamma = a^2 cos^2(iota) - Delta, delta = Delta r^2,
 * rho = r^2 + a^2. With x = J/E the two conditions R(r_p) = R(r_a) = 0 reduce to one quadratic
 * in x and then E^2 = delta_p / (alpha_p + beta_p x + gamma_p x^2). Only the values of Delta at
 * the turning points enter, so the same closed form serves every mass function m(r) (Kerr's
 * polynomial structure, used by Schmidt to eliminate, is not needed). A circular orbit (e = 0)
 * uses R(r_0) = R'(r_0) = 0 instead. The orbit is bound and stable when R &gt; 0 between the
 * turning points with R'(r_p) &gt; 0 (for e = 0: R''(r_0) &lt; 0); at the separatrix R'(r_p) = 0.
 *
 * <p>Retrograde orbits have iota &gt; 90 deg (L &lt; 0).
 */
public final class OrbitElements {
    /**
     * A solved bound orbit.
     *
     * @param p semi-latus rectum (M)
     * @param e eccentricity
     * @param inclination iota (radians, cos iota = L / sqrt(L^2 + Q))
     * @param energy E = -p_t
     * @param angularMomentum L = p_phi
     * @param carter Q
     * @param zMinus cos^2 of the polar turning angle (0 for equatorial orbits)
     * @param start state at periapsis on the equator, phi = 0, moving north (p_theta &lt;= 0)
     */
    public record Solution(double p, double e, double inclination, double energy, double angularMomentum,
                           double carter, double zMinus, InitialState start) {
        public double periapsis() {
            return p / (1 + e);
        }

        public double apoapsis() {
            return p / (1 - e);
        }

        /** @return true when the orbit stays in the equatorial plane (Q = 0) */
        public boolean equatorial() {
            return carter == 0.0;
        }
    }

    private OrbitElements() {
    }

    /**
     * Solves (E, L, Q) for the elements, or throws a {@link UserInputException} naming the limit.
     *
     * @param st a separable spacetime ({@link MassFunctionSpacetime})
     * @param p semi-latus rectum (M), option {@code --p}
     * @param e eccentricity in [0, 1), option {@code --e}
     * @param inclination iota in [0, pi] radians ({@code --inclination-deg}); &gt; pi/2 is retrograde
     */
    public static Solution solve(Spacetime st, double p, double e, double inclination) {
        if (!(st instanceof MassFunctionSpacetime ms) || !st.separable()) {
            throw new UserInputException("orbit elements (--p, --e) need a separable spacetime (Kerr or a "
                    + "mass-function family); family " + st.family() + " is not");
        }
        if (!(e >= 0.0 && e < 1.0)) {
            throw new UserInputException(String.format(Locale.ROOT,
                    "--e %s gives no bound orbit: the eccentricity must be in [0, 1)", e));
        }
        if (!(p > 0.0) || !Double.isFinite(p)) {
            throw new UserInputException("--p must be a positive number of M, got " + p);
        }
        if (!(inclination >= 0.0 && inclination <= FastMath.PI)) {
            throw new UserInputException("--inclination-deg must be in [0, 180]");
        }
        Solution s = trySolve(ms, p, e, inclination);
        if (s == null) {
            double ps = separatrix(ms, p, e, inclination);
            throw new UserInputException(String.format(Locale.ROOT,
                    "--p %s gives no bound orbit for e = %s, inclination %.4g deg (family %s, spin %s): "
                            + "p must exceed the separatrix p_s = %.6f", p, e, FastMath.toDegrees(inclination),
                    st.family(), st.spin(), ps));
        }
        return s;
    }

    /**
     * @return the separatrix p_s for (e, iota): the smallest p above which {@link #solve}
     *     succeeds, found by bisection between the invalid pLow and a valid p
     */
    public static double separatrix(MassFunctionSpacetime st, double pLow, double e, double inclination) {
        double lo = pLow;
        double hi = FastMath.max(2 * pLow, 12.0);
        int guard = 0;
        while (trySolve(st, hi, e, inclination) == null && guard++ < 60) {
            hi *= 2;
        }
        if (trySolve(st, lo, e, inclination) != null) {
            return lo;
        }
        for (int it = 0; it < 200 && hi - lo > 1e-12 * hi; it++) {
            double mid = 0.5 * (lo + hi);
            if (trySolve(st, mid, e, inclination) == null) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return hi;
    }

    /** @return the solution, or null when the elements give no stable bound orbit */
    static Solution trySolve(MassFunctionSpacetime st, double p, double e, double inclination) {
        final double a = st.spin();
        final double c = FastMath.cos(inclination);
        final double s = FastMath.sin(inclination);
        final double rp = p / (1 + e);
        final double ra = p / (1 - e);
        double[] cp = coefficients(st, rp, c);
        double[] qa;
        if (e == 0.0) {
            qa = derivativeCoefficients(st, rp, c);
        } else {
            qa = coefficients(st, ra, c);
        }
        // delta_p (alpha_2 + beta_2 x + gamma_2 x^2) = delta_2 (alpha_p + beta_p x + gamma_p x^2)
        final double qa2 = cp[3] * qa[2] - qa[3] * cp[2];
        final double qb = cp[3] * qa[1] - qa[3] * cp[1];
        final double qc = cp[3] * qa[0] - qa[3] * cp[0];
        final double disc = qb * qb - 4 * qa2 * qc;
        if (!(disc >= 0) || qa2 == 0.0) {
            return null;
        }
        // numerically stable roots (Press et al. 2007, Numerical Recipes 3rd ed., eq. 5.6.4)
        final double q = -0.5 * (qb + FastMath.copySign(FastMath.sqrt(disc), qb));
        final double[] roots = {q / qa2, q == 0.0 ? -q / qa2 : qc / q};
        Solution best = null;
        for (double x : roots) {
            if (!(x >= 0.0) || !Double.isFinite(x)) {
                continue;
            }
            double den = cp[0] + cp[1] * x + cp[2] * x * x;
            double e2 = cp[3] / den;
            if (!(e2 > 0.0)) {
                continue;
            }
            double en = FastMath.sqrt(e2);
            double j = x * en;
            double l = j * c;
            double qq = j * j * s * s;
            if (FastMath.abs(c) == 1.0 || qq < 1e-300) {
                qq = 0.0;
            }
            if (!(en < 1.0) || !bound(st, rp, ra, en, l, qq)) {
                continue;
            }
            if (best == null || en < best.energy()) {
                best = build(st, p, e, inclination, en, l, qq);
            }
        }
        return best;
    }

    /** alpha, beta, gamma, delta of R at r (see class comment). */
    private static double[] coefficients(MassFunctionSpacetime st, double r, double c) {
        double a = st.spin();
        double del = st.delta(r);
        double rho = r * r + a * a;
        return new double[] {rho * rho - a * a * del, 2 * a * c * (del - rho), a * a * c * c - del, del * r * r};
    }

    /** r-derivatives of alpha, beta, gamma, delta. */
    private static double[] derivativeCoefficients(MassFunctionSpacetime st, double r, double c) {
        double a = st.spin();
        double del = st.delta(r);
        double dd = st.deltaDerivative(r);
        double rho = r * r + a * a;
        return new double[] {4 * r * rho - a * a * dd, 2 * a * c * (dd - 2 * r), -dd, dd * r * r + 2 * r * del};
    }

    /** @return R(r) (Carter 1968) for the mass-function spacetime */
    public static double radialPotential(MassFunctionSpacetime st, double r, double en, double l, double q) {
        double a = st.spin();
        double w = en * (r * r + a * a) - a * l;
        double k = l - a * en;
        return w * w - st.delta(r) * (r * r + k * k + q);
    }

    /** @return dR/dr */
    public static double radialPotentialDerivative(MassFunctionSpacetime st, double r, double en, double l,
                                                   double q) {
        double a = st.spin();
        double w = en * (r * r + a * a) - a * l;
        double k = l - a * en;
        return 4 * en * r * w - st.deltaDerivative(r) * (r * r + k * k + q) - 2 * r * st.delta(r);
    }

    private static boolean bound(MassFunctionSpacetime st, double rp, double ra, double en, double l, double q) {
        if (!(st.delta(rp) > 0)) {
            return false;
        }
        if (ra == rp) {
            // stability of a circular orbit: R''(r0) < 0 (central difference of R')
            double h = 1e-4 * rp;
            double r2 = (radialPotentialDerivative(st, rp + h, en, l, q)
                    - radialPotentialDerivative(st, rp - h, en, l, q)) / (2 * h);
            return r2 < 0;
        }
        double scale = en * en * rp * rp * rp;
        if (!(radialPotentialDerivative(st, rp, en, l, q) > 1e-12 * scale)
                || !(radialPotentialDerivative(st, ra, en, l, q) < 0)) {
            return false;
        }
        for (int i = 1; i < 32; i++) {
            double r = rp + (ra - rp) * i / 32.0;
            if (!(st.delta(r) > 0) || !(radialPotential(st, r, en, l, q) > 0)) {
                return false;
            }
        }
        return true;
    }

    private static Solution build(MassFunctionSpacetime st, double p, double e, double inclination, double en,
                                  double l, double q) {
        double a = st.spin();
        // polar turning point: beta z^2 - (Q + L^2 + beta) z + Q = 0, z = cos^2 theta,
        // beta = a^2 (1 - E^2) (Schmidt 2002, eq. 18; Drasco & Hughes 2004, eq. 2.10)
        double b = a * a * (1 - en * en);
        double zMinus;
        if (q == 0.0) {
            zMinus = 0.0;
        } else if (b == 0.0) {
            zMinus = q / (q + l * l);
        } else {
            double sum = q + l * l + b;
            double root = FastMath.sqrt(sum * sum - 4 * b * q);
            zMinus = 2 * q / (sum + root);
        }
        double rp = p / (1 + e);
        double th = 0.5 * FastMath.PI;
        double[] g = new double[Spacetime.SIZE];
        st.inverse(rp, th, g);
        double pt = -en;
        // p_theta from the mass shell g^{mu nu} p_mu p_nu = -1 (equals Q at the equator)
        double rest = g[Spacetime.TT] * pt * pt + 2 * g[Spacetime.TP] * pt * l + g[Spacetime.PP] * l * l;
        double pth2 = q == 0.0 ? 0.0 : FastMath.max(0.0, (-1.0 - rest) / g[Spacetime.HH]);
        InitialState start = new InitialState(rp, th, 0.0, pt, 0.0, -FastMath.sqrt(pth2), l);
        return new Solution(p, e, inclination, en, l, q, zMinus, start);
    }
}
