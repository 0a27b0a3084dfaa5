package org.spindrift.sim.interferometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.RunArchive;
import org.spindrift.shared.scenario.Instrument;
import org.spindrift.shared.scenario.Interferometer;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.TimeSpan;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.shared.testing.ExternalPython;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.run.TestScenarios;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioLoader;

/** A whole run with an interferometer: files, manifest, scenario echo, and the UVFITS file read by astropy. */
class InterferometryRunTest {
    @TempDir Path tmp;

    static LoadedScenario withArray() {
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(0.5),
                List.of(TestScenarios.hotSpot(60, 7.0, 0.8, new VelocityModel(VelocityModel.Kind.RIGID, 0))), 60, 6, 7, 0);
        Scenario s = ls.scenario();
        Interferometer a = new Interferometer(null, TestArrays.five(5000), 230, 2, 0, 20, 0, TimeSpan.minutes(100),
                TimeSpan.minutes(100), 10, 1.5, 0.1, 20);
        return ls.with(new Scenario(s.name(), s.description(), s.blackHole(), s.observer(), s.sources(), s.run(),
                s.imaging(), new Instrument(0, 0.5, 0, 1), a));
    }

    @Test void runWritesTheFilesAndAstropyReadsTheUvfitsBack() throws Exception {
        ScenarioRun.Outcome o = ScenarioRun.run(ScenarioRun.prepare(withArray()), new ScenarioRun.Options(tmp.resolve("run"),
                2, false));
        Path dir = o.folder();
        List<String> vis;
        try (RunArchive a = RunArchive.open(dir)) {
            a.verifyChecksums();
            for (String f : List.of("visibilities.csv", "closure_phases.csv", "closure_amplitudes.csv",
                    "visibilities.uvfits", "plots/uv_coverage.png", "plots/visibility_amplitude.png",
                    "plots/closure_phases.png")) {
                assertTrue(a.has(f), "manifest lists " + f);
            }
            assertEquals(5, a.manifest().path("interferometer").path("stations").asInt());
            Path echo = tmp.resolve("echo.json");
            Files.writeString(echo, a.manifest().get("scenario").toString());
            assertEquals(withArray().scenario(), ScenarioLoader.load(echo).scenario(), "the echo reads back the same");
            // run --help names every file this run wrote (common practice, no source: help lists outputs)
            java.io.StringWriter help = new java.io.StringWriter();
            picocli.CommandLine cl = org.spindrift.sim.cli.Main.commandLine();
            cl.setOut(new java.io.PrintWriter(help, true));
            assertEquals(0, cl.execute("run", "--help"));
            a.manifest().get("files").fieldNames().forEachRemaining(f -> assertTrue(
                    help.toString().contains(f.substring(f.lastIndexOf('/') + 1)), "run --help names " + f));
        }
        vis = Files.readAllLines(dir.resolve("visibilities.csv"));
        // the header as docs/archive-format.md gives it, spelled out (not taken from the writer's constants)
        assertEquals("t_obs_min,t_obs_M,frame,scan,station1,station2,u_lambda,v_lambda,w_lambda,baseline_lambda,"
                + "elevation1_deg,elevation2_deg,re_jy,im_jy,amp_jy,phase_deg,sigma_jy,model_re_jy,model_im_jy",
                vis.get(0));
        int n = vis.size() - 1;
        assertTrue(n >= 10 * 10, "10 pairs at each of >= 10 frames: " + n);
        List<String> cp = Files.readAllLines(dir.resolve("closure_phases.csv"));
        assertTrue(cp.size() > 1);
        String[] first = cp.get(1).split(",", -1);
        assertEquals(0.0, Double.parseDouble(first[9]), 1e-9, "steady point source: closure phase 0");
        // astropy (Debian python3-astropy) as an independent reader of the random-groups file
        String py = String.join("\n",
                "import sys",
                "from astropy.io import fits",
                "h = fits.open(sys.argv[1])",
                "g = h[0]",
                "print(type(g).__name__, len(g.data), g.header['CRVAL4'], h['AIPS AN'].data['ANNAME'][2])",
                "for k in (0, len(g.data) - 1):",
                "    d = g.data[k]",
                "    f = g.header['CRVAL4']",
                "    print(repr(float(d['UU'] * f)), repr(float(d['VV'] * f)), repr(float(d['WW'] * f)), int(d['BASELINE']),"
                        + " repr(float(d['DATE'])), repr(float(d.data[0,0,0,0,0])), repr(float(d.data[0,0,0,0,1])),"
                        + " repr(float(d.data[0,0,0,0,2])))");
        String exe = ExternalPython.require("astropy.io.fits", "python3-astropy");
        List<String> out = ExternalPython.run(exe, py, dir.resolve("visibilities.uvfits").toString());
        String[] head = out.get(out.size() - 3).trim().split("\\s+");
        assertEquals("GroupsHDU", head[0]);
        assertEquals(n, Integer.parseInt(head[1]), "one group per visibility");
        assertEquals(230e9, Double.parseDouble(head[2]), 1.0);
        assertEquals("C", head[3], "station names in the AN table");
        for (int i = 0; i < 2; i++) {
            String[] py1 = out.get(out.size() - 2 + i).trim().split("\\s+");
            String[] c = vis.get(i == 0 ? 1 : n).split(",");
            // float32 storage: relative 1e-7
            for (int j = 0; j < 3; j++) {
                double ref = Double.parseDouble(c[6 + j]);
                assertEquals(ref, Double.parseDouble(py1[j]), 1.2e-7 * Math.abs(ref) + 1e-3, "u, v, w in wavelengths (float32)");
            }
            int a1 = c[4].charAt(0) - 'A' + 1, a2 = c[5].charAt(0) - 'A' + 1;
            assertEquals(256 * a1 + a2, Integer.parseInt(py1[3]), "BASELINE = 256 a1 + a2");
            double days = Double.parseDouble(c[0]) / 1440.0;
            assertEquals(InterferometryOutputs.EPOCH_JD + days, Double.parseDouble(py1[4]), 1e-6, "DATE in JD");
            double re = Double.parseDouble(c[12]), im = Double.parseDouble(c[13]), sig = Double.parseDouble(c[16]);
            assertEquals(re, Double.parseDouble(py1[5]), 1e-6 * Math.abs(re) + 1e-9);
            assertEquals(im, Double.parseDouble(py1[6]), 1e-6 * Math.abs(im) + 1e-9);
            assertEquals(1 / (sig * sig), Double.parseDouble(py1[7]), 1e-6 / (sig * sig), "weight = 1/sigma^2");
        }
    }
}
