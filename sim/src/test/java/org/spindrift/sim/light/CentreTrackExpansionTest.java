package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.fit.CompactModelVsRunTest;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioChecks;
import org.spindrift.sim.scenario.ScenarioLoader;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The centre's second-order expansion used by the compact-source model, on a circular equatorial
 * Kerr orbit (r = 8 M, a = 0.5): the Cartesian point moves on the circle of radius sqrt(r^2 + a^2)
 * (Boyer-Lindquist to Cartesian map, Boyer &amp; Lindquist 1967, J. Math. Phys. 8, 265) with the
 * angular velocity Omega = 1 / (r^3/2 + a) of Bardeen, Press &amp; Teukolsky 1972 (ApJ 178, 347,
 * eq. 2.16, recalled from memory), so |v| = R Omega, |acceleration| = R Omega^2 towards the axis,
 * and the 4-velocity is constant; the expansion about t reaches t + 0.5 M to the third-order term.
 */
class CentreTrackExpansionTest {
    /** Zeroth order of the expansion against the track at the same time: one interpolant, rounding only. */
    private static final double SAME_INTERPOLANT = 1e-12;
    /** Radius and speed of the interpolated track of an orbit integrated at 1e-10 (our choice: 1e-6 relative). */
    private static final double TRACK_REL = 1e-6;
    /**
     * Acceleration is the interpolant's second derivative: three orders less accurate than TRACK_REL (our
     * choice).
     */
    private static final double ACCELERATION_REL = 1e-3;
    /** Slope of a constant 4-velocity from the interpolant: the integration error over a sample spacing. */
    private static final double VELOCITY_SLOPE = 1e-8;
    /** Rounding and interpolation added to the third-order bound on the expanded position, M. */
    private static final double ROUNDING_M = 1e-9;

    @TempDir Path tmp;

    @Test
    void expansionFollowsTheCircularOrbit() throws Exception {
        Path file = tmp.resolve("c.yaml");
        Files.writeString(file, CompactModelVsRunTest.scenario("kerr", 0.5, "", 60));
        LoadedScenario ls = ScenarioLoader.load(file);
        Spacetime st = ScenarioChecks.spacetime(ls);
        double capture = Landmarks.of(st).captureRadius();
        CentreTrack track = org.spindrift.sim.fit.FitModel.centreTrack(ls.scenario(),
                org.spindrift.sim.scenario.SourceSetup.centres(ls.scenario(), st, capture), st, capture, 100.0, 0.36, 1.0e-10);
        double r = 8.0, a = 0.5;
        double big = Math.sqrt(r * r + a * a), omega = 1.0 / (Math.pow(r, 1.5) + a);
        double[] e = new double[17], p = new double[7], q = new double[7];
        for (double t = 3.1; t < 95; t += 7.3) {
            assertTrue(track.expansion(0, t, e));
            assertTrue(track.at(0, t, p));
            for (int c = 0; c < 3; c++) {
                assertEquals(p[c], e[c], SAME_INTERPOLANT, "position component " + c + " at t = " + t);
            }
            assertEquals(big, Math.hypot(e[0], e[1]), TRACK_REL * big, "radius at t = " + t);
            assertEquals(big * omega, Math.sqrt(e[3] * e[3] + e[4] * e[4] + e[5] * e[5]), TRACK_REL * big * omega,
                    "speed");
            double acc = Math.sqrt(e[6] * e[6] + e[7] * e[7] + e[8] * e[8]);
            assertEquals(big * omega * omega, acc, ACCELERATION_REL * big * omega * omega, "acceleration at t = " + t);
            // towards the axis
            assertTrue(e[6] * e[0] + e[7] * e[1] < 0, "acceleration points inwards");
            for (int c = 0; c < 4; c++) {
                assertEquals(0.0, e[13 + c], VELOCITY_SLOPE, "4-velocity slope " + c);
            }
            double dt = 0.5;
            assertTrue(track.at(0, t + dt, q));
            for (int c = 0; c < 3; c++) {
                double x = e[c] + dt * (e[3 + c] + 0.5 * dt * e[6 + c]);
                // third-order term R Omega^3 dt^3 / 6
                assertEquals(q[c], x, 2.0 * big * Math.pow(omega * dt, 3) / 6 + ROUNDING_M, "expanded position " + c);
            }
        }
        assertTrue(track.aliveThrough(0, 10.0, 20.0));
        assertFalse(track.aliveThrough(0, 90.0, 101.0), "beyond the track");
        assertFalse(track.expansion(0, 101.0, e));
    }
}
