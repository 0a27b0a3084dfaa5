package org.spindrift.sim.interferometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;

/**
 * Station gains, thermal noise and closure quantities on a synthetic five-station array observing
 * an asymmetric image (two offset points of different flux).
 */
class ObservationTest {
    static final double PIX = 1.0e-10;
    static final int N = 17;

    /** Frame times, M (10 s per M in the test set-up): 12 frames 20 minutes apart. */
    static double[] times() {
        double[] t = new double[12];
        for (int f = 0; f < t.length; f++) {
            t[f] = f * 120.0;
        }
        return t;
    }

    static double[][] vis(UvSampling s) {
        float[][] images = new float[s.frames()][N * N];
        for (float[] im : images) {
            im[8 * N + 8] = 1.0f;
            im[11 * N + 4] = 0.6f;
            im[3 * N + 12] = 0.3f;
        }
        double c = -(N - 1) / 2.0 * PIX;
        DirectFourier g = new DirectFourier(N, c, PIX, c, PIX, 1.0);
        double[] re = new double[s.size()], im = new double[s.size()];
        FrameVisibilities.compute(images, g, s.u, s.v, s.frameStart, re, im, 1);
        return new double[][] {re, im};
    }

    static double wrap(double a) {
        return FastMath.atan2(FastMath.sin(a), FastMath.cos(a));
    }

    @Test void closureQuantitiesAreUnchangedByStationGainAndPhaseErrors() {
        // closure phase: Jennison 1958; closure amplitude: Twiss, Carter & Little 1960 (station gains cancel)
        ObservingSetup o = TestArrays.setup(TestArrays.five(1e-9), 0.3, 60.0, 11);
        UvSampling s = UvSampling.of(o, times());
        assertTrue(s.size() > 30, "samples: " + s.size());
        double[][] v = vis(s);
        Observation obs = Observation.of(o, s, 2.0, v[0], v[1], 0.0);
        Closures.Phases cp = Closures.phases(s, 5, obs.re(), obs.im(), obs.sigma());
        Closures.Phases mp = Closures.phases(s, 5, obs.modelRe(), obs.modelIm(), obs.sigma());
        assertTrue(cp.size() > 10, "triangles: " + cp.size());
        double maxModel = 0, maxPhaseChange = 0;
        for (int k = 0; k < cp.size(); k++) {
            assertEquals(0.0, wrap(cp.value()[k] - mp.value()[k]), 1e-8, "closure phase row " + k);
            maxModel = FastMath.max(maxModel, FastMath.abs(mp.value()[k]));
        }
        for (int k = 0; k < s.size(); k++) {
            maxPhaseChange = FastMath.max(maxPhaseChange, FastMath.abs(wrap(FastMath.atan2(obs.im()[k], obs.re()[k])
                    - FastMath.atan2(obs.modelIm()[k], obs.modelRe()[k]))));
        }
        assertTrue(maxModel > 0.1, "the source has non-zero closure phases: " + maxModel);
        assertTrue(maxPhaseChange > 0.5, "the gains do change the visibility phases: " + maxPhaseChange);
        Closures.LogAmplitudes ca = Closures.logAmplitudes(s, 5, obs.re(), obs.im(), obs.sigma());
        Closures.LogAmplitudes ma = Closures.logAmplitudes(s, 5, obs.modelRe(), obs.modelIm(), obs.sigma());
        assertTrue(ca.size() > 10, "quadrangles: " + ca.size());
        for (int k = 0; k < ca.size(); k++) {
            assertEquals(ma.value()[k], ca.value()[k], 1e-8, "log closure amplitude row " + k);
        }
        // every triangle of stations observing together is there: C(m, 3) per frame with m stations up
        for (int f = 0; f < s.frames(); f++) {
            int pairs = s.frameStart[f + 1] - s.frameStart[f];
            int m = (int) FastMath.round((1 + FastMath.sqrt(1 + 8.0 * pairs)) / 2);
            int tri = 0, quad = 0;
            for (int k = 0; k < cp.size(); k++) {
                tri += cp.frame()[k] == f ? 1 : 0;
            }
            for (int k = 0; k < ca.size(); k++) {
                quad += ca.frame()[k] == f ? 1 : 0;
            }
            assertEquals(m * (m - 1) * (m - 2) / 6, tri, "triangles in frame " + f);
            assertEquals(2 * (m * (m - 1) * (m - 2) * (m - 3) / 24), quad, "two log closure amplitudes per quadrangle");
        }
    }

    @Test void pointAtTheOriginHasZeroClosurePhasesAndVisibilityEqualToItsFlux() {
        ObservingSetup o = TestArrays.setup(TestArrays.five(1e-9), 0.0, 0.0, 5);
        UvSampling s = UvSampling.of(o, times());
        float[][] images = new float[s.frames()][N * N];
        for (float[] im : images) {
            im[8 * N + 8] = 1.0f;
        }
        double c = -(N - 1) / 2.0 * PIX;
        double[] re = new double[s.size()], im = new double[s.size()];
        FrameVisibilities.compute(images, new DirectFourier(N, c, PIX, c, PIX, 1.0), s.u, s.v, s.frameStart, re, im, 2);
        Observation obs = Observation.of(o, s, 3.0, re, im, 0.0);
        for (int k = 0; k < s.size(); k++) {
            assertEquals(3.0, obs.modelRe()[k], 1e-12);
            assertEquals(0.0, obs.modelIm()[k], 1e-12);
        }
        Closures.Phases cp = Closures.phases(s, 5, obs.re(), obs.im(), obs.sigma());
        assertTrue(cp.size() > 0);
        for (double v : cp.value()) {
            assertEquals(0.0, v, 1e-9);
        }
    }

    @Test void thermalNoiseScatterOverSeedsMatchesTheRadiometerEquation() {
        // sigma = sqrt(SEFD1 SEFD2 / (2 dnu tau)) = sqrt(4000 * 9000 / (2 * 2e9 * 10)) = 0.03 Jy
        // (Thompson, Moran & Swenson 2017, eq. 6.50 form; arithmetic by hand)
        assertEquals(0.03, Radiometer.sigma(4000, 9000, 2e9, 10), 1e-15);
        ObservingSetup o = TestArrays.setup(TestArrays.five(6000), 0.0, 0.0, 0);
        UvSampling s = UvSampling.of(o, times());
        double[][] v = vis(s);
        double expected = Radiometer.sigma(6000, 6000, 2e9, 10);   // 0.03 Jy
        assertEquals(0.03, expected, 1e-15);
        double sum2 = 0;
        long count = 0;
        int seeds = 200;
        double[] mean = new double[s.size()];
        for (int seed = 1; seed <= seeds; seed++) {
            Observation obs = Observation.of(o.withSeed(seed), s, 2.0, v[0], v[1], 0.0);
            for (int k = 0; k < s.size(); k++) {
                double dr = obs.re()[k] - obs.modelRe()[k], di = obs.im()[k] - obs.modelIm()[k];
                sum2 += dr * dr + di * di;
                count += 2;
                mean[k] += dr / seeds;
            }
        }
        double measured = FastMath.sqrt(sum2 / count);
        // count ~ 2e4 draws: relative standard error of the rms ~ 1/sqrt(2 count) ~ 0.5%; allow 3%
        assertTrue(count > 10000, "draws: " + count);
        assertEquals(expected, measured, 0.03 * expected, "rms over seeds");
        double m = 0;
        for (double x : mean) {
            m = FastMath.max(m, FastMath.abs(x));
        }
        assertTrue(m < 5 * expected / FastMath.sqrt(seeds), "noise has zero mean: " + m);
    }
}
