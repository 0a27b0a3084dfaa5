package org.spindrift.validation;

import org.spindrift.shared.testing.ExternalPython;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.motion.MinoFrequencies;
import org.spindrift.sim.motion.OrbitElements;
import org.spindrift.sim.motion.Predictions;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;

class ReferenceFormulasTest {
    /** K(0) = pi/2 exactly: the AGM of (1, 1) needs no step, so only the rounding of pi/2. */
    private static final double EXACT = 1e-16;
    /** A tabulated value with 16 significant digits against the AGM: a few ulps of K of order 2. */
    private static final double TABLE_DIGITS = 1e-14;
    /** Two double-precision implementations of K (AGM, Cephes): a few ulps each, relative. */
    private static final double SCIPY_REL = 2e-15;
    /** Mino-time quadrature on 256 nodes (exponentially convergent) against the closed form, rad. */
    private static final double QUADRATURE_VS_CLOSED_FORM = 1e-12;
    /** 128 against 1024 nodes: the 128-node midpoint rule has converged to about 1e-12 here (our choice). */
    private static final double QUADRATURE_NODES_REL = 1e-10;
    /** Omega_theta = Omega_phi for a = 0: two quadratures of different integrands, each near 1e-12. */
    private static final double SPHERICAL_SYMMETRY_REL = 1e-9;

    @Test
    void ellipticKKnownValues() {
        // K(0) = pi/2 (Abramowitz & Stegun 1964, 17.3.11); K(1/2) = 1.854074677301372 (A&S table 17.1, from memory)
        assertEquals(Math.PI / 2, EllipticK.of(0), EXACT);
        assertEquals(1.854074677301372, EllipticK.of(0.5), TABLE_DIGITS);
    }

    @Test
    void ellipticKAgreesWithScipy() throws Exception {
        double[] m = {0.0, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99, 0.999999};
        StringBuilder py = new StringBuilder("from scipy.special import ellipk\n");
        for (double x : m) {
            py.append("print(repr(float(ellipk(").append(x).append("))))\n");
        }
        List<String> out = ExternalPython.run(ExternalPython.require("scipy.special", "python3-scipy"), py.toString());
        for (int i = 0; i < m.length; i++) {
            // scipy.special.ellipk (Cephes) as an independent calculator
            double ref = Double.parseDouble(out.get(i));
            assertEquals(ref, EllipticK.of(m[i]), SCIPY_REL * ref, "K(" + m[i] + ")");
        }
    }

    @Test
    void secondOrderCoefficientMatchesTheExactIntegralExpansion() {
        // (exact - 6 pi/p) p^2 -> (3/2)(18 + e^2) pi as p -> infinity (Cutler, Kennefick & Poisson 1994
        // closed form vs the Damour & Schafer 1988 test-mass 2PN term)
        for (double e : new double[] {0.0, 0.3, 0.6, 0.9}) {
            double coefficient = 1.5 * (18 + e * e) * Math.PI;
            double prev = Double.NaN;
            for (double p : new double[] {1e3, 1e4, 1e5}) {
                double c = (SchwarzschildPrecession.exact(p, e) - Predictions.advance1pn(p)) * p * p;
                double err = Math.abs(c - coefficient);
                assertTrue(err < 600 / p, "e=" + e + " p=" + p + " coefficient " + c + " vs " + coefficient);
                assertTrue(Double.isNaN(prev) || err < prev, "must converge");
                prev = err;
            }
        }
    }

    @Test
    void kerrQuadratureReducesToSchwarzschildClosedForms() {
        // Schwarzschild: advance from the quadrature equals the CKP 1994 elliptic form, and an inclined orbit
        // has Omega_theta = Omega_phi (spherical symmetry)
        Spacetime st = MotionChecks.kerr(0.0);
        OrbitElements.Solution s = OrbitElements.solve(st, 11, 0.45, Math.toRadians(25));
        MinoFrequencies.Result r = MinoFrequencies.compute((MassFunctionSpacetime) st, s, 256);
        assertEquals(SchwarzschildPrecession.exact(11, 0.45), r.advance(), QUADRATURE_VS_CLOSED_FORM);
        assertEquals(r.periodAzimuthal(), r.periodPolar(), SPHERICAL_SYMMETRY_REL * r.periodPolar());
    }

    @Test
    void kerrQuadratureConvergesWithNodes() {
        Spacetime st = MotionChecks.kerr(0.9);
        OrbitElements.Solution s = OrbitElements.solve(st, 10, 0.4, Math.toRadians(30));
        MinoFrequencies.Result a = MinoFrequencies.compute((MassFunctionSpacetime) st, s, 128);
        MinoFrequencies.Result b = MinoFrequencies.compute((MassFunctionSpacetime) st, s, 1024);
        // midpoint rule on a smooth periodic integrand (Trefethen & Weideman 2014, SIAM Rev. 56, 385)
        assertEquals(b.periodRadial(), a.periodRadial(), QUADRATURE_NODES_REL * b.periodRadial());
        assertEquals(b.periodPolar(), a.periodPolar(), QUADRATURE_NODES_REL * b.periodPolar());
        assertEquals(b.advance(), a.advance(), QUADRATURE_NODES_REL);
    }

}
