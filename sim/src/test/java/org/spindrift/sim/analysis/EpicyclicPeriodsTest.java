package org.spindrift.sim.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.pipeline.AnalysisStage;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.run.TestScenarios;
import org.spindrift.sim.scenario.LoadedScenario;

/**
 * A small hot spot with a rigid start: its members are on slightly eccentric orbits about
 * r = 10 M, so their radial periods and periastron advance are the epicyclic ones of the
 * circular orbit there, read from the run's summary.json.
 */
class EpicyclicPeriodsTest {
    @TempDir Path tmp;

    @Test void hotSpotRadialPeriodAndAdvanceAreEpicyclic() throws Exception {
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
        Path out = ScenarioRun.run(ScenarioRun.prepare(ls), new ScenarioRun.Options(tmp.resolve("epi"), 2, false),
                List.of(new AnalysisStage())).folder();
        JsonNode src = new ObjectMapper().readTree(out.resolve(ArchiveLayout.SUMMARY).toFile()).path("sources").get(0);
        JsonNode radial = src.path("periods").path("radial");
        assertTrue(radial.path("measured").asInt() > 100, radial.toString());
        // members sit within about 0.15 M of r = 10 M: their epicyclic periods differ by well under 1 %
        assertEquals(tr, radial.path("median_M").asDouble(), 0.01 * tr, "radial period");
        assertEquals(tr, radial.path("predicted_M").asDouble(), 1e-6 * tr, "prediction from the landmarks' Omega_r");
        JsonNode adv = src.path("periods").path("periastron_advance_deg");
        assertEquals(advanceDeg, adv.path("median").asDouble(), 0.03 * advanceDeg, "periastron advance per radial period");
        assertEquals(advanceDeg, adv.path("predicted").asDouble(), 1e-6 * advanceDeg);
        JsonNode az = src.path("periods").path("azimuthal");
        assertEquals(2 * Math.PI / om, az.path("median_M").asDouble(), 0.02 * 2 * Math.PI / om, "azimuthal period");
    }
}
