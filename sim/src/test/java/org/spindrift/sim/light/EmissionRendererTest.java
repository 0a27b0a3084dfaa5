package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.analysis.integration.SimpsonIntegrator;
import org.junit.jupiter.api.Test;

/**
 * The frame renderer (group test of 32 samples) against the reference renderer (every sample
 * queried): the test skips only samples that find no particle, so the images agree bit for bit;
 * and the kernel's normalisation.
 */
class EmissionRendererTest {
    /**
     * Frames already equal bit for bit; moments and pixels again at 1e-9 so a reordered sum stays within
     * rounding.
     */
    private static final double SAME_FRAMES_REL = 1e-9;
    /** Simpson quadrature held to 1e-12 relative on each of the two smooth pieces of the kernel. */
    private static final double KERNEL_INTEGRAL = 1e-10;

    /** Frames of a spot of 2000 particles, a = 0.5, i = 60 deg, 48 x 48, from both renderers. */
    @Test
    void framesMatchTheReferenceRendererAndDoNotDependOnTheThreadCount() {
        // alpha = 1 (g^3 without pow) and alpha = 0.5 (g^2.5 by pow)
        for (double alpha : new double[] {1.0, 0.5}) {
            LightTestSupport.SpotScene sc = LightTestSupport.SpotScene.of(alpha, 8);
            Camera cam = sc.camera();
            int frames = sc.times().length, n = cam.pixels();
            float[][] fast1, fast2, ref;
            try (EmissionRenderer r1 = sc.renderer(1, false, false);
                 EmissionRenderer r2 = sc.renderer(2, false, false);
                 EmissionRenderer rr = sc.renderer(2, true, false)) {
                fast1 = sc.frames(r1);
                fast2 = sc.frames(r2);
                ref = sc.frames(rr);
            }
            double peak = 0;
            for (int f = 0; f < frames; f++) {
                assertArrayEquals(fast1[f], fast2[f], "frame " + f + " independent of the thread count");
                peak = Math.max(peak, FrameMoments.of(ref[f], cam).flux());
            }
            assertTrue(peak > 0, "the spot is seen");
            for (int f = 0; f < frames; f++) {
                assertArrayEquals(ref[f], fast1[f], "frame " + f + " equals the reference renderer's");
                FrameMoments mf = FrameMoments.of(fast1[f], cam), mr = FrameMoments.of(ref[f], cam);
                // and so do the frames' moments (the quantities the outputs report)
                assertEquals(mr.flux(), mf.flux(), SAME_FRAMES_REL * peak, "flux of frame " + f);
                if (mr.flux() > 0.01 * peak) {
                    assertEquals(mr.x(), mf.x(), SAME_FRAMES_REL, "centroid x of frame " + f);
                    assertEquals(mr.y(), mf.y(), SAME_FRAMES_REL, "centroid y of frame " + f);
                }
                for (int k = 0; k < n * n; k++) {
                    assertEquals(ref[f][k], fast1[f][k], SAME_FRAMES_REL * Math.abs(ref[f][k]) + 1e-30f, "pixel " + k);
                }
            }
        }
    }

    /**
     * The kernel normalised by 1/(pi h^3) integrates to 1 over its support (Monaghan &amp; Lattanzio
     * 1985, A&amp;A 149, 135, eq. 2.4 and its normalisation; quadrature by Hipparchus' Simpson
     * integrator), and vanishes from r = 2h on.
     */
    @Test
    void kernelIsNormalised() {
        double h = 0.3;
        double invH = 1 / h, norm = Kernel.norm(h);
        SimpsonIntegrator simpson = new SimpsonIntegrator(1e-12, 1e-14, 3, 30);
        double inner = simpson.integrate(1_000_000, r -> 4 * Math.PI * r * r * Kernel.w(r * r, invH, norm), 0, h);
        double outer = simpson.integrate(1_000_000, r -> 4 * Math.PI * r * r * Kernel.w(r * r, invH, norm), h, 2 * h);
        assertEquals(1.0, inner + outer, KERNEL_INTEGRAL, "integral of W over space");
        assertEquals(0.0, Kernel.w(4 * h * h, invH, norm), 0.0, "zero at r = 2h");
    }
}
