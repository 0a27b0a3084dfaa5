package org.spindrift.sim.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.Coordinates;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.ZamoFrame;
import org.spindrift.sim.run.TestScenarios;
import org.spindrift.sim.spacetime.Spacetime;

/** Initial conditions of the sources. */
class SourceSetupTest {
    static SourceSetup.Placed place(LoadedScenario ls) {
        Spacetime st = ScenarioChecks.spacetime(ls);
        return SourceSetup.place(ls.scenario(), st, 2.0);
    }

    @Test void membersAreNormalisedTestMassesWithTheGivenSpread() {
        double sigma = 0.5;
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(0.7),
                List.of(TestScenarios.hotSpot(4000, 8.0, sigma, new VelocityModel(VelocityModel.Kind.THERMAL, 0.03))),
                10, 5, 17, 0);
        Spacetime st = ScenarioChecks.spacetime(ls);
        SourceSetup.Placed p = SourceSetup.place(ls.scenario(), st, 2.0);
        ParticleBatch b = p.batch();
        GeodesicEquations eq = new GeodesicEquations(st);
        double[] c = new double[3];
        Coordinates.cartesian(8.0, 0.5 * Math.PI, 0.0, 0.7, c);
        double[] xyz = new double[3];
        double[] sum2 = new double[3];
        double[] v = new double[3];
        double[] vc = p.centres()[0].velocity();
        double dv2 = 0;
        ZamoFrame zamo = new ZamoFrame(st);
        for (int i = 0; i < b.size(); i++) {
            // g^{mu nu} p_mu p_nu = -1: H = -1/2 (unit rest mass; MTW 1973 eq. 25.19)
            double h = eq.hamiltonian(b.r(i), b.theta(i), b.pT(i), b.pPhi(i), b.pR(i), b.pTheta(i));
            assertEquals(-0.5, h, 1e-12, "particle " + i);
            Coordinates.cartesian(b.r(i), b.theta(i), b.phi(i), 0.7, xyz);
            for (int k = 0; k < 3; k++) {
                sum2[k] += (xyz[k] - c[k]) * (xyz[k] - c[k]);
            }
            zamo.localVelocity(b.r(i), b.theta(i), b.pT(i), b.pR(i), b.pTheta(i), b.pPhi(i), v);
            dv2 += (v[0] - vc[0]) * (v[0] - vc[0]) + (v[1] - vc[1]) * (v[1] - vc[1]);
        }
        // sample standard deviation of a Gaussian: relative standard error 1/sqrt(2N) ~ 1.1 % for N = 4000
        for (int k = 0; k < 3; k++) {
            assertEquals(sigma, Math.sqrt(sum2[k] / b.size()), 0.05 * sigma, "spread along axis " + k);
        }
        // thermal dispersion in the (r, theta) directions, where the boost by the azimuthal bulk
        // velocity leaves the components nearly unchanged: ~ sigma_v / gamma_bulk
        double gamma = 1 / Math.sqrt(1 - vc[2] * vc[2]);
        assertEquals(0.03 / gamma, Math.sqrt(dv2 / (2 * b.size())), 0.1 * 0.03);
    }

    @Test void theSeedFixesTheDraws() {
        LoadedScenario a = TestScenarios.scenario(TestScenarios.kerr(0.2),
                List.of(TestScenarios.hotSpot(50, 9.0, 0.4, VelocityModel.rigid()), TestScenarios.ring(30, 8, 10, 20)),
                10, 5, 1234, 0);
        assertTrue(place(a).batch().bitwiseEquals(place(a).batch()));
        LoadedScenario b = a.with(a.scenario().withRun(a.scenario().run().withSeed(1235)));
        assertFalse(place(a).batch().bitwiseEquals(place(b).batch()));
    }

    @Test void ringMembersStartOnTheirOwnCircularOrbits() {
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(0.9), List.of(TestScenarios.ring(40, 6, 9, 30)),
                10, 5, 1, 0);
        SourceSetup.Placed p = place(ls);
        for (int i = 0; i < 40; i++) {
            double r = p.batch().r(i);
            assertTrue(r >= 6 && r <= 9);
            assertEquals(0.5 * Math.PI, p.batch().theta(i), 0.0);
            assertTrue(Math.abs(p.batch().phi(i)) <= Math.toRadians(15) + 1e-12);
            // Kerr prograde circular orbit, L / E at r: BPT 1972 eqs. 2.12-2.13
            double a = 0.9;
            double den = Math.sqrt(1 - 3 / r + 2 * a / Math.pow(r, 1.5));
            double e = (1 - 2 / r + a / Math.pow(r, 1.5)) / den;
            double l = Math.sqrt(r) * (1 - 2 * a / Math.pow(r, 1.5) + a * a / (r * r)) / den;
            assertEquals(-e, p.batch().pT(i), 1e-12);
            assertEquals(l, p.batch().pPhi(i), 1e-11);
            assertEquals(0.0, p.batch().pR(i), 1e-12);
        }
    }
}
