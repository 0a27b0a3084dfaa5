package org.spindrift.sim.scenario;

import java.util.List;
import java.util.Map;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.scenario.BlackHole;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.shared.scenario.SourceShape;
import org.spindrift.sim.motion.OrbitSetup;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Horizons;
import org.spindrift.sim.spacetime.Spacetime;
import org.spindrift.sim.spacetime.Spacetimes;

/**
 * Checks of a scenario that need the metric, run by {@code check} and before {@code run} writes
 * anything: family, spin and parameter ranges (through {@link Spacetimes#create}), and that
 * every source's centre orbit exists (circular orbits outside the photon orbit, start points
 * outside the horizon). Messages name file, line and key path.
 */
public final class ScenarioChecks {
    private ScenarioChecks() {
    }

    /** @return the scenario's spacetime, or a user-input error naming the offending key */
    public static Spacetime spacetime(LoadedScenario ls) {
        BlackHole b = ls.scenario().blackHole();
        final String[] first = new String[1];
        try {
            return Spacetimes.create(b.family(), b.spin(), b.parameters(), b.allowHorizonless(), key -> {
                String path = switch (key) {
                    case Spacetimes.FAMILY -> "black_hole.family";
                    case Spacetimes.SPIN -> "black_hole.spin";
                    case Spacetimes.ALLOW_HORIZONLESS -> "black_hole.allow_horizonless";
                    case Spacetimes.SERIES -> "black_hole.parameters";
                    default -> "black_hole.parameters." + key;
                };
                if (first[0] == null) {
                    first[0] = path;
                }
                return path;
            });
        } catch (UserInputException e) {
            String path = first[0] == null ? "black_hole" : first[0];
            int line = ls.line(path);
            String where = line > 0 ? ls.file() + ":" + line : ls.file().toString();
            throw new UserInputException(where + ": " + e.getMessage(), e);
        }
    }

    /** Checks every source's orbit against the metric. */
    public static void checkSources(LoadedScenario ls, Spacetime st, double captureRadius) {
        Scenario sc = ls.scenario();
        List<Source> sources = sc.sources();
        for (int i = 0; i < sources.size(); i++) {
            Source s = sources.get(i);
            String base = "sources[" + i + "].orbit";
            CentreOrbit o = s.orbit();
            if (o instanceof CentreOrbit.Circular c) {
                boolean pro = c.sense() == org.spindrift.shared.scenario.Sense.PROGRADE;
                String key = base + ".circular.radius_M";
                double[] radii = {c.radiusM()};
                if (s.shape() instanceof SourceShape.Ring ring) {
                    // every member is on its own circular orbit: check across the ring
                    key = "sources[" + i + "].shape.inner_radius_M";
                    radii = new double[9];
                    for (int k = 0; k < radii.length; k++) {
                        radii[k] = ring.innerRadiusM() + (ring.outerRadiusM() - ring.innerRadiusM()) * k / (radii.length - 1);
                    }
                }
                for (double rTest : radii) {
                    if (rTest <= captureRadius) {
                        throw ls.error(key, "radius " + fmt(rTest) + " M is inside the capture radius " + fmt(captureRadius)
                                + " M (horizon or surface)");
                    }
                    if (!Double.isFinite(CircularOrbits.ut(st, rTest, pro))) {
                        throw ls.error(key, "there is no " + c.sense().name().toLowerCase(java.util.Locale.ROOT)
                                + " circular orbit at r = " + fmt(rTest)
                                + " M in this spacetime (circular orbits exist only outside the photon orbit)");
                    }
                }
            } else if (o instanceof CentreOrbit.Elements e) {
                if (e.periapsisM() <= captureRadius) {
                    throw ls.error(base + ".elements.p_M", "periapsis p/(1+e) = " + fmt(e.periapsisM())
                            + " M is inside the capture radius " + fmt(captureRadius) + " M");
                }
                double inc = Math.toRadians(e.inclinationDeg());
                try {
                    OrbitSetup.elements(st, e.semiLatusRectumM(), e.eccentricity(),
                            e.sense() == org.spindrift.shared.scenario.Sense.RETROGRADE ? Math.PI - inc : inc);
                } catch (UserInputException ex) {
                    String msg = ex.getMessage().replace("--p ", "p_M = ").replace("--e ", "e = ")
                            .replace("(--p, --e)", "(orbit.elements)").replace("--inclination-deg", "inclination_deg");
                    throw ls.error(base + ".elements.p_M", msg);
                }
            } else if (o instanceof CentreOrbit.ZamoVelocity l) {
                if (l.radiusM() <= captureRadius) {
                    throw ls.error(base + ".zamo_velocity.r_M", "r = " + l.radiusM() + " M is inside the capture radius "
                            + fmt(captureRadius) + " M");
                }
            }
        }
    }

    static String fmt(double v) {
        return String.format(java.util.Locale.ROOT, "%.4g", v);
    }
}
