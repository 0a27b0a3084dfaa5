package org.spindrift.sim.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.run.ScenarioRun;

/** Every demo scenario in configs/ passes the checks, says it is invented, and its keys are documented. */
class DemoConfigsTest {
    static Path configs() {
        Path p = Path.of("..", "configs");
        return Files.isDirectory(p) ? p : Path.of("configs");
    }

    @Test void demoConfigsCheckCleanAndAreLabelledInvented() throws Exception {
        List<Path> files;
        try (Stream<Path> s = Files.list(configs())) {
            files = s.filter(f -> f.toString().endsWith(".yaml")).sorted().toList();
        }
        assertTrue(files.size() >= 3, "at least three demo configs: " + files);
        String readme = Files.readString(configs().resolve("README.md"));
        for (Path f : files) {
            if (FitFileLoader.isFitFile(f)) {
                // a fit demo: the fit file itself checks (its data come from a documented run command)
                FitFile fit = FitFileLoader.load(f);
                assertTrue(fit.free().size() >= 1);
                assertTrue(Files.readString(f).contains("INVENTED"), f + " says it is invented");
                assertTrue(readme.contains(f.getFileName().toString()), "configs/README.md mentions " + f.getFileName());
                continue;
            }
            LoadedScenario ls = ScenarioLoader.load(f);
            ScenarioRun.Prepared p = ScenarioRun.prepare(ls);
            assertTrue(p.times().length >= 3);
            assertTrue(ls.scenario().description().contains("INVENTED"), f + " says it is invented");
            assertTrue(readme.contains(f.getFileName().toString()), "configs/README.md mentions " + f.getFileName());
            // owner's rule for demo data: invented nuclei at Mpc distances with 1e7 .. 1e9 solar masses
            var bh = ls.scenario().blackHole();
            assertTrue(bh.massSolar() >= 1e7 && bh.massSolar() <= 1e9, f + ": mass " + bh.massSolar());
            assertTrue(bh.distanceMpc() >= 1.0, f + ": distance " + bh.distanceMpc() + " Mpc");
        }
        // the README's first command runs hotspot-kerr.yaml: a Kerr a = 0.7 hole, spot outside the ISCO
        LoadedScenario first = ScenarioLoader.load(configs().resolve("hotspot-kerr.yaml"));
        assertEquals(0.7, first.scenario().blackHole().spin());
        ScenarioRun.Prepared p = ScenarioRun.prepare(first);
        double isco = p.landmarks().get("isco_prograde");
        // Kerr a = 0.7 prograde ISCO = 3.393 M (BPT 1972 eq. 2.21; value recalled from memory)
        assertEquals(3.393, isco, 1e-3);
        double r = ((org.spindrift.shared.scenario.CentreOrbit.Circular) first.scenario().sources().get(0).orbit()).radiusM();
        assertTrue(r > isco && r < 1.3 * isco, "hot spot just outside the ISCO");
    }
}
