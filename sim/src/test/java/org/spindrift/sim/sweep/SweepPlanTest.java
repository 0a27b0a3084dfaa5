package org.spindrift.sim.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.ScenarioJson;
import org.spindrift.shared.testing.ExternalPython;
import org.spindrift.sim.scenario.ConfigNode;
import org.spindrift.sim.scenario.ScenarioLoader;

/** Expanding sweep files into tasks: values, order, Latin hypercube, task files. */
class SweepPlanTest {
    @TempDir Path tmp;

    @Test void gridOrderFirstAxisSlowestAndTaskFilesAreTheBaseWithTheAxisValues() throws Exception {
        Path f = SweepFixtures.sweep(tmp, "grid", "black_hole.spin: [0.0, 0.9]",
                "observer.inclination_deg: {from: 20, to: 60, count: 3}");
        SweepPlanner.Result r = SweepPlanner.plan(f, tmp.resolve("S"), false, 2);
        assertEquals(6, r.tasks());
        SweepPlan plan = SweepPlan.open(tmp.resolve("S"));
        double[][] expect = {{0.0, 20}, {0.0, 40}, {0.0, 60}, {0.9, 20}, {0.9, 40}, {0.9, 60}};
        Scenario base = ScenarioLoader.load(tmp.resolve("base.yaml")).scenario();
        for (int t = 0; t < 6; t++) {
            assertEquals(expect[t][0], plan.values(t).get(0).asDouble(), 0.0);
            assertEquals(expect[t][1], plan.values(t).get(1).asDouble(), 0.0);
            Path file = plan.layout().taskFile(t);
            Scenario sc = ScenarioLoader.load(file).scenario();
            assertEquals(expect[t][0], sc.blackHole().spin(), 0.0);
            assertEquals(expect[t][1], sc.observer().inclinationDeg(), 0.0);
            // everything else is the base scenario (compared through the manifest's scenario echo)
            Scenario same = new Scenario(sc.name(), sc.description(), base.blackHole(), base.observer(), sc.sources(),
                    sc.run(), sc.imaging(), sc.instrument());
            assertEquals(ScenarioJson.toJson(base), ScenarioJson.toJson(same));
            assertEquals(org.spindrift.shared.archive.AtomicFiles.sha256(file), plan.taskSha256(t));
        }
        JsonNode json = new ObjectMapper().readTree(tmp.resolve("S/sweep.json").toFile());
        assertEquals(org.spindrift.shared.archive.AtomicFiles.sha256(f), json.path("sweep_file_sha256").asText());
        assertEquals(org.spindrift.shared.archive.AtomicFiles.sha256(tmp.resolve("base.yaml")),
                json.path("base_file_sha256").asText());
        assertTrue(json.path("estimate").path("heap_bytes_max").asLong() > 0);
        // planning the same sweep again changes nothing
        long before = Files.getLastModifiedTime(tmp.resolve("S/sweep.json")).toMillis();
        assertTrue(SweepPlanner.plan(f, tmp.resolve("S"), false, 1).unchanged());
        assertEquals(before, Files.getLastModifiedTime(tmp.resolve("S/sweep.json")).toMillis());
    }

    @Test void evenlySpacedValuesMatchNumpy() throws Exception {
        double[] lin = SweepAxis.linear(0.1, 0.95, 7);
        double[] log = SweepAxis.logarithmic(1.0e6, 3.0e8, 9);
        String py = ExternalPython.require("numpy", "python3-numpy");
        // reference: numpy.linspace and numpy.geomspace (Debian's python3-numpy)
        List<String> out = ExternalPython.run(py, "import numpy as np\n"
                + "print(' '.join(repr(float(v)) for v in np.linspace(0.1, 0.95, 7)))\n"
                + "print(' '.join(repr(float(v)) for v in np.geomspace(1.0e6, 3.0e8, 9)))\n");
        double[] nl = parse(out.get(0));
        double[] ng = parse(out.get(1));
        for (int k = 0; k < 7; k++) {
            assertEquals(nl[k], lin[k], 1e-15 * Math.abs(nl[k]) + 1e-17, "linear " + k);
        }
        for (int k = 0; k < 9; k++) {
            assertEquals(ng[k], log[k], 1e-13 * ng[k], "log " + k);
        }
        assertEquals(0.95, lin[6], 0.0);
        assertEquals(3.0e8, log[8], 0.0);
    }

    private static double[] parse(String line) {
        String[] p = line.trim().split(" ");
        double[] v = new double[p.length];
        for (int i = 0; i < p.length; i++) {
            v[i] = Double.parseDouble(p[i]);
        }
        return v;
    }

    /**
     * The defining property of a Latin hypercube (McKay, Beckman & Conover 1979): in every
     * dimension each of the n equal strata holds exactly one of the n points.
     */
    @Test void latinHypercubeHasOnePointPerStratumAndIsSeeded() {
        int n = 50;
        double[][] u = LatinHypercube.sample(n, 3, 11);
        for (int j = 0; j < 3; j++) {
            boolean[] hit = new boolean[n];
            for (double[] p : u) {
                assertTrue(p[j] >= 0 && p[j] < 1);
                int s = (int) Math.floor(p[j] * n);
                assertFalse(hit[s], "stratum " + s + " of dimension " + j + " holds two points");
                hit[s] = true;
            }
        }
        assertArrayEquals(u[17], LatinHypercube.sample(n, 3, 11)[17], 0.0);
        assertNotEquals(u[17][0], LatinHypercube.sample(n, 3, 12)[17][0]);
    }

    @Test void sampledAxesAreCrossedWithGridAxesAndLogAxesStayInRange() throws Exception {
        Path f = SweepFixtures.sweep(tmp, "lhs", "black_hole.family: [kerr]",
                "black_hole.spin: {from: 0.1, to: 0.9}",
                "black_hole.mass_solar: {from: 1.0e5, to: 1.0e7, spacing: log}");
        Files.writeString(f, Files.readString(f) + "latin_hypercube: {samples: 8, seed: 3}\n");
        SweepFile sf = SweepFile.load(f);
        List<ConfigNode[]> pts = sf.points();
        assertEquals(8, pts.size());
        boolean[] decade = new boolean[8];
        for (ConfigNode[] p : pts) {
            assertEquals("kerr", ((ConfigNode.Str) p[0]).value());
            double a = ((ConfigNode.Num) p[1]).value();
            double m = ((ConfigNode.Num) p[2]).value();
            assertTrue(a >= 0.1 && a <= 0.9, "spin " + a);
            assertTrue(m >= 1.0e5 && m <= 1.0e7, "mass " + m);
            // log spacing: one sample per eighth of the two decades of log10(mass)
            int s = (int) Math.floor((Math.log10(m) - 5) / 2 * 8);
            assertFalse(decade[s]);
            decade[s] = true;
        }
        assertEquals(String.format(Locale.ROOT, "%.12f", ((ConfigNode.Num) pts.get(5)[1]).value()),
                String.format(Locale.ROOT, "%.12f", ((ConfigNode.Num) SweepFile.load(f).points().get(5)[1]).value()));
    }

    @Test void demoSweepsPlanCleanlyAndAreListed() throws Exception {
        Path configs = Files.isDirectory(Path.of("..", "configs")) ? Path.of("..", "configs") : Path.of("configs");
        String readme = Files.readString(configs.resolve("README.md"));
        List<Path> files;
        try (java.util.stream.Stream<Path> st = Files.list(configs.resolve("sweeps"))) {
            files = st.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
        }
        assertFalse(files.isEmpty());
        for (Path f : files) {
            assertTrue(Files.readString(f).contains("INVENTED"), f + " says it is invented");
            assertTrue(readme.contains("sweeps/" + f.getFileName()), f + " is listed in configs/README.md");
            SweepPlanner.Result r = SweepPlanner.plan(f, tmp.resolve(f.getFileName().toString()), false, 2);
            assertTrue(r.tasks() > 1 && r.tasks() <= 50, f + ": " + r.tasks() + " tasks");
        }
    }
}
