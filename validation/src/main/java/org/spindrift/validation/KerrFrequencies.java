package org.spindrift.validation;

import org.hipparchus.util.FastMath;

/**
 * Fundamental coordinate-time frequencies of a bound Kerr geodesic by quadrature of the
 * radial and polar potentials in Mino time (Mino 2003; Schmidt 2002, Class. Quantum Grav. 19,
 * 2743, sections 4-5; Drasco &amp; Hughes 2004, Phys. Rev. D 69, 044015, section II; Fujita &amp;
 * Hikida 2009, Class. Quantum Grav. 26, 135002, who give the same quantities in closed form).
 * Independent of the engine's metric code: it uses the Kerr quartic
 * R(r) = (E^2 - 1) r^4 + 2 r^3 + (a^2 (E^2 - 1) - L^2 - Q) r^2 + 2 ((aE - L)^2 + Q) r - a^2 Q
 * factorised as (1 - E^2)(r_a - r)(r - r_p)(r - r_3)(r - r_4) with r_3 + r_4 and r_3 r_4 from
 * Vieta's formulas, and Theta(z) with z = cos^2 theta.
 *
 * <pre>
 *   dr/dlambda = +-sqrt(R),  dtheta/dlambda = +-sqrt(Theta)
 *   dt/dlambda   = (r^2 + a^2) P / Delta - a^2 E sin^2 theta + a L,   P = E (r^2 + a^2) - a L
 *   dphi/dlambda = a P / Delta - a E + L / sin^2 theta
 * </pre>
 *
 * With r = p / (1 + e cos chi): dlambda/dchi = sqrt(1 - e^2) / ((1 + e cos chi) sqrt((1 - E^2)
 * (r - r_3)(r - r_4))); with z = z_- cos^2 psi: dlambda/dpsi = 1 / sqrt(Q / z_- - a^2 (1 - E^2) z).
 * Both integrands are smooth and periodic, so the midpoint rule converges exponentially.
 */
public final class KerrFrequencies {
    /**
     * @param periodRadial 2 pi / Omega_r (M)
     * @param periodAzimuthal 2 pi / |Omega_phi| (M)
     * @param periodPolar 2 pi / Omega_theta (M), NaN for equatorial orbits
     * @param advance 2 pi (|Omega_phi| / Omega_r - 1) (radians per radial period, in the sense of the motion)
     */
    public record Result(double periodRadial, double periodAzimuthal, double periodPolar, double advance) {
    }

    private KerrFrequencies() {
    }

    /**
     * @param a spin
     * @param p semi-latus rectum
     * @param e eccentricity (&gt; 0)
     * @param en energy E
     * @param l angular momentum L
     * @param q Carter constant Q
     * @param zMinus cos^2 of the polar turning angle (0 when equatorial)
     * @param nodes quadrature nodes per period
     */
    public static Result compute(double a, double p, double e, double en, double l, double q, double zMinus,
                                 int nodes) {
        final double rp = p / (1 + e);
        final double ra = p / (1 - e);
        final double oneMinusE2 = 1 - en * en;
        final double s34 = 2 / oneMinusE2 - ra - rp;
        final double p34 = a * a * q / (oneMinusE2 * ra * rp);
        // r3, r4 roots of r^2 - s34 r + p34
        final double disc = FastMath.sqrt(FastMath.max(0, s34 * s34 - 4 * p34));
        final double r3 = 0.5 * (s34 + disc);
        final double r4 = p34 / r3;
        double lamR = 0;
        double tR = 0;
        double phR = 0;
        for (int k = 0; k < nodes; k++) {
            double chi = 2 * FastMath.PI * (k + 0.5) / nodes;
            double r = p / (1 + e * FastMath.cos(chi));
            double w = FastMath.sqrt(1 - e * e) / ((1 + e * FastMath.cos(chi))
                    * FastMath.sqrt(oneMinusE2 * (r - r3) * (r - r4)));
            double delta = r * r - 2 * r + a * a;
            double pp = en * (r * r + a * a) - a * l;
            lamR += w;
            tR += w * (r * r + a * a) * pp / delta;
            phR += w * a * pp / delta;
        }
        double h = 2 * FastMath.PI / nodes;
        lamR *= h;
        tR *= h;
        phR *= h;
        // <f(r)> over a radial period in Mino time
        double avgTR = tR / lamR;
        double avgPhR = phR / lamR;
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
                double psi = 2 * FastMath.PI * (k + 0.5) / nodes;
                double c = FastMath.cos(psi);
                double z = zMinus * c * c;
                double w = 1 / FastMath.sqrt(q / zMinus - beta * z);
                double sin2 = 1 - z;
                lt += w;
                tt += w * (-a * a * en * sin2 + a * l);
                pt += w * (-a * en + l / sin2);
            }
            lt *= h;
            tt *= h;
            pt *= h;
            lamTh = lt;
            avgTTh = tt / lt;
            avgPhTh = pt / lt;
        }
        double gamma = avgTR + avgTTh;
        double upsPhi = avgPhR + avgPhTh;
        double periodR = lamR * gamma;
        // periods positive; the advance in the sense of the orbital motion
        double periodPhi = 2 * FastMath.PI * gamma / FastMath.abs(upsPhi);
        double periodTh = q == 0.0 ? Double.NaN : lamTh * gamma;
        double advance = FastMath.abs(upsPhi) * lamR - 2 * FastMath.PI;
        return new Result(periodR, periodPhi, periodTh, advance);
    }

    /** @return the Kerr quartic R(r) (Schmidt 2002, eq. 4 expanded; Carter 1968) */
    public static double quartic(double a, double r, double en, double l, double q) {
        return (en * en - 1) * r * r * r * r + 2 * r * r * r + (a * a * (en * en - 1) - l * l - q) * r * r
                + 2 * ((a * en - l) * (a * en - l) + q) * r - a * a * q;
    }
}
