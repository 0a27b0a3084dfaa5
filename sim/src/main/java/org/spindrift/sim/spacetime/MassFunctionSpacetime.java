package org.spindrift.sim.spacetime;

import org.hipparchus.CalculusFieldElement;
import org.hipparchus.util.FastMath;

/**
 * Kerr metric with the mass replaced by a radial mass function m(r), in the Guerses-Guersey
 * form (Guerses & Guersey 1975, J. Math. Phys. 16, 2385; rotating regular black holes:
 * Bambi & Modesto 2013, Phys. Lett. B 721, 329):
 *
 * <pre>
 *   Sigma = r^2 + a^2 cos^2(theta),   Delta = r^2 - 2 m(r) r + a^2
 *   g_tt = -(1 - 2 m r / Sigma)        g_tphi = -2 m r a sin^2(theta) / Sigma
 *   g_phiphi = (r^2 + a^2 + 2 m r a^2 sin^2(theta) / Sigma) sin^2(theta)
 *   g_rr = Sigma / Delta               g_thth = Sigma
 * </pre>
 *
 * With m = M this is Kerr in Boyer-Lindquist coordinates (Boyer & Lindquist 1967, J. Math. Phys.
 * 8, 265, eq. 2.13); with m = M - Q^2/(2r) it is Kerr-Newman. Because Delta depends on r alone,
 * the Hamilton-Jacobi equation separates and the Carter constant is conserved.
 *
 * <p>The inverse metric is written in the forms
 * g^tt = -(r^2+a^2)^2/(Sigma Delta) + a^2 sin^2/Sigma, g^tphi = -2 a m r/(Sigma Delta),
 * g^phiphi = 1/(Sigma sin^2) - a^2/(Sigma Delta), g^rr = Delta/Sigma, g^thth = 1/Sigma
 * (Misner, Thorne & Wheeler 1973, eq. 33.2 generalised to m(r)), which differentiate simply.
 */
public final class MassFunctionSpacetime implements Spacetime {
    private final String family;
    private final double a;
    private final MassFunction mass;

    /**
     * @param family the family name for reports (kerr, kerr-newman, hayward, bardeen, mass-series)
     * @param spin the spin a in units of M
     * @param mass the mass function
     */
    public MassFunctionSpacetime(String family, double spin, MassFunction mass) {
        this.family = family;
        this.a = spin;
        this.mass = mass;
    }

    /** @return the mass function */
    public MassFunction massFunction() {
        return mass;
    }

    /** @return Delta(r) = r^2 - 2 m(r) r + a^2 */
    public double delta(double r) {
        return r * r - 2.0 * mass.value(r) * r + a * a;
    }

    /** @return dDelta/dr = 2 r - 2 (m + r m') */
    public double deltaDerivative(double r) {
        return 2.0 * r - 2.0 * (mass.value(r) + r * mass.derivative(r));
    }

    @Override public String family() {
        return family;
    }

    @Override public double spin() {
        return a;
    }

    @Override public boolean separable() {
        return true;
    }

    @Override public double carter(double theta, double pTheta, double energy, double angularMomentum,
                                   double mu2) {
        double c = Trig.cos(theta); // allocation-free, see inverse()
        double s = Trig.sin(theta);
        // Carter 1968, Phys. Rev. 174, 1559: Q = p_th^2 + cos^2 th (a^2 (mu^2 - E^2) + L^2 / sin^2 th)
        return pTheta * pTheta + c * c * (a * a * (mu2 - energy * energy)
                + angularMomentum * angularMomentum / (s * s));
    }

    @Override public void inverse(double r, double theta, double[] out) {
        components(r, theta, out, true);
    }

    @Override public void covariant(double r, double theta, double[] out) {
        components(r, theta, out, false);
    }

    /** The inverse (inverse = true) or covariant metric with first derivatives, from one set of shared terms. */
    private void components(double r, double theta, double[] out, boolean inverse) {
        // Trig = StrictMath bit for bit, without JDK 17's JNI call; FastMath.sin/cos would allocate a
        // reduction object for theta > pi/2 (Hipparchus 4.0.2), which the hot loops must not
        final double s = Trig.sin(theta);
        final double c = Trig.cos(theta);
        final double s2 = s * s;
        final double a2 = a * a;
        final double m = mass.value(r);
        final double mr = mass.derivative(r);

        final double sig = r * r + a2 * c * c;
        final double sigR = 2.0 * r;
        final double sigT = -2.0 * a2 * s * c;
        final double del = r * r - 2.0 * m * r + a2;
        final double delR = 2.0 * r - 2.0 * (m + r * mr);
        final double rho = r * r + a2;
        if (inverse) {
            final double d = sig * del;
            final double dR = sigR * del + sig * delR;
            final double dT = sigT * del;
            // three reciprocals instead of two dozen divisions (this is the integrators' hot path)
            final double id = 1.0 / d;
            final double id2 = id * id;
            final double is = 1.0 / sig;
            final double is2 = is * is;
            final double rho2 = rho * rho;

            // g^tt = -(r^2+a^2)^2 / D + a^2 sin^2 / Sigma
            out[TT] = -rho2 * id + a2 * s2 * is;
            out[DR + TT] = -4.0 * r * rho * id + rho2 * dR * id2 - a2 * s2 * sigR * is2;
            out[DTH + TT] = rho2 * dT * id2 + a2 * (2.0 * s * c * sig - s2 * sigT) * is2;

            // g^tphi = -B / D with B = 2 a m r
            final double b = 2.0 * a * m * r;
            final double bR = 2.0 * a * (m + r * mr);
            out[TP] = -b * id;
            out[DR + TP] = -bR * id + b * dR * id2;
            out[DTH + TP] = b * dT * id2;

            // g^phiphi = 1 / (Sigma sin^2) - a^2 / D
            final double iq = 1.0 / (sig * s2);
            final double iq2 = iq * iq;
            out[PP] = iq - a2 * id;
            out[DR + PP] = -sigR * s2 * iq2 + a2 * dR * id2;
            out[DTH + PP] = -(sigT * s2 + sig * 2.0 * s * c) * iq2 + a2 * dT * id2;

            // g^rr = Delta / Sigma
            out[RR] = del * is;
            out[DR + RR] = delR * is - del * sigR * is2;
            out[DTH + RR] = -del * sigT * is2;

            // g^thth = 1 / Sigma
            out[HH] = is;
            out[DR + HH] = -sigR * is2;
            out[DTH + HH] = -sigT * is2;
        } else {
            final double sig2 = sig * sig;
            final double p = 2.0 * m * r;
            final double pR = 2.0 * (m + r * mr);
            final double f = p / sig;                 // 2 m r / Sigma
            final double fR = pR / sig - p * sigR / sig2;
            final double fT = -p * sigT / sig2;

            out[TT] = -1.0 + f;
            out[DR + TT] = fR;
            out[DTH + TT] = fT;

            out[TP] = -a * s2 * f;
            out[DR + TP] = -a * s2 * fR;
            out[DTH + TP] = -a * (2.0 * s * c * f + s2 * fT);

            out[PP] = (rho + a2 * s2 * f) * s2;
            out[DR + PP] = (2.0 * r + a2 * s2 * fR) * s2;
            out[DTH + PP] = 2.0 * s * c * rho + a2 * (4.0 * s2 * s * c * f + s2 * s2 * fT);

            out[RR] = sig / del;
            out[DR + RR] = sigR / del - sig * delR / (del * del);
            out[DTH + RR] = sigT / del;

            out[HH] = sig;
            out[DR + HH] = sigR;
            out[DTH + HH] = sigT;
        }
    }

    @Override public <T extends CalculusFieldElement<T>> void covariant(T r, T theta, T[] out) {
        T s = theta.sin();
        T c = theta.cos();
        T s2 = s.multiply(s);
        double a2 = a * a;
        T m = mass.value(r);
        T sig = r.multiply(r).add(c.multiply(c).multiply(a2));
        T del = r.multiply(r).subtract(m.multiply(r).multiply(2.0)).add(a2);
        T f = m.multiply(r).multiply(2.0).divide(sig);
        out[TT] = f.subtract(1.0);
        out[TP] = f.multiply(s2).multiply(-a);
        out[PP] = r.multiply(r).add(a2).add(f.multiply(s2).multiply(a2)).multiply(s2);
        out[RR] = sig.divide(del);
        out[HH] = sig;
    }
}
