package org.spindrift.sim.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.hipparchus.distribution.continuous.ChiSquaredDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.ScenarioLoader;

/**
 * Recovery of known parameters: mock astrometry made by a full run (particles, ray table,
 * rendered frames; not the fit's fast model) plus Gaussian noise, fitted by least squares for
 * 10 noise seeds (free: orbit radius and initial azimuth). The true values must lie within 2 sigma in at least 80 % of the cases, and the
 * chi-square at the truth must have the mean and spread of a chi-square distribution with N
 * degrees of freedom (Hipparchus' ChiSquaredDistribution: mean N, variance 2N).
 */
class RecoveryTest {
    @TempDir Path tmp;

    static final double R = 8.0, PHI = 0.0, PA = 20.0;
    static final double SIGMA_UAS = 15.0;
    static final int SEEDS = 10;
    static final int EPOCHS = 40;

    static String truth() {
        return String.join("\n",
                "name: truth",
                "black_hole: {mass_solar: 1.0e6, distance: 1 kpc, family: kerr, spin: 0.5}",
                "observer: {inclination_deg: 30, position_angle_deg: " + PA + "}",
                "sources:",
                "  - name: spot",
                "    kind: hot_spot",
                "    particles: 600",
                "    shape: {sigma_M: 0.15}",
                "    orbit:",
                "      circular: {radius_M: " + R + ", phi_deg: " + PHI + "}",
                "    velocity: {model: shear}",
                "    emission: {spectral_index: 1.0}",
                "run: {duration: 1 orbits, snapshot_cadence: 2 M, seed: 5, tolerance: 1.0e-9, archive_subsample: 10}",
                "imaging: {field_of_view_M: 22, pixels: 48, frame_cadence: 3 M}",
                "instrument: {steady_source_flux_ratio: 0.3}",
                "");
    }

    @Test
    void truthsWithinTwoSigmaAndChiSquareAtTruth() throws Exception {
        Path scen = tmp.resolve("truth.yaml");
        Files.writeString(scen, truth());
        Path run = tmp.resolve("run");
        ScenarioRun.run(ScenarioRun.prepare(ScenarioLoader.load(scen)), new ScenarioRun.Options(run, 2, false));
        List<String> lines = Files.readAllLines(run.resolve("centroid.csv"));
        List<String> head = List.of(lines.get(0).split(","));
        int ct = head.indexOf("t_obs_min"), cx = head.indexOf("x_with_steady_uas"), cy = head.indexOf("y_with_steady_uas");
        var manifest = new com.fasterxml.jackson.databind.ObjectMapper().readTree(run.resolve("manifest.json").toFile());
        double minPerM = manifest.get("units").get("M_seconds").asDouble() / 60;
        int n = lines.size() - 1;
        double[] t = new double[n], x = new double[n], y = new double[n];
        for (int i = 0; i < n; i++) {
            String[] v = lines.get(i + 1).split(",");
            t[i] = Double.parseDouble(v[ct]);
            x[i] = Double.parseDouble(v[cx]);
            y[i] = Double.parseDouble(v[cy]);
        }
        // epochs from 30 M (all direct images of the orbit arrive) to the end of the covered interval
        double t0 = 30 * minPerM, t1 = manifest.get("light").get("fully_covered_min").get(1).asDouble();
        int inside = 0, cases = 0;
        double[] chi = new double[SEEDS];
        int dof = 2 * EPOCHS;
        StringBuilder log = new StringBuilder();
        for (int seed = 1; seed <= SEEDS; seed++) {
            Random rng = new Random(seed);
            StringBuilder csv = new StringBuilder("t_obs_min,x_uas,y_uas,sigma_uas\n");
            for (int e = 0; e < EPOCHS; e++) {
                double te = t0 + (t1 - t0) * e / (EPOCHS - 1);
                csv.append(String.format(Locale.ROOT, "%.6f,%.6f,%.6f,%.3f%n", te,
                        interp(t, x, te) + SIGMA_UAS * rng.nextGaussian(), interp(t, y, te) + SIGMA_UAS * rng.nextGaussian(),
                        SIGMA_UAS));
            }
            Path data = tmp.resolve("data" + seed + ".csv");
            Files.writeString(data, csv.toString());
            Path fit = tmp.resolve("fit" + seed + ".yaml");
            Files.writeString(fit, String.join("\n",
                    "scenario: truth.yaml",
                    "data: {astrometry: data" + seed + ".csv}",
                    "free:",
                    "  - {key: \"sources[0].orbit.circular.radius_M\", min: 6.5, max: 10, start: 8.6}",
                    "  - {key: \"sources[0].orbit.circular.phi_deg\", min: -40, max: 40, start: 6}",
                    "method: {kind: least_squares, starts: 1, seed: " + seed + "}",
                    ""));
            FitRun.Prepared p = FitRun.prepare(fit, 2);
            // chi-square at the truth (no parameter fitted): chi-square with 2 x epochs degrees of freedom
            FitModel m = new FitModel(p.fit(), p.data(), p.cache());
            double[] r = new double[m.residualCount()];
            assertTrue(m.residuals(new double[] {R, PHI}, r));
            for (double v : r) {
                chi[seed - 1] += v * v;
            }
            FitRun.Result res = FitRun.run(p, new FitRun.Options(tmp.resolve("out" + seed), 2, false));
            double[] truth = {R, PHI};
            for (int i = 0; i < 2; i++) {
                cases++;
                if (Math.abs(res.best()[i] - truth[i]) <= 2 * res.sigma()[i]) {
                    inside++;
                }
            }
            log.append(String.format(Locale.ROOT, "seed %d: r %.3f+-%.3f phi %.2f+-%.2f chi2(truth) %.1f%n",
                    seed, res.best()[0], res.sigma()[0], res.best()[1], res.sigma()[1], chi[seed - 1]));
        }
        System.out.print(log);
        assertTrue(inside >= 0.8 * cases, inside + " of " + cases + " within 2 sigma\n" + log);
        ChiSquaredDistribution d = new ChiSquaredDistribution(dof);
        double mean = 0;
        for (double c : chi) {
            mean += c / SEEDS;
        }
        double var = 0;
        for (double c : chi) {
            var += (c - mean) * (c - mean) / (SEEDS - 1);
        }
        // the sample mean of 10 draws has standard error sqrt(2N / 10); allow 3 of them
        assertEquals(d.getNumericalMean(), mean, 3 * Math.sqrt(d.getNumericalVariance() / SEEDS), "mean chi2\n" + log);
        // sample variance of 10 draws: relative standard error about sqrt(2 / 9) (near-Gaussian); allow a factor 3
        assertTrue(var > d.getNumericalVariance() / 3 && var < 3 * d.getNumericalVariance(), "variance " + var + "\n" + log);
        for (double c : chi) {
            double cdf = d.cumulativeProbability(c);
            assertTrue(cdf > 1e-3 && cdf < 1 - 1e-3, "chi2 " + c + " in the tails of chi2(" + dof + ")\n" + log);
        }
    }

    static double interp(double[] t, double[] v, double x) {
        int j = 1;
        while (j < t.length - 1 && t[j] < x) {
            j++;
        }
        double f = (x - t[j - 1]) / (t[j] - t[j - 1]);
        return v[j - 1] + f * (v[j] - v[j - 1]);
    }
}
