package org.spindrift.sim.run;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.shared.testing.ExternalPython;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.pipeline.SnapshotStage;
import org.spindrift.sim.scenario.LoadedScenario;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * Debian's python3-h5py, an independent HDF5 reader, opens the snapshots of a real run and reads
 * back the same numbers as the engine holds (positions, 4-velocities, weights, states, times).
 * Skips when h5py is missing, fails instead when SPINDRIFT_REQUIRE_EXTERNAL=1 (CI).
 */
class H5pyRunArchiveTest {
    @TempDir Path tmp;

    @Test void h5pyReadsTheRunsSnapshots() throws Exception {
        String py = ExternalPython.require("h5py, numpy", "python3-h5py");
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(0.3),
                List.of(TestScenarios.hotSpot(30, 6.0, 0.5, new VelocityModel(VelocityModel.Kind.SHEAR, 0)),
                        TestScenarios.ring(20, 8, 9, 5)), 40, 8, 4, 0);
        ScenarioRun.Outcome o = ScenarioRun.run(ScenarioRun.prepare(ls), new ScenarioRun.Options(tmp.resolve("run"), 2,
                false), List.of(new SnapshotStage()));
        ParticleHistory h = o.history();
        int s = 3;
        int i = 37;
        String script = String.join("\n",
                "import h5py, sys",
                "f = h5py.File(sys.argv[1], 'r')",
                "s, i = int(sys.argv[2]), int(sys.argv[3])",
                "print(repr(float(f['time'][s])))",
                "print(repr(float(f['r'][s, i])), repr(float(f['theta'][s, i])), repr(float(f['phi'][s, i])))",
                "print(' '.join(repr(float(v)) for v in f['u'][s, i, :]))",
                "print(repr(float(f['weight'][s, i])), int(f['state'][s, i]), int(f['source_index'][i]))",
                "print(f['r'].shape[0], f['r'].shape[1], f['centre'].shape[1])");
        String[] l = ExternalPython.run(py, script, o.folder().resolve(ArchiveLayout.SNAPSHOTS).toString(),
                Integer.toString(s), Integer.toString(i)).toArray(new String[0]);
        // python's repr of a float round-trips exactly: the numbers must be bit-identical
        assertEquals(h.time(s), Double.parseDouble(l[0]));
        String[] pos = l[1].split(" ");
        assertEquals(h.r(s)[i], Double.parseDouble(pos[0]));
        assertEquals(h.theta(s)[i], Double.parseDouble(pos[1]));
        assertEquals(h.phi(s)[i], Double.parseDouble(pos[2]));
        String[] u = l[2].split(" ");
        assertEquals(h.ut(s)[i], Double.parseDouble(u[0]));
        assertEquals(h.ur(s)[i], Double.parseDouble(u[1]));
        assertEquals(h.uTheta(s)[i], Double.parseDouble(u[2]));
        assertEquals(h.uPhi(s)[i], Double.parseDouble(u[3]));
        String[] w = l[3].split(" ");
        assertEquals(h.weight(s)[i], Float.parseFloat(w[0]));
        assertEquals(h.state(s)[i], Integer.parseInt(w[1]));
        assertEquals(1, Integer.parseInt(w[2]), "particle 37 belongs to the second source (the ring)");
        assertEquals(h.snapshots() + " 50 2", l[4]);
    }

    /** Python's hashlib, an independent SHA-256 (FIPS 180-4), agrees with every digest the run took as it wrote. */
    @Test void hashlibAgreesWithTheManifestsDigests() throws Exception {
        String py = ExternalPython.require("hashlib, json", "python3");
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(0.3),
                List.of(TestScenarios.hotSpot(20, 6.0, 0.5, new VelocityModel(VelocityModel.Kind.SHEAR, 0))), 40, 8, 4, 0);
        ScenarioRun.Outcome o = ScenarioRun.run(ScenarioRun.prepare(ls), new ScenarioRun.Options(tmp.resolve("sums"), 1,
                false));
        String script = String.join("\n",
                "import hashlib, json, os, sys",
                "d = sys.argv[1]",
                "m = json.load(open(os.path.join(d, 'manifest.json')))",
                "bad = [n for n, h in m['files'].items() if hashlib.sha256(open(os.path.join(d, n), 'rb').read()).hexdigest() != h]",
                "print(len(m['files']), len(bad), ' '.join(bad))");
        String[] l = ExternalPython.run(py, script, o.folder().toString()).get(0).split(" ");
        assertTrue(Integer.parseInt(l[0]) >= 12, "files listed: " + l[0]);
        assertEquals("0", l[1], "files whose digest differs: " + String.join(" ", l));
    }
}
