package org.spindrift.sim.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.analysis.LandmarksPlot;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code spindrift landmarks}: horizon, ISCO, photon orbits, Omega maximum ... of one spacetime. */
@Command(name = "landmarks", mixinStandardHelpOptions = true,
        description = {
            "Landmarks of a spacetime: outer horizon, equatorial ergosurface, ISCO and circular photon orbit in"
                    + " both senses, prograde marginally bound orbit, the maximum of the prograde Omega(r) where"
                    + " one exists, and for horizonless objects the surface radius where particles and rays are"
                    + " stopped.",
            "Radii in M, frequencies (angular, coordinate time) in 1/M; absent landmarks print as '-' (null in"
                    + " JSON). Prograde orbits move towards +phi (Omega > 0); a negative --spin turns the hole"
                    + " against them."})
public final class LandmarksCommand implements Callable<Integer> {
    @Mixin
    SpacetimeOptions spacetime;

    @Option(names = "--json", description = "Print the landmarks as one JSON object.")
    boolean json;

    @Option(names = "--at", paramLabel = "R", split = ",",
            description = "Also list the circular equatorial orbits at these radii (M): Omega, E, L, shear rate"
                    + " r dOmega/dr and the squared radial and vertical epicyclic frequencies (negative where unstable),"
                    + " both senses.")
    List<Double> at;

    @Option(names = "--plot", paramLabel = "FILE.png",
            description = "Draw Omega(r) and the shear rate against r with the landmarks marked.")
    Path plot;

    @Override public Integer call() throws IOException {
        if (plot != null && !plot.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".png")) {
            throw new UserInputException("--plot must name a .png file, got " + plot);
        }
        if (at != null) {
            for (double r : at) {
                if (!(r > 0.0 && r <= 1e6)) {
                    throw new UserInputException("--at radius " + r + " is out of range: 0 < r <= 1e6 M");
                }
            }
        }
        Spacetime st = spacetime.build();
        Landmarks l = Landmarks.of(st);
        List<Map<String, Object>> orbits = at == null ? null : orbits(st, at);
        if (plot != null) {
            LandmarksPlot.write(st, l, describe(), plot);
        }
        if (json) {
            Map<String, Object> out = new LinkedHashMap<>(l.toMap());
            if (orbits != null) {
                out.put("circular_orbits", orbits);
            }
            System.out.println(new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(out));
        } else {
            printTable(l, orbits);
        }
        return 0;
    }

    private String describe() {
        StringBuilder sb = new StringBuilder(spacetime.family()).append("  a = ").append(spacetime.spin());
        spacetime.parameters().forEach((k, v) -> sb.append("  ").append(k).append(" = ").append(v));
        return sb.toString();
    }

    private static List<Map<String, Object>> orbits(Spacetime st, List<Double> radii) {
        List<Map<String, Object>> out = new ArrayList<>();
        for (double r : radii) {
            for (boolean pro : new boolean[] {true, false}) {
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("r", r);
                m.put("sense", pro ? "prograde" : "retrograde");
                m.put("omega", finite(CircularOrbits.omega(st, r, pro)));
                m.put("energy", finite(CircularOrbits.energy(st, r, pro)));
                m.put("angular_momentum", finite(CircularOrbits.angularMomentum(st, r, pro)));
                boolean timelike = Double.isFinite(CircularOrbits.ut(st, r, pro));
                m.put("shear_rate", timelike ? finite(CircularOrbits.shearRate(st, r, pro)) : null);
                m.put("epicyclic_radial_squared", finite(CircularOrbits.radialEpicyclicSquared(st, r, pro)));
                m.put("epicyclic_vertical_squared", finite(CircularOrbits.verticalEpicyclicSquared(st, r, pro)));
                out.add(m);
            }
        }
        return out;
    }

    private void printTable(Landmarks l, List<Map<String, Object>> orbits) {
        System.out.println("spacetime: " + describe() + (l.hasHorizon() ? "" : "  (no horizon)"));
        row("outer horizon", l.horizonOuter(), "M");
        row("ergosurface, equator", l.ergosurfaceEquator(), "M");
        row("ISCO, prograde", l.isco(true), "M");
        row("ISCO, retrograde", l.isco(false), "M");
        row("photon orbit, prograde", l.photonOrbit(true), "M");
        row("photon orbit, retrograde", l.photonOrbit(false), "M");
        row("marginally bound, prograde", l.marginallyBoundPrograde(), "M");
        row("Omega maximum at r", l.omegaMaxRadius(), "M");
        row("Omega maximum", l.omegaMaxValue(), "1/M");
        row("capture radius", l.captureRadius(), "M");
        if (orbits != null) {
            System.out.println();
            System.out.printf(Locale.ROOT, "%10s  %-10s  %12s  %12s  %12s  %12s  %13s  %13s%n", "r (M)", "sense",
                    "Omega (1/M)", "E", "L (M)", "r dOmega/dr", "Omega_r^2", "Omega_th^2");
            for (Map<String, Object> m : orbits) {
                System.out.printf(Locale.ROOT, "%10.4f  %-10s  %12s  %12s  %12s  %12s  %13s  %13s%n", m.get("r"),
                        m.get("sense"), num(m.get("omega")), num(m.get("energy")), num(m.get("angular_momentum")),
                        num(m.get("shear_rate")), num(m.get("epicyclic_radial_squared")),
                        num(m.get("epicyclic_vertical_squared")));
            }
        }
    }

    private static void row(String name, double v, String unit) {
        System.out.printf(Locale.ROOT, "  %-28s %s%n", name, Double.isNaN(v) ? "-" : String.format(Locale.ROOT,
                "%.10f %s", v, unit));
    }

    private static String num(Object o) {
        return o == null ? "-" : String.format(Locale.ROOT, "%.6g", (Double) o);
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
