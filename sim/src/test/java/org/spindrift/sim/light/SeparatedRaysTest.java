package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.Horizons;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The separated path (Mino time, x = 1/r, cos(theta)) against the general path (Hamilton's
 * equations with the full inverse metric in the affine parameter, MTW 1973 eq. 25.19: independent
 * code sharing only the camera), thread-count independence and allocation.
 */
class SeparatedRaysTest {
    /** Equatorial crossings of the two paths, M: a tenth of the light stage's 1e-3 M target. */
    private static final double CROSSING_POSITION = 1.0e-4;
    /** Delays, M: the step control holds t to 1e-8 of the 1e4 M travel time per step, over some 20 steps. */
    private static final double CROSSING_DELAY_MAX = 2.0e-3;
    /** The 99th percentile of the delay differences: a tenth of CROSSING_DELAY_MAX (our choice). */
    private static final double CROSSING_DELAY_99 = 2.0e-4;
    /** g at the crossings: the light stage's 1e-4 relative target. */
    private static final double CROSSING_REDSHIFT = 1.0e-4;

    private static final double D = 1.0e4;

    private static void agreesWithGeneralPath(Spacetime st, double inclination) {
        double stop = Horizons.outer(st) + 0.01;
        Camera cam = new Camera(inclination, 20.0, 16.0, 24, D);
        TraceSettings run = TraceSettings.of(8.0, stop, 0.1, true).withTolerance(1.0e-8, 1.0e-10);
        TraceSettings tight = run.withGeneralPath(true).withTolerance(1.0e-12, 1.0e-14);
        double isco = Landmarks.of(st).isco(true);
        RayAccuracy.Result r = RayAccuracy.compare(st, cam, run, tight, 1, isco);
        assertTrue(r.crossings()[0] > 150, "enough equatorial crossings: " + r.crossings()[0]);
        assertEquals(0, r.mismatched(), "rays with a different number of crossings");
        // the targets of the light stage: positions within 1e-3 M, g within 1e-4 relative (the
        // crossing point's error bounds the direct image's: the screen-to-equator map stretches)
        for (int c = 0; c < RayAccuracy.CROSSINGS; c++) {
            assertTrue(r.positionMax()[c] < CROSSING_POSITION,
                    "crossing points differ by " + r.positionMax()[c] + " M at " + c);
            // delays: the step control holds t to 1e-8 of the 1e4 M travel time from the camera plane per step
            assertTrue(r.delayMax()[c] < CROSSING_DELAY_MAX,
                    "delays differ by " + r.delayMax()[c] + " M at crossing " + c);
            assertTrue(r.redshiftMax()[c] < CROSSING_REDSHIFT,
                    "g differs by " + r.redshiftMax()[c] + " at crossing " + c);
        }
        assertTrue(r.position99()[0] < CROSSING_POSITION, "crossing points differ by " + r.position99()[0] + " M");
        assertTrue(r.delay99()[0] < CROSSING_DELAY_99, "delays differ by " + r.delay99()[0] + " M");
    }

    @Test
    void kerrImagePositionsDelaysAndRedshiftsMatchTheGeneralPath() {
        agreesWithGeneralPath(LightTestSupport.kerr(0.9), 60.0);
        agreesWithGeneralPath(LightTestSupport.kerr(-0.5), 80.0);
    }

    @Test
    void massFunctionFamilyMatchesTheGeneralPath() {
        // rotating Hayward metric (Bambi & Modesto 2013), a member of the mass-function family
        agreesWithGeneralPath(new MassFunctionSpacetime("hayward", 0.7, MassFunctions.hayward(0.4)), 45.0);
    }

    @Test
    void separatedPathIsUsedExceptNearThePoles() {
        Spacetime st = LightTestSupport.kerr(0.9);
        TraceSettings s = TraceSettings.of(8.0, LightTestSupport.captureRadius(0.9), 0.1, true);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        RayTracer tr = new RayTracer(st, s);
        tr.trace(y0, new Camera(60.0, 0.0, 16.0, 8, D).initialState(st, 3.0, 2.0, y0, g), 0.0, null);
        assertTrue(tr.lastSeparated(), "inclined view: separated path");
        tr.trace(y0, new Camera(0.0, 0.0, 16.0, 8, D).initialState(st, 3.0, 2.0, y0, g), 0.0, null);
        assertFalse(tr.lastSeparated(), "face-on view (rays along the axis): general path");
        RayTracer general = new RayTracer(st, s.withGeneralPath(true));
        general.trace(y0, new Camera(60.0, 0.0, 16.0, 8, D).initialState(st, 3.0, 2.0, y0, g), 0.0, null);
        assertFalse(general.lastSeparated(), "general path on request");
    }

    @Test
    void tableDoesNotDependOnTheThreadCount() {
        Spacetime st = LightTestSupport.kerr(0.9);
        Camera cam = new Camera(60.0, 20.0, 16.0, 24, D);
        TraceSettings s = TraceSettings.of(8.0, LightTestSupport.captureRadius(0.9), 0.2, true)
                .withTolerance(1.0e-8, 1.0e-10);
        RayTable a = RayTable.trace(st, cam, s, 1);
        RayTable b = RayTable.trace(st, cam, s, 3);
        assertTrue(a.samples() > 1000 && a.subRays() > 0, "samples and refined pixels exist");
        assertEquals(a.samples(), b.samples());
        assertEquals(a.steps(), b.steps());
        for (int k = 0; k < a.rays(); k++) {
            assertEquals(a.end(k), b.end(k));
            assertEquals(a.angularMomentum(k), b.angularMomentum(k));
            assertEquals(a.firstSample(k), b.firstSample(k));
        }
        assertArrayEquals(a.x, b.x);
        assertArrayEquals(a.y, b.y);
        assertArrayEquals(a.z, b.z);
        assertArrayEquals(a.delay, b.delay);
        assertArrayEquals(a.pr, b.pr);
        assertArrayEquals(a.pth, b.pth);
        assertArrayEquals(a.pph, b.pph);
        assertArrayEquals(a.dl, b.dl);
    }

    @Test
    void tracingDoesNotAllocatePerStep() {
        // common practice, no source: allocation-free inner loops (as the motion engine's test)
        java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
        org.junit.jupiter.api.Assumptions.assumeTrue(mx instanceof com.sun.management.ThreadMXBean,
                "allocation counter not available on this JVM");
        com.sun.management.ThreadMXBean tmx = (com.sun.management.ThreadMXBean) mx;
        Spacetime st = LightTestSupport.kerr(0.9);
        Camera cam = new Camera(60.0, 20.0, 16.0, 8, D);
        TraceSettings s = TraceSettings.of(8.0, LightTestSupport.captureRadius(0.9), 0.1, true);
        RayTracer tr = new RayTracer(st, s);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        SampleBuffer buf = new SampleBuffer(1 << 20);
        long[] bytes = new long[2];
        long[] steps = new long[2];
        int[] rays = {5, 100};
        for (int warm = 0; warm < 3; warm++) {
            for (int k = 0; k < 2; k++) {
                long before = tmx.getCurrentThreadAllocatedBytes();
                steps[k] = 0;
                for (int i = 0; i < rays[k]; i++) {
                    buf.size = 0;
                    double l = Camera.initialState(st, D * FastMath.sin(1.0), 0.3 + 0.05 * i, D * FastMath.cos(1.0),
                            FastMath.sin(1.0), 0.0, FastMath.cos(1.0), y0, g);
                    tr.trace(y0, l, 0.0, buf);
                    steps[k] += tr.lastSteps();
                }
                bytes[k] = tmx.getCurrentThreadAllocatedBytes() - before;
            }
        }
        assertTrue(tr.lastSeparated(), "the separated path was measured");
        assertTrue(steps[1] > 10 * steps[0], "the long run must take many more steps");
        assertTrue(bytes[1] - bytes[0] < 4096, "allocated " + bytes[0] + " B for " + steps[0] + " steps, "
                + bytes[1] + " B for " + steps[1] + " steps");
        assertTrue(cam.pixels() > 0);
    }

    @Test
    void captureCertificateNeverMissesATurningPoint() {
        // X(x) = x^4 R(1/x) for Kerr photons with E = 1 (Carter 1968; MTW eq. 33.33b), checked by
        // brute force on a fine grid wherever the bound certifies X > 0 (common practice, no source)
        double a = 0.9;
        MinoTimeEquations eq = new MinoTimeEquations((MassFunctionSpacetime) LightTestSupport.kerr(a));
        double x1 = 1.0 / LightTestSupport.captureRadius(a);
        SplittableRandom rnd = new SplittableRandom(7);
        int certified = 0;
        for (int n = 0; n < 3000; n++) {
            double l = rnd.nextDouble(-8.0, 8.0);
            double q = rnd.nextDouble(-1.0, 40.0);
            double x = rnd.nextDouble(0.05, x1);
            eq.setConstants(l, q);
            if (!eq.noTurningBefore(x, x1)) {
                continue;
            }
            certified++;
            double k = q + (l - a) * (l - a);
            double c = a * a - a * l;
            for (int i = 0; i <= 20000; i++) {
                double z = x + (x1 - x) * i / 20000.0;
                double big = (1 + c * z * z) * (1 + c * z * z) - k * z * z * (1 - 2 * z + a * a * z * z);
                assertTrue(big > 0, "turning point missed: L = " + l + ", Q = " + q + " at x = " + z);
            }
        }
        assertTrue(certified > 300, "the certificate holds for many rays: " + certified);
    }
}
