package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.util.FastMath;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.history.SyntheticHistories;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The light stage on a particle history built in memory (no scenario, no run folder): a uniform
 * ring of particles on one circular orbit, seen face-on.
 */
class HistoryEmittersTest {
    /** Flux and centroid scatter allowed over the covered frames: discreteness of 720 particles (common practice, no source). */
    static final double STEADY_TOLERANCE = 0.01;

    /** @param gridded the gridded emission sum ({@link GriddedEmission}) instead of the particle sum */
    @ParameterizedTest(name = "gridded = {0}")
    @ValueSource(booleans = {false, true})
    void faceOnUniformRingIsSteadyCentredAtThePrimaryImageRadius(boolean gridded) {
        double re = 10.0;
        Spacetime st = LightTestSupport.kerr(0.0);
        double period = 2 * FastMath.PI * FastMath.pow(re, 1.5); // 2 pi r^1.5 (BPT 1972 eq. 2.16 at a = 0)
        int n = 720;
        double[] r = new double[n];
        double[] phi = new double[n];
        for (int i = 0; i < n; i++) {
            r[i] = re;
            phi[i] = 2 * FastMath.PI * i / n;
        }
        ParticleHistory h = SyntheticHistories.circularKerr(r, phi, 0.0, SyntheticHistories.grid(1.2 * period, period / 100));
        LightSettings s = new LightSettings(0.0, 0.0, 30.0, 64, period / 20.0, true, 1.0e6, 1.0e-3, 0.0, 0.0, 0.0,
                1.0, 7L);
        LightResult res = LightStage.run(s, st, LightTestSupport.captureRadius(0.0), new HistoryEmitters(h,
                new double[] {1.0}), 2, gridded);
        Camera cam = res.camera();
        int px = cam.pixels();
        double expected = SchwarzschildRays.faceOnImpactParameter(re);
        double fluxSum = 0;
        int covered = 0;
        for (int f = 0; f < res.timesM().length; f++) {
            if (res.covered(f)) {
                fluxSum += res.moments().get(f).flux();
                covered++;
            }
        }
        assertTrue(covered >= 5, "covered frames: " + covered);
        double mean = fluxSum / covered;
        for (int f = 0; f < res.timesM().length; f++) {
            if (!res.covered(f)) {
                continue;
            }
            FrameMoments m = res.moments().get(f);
            // an axisymmetric ring on circular orbits is stationary: constant flux, centroid on the axis
            // (symmetry; common practice, no source)
            assertEquals(mean, m.flux(), STEADY_TOLERANCE * mean, "flux of frame " + f);
            assertEquals(0.0, FastMath.hypot(m.x(), m.y()), STEADY_TOLERANCE * re, "centroid of frame " + f);
            // flux-weighted radius of the primary image (pixels beyond 8 M, outside the photon-ring region)
            // against the Darwin 1959 / Luminet 1979 quadrature (SchwarzschildRays.faceOnImpactParameter)
            float[] img = res.images()[f];
            double w = 0, sb = 0;
            for (int row = 0; row < px; row++) {
                for (int col = 0; col < px; col++) {
                    double b = FastMath.hypot(cam.skyX(col), cam.skyY(row));
                    if (b > 8.0) {
                        w += img[row * px + col];
                        sb += img[row * px + col] * b;
                    }
                }
            }
            assertEquals(expected, sb / w, 0.02 * expected, "primary image radius, frame " + f);
        }
    }
}
