package org.spindrift.sim.interferometry;

import org.hipparchus.util.FastMath;
import org.spindrift.shared.Units;
import org.spindrift.sim.light.Camera;
import org.spindrift.sim.light.FrameMoments;
import org.spindrift.sim.light.LightResult;
import org.spindrift.sim.light.LightSettings;

/**
 * Observes the light stage's frames with an array: (u, v) samples of the frames, model visibilities
 * of the unbeamed images plus the steady point source, station gains and thermal noise, closure
 * phases and log closure amplitudes.
 */
public final class FrameObservation {
    private FrameObservation() {
    }

    /**
     * Runs the observation of the light stage's frames.
     *
     * @param name scenario name (UVFITS OBJECT)
     */
    public static InterferometryResult observe(ObservingSetup o, LightResult r, String name, int threads) {
        LightSettings s = r.settings();
        UvSampling uv = UvSampling.of(o, r.timesM());
        DirectFourier grid = grid(r.camera(), s.uasPerM() / Units.UAS_PER_RAD);
        double[] re = new double[uv.size()], im = new double[uv.size()];
        FrameVisibilities.compute(r.rawImages(), grid, uv.u, uv.v, uv.frameStart, re, im, threads);
        double peak = 0;
        for (FrameMoments m : r.moments()) {
            peak = FastMath.max(peak, m.flux());
        }
        double scale = peak > 0 ? o.peakFluxJy() / peak : 0.0;
        Observation obs = Observation.of(o, uv, scale, re, im, r.steadyFlux());
        int ns = o.array().stations();
        Closures.Phases cp = Closures.phases(uv, ns, obs.re(), obs.im(), obs.sigma());
        Closures.Phases mp = Closures.phases(uv, ns, obs.modelRe(), obs.modelIm(), obs.sigma());
        Closures.LogAmplitudes ca = Closures.logAmplitudes(uv, ns, obs.re(), obs.im(), obs.sigma());
        Closures.LogAmplitudes ma = Closures.logAmplitudes(uv, ns, obs.modelRe(), obs.modelIm(), obs.sigma());
        Closures.Phases sp = null;
        Closures.LogAmplitudes sa = null;
        if (obs.steadyJy() > 0) {
            double[] sr = new double[uv.size()];
            java.util.Arrays.fill(sr, obs.steadyJy());
            double[] si = new double[uv.size()];
            sp = Closures.phases(uv, ns, sr, si, obs.sigma());
            sa = Closures.logAmplitudes(uv, ns, sr, si, obs.sigma());
        }
        return new InterferometryResult(o, uv, obs, cp, mp, sp, ca, ma, sa, scale, s.minutesPerM(), name);
    }

    /** @return the direct Fourier transform of the camera's pixel grid (x east, y north, rad) */
    public static DirectFourier grid(Camera cam, double radPerM) {
        int n = cam.pixels();
        double px = cam.pixelSize();
        return new DirectFourier(n, cam.skyX(0) * radPerM, -px * radPerM, cam.skyY(0) * radPerM, px * radPerM,
                px * px);
    }
}
