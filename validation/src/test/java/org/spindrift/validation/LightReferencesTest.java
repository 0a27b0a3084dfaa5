package org.spindrift.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.light.SchwarzschildRays;
import org.spindrift.shared.testing.ExternalPython;

/** The reference formulas of the light checks against known values and independent calculators. */
class LightReferencesTest {
    /** Closed forms evaluated in double precision: a few ulps of cancellation at most. */
    private static final double CLOSED_FORM = 1e-12;
    /** Quadrature to 1e-13 relative (Hipparchus Legendre-Gauss) against an elliptic-integral closed form. */
    private static final double QUADRATURE_REL = 1e-11;
    /** lambda(1 + eps) = 2 + O(eps) at a = 1: eps = 1e-7 leaves about 1e-7, with cancellation in 0/0. */
    private static final double NEAR_DOUBLE_ROOT = 1e-6;
    /** beta^2 at a root found by Brent's method to 1e-14 in r: |d beta^2 / dr| of order 10-100. */
    private static final double BETA_ROOT = 1e-9;
    /** Beloborodov's approximation is good to better than a per cent here (measured: 6e-4 at r = 6 M). */
    private static final double APPROXIMATION_REL = 1e-2;

    @Test
    void photonOrbitRadiiHaveTheirKnownLimits() {
        // Bardeen, Press & Teukolsky 1972, ApJ 178, 347: r = 3 M for a = 0; 1 M (prograde) and 4 M
        // (retrograde) for a = 1 (known limits, from memory)
        assertEquals(3.0, LightReferences.photonOrbit(0.0, true), CLOSED_FORM);
        assertEquals(3.0, LightReferences.photonOrbit(0.0, false), CLOSED_FORM);
        assertEquals(1.0, LightReferences.photonOrbit(1.0, true), CLOSED_FORM);
        assertEquals(4.0, LightReferences.photonOrbit(1.0, false), CLOSED_FORM);
    }

    @Test
    void equatorialPhotonOrbitsHaveNoCarterConstant() {
        // the circular equatorial photon orbits of Bardeen, Press & Teukolsky 1972 are the spherical
        // orbits of Bardeen 1973 with eta = Q/E^2 = 0: the two published formulas must agree
        for (double a : new double[] {0.3, 0.9, 0.998}) {
            for (boolean pro : new boolean[] {true, false}) {
                double r = LightReferences.photonOrbit(a, pro);
                assertEquals(0.0, LightReferences.shadowEta(r, a), CLOSED_FORM * r * r * r, "a = " + a + " " + pro);
            }
        }
    }

    @Test
    void extremeKerrShadowSpansMinusTwoToSevenEdgeOn() {
        // Bardeen 1973 (Black Holes, Les Houches): the edge-on shadow of an extreme Kerr hole runs
        // from alpha = -2 M (flat prograde edge) to alpha = 7 M (known values, from memory)
        double edgeOn = Math.PI / 2;
        assertEquals(7.0, LightReferences.shadowEdge(1.0, 4.0, edgeOn)[0], CLOSED_FORM);
        // lambda -> 2 as r -> 1+ (0/0 at r = 1): lambda(1 + eps) = 2 + O(eps)
        assertEquals(-2.0, LightReferences.shadowEdge(1.0, 1.0 + 1e-7, edgeOn)[0], NEAR_DOUBLE_ROOT);
        // edge-on, beta^2 = eta
        assertEquals(LightReferences.shadowEta(2.5, 0.9), LightReferences.shadowEdge(0.9, 2.5, edgeOn)[1], CLOSED_FORM);
    }

    @Test
    void visibleOrbitsEndWhereBetaVanishes() {
        // edge-on, every spherical photon orbit between the two equatorial ones reaches the observer
        double[] edgeOn = LightChecks.visibleOrbits(LightChecks.SHADOW_SPIN, Math.PI / 2);
        assertEquals(LightReferences.photonOrbit(LightChecks.SHADOW_SPIN, true), edgeOn[0], CLOSED_FORM);
        assertEquals(LightReferences.photonOrbit(LightChecks.SHADOW_SPIN, false), edgeOn[1], CLOSED_FORM);
        double inc = Math.toRadians(60.0);
        double[] r = LightChecks.visibleOrbits(LightChecks.SHADOW_SPIN, inc);
        assertTrue(r[0] > LightReferences.photonOrbit(LightChecks.SHADOW_SPIN, true) && r[1] < LightReferences
                .photonOrbit(LightChecks.SHADOW_SPIN, false) && r[0] < r[1]);
        for (double x : r) {
            assertEquals(0.0, LightReferences.shadowEdge(LightChecks.SHADOW_SPIN, x, inc)[1], BETA_ROOT);
        }
    }

    @Test
    void exactDeflectionAgreesWithDarwinsEllipticFormWithScipy() throws Exception {
        // Darwin 1959, Proc. R. Soc. A 249, 180 (as written by Bozza 2002, PRD 66, 103001):
        // deflection = -pi + 4 sqrt(r0/Q) (K(m) - F(phi, m)), Q^2 = (r0 - 2)(r0 + 6),
        // m = (Q - r0 + 6) / (2 Q), sin^2 phi = (Q - r0 + 2) / (Q - r0 + 6), r0 the periapsis;
        // scipy.special.ellipk / ellipkinc (Cephes) as the independent calculator
        double[] r0 = {3.5, 5.0, 10.0, 50.0, 400.0};
        StringBuilder py = new StringBuilder("import math\nfrom scipy.special import ellipk, ellipkinc\n");
        for (double r : r0) {
            py.append(String.format(Locale.ROOT, "r0 = %s%nQ = math.sqrt((r0 - 2) * (r0 + 6))%n"
                    + "m = (Q - r0 + 6) / (2 * Q)%nphi = math.asin(math.sqrt((Q - r0 + 2) / (Q - r0 + 6)))%n"
                    + "print(repr(float(-math.pi + 4 * math.sqrt(r0 / Q) * (ellipk(m) - ellipkinc(phi, m)))))%n", r));
        }
        List<String> out = ExternalPython.run(ExternalPython.require("scipy.special", "python3-scipy"), py.toString());
        for (int i = 0; i < r0.length; i++) {
            double b = Math.sqrt(r0[i] * r0[i] * r0[i] / (r0[i] - 2));   // b^2 = r0^3 / (r0 - 2M)
            double ref = Double.parseDouble(out.get(i));
            assertEquals(ref, SchwarzschildRays.deflectionExact(b), QUADRATURE_REL * ref, "r0 = " + r0[i]);
        }
    }

    @Test
    void exactDeflectionApproachesTheEpsteinShapiroSeries() {
        // the remainder after the second-order series is the third-order term 128/(3 b^3) to leading
        // order; the fourth-order term 3465 pi / (64 b^4) (Keeton & Petters 2005, from memory) makes the
        // ratio 1 + 4/b, so 10/b
        for (double b : new double[] {1e3, 1e4}) {
            double rest = SchwarzschildRays.deflectionExact(b) - LightReferences.deflectionSecondOrder(b);
            assertEquals(1.0, rest / LightReferences.deflectionThirdOrder(b), 10.0 / b, "b = " + b);
        }
    }

    @Test
    void faceOnImpactParameterMatchesBeloborodovsApproximation() {
        // Beloborodov 2002, ApJ 566, L85, eq. 1: 1 - cos(alpha) = (1 - cos(psi)) (1 - 2M/r); a face-on
        // ring has psi = pi/2, so cos(alpha) = 2/r and b = r sin(alpha) / sqrt(1 - 2/r); the
        // approximation is good to better than a per cent here (APPROXIMATION_REL)
        for (double r : new double[] {6.0, 10.0, 20.0, 100.0}) {
            double ca = 2.0 / r;
            double approx = r * Math.sqrt(1 - ca * ca) / Math.sqrt(1 - 2.0 / r);
            assertEquals(approx, SchwarzschildRays.faceOnImpactParameter(r), APPROXIMATION_REL * approx, "r = " + r);
        }
    }
}
