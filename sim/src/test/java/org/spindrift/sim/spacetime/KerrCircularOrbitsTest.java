package org.spindrift.sim.spacetime;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Circular equatorial orbits of Kerr against the closed forms of Bardeen, Press &amp; Teukolsky 1972
 * (ApJ 178, 347; equation numbers recalled from memory) and the Kerr epicyclic frequencies of
 * Okazaki, Kato &amp; Fukue 1987 (PASJ 39, 457) and Kato 1990 (PASJ 42, 99), recalled from memory.
 * Upper signs prograde, lower retrograde.
 */
class KerrCircularOrbitsTest {
    /** The shear r dOmega/dr is a derivative of the metric data: one digit less than REL (our choice). */
    private static final double SHEAR_REL = 1e-9;
    /**
     * Circular-orbit quantities from the metric code against the closed forms: a quadratic's root and
     * square roots, about 1e-13 relative even at 1.1 x the photon orbit (our choice: 1e-10).
     */
    private static final double REL = 1e-10;

    @ParameterizedTest(name = "a = {0}")
    @ValueSource(doubles = {0.0, 0.3, 0.7, 0.9, 0.998, -0.6})
    void omegaEnergyAngularMomentumMatchBardeenPressTeukolsky(double a) {
        Spacetime st = Spacetimes.create("kerr", a, Map.of(), false);
        for (boolean pro : new boolean[] {true, false}) {
            double sg = pro ? 1.0 : -1.0;
            double rStart = kerrPhotonOrbit(a, pro) * 1.05;
            for (double r = rStart; r < 200.0; r *= 1.37) {
                double sr = Math.sqrt(r);
                double r15 = r * sr;
                // BPT 1972 eq. 2.16: Omega = +-1/(r^3/2 +- a)
                double omega = sg / (r15 + sg * a);
                // BPT 1972 eq. 2.12 and 2.13
                double den = Math.pow(r, 0.75) * Math.sqrt(r15 - 3.0 * sr + sg * 2.0 * a);
                double e = (r15 - 2.0 * sr + sg * a) / den;
                double l = sg * (r * r - sg * 2.0 * a * sr + a * a) / den;
                String at = "a=" + a + " r=" + r + (pro ? " prograde" : " retrograde");
                assertEquals(omega, CircularOrbits.omega(st, r, pro), REL * Math.abs(omega), "Omega " + at);
                assertEquals(e, CircularOrbits.energy(st, r, pro), REL * Math.abs(e), "E " + at);
                assertEquals(l, CircularOrbits.angularMomentum(st, r, pro), REL * Math.abs(l), "L " + at);
                // shear r dOmega/dr, differentiating eq. 2.16: -+(3/2) r^3/2 / (r^3/2 +- a)^2
                double shear = -1.5 * r15 * sg / ((r15 + sg * a) * (r15 + sg * a));
                assertEquals(shear, CircularOrbits.shearRate(st, r, pro), SHEAR_REL * Math.abs(shear), "shear " + at);
            }
        }
    }

    @ParameterizedTest(name = "a = {0}")
    @ValueSource(doubles = {0.0, 0.5, 0.9, -0.3})
    void epicyclicFrequenciesMatchKatoClosedForms(double a) {
        Spacetime st = Spacetimes.create("kerr", a, Map.of(), false);
        for (boolean pro : new boolean[] {true, false}) {
            double sg = pro ? 1.0 : -1.0;
            for (double r = kerrPhotonOrbit(a, pro) * 1.1; r < 100.0; r *= 1.29) {
                double r15 = Math.pow(r, 1.5);
                double om2 = 1.0 / ((r15 + sg * a) * (r15 + sg * a));
                // Okazaki, Kato & Fukue 1987; Kato 1990: kappa^2 = Omega^2 (1 - 6/r +- 8a r^-3/2 - 3a^2/r^2)
                double kr2 = om2 * (1.0 - 6.0 / r + sg * 8.0 * a / r15 - 3.0 * a * a / (r * r));
                // Omega_theta^2 = Omega^2 (1 -+ 4a r^-3/2 + 3a^2/r^2)
                double kt2 = om2 * (1.0 - sg * 4.0 * a / r15 + 3.0 * a * a / (r * r));
                String at = "a=" + a + " r=" + r + (pro ? " prograde" : " retrograde");
                // scale: Omega^2, because kappa^2 passes through zero at the ISCO
                assertEquals(kr2, CircularOrbits.radialEpicyclicSquared(st, r, pro), REL * om2, "Omega_r^2 " + at);
                assertEquals(kt2, CircularOrbits.verticalEpicyclicSquared(st, r, pro), REL * om2, "Omega_th^2 " + at);
            }
        }
    }

    /** BPT 1972 eq. 2.18: r_ph = 2 (1 + cos(2/3 arccos(-+a))). */
    static double kerrPhotonOrbit(double a, boolean pro) {
        return 2.0 * (1.0 + Math.cos(2.0 / 3.0 * Math.acos(pro ? -a : a)));
    }
}
