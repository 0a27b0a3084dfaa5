package org.spindrift.validation;

import org.hipparchus.util.FastMath;

/**
 * Exact periastron advance of a bound Schwarzschild geodesic per radial period (Cutler,
 * Kennefick &amp; Poisson 1994, Phys. Rev. D 50, 3816, section II; equation number not
 * recalled): Delta phi = 4 sqrt(p / (p - 6 + 2e)) K(4e / (p - 6 + 2e)) - 2 pi, with K the
 * complete elliptic integral of the first kind in the parameter convention ({@link EllipticK}).
 */
public final class SchwarzschildPrecession {
    private SchwarzschildPrecession() {
    }

    /** @return the exact advance (radians per radial period) for p &gt; 6 + 2e */
    public static double exact(double p, double e) {
        double d = p - 6 + 2 * e;
        return 4 * FastMath.sqrt(p / d) * EllipticK.of(4 * e / d) - 2 * FastMath.PI;
    }
}
