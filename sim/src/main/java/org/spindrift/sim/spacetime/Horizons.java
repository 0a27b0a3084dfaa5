package org.spindrift.sim.spacetime;

import java.util.function.DoubleUnaryOperator;
import org.hipparchus.util.FastMath;

/**
 * The outer horizon of a {@link Spacetime}: the largest r where g^rr = 0.
 *
 * <ul>
 *   <li>Mass-function family: the largest positive root of Delta(r) = r^2 - 2 m(r) r + a^2
 *       (Bambi & Modesto 2013, Phys. Lett. B 721, 329), including a double root (extremal).</li>
 *   <li>Johannsen-Psaltis: g^rr = W / (Sigma (1 + h)) with W = Delta + a^2 sin^2 h depends on
 *       theta, so the surface g^rr = 0 is not a sphere (Johannsen 2013, Phys. Rev. D 87, 124017,
 *       reference recalled from memory, studies such surfaces). We report the largest root of W over theta; it equals the Kerr
 *       r_+ at the poles and lies outside r_+ at the equator when epsilon_3 &lt; 0; there is no
 *       horizon when W has no root at some polar angle (the surface does not close, e.g. at the
 *       poles for |a| &gt; 1). Everything
 *       inside this radius is treated as captured (a conservative choice: the true null surface
 *       lies on or inside the g^rr = 0 surface, since a null surface r = R(theta) needs
 *       g^rr = -g^thth R'^2 &lt;= 0).</li>
 *   <li>Any other member: the largest root of g^rr over a grid of polar angles, none unless
 *       there is a root at every angle.</li>
 * </ul>
 * The search covers 1e-4 M &lt; r &lt; {@link #R_MAX}.
 */
public final class Horizons {
    /** Outer end of the horizon search, M. */
    public static final double R_MAX = 100.0;
    /** Inner end of the horizon search, M. */
    public static final double R_MIN = 1e-4;
    private static final int THETA_STEPS = 8;

    private Horizons() {
    }

    /** @return the outer horizon radius in M, or NaN when the spacetime has none */
    public static double outer(Spacetime st) {
        if (st instanceof MassFunctionSpacetime mfs) {
            final double a2 = mfs.spin() * mfs.spin();
            return RadialSearch.outermostRoot(r -> mfs.delta(r) / (r * r + a2), R_MAX, R_MIN, true);
        }
        double best = Double.NaN;
        for (int k = 0; k <= THETA_STEPS; k++) {
            final double theta = 0.5 * FastMath.PI * k / THETA_STEPS;
            DoubleUnaryOperator f;
            if (st instanceof JohannsenPsaltisSpacetime jp) {
                final double a2 = jp.spin() * jp.spin();
                f = r -> jp.w(r, theta) / (r * r + a2);
            } else {
                final double[] g = new double[Spacetime.SIZE];
                f = r -> {
                    st.inverse(r, theta, g);
                    return g[Spacetime.RR];
                };
            }
            double root = RadialSearch.outermostRoot(f, R_MAX, R_MIN, true);
            if (Double.isNaN(root)) {
                return Double.NaN;      // the surface g^rr = 0 does not close: no horizon
            }
            best = Double.isNaN(best) ? root : FastMath.max(best, root);
        }
        return best;
    }
}
