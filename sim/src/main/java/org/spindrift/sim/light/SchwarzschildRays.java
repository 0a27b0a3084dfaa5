package org.spindrift.sim.light;

import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.util.FastMath;

/**
 * Photon orbits of the Schwarzschild metric by quadrature of the orbit equation (Darwin 1959,
 * Proc. R. Soc. A 249, 180; Luminet 1979, A&amp;A 75, 228, eq. 3): with u = 1/r (G = c = M = 1),
 * dphi/du = 1 / sqrt(1/b^2 - u^2 + 2 u^3). Written independently of the ray tracer (Hipparchus
 * quadrature and root finding), as the reference its checks compare with.
 */
public final class SchwarzschildRays {
    private SchwarzschildRays() {
    }

    /**
     * Exact deflection of a photon with impact parameter b &gt; sqrt(27) (Darwin 1959): 2 Phi(u_p) - pi
     * with Phi the azimuth swept from infinity to the periapsis u_p = 1 / r_p, by quadrature.
     */
    public static double deflectionExact(double b) {
        double inv2 = 1.0 / (b * b);
        double up = periapsis(inv2);
        return 2.0 * sweep(up, inv2, up) - FastMath.PI;
    }

    /**
     * Impact parameter of the direct image of an equatorial ring at radius re for a face-on
     * observer: the ray's azimuth in its orbital plane sweeps pi/2 between infinity and the ring
     * (Darwin 1959; Luminet 1979).
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
    private static double periapsis(double inv2) {
        return new BrentSolver(1e-15).solve(200, u -> inv2 - u * u + 2 * u * u * u, 0.0, 1.0 / 3.0);
    }

    /**
     * Phi(u1) = integral_0^u1 du / sqrt(F(u)), F = 1/b^2 - u^2 + 2 u^3, for u1 &lt;= up, written with
     * u = up - t^2 so that the square-root singularity at the periapsis disappears.
     */
    private static double sweep(double up, double inv2, double u1) {
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
