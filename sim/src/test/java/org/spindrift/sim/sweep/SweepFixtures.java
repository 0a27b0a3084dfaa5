package org.spindrift.sim.sweep;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/** Tiny synthetic scenario and sweep files for the sweep tests (round invented values, seconds per task). */
public final class SweepFixtures {
    private SweepFixtures() {
    }

    /** A 40-particle hot spot at r = 8 M around a 1e6 solar-mass hole at 1 kpc (synthetic test values). */
    public static final String BASE = String.join("\n",
            "name: sweep-base",
            "black_hole:",
            "  mass_solar: 1.0e6",
            "  distance: 1 kpc",
            "  family: kerr",
            "  spin: 0.5",
            "observer:",
            "  inclination_deg: 30",
            "sources:",
            "  - name: spot",
            "    kind: hot_spot",
            "    particles: 40",
            "    shape:",
            "      sigma_M: 0.2",
            "    orbit:",
            "      circular:",
            "        radius_M: 8.0",
            "    velocity:",
            "      model: shear",
            "run:",
            "  duration: 2 orbits",
            "  snapshot_cadence: 20 M",
            "  seed: 7",
            "imaging:",
            "  field_of_view_M: 24",
            "  pixels: 16",
            "  frame_cadence: 40 M",
            "");

    /** Writes the base scenario and a sweep file with the given axes lines into dir; @return the sweep file */
    public static Path sweep(Path dir, String name, String... axesLines) throws IOException {
        Files.writeString(dir.resolve("base.yaml"), BASE);
        StringBuilder s = new StringBuilder("name: " + name + "\nbase: base.yaml\naxes:\n");
        for (String l : axesLines) {
            s.append("  ").append(l).append('\n');
        }
        Path f = dir.resolve(name + ".yaml");
        Files.writeString(f, s.toString());
        return f;
    }
}
