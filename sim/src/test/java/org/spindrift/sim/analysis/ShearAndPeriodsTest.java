package org.spindrift.sim.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.history.SyntheticHistories;
import org.spindrift.sim.run.Evolution;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.run.TestScenarios;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.spacetime.CircularOrbits;

/**
 * Periods and shear shapes against published formulas and kinematic shear, on histories built in
 * memory: closed-form circular orbits, or particles evolved without a run folder.
 */
class ShearAndPeriodsTest {
    /** Synthetic circular histories: phi is exact, so T_phi only carries the slope fit's rounding. */
    static final double SYNTHETIC_REL = 1e-9;
    /** Evolved circular orbits at the scenario tolerance 1e-10 over a few orbits. */
    static final double EVOLVED_REL = 1e-7;
    /** Evolved circular orbits: drift of r in M over the run at that tolerance. */
    static final double EVOLVED_RADIUS_M = 1e-7;
    /** Bin means of exact phases: relative rounding plus an absolute floor for bins near zero lag. */
    static final double LAG_REL = 1e-6;
    static final double LAG_ABS = 1e-9;
    /** First-order kinematic shear at early times, a 0.3 M ball in 8 bins: 10 %. */
    static final double SHEAR_SLOPE_REL = 0.1;
    /** Landmark radii and derivatives are root-polished: closed forms agree far below this. */
    static final double LANDMARK_ABS = 1e-6;
    static final double OMEGA_DERIVATIVE_ABS = 1e-8;

    /** Prograde Kerr Omega = 1 / (r^1.5 + a) (Bardeen, Press & Teukolsky 1972, ApJ 178, 347, eq. 2.16). */
    static double omegaKerr(double r, double a) {
        return 1.0 / (Math.pow(r, 1.5) + a);
    }

    /** Evolves a scenario's particles in memory (no run folder). */
    static ParticleHistory evolve(LoadedScenario ls) {
        return Evolution.inMemory(ScenarioRun.prepare(ls), 2).history();
    }

    /** @return n radii spread evenly over [r0, r1] and random start azimuths (seeded) */
    static double[][] ring(int n, double r0, double r1, long seed) {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(seed);
        double[] r = new double[n];
        double[] phi = new double[n];
        for (int i = 0; i < n; i++) {
            r[i] = r0 + (r1 - r0) * (i + 0.5) / n;
            phi[i] = 2 * Math.PI * rnd.nextDouble();
        }
        return new double[][] {r, phi};
    }

    @Test void thinRingAzimuthalPeriodsAreTwoPiOverOmega() {
        // a synthetic history of circular orbits built in memory
        double a = 0.9;
        double[][] ring = ring(24, 6.0, 9.0, 3);
        ParticleHistory h = SyntheticHistories.circularKerr(ring[0], ring[1], a, SyntheticHistories.grid(300, 5));
        ParticlePeriods p = ParticlePeriods.of(h);
        for (int i = 0; i < h.particles(); i++) {
            double r = h.r(0)[i];
            double expected = 2 * Math.PI / omegaKerr(r, a);
            assertEquals(expected, p.periodPhi(i), SYNTHETIC_REL * expected, "T_phi at r = " + r);
            assertTrue(Double.isNaN(p.periodR(i)), "no radial oscillation on a circular orbit");
            assertTrue(Double.isNaN(p.periodTheta(i)), "no vertical oscillation in the equatorial plane");
        }
    }

    @Test void evolvedThinRingStaysCircularWithTheSamePeriods() {
        // the same check through the motion engine: a thin ring evolved in memory
        double a = 0.9;
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(a), List.of(TestScenarios.ring(24, 6.0, 9.0, 4.0)),
                300, 5, 3, 0);
        ParticleHistory h = evolve(ls);
        ParticlePeriods p = ParticlePeriods.of(h);
        for (int i = 0; i < h.particles(); i++) {
            double r = h.r(0)[i];
            double expected = 2 * Math.PI / omegaKerr(r, a);
            assertEquals(expected, p.periodPhi(i), EVOLVED_REL * expected, "T_phi at r = " + r);
            assertEquals(r, h.r(h.snapshots() - 1)[i], EVOLVED_RADIUS_M, "a circular orbit stays at its radius");
            assertTrue(Double.isNaN(p.periodR(i)), "no radial oscillation on a circular orbit");
        }
    }

    @Test void ringLagGrowsAsTheDifferenceOfAngularVelocities() {
        // a synthetic history of circular orbits built in memory
        double a = 0.5;
        double[][] ring = ring(300, 7.0, 9.0, 11);
        ParticleHistory h = SyntheticHistories.circularKerr(ring[0], ring[1], a, SyntheticHistories.grid(40, 5));
        int[] idx = new int[h.particles()];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        int bins = 10;
        LagProfile l0 = LagProfile.of(h.r(0), h.phi(0), idx, idx.length, bins);
        int s = h.snapshots() - 1;
        double t = h.time(s);
        LagProfile lt = LagProfile.of(h.r(s), h.phi(s), idx, idx.length, bins);
        // kinematic shear on circular orbits: each member's phi grows by Omega(r_i) t, so between two
        // bins the lag changes by -(<Omega>_b - <Omega>_0) t (common practice, no source); the bins
        // hold the same particles at both times (radii do not change)
        for (int b = 1; b < bins; b++) {
            double mb = meanOmegaInBin(h, b, bins, a);
            double m0 = meanOmegaInBin(h, 0, bins, a);
            double expected = -(mb - m0) * t;
            double measured = (lt.lag()[b] - lt.lag()[0]) - (l0.lag()[b] - l0.lag()[0]);
            assertEquals(expected, measured, LAG_REL * Math.abs(expected) + LAG_ABS, "bin " + b);
        }
        assertTrue(Double.isNaN(lt.stationaryRadius()), "Kerr Omega(r) is monotonic: no stationary lag");
    }

    /** Mean Omega over the members of equal-count bin b (members sorted by r). */
    private static double meanOmegaInBin(ParticleHistory h, int b, int bins, double a) {
        double[] r = h.r(0).clone();
        java.util.Arrays.sort(r);
        int m = r.length;
        int from = (int) ((long) b * m / bins);
        int to = (int) ((long) (b + 1) * m / bins);
        double s = 0;
        for (int k = from; k < to; k++) {
            s += omegaKerr(r[k], a);
        }
        return s / (to - from);
    }

    @Test void hotSpotLagFollowsTheShearRateAtEarlyTimes() {
        // a small ball with the shear velocity model: to first order in t the lag slope is
        // d(dphi)/dr = -(dOmega/dr)(r_c) t (kinematic shear, common practice), with
        // dOmega/dr = -1.5 r^0.5 / (r^1.5 + a)^2 from BPT 1972 eq. 2.16
        double a = 0.5;
        double rc = 10.0;
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.kerr(a),
                List.of(TestScenarios.hotSpot(600, rc, 0.3, new VelocityModel(VelocityModel.Kind.SHEAR, 0))), 30, 15, 5, 0);
        ParticleHistory h = evolve(ls);
        int[] idx = new int[h.particles()];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        double[] slopes = new double[3];
        for (int s = 0; s < 3; s++) {
            LagProfile lp = LagProfile.of(h.r(s), h.phi(s), idx, idx.length, 8);
            slopes[s] = ParticlePeriods.slope(lp.r(), lp.lag(), lp.r().length);
        }
        double dOmega = -1.5 * Math.sqrt(rc) / Math.pow(Math.pow(rc, 1.5) + a, 2);
        double t = h.time(2);
        double expected = -dOmega * t;
        double measured = slopes[2] - slopes[0];
        assertEquals(expected, measured, SHEAR_SLOPE_REL * Math.abs(expected), "lag slope growth over " + t + " M");
        // cross-check the landmark derivative of Omega against the closed form
        assertEquals(dOmega, CircularOrbits.omegaDerivative(org.spindrift.sim.scenario.ScenarioChecks.spacetime(ls), rc,
                true), OMEGA_DERIVATIVE_ABS);
    }

    @Test void lagIsStationaryAtTheOmegaMaximumOfAHorizonlessHayward() {
        // rotating Hayward a = 0.9, l = 1: Omega(r) peaks at r^3 = 10 l^2, r = 2.154 M (landmarks; derived
        // by hand in LandmarksTest, no published source); gas there leads, both arms trail: a V
        double rMax = Math.cbrt(10.0);
        LoadedScenario ls = TestScenarios.scenario(TestScenarios.horizonlessHayward(0.9, 1.0),
                List.of(TestScenarios.ring(600, 1.75, 2.65, 2.0)), 120, 20, 8, 0);
        ScenarioRun.Prepared p = ScenarioRun.prepare(ls);
        assertEquals(rMax, p.landmarks().get("omega_max_radius"), LANDMARK_ABS);
        ParticleHistory h = Evolution.inMemory(p, 2).history();
        List<ShearShape> shapes = ShearAnalysis.of(h, new int[] {0});
        ShearShape last = shapes.get(shapes.size() - 1);
        LagProfile lp = last.lag();
        double binWidth = (2.65 - 1.75) / lp.r().length;
        assertEquals(rMax, lp.stationaryRadius(), binWidth, "lag stationary at the Omega maximum");
        assertTrue(lp.innerArm() > 0 && lp.outerArm() > 0, "two arms");
        // both ends trail the stationary point (a V, not a monotonic lag)
        assertTrue(lp.lag()[0] > lp.lag()[lp.r().length / 2] && lp.lag()[lp.r().length - 1] > lp.lag()[lp.r().length / 2]);
    }
}
