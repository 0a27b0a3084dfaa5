package org.spindrift.validation;

import org.hipparchus.util.FastMath;

/**
 * Complete elliptic integral of the first kind K(m) = int_0^{pi/2} dt / sqrt(1 - m sin^2 t)
 * (parameter m = k^2), by the arithmetic-geometric mean: K(m) = pi / (2 AGM(1, sqrt(1 - m)))
 * (Abramowitz &amp; Stegun 1964, Handbook of Mathematical Functions, 17.6.1). Independent of
 * the engine; cross-checked against scipy.special.ellipk in the tests.
 */
public final class EllipticK {
    private EllipticK() {
    }

    /** @return K(m) for 0 &lt;= m &lt; 1 */
    public static double of(double m) {
        if (!(m >= 0 && m < 1)) {
            throw new IllegalArgumentException("K(m) needs 0 <= m < 1, got " + m);
        }
        double a = 1.0;
        double b = FastMath.sqrt(1.0 - m);
        for (int i = 0; i < 60 && FastMath.abs(a - b) > 1e-16 * a; i++) {
            double an = 0.5 * (a + b);
            b = FastMath.sqrt(a * b);
            a = an;
        }
        return FastMath.PI / (2.0 * a);
    }
}
