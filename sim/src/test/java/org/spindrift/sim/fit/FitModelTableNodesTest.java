package org.spindrift.sim.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A free spin is put on a grid of table values: a fit that moves it traces one table per grid
 * value visited, and the linear interpolation between grid values stays within the model's own
 * accuracy of the model evaluated at the exact spin.
 */
class FitModelTableNodesTest {
    @TempDir Path tmp;

    @Test void freeSpinTracesOneTablePerGridValueAndInterpolatesClosely() throws Exception {
        Files.writeString(tmp.resolve("truth.yaml"), CompactModelVsRunTest.scenario("kerr", 0.5, "", 45, 0, 32));
        StringBuilder csv = new StringBuilder("t_obs_min,x_uas,y_uas,sigma_uas\n");
        for (int e = 0; e < 12; e++) {
            csv.append(String.format(Locale.ROOT, "%.4f,0,0,1%n", 4.0 + 0.5 * e));
        }
        Files.writeString(tmp.resolve("data.csv"), csv.toString());
        Path fit = tmp.resolve("fit.yaml");
        Files.writeString(fit, String.join("\n",
                "scenario: truth.yaml",
                "data: {astrometry: data.csv}",
                "free:",
                "  - {key: \"sources[0].orbit.circular.radius_M\", min: 6.5, max: 10, start: 8}",
                "  - {key: black_hole.spin, min: 0.3, max: 0.7, start: 0.5}",
                "method: {kind: least_squares, starts: 1, seed: 1}",
                ""));
        FitRun.Prepared p = FitRun.prepare(fit, 2);
        FitModel m = new FitModel(p.fit(), p.data(), p.cache());
        int before = p.cache().tablesTraced();
        double worst = 0, radius = 0;
        for (int k = 0; k <= 12; k++) {
            double spin = 0.5 + 0.0008 * k;     // inside one grid interval [0.50, 0.51]
            FitModel.Prediction g = m.predict(new double[] {8.0, spin});
            if (k == 6) {
                // against the model at the exact spin (a table of its own)
                FitModel.Prediction e = m.predictAt(new double[] {8.0, spin});
                for (int i = 0; i < g.x().length; i++) {
                    worst = Math.max(worst, Math.hypot(g.x()[i] - e.x()[i], g.y()[i] - e.y()[i]));
                    radius = Math.max(radius, Math.hypot(e.x()[i], e.y()[i]));
                }
            }
        }
        // the 13 spins need the grid tables 0.50 (traced by prepare, at the start values) and 0.51,
        // plus the exact-spin table of the comparison
        assertEquals(2, p.cache().tablesTraced() - before, "tables traced");
        assertTrue(radius > 0, "the spot is seen");
        // The orbit itself changes smoothly (Omega = 1/(r^1.5 + a), Bardeen et al. 1972: the phase moves
        // by about 3e-3 rad per 0.01 of spin over this orbit), so the interpolation's own error is of
        // order 1e-5; what differs is the sampling of each table: a table traced at another spin
        // samples the image differently, a scatter of the model's own size (about 1 % of the track
        // radius against a full run, CompactModelVsRunTest). Measured here: 1.2 %. The grid keeps that
        // scatter out of the derivatives a fit takes within one grid interval.
        assertTrue(worst <= 0.02 * radius, "interpolation error " + worst / radius + " of the track radius");
    }
}
