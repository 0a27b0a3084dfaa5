package org.spindrift.sim.motion;

import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;

/**
 * Exact fundamental periods and periastron advance of a bound geodesic in a separable
 * (mass-function) spacetime, by quadrature of the radial and polar motions in Mino time (Mino
 * 2003, Phys. Rev. D 67, 084027; Schmidt 2002, Class. Quantum Grav. 19, 2743, sections 4-5;
 * Drasco &amp; Hughes 2004, Phys. Rev. D 69, 044015, section II; Fujita &amp; Hikida 2009, Class.
 * Quantum Grav. 26, 135002, give the Kerr case in closed form). With
 * Delta(r) = r^2 - 2 m(r) r + a^2 the motion separates as in Kerr (Carter 1968):
 *
 * <pre>
 *   dr/dlambda = +-sqrt(R),  R = (E (r^2 + a^2) - a L)^2 - Delta (r^2 + (L - a E)^2 + Q)
 *   dtheta/dlambda = +-sqrt(Theta),  Theta = Q - cos^2 theta (a^2 (1 - E^2) + L^2 / sin^2 theta)
 *   dt/dlambda   = (r^2 + a^2) P / Delta - a^2 E sin^2 theta + a L,   P = E (r^2 + a^2) - a L
 *   dphi/dlambda = a P / Delta - a E + L / sin^2 theta
 * </pre>
 *
 * The radial and polar parts are periodic in Mino time lambda with periods Lambda_r, Lambda_theta;
 * coordinate-time periods follow from the averages over them (Drasco &amp; Hughes 2004, section II):
 * Gamma = &lt;dt/dlambda&gt;_r + &lt;dt/dlambda&gt;_theta, T_r = Gamma Lambda_r,
 * T_theta = Gamma Lambda_theta, Omega_phi = (&lt;dphi/dlambda&gt;_r + &lt;dphi/dlambda&gt;_theta) / Gamma.
 *
 * <p>Radial part: r = p / (1 + e cos chi), R = (1 - E^2)(r_a - r)(r - r_p) F(r) with F &gt; 0 on
 * [r_p, r_a], so dlambda/dchi = sqrt(1 - e^2) / ((1 + e cos chi) sqrt((1 - E^2) F(r))). For Kerr R is
 * a quartic and F = (r - r_3)(r - r_4) with r_3 + r_4 and r_3 r_4 from Vieta's formulas (Schmidt
 * 2002), exact to rounding; for the other mass functions F is evaluated as
 * R / ((1 - E^2)(r_a - r)(r - r_p)) at the midpoint nodes, which never touch the turning points
 * (about three digits are lost to cancellation at the nodes next to them: ~1e-11 relative). Polar part: z = cos^2 theta = z_- cos^2 psi,
 * dlambda/dpsi = 1 / sqrt(Q / z_- - a^2 (1 - E^2) z). Both integrands are smooth and periodic, so
 * the midpoint rule converges exponentially (Trefethen &amp; Weideman 2014, SIAM Rev. 56, 385).
 */
public final class MinoFrequencies {
    /** Default quadrature nodes per period (converged to about 1e-13 for p &gt; 6, e &lt; 0.8). */
    public static final int NODES = 512;

    /**
     * @param periodRadial 2 pi / Omega_r (M), NaN for a circular orbit (e = 0)
     * @param periodAzimuthal 2 pi / |Omega_phi| (M)
     * @param periodPolar 2 pi / Omega_theta (M), NaN for equatorial orbits
     * @param advance 2 pi (|Omega_phi| / Omega_r - 1), radians per radial period in the sense of the
     *     motion, NaN for a circular orbit
     */
    public record Result(double periodRadial, double periodAzimuthal, double periodPolar, double advance) {
    }

    private MinoFrequencies() {
    }

    /** As {@link #compute(MassFunctionSpacetime, OrbitElements.Solution, int)} with {@link #NODES} nodes. */
    public static Result compute(MassFunctionSpacetime st, OrbitElements.Solution s) {
        return compute(st, s, NODES);
    }

    /**
     * @param st a separable (mass-function) spacetime
     * @param s the orbit (E, L, Q, z_-) from {@link OrbitElements#solve}
     * @param nodes quadrature nodes per period
     */
    public static Result compute(MassFunctionSpacetime st, OrbitElements.Solution s, int nodes) {
        final double a = st.spin();
        final double p = s.p();
        final double e = s.e();
        final double en = s.energy();
        final double l = s.angularMomentum();
        final double q = s.carter();
        final double zMinus = s.zMinus();
        final double rp = s.periapsis();
        final double ra = s.apoapsis();
        final double oneMinusE2 = 1 - en * en;
        final double h = 2 * FastMath.PI / nodes;
        // Kerr (m = 1): the remaining roots r3, r4 of the quartic, r^2 - s34 r + p34 = 0
        final boolean kerr = "kerr".equals(st.family());
        final double s34 = 2 / oneMinusE2 - ra - rp;
        final double p34 = a * a * q / (oneMinusE2 * ra * rp);
        final double r3 = 0.5 * (s34 + FastMath.sqrt(FastMath.max(0, s34 * s34 - 4 * p34)));
        final double r4 = r3 > 0 ? p34 / r3 : 0.0;
        double lamR = Double.NaN;
        double avgTR;
        double avgPhR;
        if (e > 0) {
            double lr = 0;
            double tr = 0;
            double pr = 0;
            for (int k = 0; k < nodes; k++) {
                double chi = h * (k + 0.5);
                double c = FastMath.cos(chi);
                double r = p / (1 + e * c);
                double f = kerr ? (r - r3) * (r - r4)
                        : OrbitElements.radialPotential(st, r, en, l, q) / (oneMinusE2 * (ra - r) * (r - rp));
                double w = FastMath.sqrt(1 - e * e) / ((1 + e * c) * FastMath.sqrt(oneMinusE2 * f));
                double delta = st.delta(r);
                double pp = en * (r * r + a * a) - a * l;
                lr += w;
                tr += w * (r * r + a * a) * pp / delta;
                pr += w * a * pp / delta;
            }
            lamR = lr * h;
            avgTR = tr / lr;
            avgPhR = pr / lr;
        } else {
            // circular: r = p throughout, the radial averages are the values there
            double delta = st.delta(p);
            double pp = en * (p * p + a * a) - a * l;
            avgTR = (p * p + a * a) * pp / delta;
            avgPhR = a * pp / delta;
        }
        double avgTTh;
        double avgPhTh;
        double lamTh = Double.NaN;
        if (q == 0.0) {
            avgTTh = -a * a * en + a * l;
            avgPhTh = -a * en + l;
        } else {
            double beta = a * a * oneMinusE2;
            double lt = 0;
            double tt = 0;
            double pt = 0;
            for (int k = 0; k < nodes; k++) {
                double psi = h * (k + 0.5);
                double c = FastMath.cos(psi);
                double z = zMinus * c * c;
                double w = 1 / FastMath.sqrt(q / zMinus - beta * z);
                double sin2 = 1 - z;
                lt += w;
                tt += w * (-a * a * en * sin2 + a * l);
                pt += w * (-a * en + l / sin2);
            }
            lamTh = lt * h;
            avgTTh = tt / lt;
            avgPhTh = pt / lt;
        }
        double gamma = avgTR + avgTTh;
        double upsPhi = avgPhR + avgPhTh;
        // periods positive; the advance in the sense of the orbital motion
        double periodPhi = 2 * FastMath.PI * gamma / FastMath.abs(upsPhi);
        double periodR = lamR * gamma;
        double periodTh = q == 0.0 ? Double.NaN : lamTh * gamma;
        double advance = FastMath.abs(upsPhi) * lamR - 2 * FastMath.PI;
        return new Result(periodR, periodPhi, periodTh, advance);
    }
}
