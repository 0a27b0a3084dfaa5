package org.spindrift.sim.spacetime;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.hipparchus.analysis.solvers.LaguerreSolver;
import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Landmarks against closed forms and independent solutions. Equation numbers of Bardeen, Press &amp;
 * Teukolsky 1972 (ApJ 178, 347) are recalled from memory; the formulas themselves are standard.
 */
class LandmarksTest {
    /** Landmarks are root searches converged to 1e-15 relative in r, conditioned by flat minima: 1e-10 (our choice). */
    private static final double REL = 1e-10;
    /** dE/dr at the ISCO against dE/dr at 1.2 r_isco: central differences (step 1e-4 r) leave about 1e-8 of it. */
    private static final double FLAT_AT_ISCO = 1e-5;
    /** A vertical epicyclic frequency at its root, and a sum of closed forms of order 1: about 5000 ulps. */
    private static final double ROOT_VALUE = 1e-12;

    @ParameterizedTest(name = "a = {0}")
    @ValueSource(doubles = {0.0, 0.3, 0.5, 0.7, 0.9, 0.998, 0.99999, -0.4})
    void kerrLandmarksMatchBardeenPressTeukolsky(double a) {
        checkKerr(Landmarks.of(Spacetimes.create("kerr", a, Map.of(), false)), a);
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"kerr-newman:charge", "hayward:core_length", "bardeen:core_charge", "mass-series:c3",
        "jp:epsilon3"})
    void everyFamilyHasKerrLandmarksAtZeroDeformation(String familyAndKey) {
        String[] fk = familyAndKey.split(":");
        checkKerr(Landmarks.of(Spacetimes.create(fk[0], 0.8, Map.of(fk[1], 0.0), false)), 0.8);
    }

    private static void checkKerr(Landmarks l, double a) {
        // Boyer & Lindquist 1967; BPT 1972 eq. 2.x (recalled from memory): r_+ = 1 + sqrt(1 - a^2)
        assertRel(1.0 + Math.sqrt(1.0 - a * a), l.horizonOuter(), "horizon");
        // static limit at the equator: g_tt = -(1 - 2/r) there (common practice, no source)
        assertRel(2.0, l.ergosurfaceEquator(), "ergosurface");
        for (boolean pro : new boolean[] {true, false}) {
            String s = pro ? " prograde" : " retrograde";
            assertRel(kerrIsco(a, pro), l.isco(pro), "ISCO" + s);
            assertRel(KerrCircularOrbitsTest.kerrPhotonOrbit(a, pro), l.photonOrbit(pro), "photon orbit" + s);
        }
        // BPT 1972 eq. 2.19: r_mb = 2 -+ a + 2 sqrt(1 -+ a)
        assertRel(2.0 - a + 2.0 * Math.sqrt(1.0 - a), l.marginallyBoundPrograde(), "marginally bound");
        assertTrue(Double.isNaN(l.omegaMaxRadius()), "Kerr Omega(r) grows monotonically inwards (BPT eq. 2.16)");
        // with a horizon the capture radius is the outer horizon plus the margin
        assertEquals(l.horizonOuter() + Landmarks.CAPTURE_MARGIN, l.captureRadius(), 0.0);
    }

    @Test
    void extremalKerrHorizonIsTheDoubleRoot() {
        // BPT 1972: r_+ = M at a = M
        assertRel(1.0, Landmarks.of(Spacetimes.create("kerr", 1.0, Map.of(), false)).horizonOuter(), "a = 1 horizon");
    }

    @ParameterizedTest(name = "a = {0}, Q = {1}")
    @CsvSource({"0.0, 0.5", "0.5, 0.5", "0.6, 0.79", "-0.3, 0.9"})
    void kerrNewmanHorizon(double a, double q) {
        // Newman et al. 1965, J. Math. Phys. 6, 918: r_+ = M + sqrt(M^2 - a^2 - Q^2)
        Spacetime st = Spacetimes.create("kerr-newman", a, Map.of("charge", q), false);
        assertRel(1.0 + Math.sqrt(1.0 - a * a - q * q), Horizons.outer(st), "Kerr-Newman horizon");
    }

    @ParameterizedTest(name = "l = {0}")
    @ValueSource(doubles = {0.1, 0.3, 0.5, 0.7, 0.76})
    void staticHaywardHorizonSolvesTheCubic(double core) {
        // Hayward 2006, Phys. Rev. Lett. 96, 031103: r^3 - 2 M r^2 + 2 M l^2 = 0; solved here with
        // Hipparchus' Laguerre solver (reference library), outermost real root
        Complex[] roots = new LaguerreSolver(1e-15, 1e-15).solveAllComplex(new double[] {2.0 * core * core, 0.0, -2.0, 1.0}, 1.5);
        double outer = Double.NEGATIVE_INFINITY;
        for (Complex z : roots) {
            if (Math.abs(z.getImaginary()) < 1e-9 && z.getReal() > outer) {
                outer = z.getReal();
            }
        }
        Spacetime st = Spacetimes.create("hayward", 0.0, Map.of("core_length", core), false);
        assertRel(outer, Landmarks.of(st).horizonOuter(), "Hayward horizon");
    }

    /**
     * For the mass-function family the equatorial circular-orbit condition reduces to
     * Omega = sqrt(M_eff) / (r^1.5 + a sqrt(M_eff)) with M_eff = m - r m' (derived by hand from
     * the Guerses-Guersey metric: g_tt,r = 2 mu', g_tphi,r = -2 a mu', g_phiphi,r = 2 r + 2 a^2 mu'
     * with mu = m/r; reduces to BPT 1972 eq. 2.16 for m = M; no published source used).
     */
    @ParameterizedTest(name = "{0} a={1} p={2}")
    @CsvSource({"hayward, 0.9, 1.0", "hayward, 0.4, 0.6", "bardeen, 0.7, 0.5", "kerr-newman, 0.5, 0.7"})
    void massFunctionOmegaMatchesGeneralisedKeplerLaw(String family, double a, double p) {
        String key = switch (family) {
            case "hayward" -> "core_length";
            case "bardeen" -> "core_charge";
            default -> "charge";
        };
        MassFunctionSpacetime st = (MassFunctionSpacetime) Spacetimes.create(family, a, Map.of(key, p), true);
        MassFunction m = st.massFunction();
        for (double r = 2.5; r < 60.0; r *= 1.4) {
            double meff = m.value(r) - r * m.derivative(r);
            double sq = Math.sqrt(meff);
            assertRel(sq / (Math.pow(r, 1.5) + a * sq), CircularOrbits.omega(st, r, true), "Omega prograde r=" + r);
            assertRel(-sq / (Math.pow(r, 1.5) - a * sq), CircularOrbits.omega(st, r, false), "Omega retrograde r=" + r);
        }
    }

    /**
     * Horizonless rotating Hayward object: Omega(r) has a maximum. With the law above,
     * dOmega/dr = 0 where M_eff / r^3 = (r^3 - 4 l^2) / (r^3 + 2 l^2)^2 peaks, at r^3 = 10 l^2,
     * whatever the spin (derived by hand; no published source).
     */
    @ParameterizedTest(name = "a = {0}, l = {1}")
    @CsvSource({"0.9, 1.0", "0.0, 1.0", "0.6, 2.0", "0.99, 0.9"})
    void horizonlessHaywardOmegaMaximum(double a, double core) {
        Landmarks l = Landmarks.of(Spacetimes.create("hayward", a, Map.of("core_length", core), true));
        assertFalse(l.hasHorizon());
        double r = Math.cbrt(10.0 * core * core);
        double meff = 6.0 * core * core / Math.pow(12.0 * core * core, 2) * r * r * r;
        double omega = Math.sqrt(meff) / (Math.pow(r, 1.5) + a * Math.sqrt(meff));
        assertRel(r, l.omegaMaxRadius(), "Omega maximum radius");
        assertRel(omega, l.omegaMaxValue(), "Omega maximum value");
        // the surface lies inside every landmark
        assertTrue(l.captureRadius() < l.omegaMaxRadius());
        assertTrue(l.captureRadius() >= Landmarks.MIN_SURFACE);
        assertEquals(l.captureRadius(), Landmarks.captureRadius(Spacetimes.create("hayward", a,
                Map.of("core_length", core), true)), 0.0);
    }

    @ParameterizedTest(name = "{0} a={1} {2}={3}")
    @CsvSource({"hayward, 0.5, core_length, 0.5", "bardeen, 0.6, core_charge, 0.4", "jp, 0.5, epsilon3, 1.0",
        "jp, 0.7, epsilon3, -1.0", "mass-series, 0.3, c2, 0.4"})
    void iscoIsWhereEnergyIsStationary(String family, double a, String key, double p) {
        Spacetime st = Spacetimes.create(family, a, Map.of(key, p), false);
        Landmarks l = Landmarks.of(st);
        for (boolean pro : new boolean[] {true, false}) {
            double r = l.isco(pro);
            assertFalse(Double.isNaN(r), family + " ISCO");
            // BPT 1972 sec. II: marginal stability where dE/dr = 0, E minimal; central differences
            double h = 1e-4 * r;
            double slope = (CircularOrbits.energy(st, r + h, pro) - CircularOrbits.energy(st, r - h, pro)) / (2 * h);
            double slopeOut = (CircularOrbits.energy(st, 1.2 * r + h, pro) - CircularOrbits.energy(st, 1.2 * r - h, pro))
                    / (2 * h);
            assertTrue(Math.abs(slope) < FLAT_AT_ISCO * Math.abs(slopeOut),
                    family + " dE/dr at ISCO " + slope + " vs " + slopeOut);
            assertTrue(CircularOrbits.verticalEpicyclicSquared(st, r, pro) > 0.0);
            // photon orbit: E diverges there (BPT 1972 eq. 2.18 discussion)
            double ph = l.photonOrbit(pro);
            assertTrue(ph < r);
            assertTrue(CircularOrbits.energy(st, ph * (1 + 1e-7), pro) > 100.0, family + " E near photon orbit");
        }
        double mb = l.marginallyBoundPrograde();
        assertRel(1.0, CircularOrbits.energy(st, mb, true), family + " E = 1 at the marginally bound orbit");
    }

    @Test
    void jpAtHighSpinTurnsVerticallyUnstableFirst() {
        // Johannsen & Psaltis 2011 (recalled from memory): for epsilon3 > 0 the vertical instability sets the ISCO
        Spacetime st = Spacetimes.create("jp", 0.9, Map.of("epsilon3", 2.0), true);
        Landmarks l = Landmarks.of(st);
        double r = l.isco(true);
        assertEquals(0.0, CircularOrbits.verticalEpicyclicSquared(st, r, true), ROOT_VALUE);
        assertTrue(CircularOrbits.radialEpicyclicSquared(st, r, true) > 0.0);
        assertTrue(CircularOrbits.verticalEpicyclicSquared(st, 1.01 * r, true) > 0.0);
        assertTrue(CircularOrbits.verticalEpicyclicSquared(st, 0.99 * r, true) < 0.0);
        assertFalse(l.hasHorizon(), "the surface g^rr = 0 does not close for this epsilon3");
        assertTrue(l.captureRadius() < r);
    }

    @Test
    void jsonKeysAreTheDocumentedOnes() {
        Map<String, Double> m = Landmarks.of(Spacetimes.create("kerr", 0.9, Map.of(), false)).toMap();
        assertEquals(List.of("horizon_outer", "ergosurface_equator", "isco_prograde", "isco_retrograde",
                "photon_orbit_prograde", "photon_orbit_retrograde", "marginally_bound_prograde", "omega_max_radius",
                "omega_max_value", "capture_radius"), List.copyOf(m.keySet()));
        assertNull(m.get("omega_max_radius"));
        // Kerr a = 0.9: horizon 1 + sqrt(1 - 0.81) (Boyer & Lindquist 1967) + 0.01 M
        assertEquals(1.0 + Math.sqrt(0.19) + 0.01, m.get("capture_radius"), ROOT_VALUE);
    }

    /** BPT 1972 eq. 2.21 (written for a >= 0: upper sign for orbits co-rotating with the hole). */
    static double kerrIsco(double a, boolean pro) {
        double z1 = 1.0 + Math.cbrt(1.0 - a * a) * (Math.cbrt(1.0 + a) + Math.cbrt(1.0 - a));
        double z2 = Math.sqrt(3.0 * a * a + z1 * z1);
        boolean coRotating = pro == (a >= 0.0);
        return 3.0 + z2 + (coRotating ? -1.0 : 1.0) * Math.sqrt((3.0 - z1) * (3.0 + z1 + 2.0 * z2));
    }

    private static void assertRel(double expected, double actual, String what) {
        assertEquals(expected, actual, REL * Math.abs(expected), what);
    }
}
