package org.spindrift.validation;

import org.hipparchus.util.FastMath;

/**
 * Published results for light near a black hole (geometric units G = c = M = 1), written out
 * here independently of the engine's ray tracer: the Kerr shadow edge and the weak-field
 * Schwarzschild deflection series. The exact Schwarzschild deflection and the face-on image
 * radius are in {@link org.spindrift.sim.light.SchwarzschildRays} (the sim tests use them too).
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
}
