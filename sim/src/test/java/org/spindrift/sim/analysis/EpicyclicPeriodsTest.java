package org.spindrift.sim.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.run.Evolution;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.run.TestScenarios;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.SourceSetup;

/**
 * A small hot spot with a rigid start: its members are on slightly eccentric orbits about
 * r = 10 M, so their radial periods and periastron advance are the epicyclic ones of the
 * circular orbit there. The particles are evolved in memory (no run folder) and analysed with
 * the turning points the integrator found.
 */
class EpicyclicPeriodsTest {
    /** Members within about 0.15 M of r = 10 M: their epicyclic periods differ by well under 1 %. */
    static final double SPREAD_REL = 0.01;
    /** Periastron advance is a small difference of two periods: three times the period spread. */
    static final double ADVANCE_REL = 0.03;
    /** Azimuthal periods from turning points, a ball of 0.15 M: 2 %. */
    static final double AZIMUTHAL_REL = 0.02;
    /** A closed form against the landmarks' root-polished frequencies. */
    static final double CLOSED_FORM_REL = 1e-6;

    @Test void hotSpotRadialPeriodAndAdvanceAreEpicyclic() {
        double a = 0.5;
        double r = 10.0;
        // Kerr prograde: Omega = 1/(r^1.5 + a) (BPT 1972 eq. 2.16) and the radial epicyclic frequency
        // Omega_r = Omega sqrt(1 - 6/r + 8 a r^-1.5 - 3 a^2/r^2) (Okazaki, Kato & Fukue 1987, PASJ 39, 457;
        // formula recalled from memory)
        double om = 1.0 / (Math.pow(r, 1.5) + a);
        double kr = om * Math.sqrt(1 - 6 / r + 8 * a / Math.pow(r, 1.5) - 3 * a * a / (r * r));
        double tr = 2 * Math.PI / kr;
        double advanceDeg = Math.toDegrees(2 * Math.PI * (om / kr - 1));
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(a),
                List.of(TestScenarios.hotSpot(120, r, 0.15, VelocityModel.rigid())), 4.5 * tr, tr / 40, 21, 0);
        ScenarioRun.Prepared p = ScenarioRun.prepare(ls);
        Evolution.Evolved e = Evolution.inMemory(p, 2);
        AnalysisResult res = AnalysisResult.of(e.history(), e.turningPoints(), p.placed().firstIndex());
        ParticlePeriods per = res.periods();
        double[] radial = Stats.medianHalfRange(per.periodR(), per.periodR().length);
        assertTrue(radial[2] > 100, "radial periods measured: " + radial[2]);
        // members sit within about 0.15 M of r = 10 M: their epicyclic periods differ by well under 1 %
        assertEquals(tr, radial[0], SPREAD_REL * tr, "radial period");
        SourceSetup.Prediction pred = p.placed().centres()[0].prediction();
        assertEquals(tr, pred.radial(), CLOSED_FORM_REL * tr, "prediction from the landmarks' Omega_r");
        double[] adv = per.advance().clone();
        for (int i = 0; i < adv.length; i++) {
            adv[i] = Math.toDegrees(adv[i]);
        }
        double[] advance = Stats.medianHalfRange(adv, adv.length);
        assertEquals(advanceDeg, advance[0], ADVANCE_REL * advanceDeg, "periastron advance per radial period");
        assertEquals(advanceDeg, Math.toDegrees(pred.advance()), CLOSED_FORM_REL * advanceDeg);
        double[] az = Stats.medianHalfRange(per.periodPhi(), per.periodPhi().length);
        assertEquals(2 * Math.PI / om, az[0], AZIMUTHAL_REL * 2 * Math.PI / om, "azimuthal period");
    }
}
