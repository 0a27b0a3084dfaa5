package org.spindrift.sim.spacetime;

import org.hipparchus.analysis.differentiation.DSFactory;
import org.hipparchus.analysis.differentiation.DerivativeStructure;
import org.hipparchus.util.FastMath;

/**
 * Circular equatorial geodesics of any {@link Spacetime} (all members are reflection-symmetric
 * about theta = pi/2, so such orbits exist wherever they are timelike).
 *
 * <p>Conventions: "prograde" is the branch Omega = (-g_tphi,r + sqrt(D)) / g_phiphi,r, which
 * far out has Omega &gt; 0 and L &gt; 0 (moving towards +phi); for a &gt; 0 it co-rotates with the
 * hole, and a negative spin
 * describes a hole turning the other way, exactly as in the Kerr formulas of Bardeen, Press &amp;
 * Teukolsky 1972 (ApJ 178, 347), e.g. Omega = 1/(r^1.5 + a) for prograde orbits at either sign of a.
 * E = -u_t and L = u_phi per unit rest mass; Omega = u^phi/u^t, and all frequencies (Omega, the
 * epicyclic frequencies) are angular frequencies in coordinate time, in units of 1/M.
 *
 * <p>Methods return NaN where the orbit does not exist: no real Omega, or E, L and u^t when the
 * circular orbit would be spacelike or null (inside the photon orbit).
 *
 * <p>{@link #omega}, {@link #energy}, {@link #angularMomentum} and {@link #ut} use a per-thread
 * scratch buffer (or the one passed in) and do not allocate. {@link #shearRate} and the
 * epicyclic frequencies take second metric derivatives by Hipparchus automatic differentiation
 * of {@link Spacetime#covariant(org.hipparchus.CalculusFieldElement, org.hipparchus.CalculusFieldElement,
 * org.hipparchus.CalculusFieldElement[])}; they allocate (a few small objects per call).
 */
public final class CircularOrbits {
    private static final double EQUATOR = 0.5 * FastMath.PI;
    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[Spacetime.SIZE]);
    private static final DSFactory DS2 = new DSFactory(2, 2);

    private CircularOrbits() {
    }

    /** Omega with a per-thread scratch buffer. */
    public static double omega(Spacetime st, double r, boolean prograde) {
        return omega(st, r, prograde, SCRATCH.get());
    }

    /**
     * Angular velocity Omega = dphi/dt of the circular equatorial geodesic: the root of
     * g_tt,r + 2 Omega g_tphi,r + Omega^2 g_phiphi,r = 0 (the radial geodesic equation with
     * u^r = u^theta = 0, e.g. Bardeen, Press &amp; Teukolsky 1972, sec. II; Johannsen &amp; Psaltis
     * 2011, Phys. Rev. D 83, 124015, sec. V), evaluated in the cancellation-free form of the
     * quadratic formula.
     *
     * @param scratch a buffer of length {@link Spacetime#SIZE}, overwritten
     */
    public static double omega(Spacetime st, double r, boolean prograde, double[] scratch) {
        st.covariant(r, EQUATOR, scratch);
        return omegaFromBuffer(scratch, prograde);
    }

    /** Omega from a buffer already filled by {@link Spacetime#covariant(double, double, double[])} at the equator. */
    static double omegaFromBuffer(double[] g, boolean prograde) {
        final double c = g[Spacetime.DR + Spacetime.TT];
        final double b = g[Spacetime.DR + Spacetime.TP];
        final double a = g[Spacetime.DR + Spacetime.PP];
        final double disc = b * b - a * c;
        if (!(disc >= 0.0)) {
            return Double.NaN;
        }
        final double sq = FastMath.sqrt(disc);
        // Prograde is the root (-b + sq)/a, retrograde (-b - sq)/a, whatever the sign of a:
        // for Kerr these are 1/(r^1.5 + a) and -1/(r^1.5 - a) identically (BPT 1972 eq. 2.16),
        // including where g_phiphi,r < 0 (r^3 < a^2). Each is taken in the form without
        // cancellation, (-b + sq)/a = c/(-b - sq).
        if (prograde) {
            return b <= 0.0 ? (-b + sq) / a : c / (-b - sq);
        }
        return b >= 0.0 ? (-b - sq) / a : c / (-b + sq);
    }

    /** u^t of the circular orbit, per-thread scratch. */
    public static double ut(Spacetime st, double r, boolean prograde) {
        return ut(st, r, prograde, SCRATCH.get());
    }

    /** u^t = (-(g_tt + 2 Omega g_tphi + Omega^2 g_phiphi))^(-1/2), NaN if not timelike. */
    public static double ut(Spacetime st, double r, boolean prograde, double[] scratch) {
        double w = omega(st, r, prograde, scratch);
        return utFromBuffer(scratch, w);
    }

    private static double utFromBuffer(double[] g, double w) {
        final double n = -(g[Spacetime.TT] + 2.0 * w * g[Spacetime.TP] + w * w * g[Spacetime.PP]);
        return n > 0.0 ? 1.0 / FastMath.sqrt(n) : Double.NaN;
    }

    /** Energy per unit mass, per-thread scratch. */
    public static double energy(Spacetime st, double r, boolean prograde) {
        return energy(st, r, prograde, SCRATCH.get());
    }

    /** E = -u_t = -(g_tt + Omega g_tphi) u^t. */
    public static double energy(Spacetime st, double r, boolean prograde, double[] scratch) {
        double w = omega(st, r, prograde, scratch);
        double ut = utFromBuffer(scratch, w);
        return -(scratch[Spacetime.TT] + w * scratch[Spacetime.TP]) * ut;
    }

    /** Angular momentum per unit mass, per-thread scratch. */
    public static double angularMomentum(Spacetime st, double r, boolean prograde) {
        return angularMomentum(st, r, prograde, SCRATCH.get());
    }

    /** L = u_phi = (g_tphi + Omega g_phiphi) u^t. */
    public static double angularMomentum(Spacetime st, double r, boolean prograde, double[] scratch) {
        double w = omega(st, r, prograde, scratch);
        double ut = utFromBuffer(scratch, w);
        return (scratch[Spacetime.TP] + w * scratch[Spacetime.PP]) * ut;
    }

    /**
     * -(g_tt + 2 Omega g_tphi + Omega^2 g_phiphi) = (u^t)^-2: positive where the circular orbit
     * is timelike, zero at a circular photon orbit (used by {@link Landmarks}).
     */
    public static double timelikeNorm(Spacetime st, double r, boolean prograde) {
        double[] g = SCRATCH.get();
        double w = omega(st, r, prograde, g);
        return -(g[Spacetime.TT] + 2.0 * w * g[Spacetime.TP] + w * w * g[Spacetime.PP]);
    }

    /** @return the shear rate r dOmega/dr, 1/M */
    public static double shearRate(Spacetime st, double r, boolean prograde) {
        return r * omegaDerivative(st, r, prograde);
    }

    /**
     * dOmega/dr by implicit differentiation of F(Omega, r) = g_tt,r + 2 Omega g_tphi,r +
     * Omega^2 g_phiphi,r = 0: dOmega/dr = -F_r / F_Omega (second metric derivatives by automatic
     * differentiation).
     */
    public static double omegaDerivative(Spacetime st, double r, boolean prograde) {
        DerivativeStructure[] g = metric(st, r);
        double w = omega(st, r, prograde);
        double fr = d(g[Spacetime.TT], 2, 0) + 2.0 * w * d(g[Spacetime.TP], 2, 0) + w * w * d(g[Spacetime.PP], 2, 0);
        double fw = 2.0 * d(g[Spacetime.TP], 1, 0) + 2.0 * w * d(g[Spacetime.PP], 1, 0);
        return -fr / fw;
    }

    /**
     * Squared radial epicyclic frequency Omega_r^2 (1/M^2); negative where circular orbits are
     * radially unstable, zero at the ISCO.
     *
     * <p>From the effective potential V(r, theta) = 1 + E^2 g^tt - 2 E L g^tphi + L^2 g^phiphi
     * (so that g_rr (u^r)^2 + g_thth (u^theta)^2 = -V): linearising about the circular orbit
     * gives oscillations with Omega_r^2 = V_rr / (2 g_rr (u^t)^2) and
     * Omega_theta^2 = V_thth / (2 g_thth (u^t)^2) in coordinate time (e.g. Johannsen &amp; Psaltis
     * 2011, ApJ 726, 11, sec. 2; Bambi 2017, "Black Holes: A Laboratory for Testing Strong
     * Gravity", Springer, ch. on QPOs; both recalled from memory). For Kerr this gives the closed
     * forms of Okazaki, Kato &amp; Fukue 1987 (PASJ 39, 457) and Kato 1990 (PASJ 42, 99), which the
     * tests check.
     */
    public static double radialEpicyclicSquared(Spacetime st, double r, boolean prograde) {
        return epicyclicSquared(st, r, prograde, true);
    }

    /** Squared vertical epicyclic frequency Omega_theta^2 (1/M^2); see {@link #radialEpicyclicSquared}. */
    public static double verticalEpicyclicSquared(Spacetime st, double r, boolean prograde) {
        return epicyclicSquared(st, r, prograde, false);
    }

    /** @return Omega_r = sqrt(Omega_r^2) in 1/M, NaN where radially unstable */
    public static double radialEpicyclic(Spacetime st, double r, boolean prograde) {
        double x = radialEpicyclicSquared(st, r, prograde);
        return x >= 0.0 ? FastMath.sqrt(x) : Double.NaN;
    }

    /** @return Omega_theta = sqrt(Omega_theta^2) in 1/M, NaN where vertically unstable */
    public static double verticalEpicyclic(Spacetime st, double r, boolean prograde) {
        double x = verticalEpicyclicSquared(st, r, prograde);
        return x >= 0.0 ? FastMath.sqrt(x) : Double.NaN;
    }

    private static double epicyclicSquared(Spacetime st, double r, boolean prograde, boolean radial) {
        double[] buf = SCRATCH.get();
        double w = omega(st, r, prograde, buf);
        double ut = utFromBuffer(buf, w);
        if (Double.isNaN(ut)) {
            return Double.NaN;
        }
        double e = -(buf[Spacetime.TT] + w * buf[Spacetime.TP]) * ut;
        double l = (buf[Spacetime.TP] + w * buf[Spacetime.PP]) * ut;
        double grr = buf[Spacetime.RR];
        double ghh = buf[Spacetime.HH];
        DerivativeStructure[] g = metric(st, r);
        // inverse of the t-phi block through D = g_tphi^2 - g_tt g_phiphi:
        // E^2 g^tt - 2 E L g^tphi + L^2 g^phiphi = -(E^2 g_phiphi + 2 E L g_tphi + L^2 g_tt) / D
        DerivativeStructure dd = g[Spacetime.TP].multiply(g[Spacetime.TP]).subtract(g[Spacetime.TT].multiply(g[Spacetime.PP]));
        DerivativeStructure num = g[Spacetime.PP].multiply(e * e).add(g[Spacetime.TP].multiply(2.0 * e * l))
                .add(g[Spacetime.TT].multiply(l * l));
        DerivativeStructure v = num.divide(dd).negate().add(1.0);
        return radial ? d(v, 2, 0) / (2.0 * grr * ut * ut) : d(v, 0, 2) / (2.0 * ghh * ut * ut);
    }

    /** The covariant metric at (r, pi/2) with derivatives up to second order in r and theta. */
    private static DerivativeStructure[] metric(Spacetime st, double r) {
        DerivativeStructure[] g = new DerivativeStructure[5];
        st.covariant(DS2.variable(0, r), DS2.variable(1, EQUATOR), g);
        return g;
    }

    private static double d(DerivativeStructure x, int nr, int nth) {
        return x.getPartialDerivative(nr, nth);
    }
}
