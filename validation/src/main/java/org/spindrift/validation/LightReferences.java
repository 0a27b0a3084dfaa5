package org.spindrift.validation;

import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.util.FastMath;

/**
 * Published results for light near a black hole (geometric units G = c = M = 1), written out
 * here independently of the engine's ray tracer: the Kerr shadow edge, the weak-field and exact
 * Schwarzschild deflection, and the face-on direct image of an equatorial ring.
 */
public final class LightReferences {
    private LightReferences() {
    }

    /**
     * Radius of the circular equatorial photon orbit of Kerr (Bardeen, Press &amp; Teukolsky 1972,
     * ApJ 178, 347, eq. 2.18): r = 2 (1 + cos(2/3 arccos(-+a))), upper sign prograde.
     */
    public static double photonOrbit(double a, boolean prograde) {
        return 2.0 * (1.0 + FastMath.cos(2.0 / 3.0 * FastMath.acos(prograde ? -a : a)));
    }

    /**
     * lambda = L/E of the spherical photon orbit at radius r (Bardeen 1973, in: Black Holes, Les
     * Houches, p. 215; Chandrasekhar 1983, ch. 7): lambda = -(r^3 - 3 r^2 + a^2 r + a^2) / (a (r - 1)).
     */
    public static double shadowLambda(double r, double a) {
        return -(r * r * r - 3.0 * r * r + a * a * r + a * a) / (a * (r - 1.0));
    }

    /**
     * eta = Q/E^2 of the spherical photon orbit at radius r (Bardeen 1973, as above):
     * eta = r^3 (4 a^2 - r (r - 3)^2) / (a^2 (r - 1)^2).
     */
    public static double shadowEta(double r, double a) {
        return r * r * r * (4.0 * a * a - r * (r - 3.0) * (r - 3.0)) / (a * a * (r - 1.0) * (r - 1.0));
    }

    /**
     * Screen point of the shadow edge from the spherical photon orbit at radius r, seen by a distant
     * observer at inclination i (Bardeen 1973, as above): alpha = -lambda / sin i,
     * beta^2 = eta + a^2 cos^2 i - lambda^2 cot^2 i.
     *
     * @return {alpha, beta^2}; the orbit contributes an edge point only where beta^2 &gt;= 0
     */
    public static double[] shadowEdge(double a, double r, double inclination) {
        double l = shadowLambda(r, a);
        double s = FastMath.sin(inclination);
        double c = FastMath.cos(inclination);
        return new double[] {-l / s, shadowEta(r, a) + a * a * c * c - l * l * c * c / (s * s)};
    }

    /**
     * Schwarzschild deflection angle to second order in M/b (Epstein &amp; Shapiro 1980, Phys. Rev. D
     * 22, 2947): 4/b + 15 pi / (4 b^2).
     */
    public static double deflectionSecondOrder(double b) {
        return 4.0 / b + 15.0 * FastMath.PI / (4.0 * b * b);
    }

    /**
     * Third-order term of the Schwarzschild deflection series, 128 / (3 b^3) (Keeton &amp; Petters
     * 2005, Phys. Rev. D 72, 104006, Schwarzschild case; coefficient recalled from memory): the
     * size of what {@link #deflectionSecondOrder} leaves out.
     */
    public static double deflectionThirdOrder(double b) {
        return 128.0 / (3.0 * b * b * b);
    }

    /**
     * Exact Schwarzschild deflection of a photon with impact parameter b &gt; sqrt(27) (Darwin 1959,
     * Proc. R. Soc. A 249, 180): 2 Phi(u_p) - pi with Phi the azimuth swept from infinity to the
     * periapsis u_p = 1 / r_p, by quadrature ({@link #sweep}).
     */
    public static double deflectionExact(double b) {
        double inv2 = 1.0 / (b * b);
        double up = periapsis(inv2);
        return 2.0 * sweep(up, inv2, up) - FastMath.PI;
    }

    /**
     * Impact parameter of the direct image of an equatorial ring at radius re for a face-on
     * observer: the ray's azimuth in its orbital plane sweeps pi/2 between infinity and the ring
     * (Darwin 1959, as above; Luminet 1979, A&amp;A 75, 228, eq. 3: with u = 1/r,
     * dphi/du = 1 / sqrt(1/b^2 - u^2 + 2 u^3)); Hipparchus quadrature and root finding.
     */
    public static double faceOnImpactParameter(double re) {
        double ue = 1.0 / re;
        return new BrentSolver(1e-12).solve(200, b -> {
            double inv2 = 1.0 / (b * b);
            double up = periapsis(inv2);
            double toPeri = sweep(up, inv2, up);
            // the equator (sweep pi/2) is reached inbound if the sweep to periapsis exceeds pi/2,
            // else outbound where the inbound sweep would be 2 Phi(up) - pi/2
            double target = toPeri >= 0.5 * FastMath.PI ? 0.5 * FastMath.PI : 2.0 * toPeri - 0.5 * FastMath.PI;
            return sweep(up, inv2, FastMath.min(ue, up)) - target;
        }, FastMath.sqrt(27.0) + 1e-6, 3.0 * re);
    }

    /** @return the periapsis u_p: the smallest positive root of 1/b^2 - u^2 + 2 u^3 (exists for b &gt; sqrt 27) */
    static double periapsis(double inv2) {
        return new BrentSolver(1e-15).solve(200, u -> inv2 - u * u + 2 * u * u * u, 0.0, 1.0 / 3.0);
    }

    /**
     * Phi(u1) = integral_0^u1 du / sqrt(F(u)), F = 1/b^2 - u^2 + 2 u^3, for u1 &lt;= up, written with
     * u = up - t^2 so that the square-root singularity at the periapsis disappears.
     */
    static double sweep(double up, double inv2, double u1) {
        IterativeLegendreGaussIntegrator quad = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-13);
        double fPrime = 2.0 * up - 6.0 * up * up;   // -F'(up) > 0
        double lower = FastMath.sqrt(FastMath.max(0.0, up - u1));
        if (lower >= FastMath.sqrt(up)) {
            return 0.0;
        }
        // F(up - s) / s = -F'(up) + (6 up - 1) s - 2 s^2 exactly (F cubic, F(up) = 0), s = t^2
        return quad.integrate(1_000_000, t -> {
            double sq = t * t;
            return 2.0 / FastMath.sqrt(fPrime + (6.0 * up - 1.0) * sq - 2.0 * sq * sq);
        }, lower, FastMath.sqrt(up));
    }
}
