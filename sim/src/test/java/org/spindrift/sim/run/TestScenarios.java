package org.spindrift.sim.run;

import java.util.List;
import java.util.Map;
import org.spindrift.shared.scenario.BlackHole;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Emission;
import org.spindrift.shared.scenario.Flare;
import org.spindrift.shared.scenario.Imaging;
import org.spindrift.shared.scenario.Observer;
import org.spindrift.shared.scenario.RunSettings;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Sense;
import org.spindrift.shared.scenario.Source;
import org.spindrift.shared.scenario.SourceShape;
import org.spindrift.shared.scenario.TimeSpan;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.scenario.LoadedScenario;

/** Small scenarios built in code for the tests (tiny particle counts, short durations). */
public final class TestScenarios {
    private TestScenarios() {
    }

    /** Obviously synthetic round values for every test: 1e6 solar masses at 1 kpc (= 1e-3 Mpc). */
    public static final double MASS_SOLAR = 1.0e6;
    /** 1 kpc in Mpc. */
    public static final double DISTANCE_MPC = 1.0e-3;

    public static BlackHole kerr(double a) {
        return new BlackHole(MASS_SOLAR, DISTANCE_MPC, "kerr", a, Map.of(), false);
    }

    public static BlackHole horizonlessHayward(double a, double l) {
        return new BlackHole(MASS_SOLAR, DISTANCE_MPC, "hayward", a, Map.of("core_length", l), true);
    }

    /** A ring on circular orbits between inner and outer (shear model: each member on its own circular orbit). */
    public static Source ring(int n, double inner, double outer, double arcDeg) {
        return new Source("ring", Source.Kind.RING, n, new SourceShape.Ring(inner, outer, arcDeg),
                new CentreOrbit.Circular(0.5 * (inner + outer), Sense.PROGRADE, 0.0),
                new VelocityModel(VelocityModel.Kind.SHEAR, 0.0), new Emission(1.0, 0.0, new Flare.Constant()));
    }

    public static Source hotSpot(int n, double r, double sigma, VelocityModel v) {
        return new Source("spot", Source.Kind.HOT_SPOT, n, new SourceShape.Ball(sigma),
                new CentreOrbit.Circular(r, Sense.PROGRADE, 0.0), v,
                new Emission(2.0, 1.0, new Flare.Gaussian(TimeSpan.geometric(20), TimeSpan.geometric(10))));
    }

    /** A scenario with a coarse camera (16 x 16 pixels) so that the light stage stays cheap in tests. */
    public static LoadedScenario scenario(BlackHole bh, List<Source> sources, double durationM, double cadenceM,
            long seed, int subsample) {
        Scenario sc = new Scenario("test", "test scenario", bh, new Observer(60, 0), sources,
                new RunSettings(TimeSpan.geometric(durationM), TimeSpan.geometric(cadenceM), seed, 1e-10, subsample),
                new Imaging(20, 16, null, true), null);
        return LoadedScenario.of(sc, "test.yaml");
    }
}
