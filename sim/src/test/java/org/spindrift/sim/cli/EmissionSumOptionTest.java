package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchive;

/**
 * {@code imaging.emission_sum}: a run with the gridded sum says so in its manifest and scenario
 * echo, and its light curve follows the particle sum's; an unknown value is one line, exit 2.
 */
class EmissionSumOptionTest {
    @TempDir Path tmp;

    /** A spot a little wider than the pixel (the smoothing length, 0.75 M here). */
    static String scenario(String sum) {
        return scenario(sum, 0.8);
    }

    static String scenario(String sum, double sigma) {
        return DegenerateRunsTest.BASE.replace("SOURCE", DegenerateRunsTest.SPOT.replace("PARTICLES", "600")
                .replace("SIGMA", Double.toString(sigma))).replace("  pixels: 16", "  pixels: 32\n  emission_sum: " + sum);
    }

    private double[] lightCurve(String sum) throws Exception {
        Path file = tmp.resolve(sum + ".yaml");
        Files.writeString(file, scenario(sum));
        Path out = tmp.resolve("run-" + sum);
        String[] io = CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet", "--threads", "2");
        assertFalse(io[1].contains("Exception"), io[1]);
        try (RunArchive a = RunArchive.open(out, true)) {
            assertEquals(sum, a.manifest().path(ArchiveLayout.K_LIGHT).path("emission_sum").asText());
            assertEquals(sum, a.manifest().path(ArchiveLayout.K_SCENARIO).path("imaging").path("emission_sum").asText());
        }
        List<String> lines = Files.readAllLines(out.resolve(ArchiveLayout.LIGHTCURVE));
        List<String> head = List.of(lines.get(0).split(","));
        int col = head.indexOf("flux");
        double[] f = new double[lines.size() - 1];
        for (int i = 1; i < lines.size(); i++) {
            f[i - 1] = Double.parseDouble(lines.get(i).split(",")[col]);
        }
        return f;
    }

    @Test void gridRunFollowsTheParticleSum() throws Exception {
        double[] p = lightCurve("particles");
        double[] g = lightCurve("grid");
        assertEquals(p.length, g.length);
        double peak = 0, worst = 0;
        for (double v : p) {
            peak = Math.max(peak, v);
        }
        for (int i = 0; i < p.length; i++) {
            worst = Math.max(worst, Math.abs(g[i] - p[i]));
        }
        // the gridded kernel has the cubic spline's second moment (docs/methods.md); for a spot wider
        // than a pixel the light curves agree to a few per cent of the peak (the 3 % bound is our choice,
        // common practice, no source; measured: 0.77 % of the peak)
        assertTrue(worst <= 0.03 * peak, "largest flux difference " + worst / peak + " of the peak");
        assertTrue(peak > 0, "the spot is seen");
    }

    /**
     * auto: the grid for a spot at least one grid spacing (0.95 x 0.75 M here) wide, the particles for
     * a narrower one; the manifest names what was asked, what was used and the width it went by.
     */
    @Test void autoTakesTheGridOnlyForGasItResolves() throws Exception {
        for (double sigma : new double[] {0.8, 0.3}) {
            Path file = tmp.resolve("auto-" + sigma + ".yaml");
            Files.writeString(file, scenario("auto", sigma));
            Path out = tmp.resolve("run-auto-" + sigma);
            CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet", "--threads", "2");
            try (RunArchive a = RunArchive.open(out, true)) {
                var light = a.manifest().path(ArchiveLayout.K_LIGHT);
                assertEquals("auto", light.path("emission_sum_asked").asText());
                assertEquals("auto", a.manifest().path(ArchiveLayout.K_SCENARIO).path("imaging").path("emission_sum")
                        .asText());
                // a Gaussian spot's rms width along each axis is its sigma (the definition of sigma); 600
                // particles estimate it to ~ sigma / sqrt(2 x 600) = 3 % (common practice, no source)
                double w = light.path("thinnest_source_rms_M").asDouble();
                assertTrue(w > 0.85 * sigma && w <= 1.05 * sigma, "thinnest width " + w + " for sigma " + sigma);
                // spacing sqrt(0.9) h: the cloud-in-cell kernel's second moment s^2 / 3 equals the cubic
                // spline's 0.3 h^2 (Hockney & Eastwood 1988, ch. 5; Monaghan & Lattanzio 1985, eq. 2.4)
                assertEquals(0.75 * Math.sqrt(0.9), light.path("grid_spacing_M").asDouble(), 1e-12);
                assertEquals(sigma > 0.75 ? "grid" : "particles", light.path("emission_sum").asText());
            }
        }
    }

    @Test void unknownValueIsOneLineExitTwo() throws Exception {
        Path file = tmp.resolve("bad.yaml");
        Files.writeString(file, scenario("fast"));
        Path out = tmp.resolve("run-bad");
        String[] io = CliCapture.run(2, "run", file.toString(), "-o", out.toString(), "--quiet");
        assertEquals(1, io[1].strip().lines().count(), io[1]);
        assertTrue(io[1].contains("imaging.emission_sum"), io[1]);
        assertTrue(io[1].contains("grid"), io[1]);
        assertFalse(Files.exists(out), "nothing written");
    }
}
