package org.spindrift.sim.motion;

import org.hipparchus.util.FastMath;

/** Post-Newtonian predictions of the periastron advance per radial period (radians), M = 1. */
public final class Predictions {
    private Predictions() {
    }

    /** 1PN (Einstein 1915, Sitzungsber. Preuss. Akad. Wiss., 831): 6 pi / p. */
    public static double advance1pn(double p) {
        return 6 * FastMath.PI / p;
    }

    /**
     * Test-mass Schwarzschild expansion to second order in 1/p:
     * 6 pi / p + (3/2) (18 + e^2) pi / p^2 (Damour &amp; Schafer 1988, Nuovo Cimento B 101, 127,
     * test-mass limit; checked against the expansion of the exact Cutler, Kennefick &amp;
     * Poisson 1994 integral in the validation tests).
     */
    public static double advance2pn(double p, double e) {
        return 6 * FastMath.PI / p + 1.5 * (18 + e * e) * FastMath.PI / (p * p);
    }

    /**
     * Leading spin term for equatorial orbits, the Lense-Thirring advance of the longitude of
     * periapsis: -8 pi a / p^(3/2) for prograde orbits, +8 pi a / p^(3/2) for retrograde ones
     * (Lense &amp; Thirring 1918, Phys. Z. 19, 156; per-orbit form 2 pi (dOmega/dt + domega/dt)
     * with dOmega/dt = 2J/(A^3 (1-e^2)^(3/2)), domega/dt = -6J/(A^3 (1-e^2)^(3/2)) at zero
     * inclination, A the semi-major axis; from memory, as in standard treatments of the
     * Lense-Thirring effect).
     */
    public static double advanceSpin(double a, double p, boolean prograde) {
        return (prograde ? -8.0 : 8.0) * FastMath.PI * a / FastMath.pow(p, 1.5) + 0.0; // + 0.0: no -0.0 at a = 0
    }
}
