package org.spindrift.sim.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.analysis.OrbitPlot;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.EndState;
import org.spindrift.sim.motion.MinoFrequencies;
import org.spindrift.sim.motion.OrbitElements;
import org.spindrift.sim.motion.OrbitMeasurement;
import org.spindrift.sim.motion.OrbitSetup;
import org.spindrift.sim.motion.Predictions;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code spindrift orbit}: one bound orbit from elements, measured periods and periastron advance. */
@Command(name = "orbit", mixinStandardHelpOptions = true,
        description = {
            "Integrate one bound test-mass orbit given by its elements and measure, from the trajectory, its"
                    + " radial, azimuthal and polar periods and its periastron advance; compare with the"
                    + " post-Newtonian predictions.",
            "The orbit starts at periapsis r_p = p/(1+e) on the equator; the apoapsis is r_a = p/(1-e).",
            "The inclination iota is defined by cos(iota) = L / sqrt(L^2 + Q), with L the axial angular"
                    + " momentum and Q the Carter constant; iota > 90 deg is retrograde.",
            "Times are coordinate time in M, angles in radians; periods are positive and the periastron"
                    + " advance is counted in the sense of the orbital motion (also for retrograde orbits). A"
                    + " circular orbit (--e 0) has no periapsis: period_radial and periastron_advance are null;"
                    + " near-circular orbits (e < 1e-3) give ill-conditioned periapsis times.",
            "Beside each measured mean: its uncertainty, a conservative estimate (the difference from the same"
                    + " windowed mean over the first half of the orbits, plus the difference from a second"
                    + " integration at 10 times the tolerance; inclined orbits need a few hundred orbits for"
                    + " 1e-8), and the exact value from quadrature of the separated radial and polar motions in"
                    + " Mino time."})
public final class OrbitCommand implements Callable<Integer> {
    @Mixin
    SpacetimeOptions spacetime;

    @Option(names = "--p", paramLabel = "P", required = true, description = "Semi-latus rectum p in M.")
    double p;

    @Option(names = "--e", paramLabel = "E", required = true, description = "Eccentricity e, 0 <= e < 1.")
    double e;

    @Option(names = "--inclination-deg", paramLabel = "DEG", defaultValue = "0",
            description = "Inclination iota in degrees, 0..180, cos(iota) = L / sqrt(L^2 + Q) (default: ${DEFAULT-VALUE}).")
    double inclinationDeg;

    @Option(names = "--retrograde", description = "Retrograde orbit: use 180 deg - iota.")
    boolean retrograde;

    @Option(names = "--orbits", paramLabel = "N", defaultValue = "20",
            description = "Radial periods to integrate and average over, 1..100000 (default: ${DEFAULT-VALUE}).")
    int orbits;

    @Option(names = "--tolerance", paramLabel = "TOL", defaultValue = "1e-12",
            description = "Absolute and relative tolerance of the integrator, 1e-15..1e-3 (default: ${DEFAULT-VALUE}).")
    double tolerance;

    @Option(names = "--json", description = "Print the results as JSON.")
    boolean json;

    @Option(names = "--plot", paramLabel = "FILE.png", description = "Draw the orbit in its plane, periapses marked.")
    Path plot;

    @Override public Integer call() throws IOException {
        if (orbits < 1 || orbits > 100_000) {
            throw new UserInputException("--orbits must be in 1..100000, got " + orbits);
        }
        if (!(tolerance >= 1e-15 && tolerance <= 1e-3)) {
            throw new UserInputException("--tolerance must be in 1e-15..1e-3, got " + tolerance);
        }
        if (!(inclinationDeg >= 0 && inclinationDeg <= 180)) {
            throw new UserInputException("--inclination-deg must be in [0, 180], got " + inclinationDeg);
        }
        if (plot != null && !plot.toString().toLowerCase(Locale.ROOT).endsWith(".png")) {
            throw new UserInputException("--plot must name a .png file, got " + plot);
        }
        if (!(p > 0 && p <= 1e6)) {
            throw new UserInputException("--p must be in (0, 1e6] M, got " + p);
        }
        Spacetime st = spacetime.build();
        double iotaDeg = retrograde ? 180.0 - inclinationDeg : inclinationDeg;
        double iota = FastMath.toRadians(iotaDeg);
        OrbitElements.Solution sol = OrbitSetup.elements(st, p, e, iota);
        BatchIntegrator.Config cfg = BatchIntegrator.Config.of(Landmarks.captureRadius(st))
                .withTolerance(tolerance, tolerance).withEscapeRadius(FastMath.max(1e4, 10 * sol.apoapsis()));
        OrbitMeasurement.Result m = OrbitMeasurement.measure(st, sol.start(), orbits, cfg, 200,
                OrbitMeasurement.keplerPeriod(p, e), e == 0.0);
        if (m.orbits() < orbits) {
            System.err.println("orbit: the trajectory ended (" + m.endState().name().toLowerCase(Locale.ROOT)
                    + ") after " + m.orbits() + " of " + orbits + " radial periods");
            return 1;
        }
        boolean equatorial = sol.equatorial();
        boolean prograde = sol.angularMomentum() > 0;
        // exact values: orbit elements exist only for separable (mass-function) spacetimes
        MinoFrequencies.Result x = MinoFrequencies.compute((MassFunctionSpacetime) st, sol);
        // uncertainty = window part (full vs half the orbits) + integration part (10 x looser tolerance)
        double looser = FastMath.min(1e-3, 10 * tolerance);
        OrbitMeasurement.Result m10 = OrbitMeasurement.measure(st, sol.start(), orbits,
                cfg.withTolerance(looser, looser), 2, OrbitMeasurement.keplerPeriod(p, e), e == 0.0);
        OrbitMeasurement.Uncertainty w = m.uncertainty();
        OrbitMeasurement.Uncertainty u = new OrbitMeasurement.Uncertainty(
                w.periodRadial() + FastMath.abs(m.periodRadial() - m10.periodRadial()),
                w.periodAzimuthal() + FastMath.abs(m.periodAzimuthal() - m10.periodAzimuthal()),
                w.periodPolar() + FastMath.abs(m.periodPolar() - m10.periodPolar()),
                w.advance() + FastMath.abs(m.advance() - m10.advance()));
        Map<String, Object> out = new LinkedHashMap<>();
        out.put("energy", sol.energy());
        out.put("angular_momentum", sol.angularMomentum());
        out.put("carter", st.separable() ? sol.carter() : null);
        out.put("period_radial", finite(m.periodRadial()));
        out.put("period_azimuthal", finite(m.periodAzimuthal()));
        out.put("period_polar", equatorial ? null : finite(m.periodPolar()));
        out.put("periastron_advance", finite(m.advance()));
        out.put("period_radial_uncertainty", finite(u.periodRadial()));
        out.put("period_azimuthal_uncertainty", finite(u.periodAzimuthal()));
        out.put("period_polar_uncertainty", equatorial ? null : finite(u.periodPolar()));
        out.put("periastron_advance_uncertainty", finite(u.advance()));
        out.put("period_radial_exact", finite(x.periodRadial()));
        out.put("period_azimuthal_exact", finite(x.periodAzimuthal()));
        out.put("period_polar_exact", equatorial ? null : finite(x.periodPolar()));
        out.put("periastron_advance_exact", finite(x.advance()));
        out.put("mass_shell_drift_max", m.massShellDriftMax());
        out.put("carter_drift_max", finite(m.carterDriftMax()));
        out.put("advance_1pn", Predictions.advance1pn(p));
        out.put("advance_2pn", Predictions.advance2pn(p, e));
        out.put("advance_spin", equatorial ? Predictions.advanceSpin(st.spin(), p, prograde) : null);
        if (plot != null) {
            OrbitPlot.write(st, sol, m, plot, String.format(Locale.ROOT, "%s a=%s p=%s e=%s iota=%s deg", st.family(),
                    st.spin(), p, e, iotaDeg));
        }
        if (json) {
            ObjectMapper om = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            System.out.println(om.writeValueAsString(out));
        } else {
            System.out.printf(Locale.ROOT, "%-22s %s%n", "energy", sol.energy());
            System.out.printf(Locale.ROOT, "%-22s %s%n", "angular_momentum", sol.angularMomentum());
            System.out.printf(Locale.ROOT, "%-22s %s%n%n", "carter", sol.carter());
            System.out.printf(Locale.ROOT, "%-26s %-22s %-11s %-22s %s%n", "quantity (over " + m.orbits() + " orbits)",
                    "measured", "uncertainty", "exact (Mino quadrature)", "measured - exact");
            row("period_radial (M)", m.periodRadial(), u.periodRadial(), x.periodRadial());
            row("period_azimuthal (M)", m.periodAzimuthal(), u.periodAzimuthal(), x.periodAzimuthal());
            if (!equatorial) {
                row("period_polar (M)", m.periodPolar(), u.periodPolar(), x.periodPolar());
            }
            row("periastron_advance (rad)", m.advance(), u.advance(), x.advance());
            System.out.println();
            for (String k : new String[] {"mass_shell_drift_max", "carter_drift_max", "advance_1pn", "advance_2pn",
                "advance_spin"}) {
                Object v = out.get(k);
                System.out.printf(Locale.ROOT, "%-22s %s%n", k, v == null ? "-" : v);
            }
        }
        return 0;
    }

    private static void row(String name, double measured, double uncertainty, double exact) {
        System.out.printf(Locale.ROOT, "%-26s %-22s %-11s %-22s %s%n", name, num(measured),
                Double.isFinite(uncertainty) ? String.format(Locale.ROOT, "%.2e", uncertainty) : "-", num(exact),
                Double.isFinite(measured) && Double.isFinite(exact)
                        ? String.format(Locale.ROOT, "%.2e", measured - exact) : "-");
    }

    private static String num(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "-";
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
