package org.spindrift.sim.study;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.stream.Stream;
import org.hipparchus.distribution.continuous.ChiSquaredDistribution;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.spindrift.sim.cli.Main;
import org.spindrift.sim.fit.FitModel;
import org.spindrift.sim.light.CompactSourceModel;
import picocli.CommandLine;

/**
 * The distinguishability study on a synthetic object: 1e6 solar masses at 1 kpc, so that
 * 1 M = GM/c^2 subtends 9.9 micro-arcseconds and GM/c^3 = 4.93 s (round synthetic values; the
 * hot spot's orbit of radius 6 M spans about 120 micro-arcseconds). The truth is a
 * Johannsen-Psaltis spacetime (epsilon3 = 0 is Kerr, both signs allowed), the reference Kerr.
 * Noise of 1 micro-arcsecond is 0.1 M, 50 micro-arcseconds 5 M.
 */
class DistinguishTest {
    @TempDir Path tmp;

    static final String SCENARIO = String.join("\n",
            "name: synthetic-jp",
            "black_hole: {mass_solar: 1.0e6, distance: 1 kpc, family: johannsen-psaltis, spin: 0.5,",
            "  parameters: {epsilon3: 0.0}}",
            "observer: {inclination_deg: 30, position_angle_deg: 10}",
            "sources:",
            "  - name: spot",
            "    kind: hot_spot",
            "    particles: 10",
            "    shape: {sigma_M: 0.4}",
            "    orbit:",
            "      circular: {radius_M: 6.0, phi_deg: 0}",
            "run: {duration: 16 min, snapshot_cadence: 0.5 min}",
            "imaging: {field_of_view_M: 16, pixels: 24, frame_cadence: 0.5 min}",
            "");

    static String study(String values, String sigmas, int realisations, String free) {
        return String.join("\n",
                "name: synthetic-study",
                "truth: truth.yaml",
                "deformation:",
                "  key: black_hole.parameters.epsilon3",
                "  values: " + values,
                "  step: 0.5",
                "reference:",
                "  free:",
                free,
                "instrument:",
                "  sigma_uas: " + sigmas,
                "  beam_fwhm_uas: [0]",
                "  cadence_min: 2",
                "  campaign_min: 8",
                "realisations: " + realisations,
                "seed: 5",
                "");
    }

    static final String PA = String.join("\n",
            "    - key: observer.position_angle_deg",
            "      min: -30",
            "      max: 50");

    private StudyFile load(String text) throws Exception {
        Files.writeString(tmp.resolve("truth.yaml"), SCENARIO);
        Path f = tmp.resolve("study.yaml");
        Files.writeString(f, text);
        return StudyFile.load(f);
    }

    /**
     * Wilks' theorem (Wilks 1938, Ann. Math. Stat. 9, 60): with the truth at the reference
     * (epsilon3 = 0), Delta chi-square follows chi-square with 1 degree of freedom (one extra
     * parameter). Kolmogorov-Smirnov statistic of 40 realisations against Hipparchus'
     * ChiSquaredDistribution(1); the 1 % critical value of D is 1.63 / sqrt(n) (Kolmogorov's
     * limiting distribution; Smirnov 1948, Ann. Math. Stat. 19, 279; value from memory). Few
     * epochs and one free parameter keep the fits cheap; the tables are traced once.
     */
    @Test
    void zeroDeformationGivesChiSquareOneDof() throws Exception {
        StudyFile s = load(study("[0.0]", "[1.0]", 40, PA));
        CellStudy.Result r = new CellStudy(s, new FitModel.Cache(2), 2).run(s.cell(0));
        double[] d = r.delta().clone();
        Arrays.sort(d);
        ChiSquaredDistribution chi = new ChiSquaredDistribution(1);
        double dmax = 0;
        for (int i = 0; i < d.length; i++) {
            double f = chi.cumulativeProbability(d[i]);
            dmax = FastMath.max(dmax, FastMath.max((i + 1.0) / d.length - f, f - (double) i / d.length));
        }
        assertTrue(dmax < 1.63 / FastMath.sqrt(d.length), "KS D = " + dmax + " for " + Arrays.toString(d));
        assertEquals(0.0, r.expected(), 1e-6, "noise-free: the reference is the truth");
    }

    /**
     * The expected (noise-free) Delta chi-square scales as 1/sigma^2: uniform weights do not move
     * the best fit (common practice, no source). The study relies on it (one noise-free fit per
     * deformation and beam, scaled): the study's value at 1 micro-arcsecond against a separate fit
     * made directly at 2 micro-arcseconds, within 1 %. The
     * strong deformation (epsilon3 = 3) at 1 micro-arcsecond (0.1 M) exceeds 5 sigma; a tiny one
     * (epsilon3 = 0.01) at 50 micro-arcseconds (5 M) stays below 2 sigma.
     */
    @Test
    void expectedScalesAsInverseSigmaSquaredAndSeparates() throws Exception {
        StudyFile s = load(study("[3.0, 0.01]", "[1.0, 2.0, 50.0]", 1, PA));
        FitModel.Cache cache = new FitModel.Cache(2);
        CellStudy c = new CellStudy(s, cache, 2);
        double e1 = c.run(s.cell(0)).expected();
        double e2 = new CellStudy(s, cache, 2).noiseFreeChiSquareDirect(s.cell(1));
        assertEquals(2.0, s.cell(1).sigmaUas());
        assertEquals(4.0, e1 / e2, 0.04, "1/sigma^2 scaling: " + e1 + " vs " + e2);
        assertTrue(Wilks.sigma(e1, 1) > 5, "strong deformation at 1 uas: " + Wilks.sigma(e1, 1) + " sigma");
        CellStudy.Result tiny = c.run(s.cell(5));
        assertEquals(0.01, tiny.cell().deformation());
        assertEquals(50.0, tiny.cell().sigmaUas());
        assertTrue(tiny.expectedSigma() < 2, "tiny deformation at 50 uas: " + tiny.expectedSigma() + " sigma");
    }

    /**
     * Two-sided normal equivalents: for one degree of freedom Delta chi^2 = n^2 (chi^2_1 = Z^2);
     * for two, the 3 and 5 sigma thresholds are Delta chi^2 = 11.83 and 28.74 (Particle Data
     * Group, Review of Particle Physics, Statistics, table of Delta chi^2 for joint confidence
     * regions; values from memory).
     */
    @Test
    void wilksSignificance() {
        assertEquals(3.0, Wilks.sigma(9.0, 1), 1e-6);
        assertEquals(5.0, Wilks.sigma(25.0, 1), 1e-6);
        assertEquals(12.0, Wilks.sigma(144.0, 1), 1e-6);
        assertEquals(40.0, Wilks.sigma(1600.0, 1), 1e-3);
        assertEquals(3.0, Wilks.sigma(11.83, 2), 0.01);
        assertEquals(5.0, Wilks.sigma(28.74, 2), 0.01);
        assertEquals(0.0, Wilks.sigma(0.0, 1));
    }

    /**
     * The beam reaches the study's model through the truth scenario: with a 40 micro-arcsecond
     * (4 M) beam and a steady source of half the mean flare flux 6 M away from the spot (3.5 beam
     * sigmas, so resolved), the reported position is the peak on the spot's primary image, near the
     * flare's own flux centroid (within a few per cent for the secondary image's pull), not the
     * centroid with the steady source F c / (F + F_s), about 1.5 times closer to the hole (common
     * practice, no source); without a beam it is that centroid.
     */
    @Test
    void beamSetsTheReportedPosition() throws Exception {
        StudyFile s = load(study("[3.0]", "[1.0]", 1, PA).replace("beam_fwhm_uas: [0]", "beam_fwhm_uas: [0, 40]")
                .replace("campaign_min: 8", "campaign_min: 8\n  steady_source_flux_ratio: 0.5"));
        FitModel.Cache cache = new FitModel.Cache(2);
        var beamed = FitModel.frames(s.truthTree(3.0, 40.0).load(), cache, new CompactSourceModel());
        var plain = FitModel.frames(s.truthTree(3.0, 0.0).load(), cache, new CompactSourceModel());
        double[] toFlare = new double[beamed.timesM().length], toSteady = new double[toFlare.length];
        int n = 0;
        for (int f = 0; f < toFlare.length; f++) {
            double t = beamed.timesM()[f];
            if (t < beamed.coveredFrom() || t > beamed.coveredTo() || !(beamed.flux()[f] > 0)) {
                continue;
            }
            double a = FastMath.hypot(beamed.astrometricX()[f], beamed.astrometricY()[f]);
            toFlare[n] = a / FastMath.hypot(beamed.x()[f], beamed.y()[f]);
            toSteady[n++] = a / FastMath.hypot(beamed.steadyX()[f], beamed.steadyY()[f]);
            assertEquals(plain.steadyX()[f], plain.astrometricX()[f], 0.0, "no beam: the steady centroid");
        }
        assertTrue(n >= 5, "covered frames: " + n);
        double mf = CellStudy.percentile(Arrays.copyOf(toFlare, n), 50), ms = CellStudy.percentile(Arrays.copyOf(toSteady, n), 50);
        assertTrue(mf > 0.97 && mf < 1.15, "beam peak over flare centroid: " + mf);
        assertTrue(ms > 1.35, "beam peak over centroid with the steady source: " + ms);
    }

    /** The parabola's vertex through three points of a quadratic profile is its exact minimum. */
    @Test
    void profileMinimumOfAQuadratic() {
        double[] x = {0.5, 1.0, 1.5};
        double[] c = new double[3];
        for (int i = 0; i < 3; i++) {
            c[i] = 7.0 + 4.0 * (x[i] - 0.8) * (x[i] - 0.8);
        }
        assertEquals(7.0, CellStudy.profileMinimum(x, c, 0.5, v -> true), 1e-12);
        assertEquals(c[1], CellStudy.profileMinimum(x, c, 0.5, v -> v > 0.9), 1e-12, "vertex not allowed: best node");
    }

    static Stream<Arguments> broken() {
        String good = study("[0.0, 1.0]", "[1.0]", 2, PA);
        return Stream.of(
                Arguments.of("unknown key", good.replace("realisations:", "realizations:"), "realizations"),
                Arguments.of("empty grid", good.replace("values: [0.0, 1.0]", "values: []"), "deformation.values"),
                Arguments.of("negative sigma", good.replace("sigma_uas: [1.0]", "sigma_uas: [1.0, -2]"),
                        "instrument.sigma_uas[1]"),
                Arguments.of("deformation not allowed", good.replace("values: [0.0, 1.0]", "values: [0.0, 1.0e5]"),
                        "deformation.values"),
                Arguments.of("free key unknown", good.replace("observer.position_angle_deg", "observer.position_angel_deg"),
                        "reference.free[0].key"),
                Arguments.of("truth outside bounds", good.replace("min: -30", "min: 20"), "reference.free[0].key"),
                Arguments.of("campaign shorter than cadence", good.replace("campaign_min: 8", "campaign_min: 1"),
                        "instrument.campaign_min"),
                Arguments.of("missing truth", good.replace("truth: truth.yaml", "truth: nowhere.yaml"), "truth"),
                Arguments.of("campaign longer than the run", good.replace("campaign_min: 8", "campaign_min: 60"),
                        "instrument.campaign_min"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("broken")
    void badStudyFileOneLineExitTwo(String label, String text, String mention) throws Exception {
        Files.writeString(tmp.resolve("truth.yaml"), SCENARIO);
        Path f = tmp.resolve("bad.yaml");
        Files.writeString(f, text);
        Path out = tmp.resolve("out");
        boolean runOnly = label.equals("campaign longer than the run");
        for (String[] args : runOnly ? new String[][] {{"distinguish", f.toString(), "-o", out.toString(), "--threads", "1"}}
                : new String[][] {{"distinguish", f.toString(), "-o", out.toString(), "--threads", "1"},
                    {"check", f.toString()}}) {
            StringWriter err = new StringWriter();
            CommandLine cl = Main.commandLine();
            cl.setErr(new PrintWriter(err));
            cl.setOut(new PrintWriter(new StringWriter()));
            int code = cl.execute(args);
            String msg = err.toString().strip();
            assertEquals(2, code, label + ": " + msg);
            assertEquals(1, msg.lines().count(), label + ": one line: " + msg);
            assertTrue(msg.contains(mention), label + ": names '" + mention + "': " + msg);
            assertTrue(msg.contains("bad.yaml"), label + ": names the file: " + msg);
        }
        assertFalse(Files.exists(out), label + ": no study folder");
    }

    /**
     * A study folder: one CSV row per cell, a manifest whose SHA-256 sums match its files; running
     * again resumes (no cell redone) and gives byte-identical results; a sweep task of kind study
     * is checked like the study file.
     */
    @Test
    void folderResumesAndSweepKindChecks() throws Exception {
        StudyFile s = load(study("[0.0, 2.0]", "[5.0]", 1, PA));
        Path out = tmp.resolve("st");
        StudyRun.Summary first = StudyRun.run(s, out, 2, 1, false);
        assertEquals(2, first.ran());
        java.util.List<String> rows = Files.readAllLines(out.resolve(StudyRun.CSV));
        assertEquals(3, rows.size(), "header and one row per cell");
        assertTrue(rows.get(0).startsWith("cell,deformation,beam_fwhm_uas,sigma_uas"), rows.get(0));
        assertTrue(org.spindrift.sim.sweep.TaskState.manifestComplete(out, true), "manifest with matching sha256");
        byte[] csv = Files.readAllBytes(out.resolve(StudyRun.CSV));
        Files.delete(StudyRun.cellFile(out, 1));
        StudyRun.Summary again = StudyRun.run(s, out, 1, 2, false);
        assertEquals(1, again.ran(), "only the missing cell");
        assertEquals(1, again.skipped());
        assertTrue(Arrays.equals(csv, Files.readAllBytes(out.resolve(StudyRun.CSV))), "same bytes for any jobs/threads");
        org.spindrift.sim.sweep.TaskKind kind = org.spindrift.sim.sweep.TaskKinds.get("study");
        assertTrue(kind != null, "study kind registered");
        kind.check(s.file(), org.spindrift.sim.scenario.ConfigTreeReader.read(s.file()));
        // the kind's headline numbers are the first cell's: zero deformation, so nothing to tell apart
        assertEquals(0.0, kind.outputs(out).get("expected_delta_chi2"), 1e-6);
    }
}
