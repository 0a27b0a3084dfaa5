package org.spindrift.sim.motion;

import org.junit.jupiter.api.Test;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class OrbitElementsTest {
    /** Order-1 results of the set-up (E, cos iota, z_-, H): closed forms and root solves to about 500 ulps. */
    private static final double ORDER_ONE = 1e-13;
    /** Angular momenta of order 4 M: the relative precision of E, times L, doubled by the square root of L^2. */
    private static final double ANGULAR_MOMENTUM = 1e-12;
    /** L = p / sqrt(p - 3 - e^2) of up to 5 M, with cancellation in p - 3 - e^2 near the separatrix (p = 6.5). */
    private static final double ANGULAR_MOMENTUM_NEAR_SEPARATRIX = 1e-11;
    /**
     * Carter constant and L^2 + Q of order 10-20 M^2, built from squares of the order-1 results: 1e-10 (our
     * choice).
     */
    private static final double CARTER = 1e-10;
    /**
     * e = 1e-5: the two-turning-point branch is conditioned like 1/e; its E differs from the circular one by
     * about 1e-10.
     */
    private static final double NEAR_CIRCULAR_E = 1e-9;
    /** As NEAR_CIRCULAR_E for L, which is larger (about 4 M) and more sensitive to the turning points. */
    private static final double NEAR_CIRCULAR_L = 1e-8;
    /** A potential at its root, relative to r^4: terms of size up to r^4 cancel (about 1e6 ulps, our choice). */
    private static final double POTENTIAL_ROOT = 1e-10;
    /** The polar potential at its turning point, relative to Q + L^2: a few terms of that size cancel. */
    private static final double THETA_ROOT = 1e-12;
    /** The separatrix from a root search, checked to the six decimals that the error message prints. */
    private static final double SEPARATRIX = 1e-6;
    /** Periapsis radius found on the dense output of an orbit integrated at tolerance 1e-12: 1e-8 M (our choice). */
    private static final double INTEGRATED_TURNING_POINT = 1e-8;
    /**
     * Largest sampled r at 400 samples per orbit: below r_a by at most about r (pi / 400)^2 / 2, some 1e-3 M
     * here.
     */
    private static final double SAMPLED_APOAPSIS = 1e-3;
    /** Drift of H = -1/2 over 5 orbits at integration tolerance 1e-12: about 10 steps of error (our choice). */
    private static final double MASS_SHELL_DRIFT = 1e-11;
    /** Relative drift of the Carter constant over 5 orbits at tolerance 1e-12 (our choice, as MASS_SHELL_DRIFT). */
    private static final double CARTER_DRIFT = 1e-9;
    /** Levenberg-Marquardt with a central-difference Jacobian (step 1e-7): E converges to about 1e-11. */
    private static final double LEAST_SQUARES_E = 1e-10;
    /** As LEAST_SQUARES_E for L = J cos(iota) of order 3 M. */
    private static final double LEAST_SQUARES_L = 1e-9;
    /** As LEAST_SQUARES_E for Q = J^2 sin^2(iota) of order 10 M^2 (a square doubles the error). */
    private static final double LEAST_SQUARES_Q = 1e-8;

    @Test
    void schwarzschildEccentricOrbitsMatchTheClosedForm() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.0);
        double[][] cases = {{10, 0.5}, {7.2, 0.3}, {20, 0.9}, {6.5, 0.1}};
        for (double[] c : cases) {
            double p = c[0];
            double e = c[1];
            OrbitElements.Solution s = OrbitElements.solve(st, p, e, 0.0);
            // Cutler, Kennefick & Poisson 1994, Phys. Rev. D 50, 3816, eq. 2.5:
            // E^2 = ((p-2)^2 - 4 e^2) / (p (p - 3 - e^2)), L^2 = p^2 / (p - 3 - e^2)
            double e2 = ((p - 2) * (p - 2) - 4 * e * e) / (p * (p - 3 - e * e));
            double l2 = p * p / (p - 3 - e * e);
            assertEquals(Math.sqrt(e2), s.energy(), ORDER_ONE, "E at p=" + p + " e=" + e);
            assertEquals(Math.sqrt(l2), s.angularMomentum(), ANGULAR_MOMENTUM_NEAR_SEPARATRIX,
                    "L at p=" + p + " e=" + e);
            assertEquals(0.0, s.carter());
        }
    }

    @Test
    void schwarzschildInclinationSplitsTotalAngularMomentum() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.0);
        double iota = Math.toRadians(40);
        OrbitElements.Solution s = OrbitElements.solve(st, 10, 0.4, iota);
        // spherical symmetry: L^2 + Q equals the equatorial L^2 (CKP 1994 eq. 2.5)
        double l2 = 100 / (10 - 3 - 0.16);
        assertEquals(l2, s.angularMomentum() * s.angularMomentum() + s.carter(), CARTER);
        assertEquals(Math.cos(iota), s.angularMomentum() / Math.sqrt(l2), ORDER_ONE);
        // for a = 0 the polar turning point is theta_min = pi/2 - iota
        assertEquals(Math.cos(Math.PI / 2 - iota) * Math.cos(Math.PI / 2 - iota), s.zMinus(), ORDER_ONE);
    }

    @Test
    void circularLimitReproducesBardeenPressTeukolsky() {
        for (double a : new double[] {0.0, 0.5, 0.9, 0.998}) {
            MassFunctionSpacetime st = KerrTestOrbits.kerr(a);
            double r = 9;
            double[] pro = KerrTestOrbits.circularEL(a, r);
            double[] ret = KerrTestOrbits.circularELRetro(a, r);
            OrbitElements.Solution s0 = OrbitElements.solve(st, r, 0.0, 0.0);
            // Bardeen, Press & Teukolsky 1972, ApJ 178, 347, eq. 2.12-2.13
            assertEquals(pro[0], s0.energy(), ORDER_ONE);
            assertEquals(pro[1], s0.angularMomentum(), ANGULAR_MOMENTUM);
            OrbitElements.Solution sr = OrbitElements.solve(st, r, 0.0, Math.PI);
            assertEquals(ret[0], sr.energy(), ORDER_ONE);
            assertEquals(ret[1], sr.angularMomentum(), ANGULAR_MOMENTUM);
            // e -> 0 through the two-turning-point branch
            OrbitElements.Solution se = OrbitElements.solve(st, r, 1e-5, 0.0);
            assertEquals(pro[0], se.energy(), NEAR_CIRCULAR_E);
            assertEquals(pro[1], se.angularMomentum(), NEAR_CIRCULAR_L);
        }
    }

    @Test
    void kerrInclinedOrbitHasTurningPointsOfTheKerrQuartic() {
        double a = 0.9;
        MassFunctionSpacetime st = KerrTestOrbits.kerr(a);
        for (double iotaDeg : new double[] {20, 60, 90, 130}) {
            OrbitElements.Solution s = OrbitElements.solve(st, 11, 0.4, Math.toRadians(iotaDeg));
            double en = s.energy();
            double l = s.angularMomentum();
            double q = s.carter();
            // Kerr radial potential as a quartic (Schmidt 2002, CQG 19, 2743, eq. 4 expanded;
            // Carter 1968): R = (E^2-1) r^4 + 2 r^3 + (a^2(E^2-1) - L^2 - Q) r^2 + 2((aE-L)^2+Q) r - a^2 Q
            for (double r : new double[] {s.periapsis(), s.apoapsis()}) {
                double rr = (en * en - 1) * Math.pow(r, 4) + 2 * Math.pow(r, 3)
                        + (a * a * (en * en - 1) - l * l - q) * r * r + 2 * ((a * en - l) * (a * en - l) + q) * r
                        - a * a * q;
                assertEquals(0.0, rr, POTENTIAL_ROOT * Math.pow(r, 4), "R at r=" + r + " iota=" + iotaDeg);
            }
            assertEquals(Math.cos(Math.toRadians(iotaDeg)), l / Math.sqrt(l * l + q), ORDER_ONE);
            // polar potential vanishes at the turning point (Carter 1968)
            double z = s.zMinus();
            // sin^2(theta) Theta = Q (1 - z) - z (a^2 (1 - E^2) (1 - z) + L^2), z = cos^2(theta)
            double th = q * (1 - z) - z * (a * a * (1 - en * en) * (1 - z) + l * l);
            assertEquals(0.0, th, THETA_ROOT * (q + l * l));
            assertTrue(z > 0 && z <= 1);
        }
    }

    @Test
    void schwarzschildSeparatrixIsSixPlusTwoE() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.0);
        for (double e : new double[] {0.0, 0.3, 0.7}) {
            // Cutler, Kennefick & Poisson 1994: bound orbits need p > 6 + 2e
            assertEquals(6 + 2 * e, OrbitElements.separatrix(st, 5.0, e, 0.0), SEPARATRIX);
            UserInputException ex = assertThrows(UserInputException.class,
                    () -> OrbitElements.solve(st, 6 + 2 * e - 0.01, e, 0.0));
            assertTrue(ex.getMessage().contains(String.format(java.util.Locale.ROOT, "%.6f", 6 + 2 * e)),
                    ex.getMessage());
            OrbitElements.solve(st, 6 + 2 * e + 0.01, e, 0.0);
        }
    }

    @Test
    void unboundElementsAreRejected() {
        MassFunctionSpacetime st = KerrTestOrbits.kerr(0.5);
        assertThrows(UserInputException.class, () -> OrbitElements.solve(st, 10, 1.0, 0.0));
        assertThrows(UserInputException.class, () -> OrbitElements.solve(st, 10, -0.1, 0.0));
        assertThrows(UserInputException.class, () -> OrbitElements.solve(st, -3, 0.2, 0.0));
    }

    @Test
    void massFunctionFamilyTurningPointsAreRootsOfItsOwnPotential() {
        MassFunctionSpacetime st = new MassFunctionSpacetime("hayward", 0.6, MassFunctions.hayward(0.8));
        OrbitElements.Solution s = OrbitElements.solve(st, 9, 0.5, Math.toRadians(35));
        for (double r : new double[] {s.periapsis(), s.apoapsis()}) {
            assertEquals(0.0, OrbitElements.radialPotential(st, r, s.energy(), s.angularMomentum(), s.carter()),
                    POTENTIAL_ROOT * Math.pow(r, 4));
        }
        // mass shell at the start (Misner, Thorne & Wheeler 1973 eq. 25.19: H = -1/2)
        InitialState x = s.start();
        double h = new GeodesicEquations(st).hamiltonian(x.r(), x.theta(), x.pT(), x.pPhi(), x.pR(), x.pTheta());
        assertEquals(-0.5, h, ORDER_ONE);
        assertEquals(s.carter(), x.pTheta() * x.pTheta(), CARTER);
    }

    @Test
    void integratedOrbitTurnsAtTheRequestedRadii() {
        // second route: the trajectory started from the solved constants must turn at r_p and r_a
        MassFunctionSpacetime st = new MassFunctionSpacetime("bardeen", 0.5, MassFunctions.bardeen(0.6));
        OrbitElements.Solution s = OrbitElements.solve(st, 9.5, 0.35, Math.toRadians(50));
        OrbitMeasurement.Result m = OrbitMeasurement.measure(st, s.start(), 5,
                BatchIntegrator.Config.of(Landmarks.captureRadius(st)), 400, OrbitMeasurement.keplerPeriod(9.5, 0.35));
        assertEquals(5, m.orbits());
        double[] rPeri = m.periapses()[1];
        for (double r : rPeri) {
            assertEquals(s.periapsis(), r, INTEGRATED_TURNING_POINT);
        }
        double rMax = 0;
        for (double r : m.samples()[1]) {
            rMax = Math.max(rMax, r);
        }
        assertTrue(rMax <= s.apoapsis() + INTEGRATED_TURNING_POINT && rMax > s.apoapsis() - SAMPLED_APOAPSIS,
                "max r " + rMax + " vs " + s.apoapsis());
        assertTrue(m.massShellDriftMax() < MASS_SHELL_DRIFT);
        assertTrue(m.carterDriftMax() < CARTER_DRIFT * s.carter());
    }

    @Test
    void closedFormAgreesWithHipparchusLeastSquaresOnTheMassFunctionFamily() {
        // second route: solve R(r_p) = R(r_a) = 0 for (E, J) numerically with Hipparchus'
        // Levenberg-Marquardt optimizer on the Carter-form potential, L = J cos(iota), Q = J^2 sin^2(iota)
        MassFunctionSpacetime st = new MassFunctionSpacetime("hayward", 0.7, MassFunctions.hayward(0.6));
        double p = 9;
        double e = 0.4;
        double iota = Math.toRadians(55);
        double rp = p / (1 + e);
        double ra = p / (1 - e);
        double c = Math.cos(iota);
        double s2 = Math.sin(iota) * Math.sin(iota);
        java.util.function.BiFunction<double[], Double, Double> rr = (x, r) ->
                OrbitElements.radialPotential(st, r, x[0], c * x[1], s2 * x[1] * x[1]) / Math.pow(r, 4);
        org.hipparchus.optim.nonlinear.vector.leastsquares.MultivariateJacobianFunction model = point -> {
            double[] x = point.toArray();
            double[] v = {rr.apply(x, rp), rr.apply(x, ra)};
            double[][] jac = new double[2][2];
            for (int k = 0; k < 2; k++) {
                double h = 1e-7 * Math.max(1, Math.abs(x[k]));
                double[] xp = x.clone();
                double[] xm = x.clone();
                xp[k] += h;
                xm[k] -= h;
                jac[0][k] = (rr.apply(xp, rp) - rr.apply(xm, rp)) / (2 * h);
                jac[1][k] = (rr.apply(xp, ra) - rr.apply(xm, ra)) / (2 * h);
            }
            return new org.hipparchus.util.Pair<>(new org.hipparchus.linear.ArrayRealVector(v),
                    new org.hipparchus.linear.Array2DRowRealMatrix(jac));
        };
        var problem = new org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder()
                .start(new double[] {0.96, 3.4}).model(model).target(new double[] {0, 0})
                .maxEvaluations(10_000).maxIterations(10_000).build();
        var opt = new org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(1e-15).withParameterRelativeTolerance(1e-15).optimize(problem);
        double[] x = opt.getPoint().toArray();
        OrbitElements.Solution sol = OrbitElements.solve(st, p, e, iota);
        assertEquals(x[0], sol.energy(), LEAST_SQUARES_E);
        assertEquals(x[1] * c, sol.angularMomentum(), LEAST_SQUARES_L);
        assertEquals(s2 * x[1] * x[1], sol.carter(), LEAST_SQUARES_Q);
    }
}
