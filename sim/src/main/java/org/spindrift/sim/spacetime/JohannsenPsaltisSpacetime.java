package org.spindrift.sim.spacetime;

import org.hipparchus.CalculusFieldElement;
import org.hipparchus.util.FastMath;

/**
 * The Johannsen-Psaltis deformed Kerr metric with the single deformation
 * h(r, theta) = epsilon_3 M^3 r / Sigma^2 (Johannsen & Psaltis 2011, Phys. Rev. D 83, 124015,
 * section III: the lowest-order deformation parameter they keep; equation numbers not quoted
 * because they are recalled from memory only), M = 1:
 *
 * <pre>
 *   Sigma = r^2 + a^2 cos^2,  Delta = r^2 - 2 r + a^2,  W = Delta + a^2 sin^2 h
 *   g_tt   = -(1 + h)(1 - 2 r / Sigma)
 *   g_tphi = -2 a r sin^2 (1 + h) / Sigma
 *   g_phiphi = sin^2 (r^2 + a^2 + 2 a^2 r sin^2 / Sigma) + h a^2 (Sigma + 2 r) sin^4 / Sigma
 *   g_rr   = Sigma (1 + h) / W,    g_thth = Sigma
 * </pre>
 *
 * The geodesic equations do not separate: {@link #separable()} is false and {@link #carter}
 * returns NaN.
 *
 * <p>Inverse metric. The t-phi block has g_tphi^2 - g_tt g_phiphi = (1 + h) sin^2 W (derived
 * here: the h-terms combine through the Kerr identity
 * (r^2+a^2) Sigma + 2 a^2 r sin^2 = (r^2+a^2)^2 - a^2 sin^2 Delta), so with
 * U = r / Sigma, K = 1 - 2 U and P = g_phiphi / sin^2:
 * g^tt = -P / ((1+h) W), g^tphi = -2 a U / W, g^phiphi = K / (sin^2 W),
 * g^rr = W / (Sigma (1+h)), g^thth = 1 / Sigma. At h = 0 these are the Kerr forms
 * (Misner, Thorne & Wheeler 1973, eq. 33.2). The first derivatives below follow by the product
 * and quotient rules; the tests check all of them against automatic differentiation.
 */
public final class JohannsenPsaltisSpacetime implements Spacetime {
    /** Family name on the command line. */
    public static final String FAMILY = "johannsen-psaltis";

    private final double a;
    private final double eps;

    /**
     * @param spin a in units of M
     * @param epsilon3 the deformation parameter epsilon_3
     */
    public JohannsenPsaltisSpacetime(double spin, double epsilon3) {
        this.a = spin;
        this.eps = epsilon3;
    }

    /** @return epsilon_3 */
    public double epsilon3() {
        return eps;
    }

    /** @return h(r, theta) = epsilon_3 r / Sigma^2 (Johannsen & Psaltis 2011, M = 1) */
    public double h(double r, double theta) {
        double c = FastMath.cos(theta);
        double sig = r * r + a * a * c * c;
        return eps * r / (sig * sig);
    }

    /** @return W(r, theta) = Delta + a^2 sin^2(theta) h, the numerator of g^rr */
    public double w(double r, double theta) {
        double s = FastMath.sin(theta);
        return r * r - 2.0 * r + a * a + a * a * s * s * h(r, theta);
    }

    @Override public String family() {
        return FAMILY;
    }

    @Override public double spin() {
        return a;
    }

    @Override public boolean separable() {
        return false;
    }

    @Override public double carter(double theta, double pTheta, double energy, double angularMomentum,
                                   double mu2) {
        return Double.NaN;
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
        final double sc2 = 2.0 * s * c;          // d(sin^2)/dtheta
        final double a2 = a * a;

        final double sig = r * r + a2 * c * c;
        final double sigR = 2.0 * r;
        final double sigT = -a2 * sc2;
        final double sig2 = sig * sig;
        final double sig3 = sig2 * sig;

        // h = eps r / Sigma^2
        final double h = eps * r / sig2;
        final double hR = eps * (sig - 2.0 * r * sigR) / sig3;
        final double hT = -2.0 * eps * r * sigT / sig3;
        final double f = 1.0 + h;

        // U = r / Sigma, K = 1 - 2U
        final double u = r / sig;
        final double uR = 1.0 / sig - r * sigR / sig2;
        final double uT = -r * sigT / sig2;
        final double k = 1.0 - 2.0 * u;
        final double kR = -2.0 * uR;
        final double kT = -2.0 * uT;

        // W = Delta + a^2 sin^2 h
        final double w = r * r - 2.0 * r + a2 + a2 * s2 * h;
        final double wR = 2.0 * r - 2.0 + a2 * s2 * hR;
        final double wT = a2 * (sc2 * h + s2 * hT);

        // V = 2U + h (1 + 2U), so that g_phiphi = sin^2 (r^2 + a^2) + a^2 sin^4 V
        final double v = 2.0 * u + h * (1.0 + 2.0 * u);
        final double vR = 2.0 * uR + hR * (1.0 + 2.0 * u) + 2.0 * h * uR;
        final double vT = 2.0 * uT + hT * (1.0 + 2.0 * u) + 2.0 * h * uT;

        // Sigma F
        final double sf = sig * f;
        final double sfR = sigR * f + sig * hR;
        final double sfT = sigT * f + sig * hT;
        if (inverse) {
            final double w2 = w * w;

            // P = g_phiphi / sin^2 = r^2 + a^2 + a^2 sin^2 V
            final double p = r * r + a2 + a2 * s2 * v;
            final double pR = 2.0 * r + a2 * s2 * vR;
            final double pT = a2 * (sc2 * v + s2 * vT);

            // g^tt = -P / (F W)
            final double fw = f * w;
            final double fwR = hR * w + f * wR;
            final double fwT = hT * w + f * wT;
            final double fw2 = fw * fw;
            out[TT] = -p / fw;
            out[DR + TT] = -pR / fw + p * fwR / fw2;
            out[DTH + TT] = -pT / fw + p * fwT / fw2;

            // g^tphi = -2 a U / W
            out[TP] = -2.0 * a * u / w;
            out[DR + TP] = -2.0 * a * (uR / w - u * wR / w2);
            out[DTH + TP] = -2.0 * a * (uT / w - u * wT / w2);

            // g^phiphi = K / (sin^2 W)
            final double q = s2 * w;
            final double qR = s2 * wR;
            final double qT = sc2 * w + s2 * wT;
            out[PP] = k / q;
            out[DR + PP] = kR / q - k * qR / (q * q);
            out[DTH + PP] = kT / q - k * qT / (q * q);

            // g^rr = W / (Sigma F)
            out[RR] = w / sf;
            out[DR + RR] = wR / sf - w * sfR / (sf * sf);
            out[DTH + RR] = wT / sf - w * sfT / (sf * sf);

            // g^thth = 1 / Sigma
            out[HH] = 1.0 / sig;
            out[DR + HH] = -sigR / sig2;
            out[DTH + HH] = -sigT / sig2;
        } else {
            // g_tt = -F K
            out[TT] = -f * k;
            out[DR + TT] = -(hR * k + f * kR);
            out[DTH + TT] = -(hT * k + f * kT);

            // g_tphi = -2 a sin^2 U F
            final double uf = u * f;
            final double ufR = uR * f + u * hR;
            final double ufT = uT * f + u * hT;
            out[TP] = -2.0 * a * s2 * uf;
            out[DR + TP] = -2.0 * a * s2 * ufR;
            out[DTH + TP] = -2.0 * a * (sc2 * uf + s2 * ufT);

            // g_phiphi = sin^2 (r^2 + a^2) + a^2 sin^4 V
            final double s4 = s2 * s2;
            out[PP] = s2 * (r * r + a2) + a2 * s4 * v;
            out[DR + PP] = s2 * 2.0 * r + a2 * s4 * vR;
            out[DTH + PP] = sc2 * (r * r + a2) + a2 * (2.0 * s2 * sc2 * v + s4 * vT);

            // g_rr = Sigma F / W
            out[RR] = sf / w;
            out[DR + RR] = sfR / w - sf * wR / (w * w);
            out[DTH + RR] = sfT / w - sf * wT / (w * w);

            out[HH] = sig;
            out[DR + HH] = sigR;
            out[DTH + HH] = sigT;
        }
    }

    @Override public <T extends CalculusFieldElement<T>> void covariant(T r, T theta, T[] out) {
        // written directly from the line element (Johannsen & Psaltis 2011), not from
        // the rearranged forms above, so that the tests compare two independent routes
        T s = theta.sin();
        T c = theta.cos();
        T s2 = s.multiply(s);
        double a2 = a * a;
        T sig = r.multiply(r).add(c.multiply(c).multiply(a2));
        T h = r.multiply(eps).divide(sig.multiply(sig));
        T onePlusH = h.add(1.0);
        T twoROverSig = r.multiply(2.0).divide(sig);
        T delta = r.multiply(r).subtract(r.multiply(2.0)).add(a2);
        out[TT] = onePlusH.multiply(twoROverSig.negate().add(1.0)).negate();
        out[TP] = r.multiply(-2.0 * a).multiply(s2).multiply(onePlusH).divide(sig);
        T kerrPart = s2.multiply(r.multiply(r).add(a2).add(r.multiply(2.0 * a2).multiply(s2).divide(sig)));
        T deform = h.multiply(a2).multiply(sig.add(r.multiply(2.0))).multiply(s2.multiply(s2)).divide(sig);
        out[PP] = kerrPart.add(deform);
        out[RR] = sig.multiply(onePlusH).divide(delta.add(h.multiply(s2).multiply(a2)));
        out[HH] = sig;
    }
}
