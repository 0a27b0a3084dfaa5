package org.spindrift.sim.interferometry;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.Units;
import org.spindrift.sim.light.Camera;
import org.spindrift.sim.light.FrameMoments;
import org.spindrift.sim.light.LightResult;
import org.spindrift.sim.light.LightRunStage;
import org.spindrift.sim.light.LightSettings;
import org.spindrift.sim.run.RunContext;
import org.spindrift.sim.run.RunNotes;
import org.spindrift.sim.run.RunStage;

/**
 * The interferometry stage of {@code spindrift run} (only when the scenario has an
 * {@code interferometer} section): (u, v) samples of the light stage's frames, model visibilities
 * of the unbeamed images plus the steady point source, station gains and thermal noise, closure
 * phases and log closure amplitudes, their files and plots, and an {@code interferometer} object in
 * the manifest and the summary.
 */
public final class InterferometryStage implements RunStage {
    /** Key of the {@link InterferometryResult} in the run's products. */
    public static final String RESULT = "interferometer";

    @Override public String name() {
        return "interferometer";
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

    @Override public void run(RunContext ctx) throws IOException {
        if (ctx.scenario().interferometer() == null) {
            return;
        }
        LightResult r = ctx.product(LightRunStage.RESULT, LightResult.class);
        if (r == null) {
            return;
        }
        if (ctx.progress()) {
            System.err.printf("spindrift: interferometer: %d frames, %d stations%n", r.timesM().length,
                    ctx.scenario().interferometer().stations().size());
        }
        ObservingSetup o = ObservingSetup.of(ctx.scenario());
        InterferometryResult res = observe(o, r, ctx.scenario().name(), ctx.threads());
        InterferometryOutputs.write((n, w) -> ctx.archive().writeStream(n, w), res);
        InterferometryPlots.write((n, w) -> ctx.archive().writeStream(n, w), res, RunNotes.guard(ctx));
        ctx.products().put(RESULT, res);
        ObjectNode m = ctx.manifest().putObject("interferometer");
        m.put("stations", o.array().stations());
        m.put("visibilities", res.sampling().size());
        m.put("closure_phases", res.phases().size());
        m.put("log_closure_amplitudes", res.amplitudes().size());
        m.put("jy_per_image_flux", res.jyPerFlux());
        m.put("steady_source_jy", res.observation().steadyJy());
        m.put("max_baseline_lambda", res.sampling().maxBaseline());
        m.put("wavelength_m", o.wavelength());
        m.put("seed", o.seed());
        m.put("noise", "radiometer equation sigma = sqrt(SEFD_1 SEFD_2 / (2 bandwidth integration)) per real and"
                + " imaginary part; station gains per scan");
        ObjectNode sm = ctx.summary().putObject("interferometer");
        sm.put("visibilities", res.sampling().size());
        double snr = 0;
        for (int k = 0; k < res.sampling().size(); k++) {
            snr = FastMath.max(snr, FastMath.hypot(res.observation().modelRe()[k], res.observation().modelIm()[k])
                    / res.observation().sigma()[k]);
        }
        sm.put("max_snr", snr);
        double cpMax = 0;
        for (double v : res.modelPhases().value()) {
            cpMax = FastMath.max(cpMax, FastMath.abs(v));
        }
        sm.put("max_abs_model_closure_phase_deg", FastMath.toDegrees(cpMax));
    }
}
