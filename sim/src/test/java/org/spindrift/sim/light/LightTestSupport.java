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

    /**
     * A spot of 2000 particles (size 0.4 M, spectral index alpha) on a circular orbit at r = 6 M around
     * Kerr a = 0.5, seen at i = 60 deg on 48 x 48 pixels over 20 M, with the run's ray table and
     * {@code frames} observer times spread over the fully covered interval.
     */
    record SpotScene(Spacetime spacetime, CircularSpotHistory history, Camera camera, double smoothing,
                     RayTable table, double[] times) {
        static SpotScene of(double alpha, int frames) {
            double a = 0.5;
            Spacetime st = kerr(a);
            CircularSpotHistory h = new CircularSpotHistory(st, 6.0, 0.3, 0.4, 2000, 0.0, 200.0, 101, alpha, 5L);
            LightSettings s = new LightSettings(60.0, 0.0, 20.0, 48, 2.0, true, 1.0e6, 1.0e-3, 0.0, 0.0, 0.0, 1.0, 7L);
            Camera cam = s.camera();
            RayTable table = LightTestSupport.table(h, st, a, s);
            double[] d = table.delayRange();
            double tA = h.time(0) + d[1], tB = h.time(h.snapshots() - 1) + d[0];
            double[] times = new double[frames];
            for (int f = 0; f < frames; f++) {
                times[f] = tA + (tB - tA) * f / (frames - 1);
            }
            return new SpotScene(st, h, cam, LightStage.smoothingLength(cam), table, times);
        }

        /** @return a renderer of this scene ({@link EmissionRenderer}'s full constructor) */
        EmissionRenderer renderer(int threads, boolean reference, boolean gridded) {
            return new EmissionRenderer(table, history, spacetime, smoothing, threads, reference, gridded);
        }

        /** @return every frame rendered by r, one image per time */
        float[][] frames(EmissionRenderer r) {
            int n = camera.pixels();
            float[][] out = new float[times.length][n * n];
            for (int f = 0; f < times.length; f++) {
                r.render(times[f], out[f]);
            }
            return out;
        }
    }
}
