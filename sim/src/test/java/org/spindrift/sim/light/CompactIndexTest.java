package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The compact model's shortcuts against the plain computations they replace: delay quantiles
 * by bisection over radius bins equal to {@link RayTable#delayQuantiles} (sorting the selected
 * delays) for random radial ranges, and the tabulated Gaussian against exp(-u) (Hipparchus).
 */
class CompactIndexTest {
    @Test
    void delayQuantilesEqualTheTablesOwn() {
        double a = 0.5;
        Spacetime st = LightTestSupport.kerr(a);
        Camera cam = new Camera(60.0, 0.0, 20.0, 32, LightSettings.CAMERA_DISTANCE_M);
        TraceSettings ts = TraceSettings.of(12.0, LightTestSupport.captureRadius(a), LightStage.smoothingLength(cam),
                true);
        RayTable table = RayTable.trace(st, cam, ts, 2);
        CompactSourceModel.Index index = new CompactSourceModel.Index(table, 0.5);
        SplittableRandom rng = new SplittableRandom(11);
        float[][] scratch = new float[2][];
        for (int i = 0; i < 40; i++) {
            double lo = rng.nextDouble(1.0, 11.0), hi = lo + rng.nextDouble(0.01, 6.0);
            double qa = rng.nextDouble(0.0, 0.2), qb = rng.nextDouble(0.8, 1.0);
            double[] want = table.delayQuantiles(lo, hi, qa, qb);
            double[] got = index.delayQuantiles(lo, hi, qa, qb, scratch);
            assertEquals(want[0], got[0], 0.0, "lower quantile in [" + lo + ", " + hi + "]");
            assertEquals(want[1], got[1], 0.0, "upper quantile in [" + lo + ", " + hi + "]");
        }
    }

    @Test
    void tabulatedGaussianWithinItsStatedError() {
        double worst = 0;
        for (int i = 0; i <= 80000; i++) {
            double u = i * (CompactSourceModel.CUT_SIGMAS * CompactSourceModel.CUT_SIGMAS / 2) / 80000 * 0.9999999;
            worst = FastMath.max(worst, FastMath.abs(CompactSourceModel.gaussian(u) / FastMath.exp(-u) - 1));
        }
        // linear interpolation error h^2 max|f''| / 8 relative to f for f = exp(-u), h = 1/512 (de Boor 1978, ch. II)
        assertEquals(0.0, worst, 1.0 / (512.0 * 512.0 * 8.0) * 1.001);
    }
}
