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

    /** The run's ray table for a history seen with settings s around Kerr of spin a (2 threads). */
    static RayTable table(EmitterHistory h, Spacetime st, double a, LightSettings s) {
        TraceSettings ts = LightStage.traceSettings(h, st, s.camera(), captureRadius(a), s.fieldOfViewM(), true);
        return RayTable.trace(st, s.camera(), ts, 2);
    }
}
