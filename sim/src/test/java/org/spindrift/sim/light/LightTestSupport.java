package org.spindrift.sim.light;

import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.MassFunctions;
import org.spindrift.sim.spacetime.Spacetime;

/** Shared helpers of the light tests. */
final class LightTestSupport {
    private LightTestSupport() {
    }

    static Spacetime kerr(double a) {
        return new MassFunctionSpacetime("kerr", a, MassFunctions.constant());
    }

    /** Outer Kerr horizon 1 + sqrt(1 - a^2) (Boyer &amp; Lindquist 1967), plus the project's capture margin. */
    static double captureRadius(double a) {
        return 1.0 + Math.sqrt(1.0 - a * a) + Landmarks.CAPTURE_MARGIN;
    }

    /** Traces the ray through screen point (alpha, beta) of the camera; returns its end. */
    static RayEnd traceScreen(Spacetime st, Camera cam, TraceSettings s, double alpha, double beta,
                              SampleBuffer buf) {
        RayTracer tr = new RayTracer(st, s);
        double[] y0 = new double[6];
        double[] g = new double[Spacetime.SIZE];
        double l = cam.initialState(st, alpha, beta, y0, g);
        return tr.trace(y0, l, RayTracer.delayOffset(cam.distance()), buf);
    }
}
