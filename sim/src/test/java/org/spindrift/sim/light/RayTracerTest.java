package org.spindrift.sim.light;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * Checks of the backward ray tracer beyond the Kerr metric. The checks against published results
 * (Kerr shadow edge, weak-field and exact deflection, face-on image radius) are rows of the
 * validation report ({@code spindrift validate}) and run in the validation module's build.
 */
class RayTracerTest {
    private static final double D = 1.0e4;
    /**
     * Agreement of two shadow edges of the same metric traced on different paths (Kerr: separated
     * equations; Johannsen-Psaltis: Hamilton's equations), M: the tracer holds each ray to 1e-9
     * relative, the bisection to 2^-40 of 5 M; 1e-6 M leaves margin (our choice).
     */
    private static final double SAME_EDGE = 1e-6;
    /** Smallest relative move of the shadow edge counted as a real change (our choice). */
    private static final double EDGE_MOVES = 0.01;

    private static double boundary(Spacetime st, Camera cam, TraceSettings s, double w, double lo, double hi) {
        return new ScreenProbe(st, cam, s).captureEdge(0.0, 0.0, w, lo, hi);
    }

    @Test
    void nonSeparableJohannsenPsaltisCameraWorksAndReducesToKerr() {
        double a = 0.5;
        Spacetime kerr = LightTestSupport.kerr(a);
        // Johannsen & Psaltis 2011 (Phys. Rev. D 83, 124015): epsilon_3 = 0 is the Kerr metric
        Spacetime jp0 = new org.spindrift.sim.spacetime.JohannsenPsaltisSpacetime(a, 0.0);
        Spacetime jp = new org.spindrift.sim.spacetime.JohannsenPsaltisSpacetime(a, 2.0);
        Camera cam = new Camera(60.0, 0.0, 20.0, 64, D);
        TraceSettings s = TraceSettings.of(20.0, LightTestSupport.captureRadius(a), 0.5, true);
        double w = 2.5;
        double bKerr = boundary(kerr, cam, s, w, 3.0, 8.0);
        double bJp0 = boundary(jp0, cam, s, w, 3.0, 8.0);
        assertEquals(bKerr, bJp0, SAME_EDGE, "JP with epsilon_3 = 0 casts the Kerr shadow");
        // the non-separable metric traces (no failed rays in the bisection) and the deformation
        // moves the shadow edge (its direction is not asserted: not checked against a source)
        double bJp = boundary(jp, cam, s, w, 2.0, 9.0);
        assertTrue(FastMath.abs(bJp - bKerr) > EDGE_MOVES * bKerr, "epsilon_3 = 2 moves the shadow edge: " + bJp);
    }
}
