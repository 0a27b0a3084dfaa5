package org.spindrift.sim.pipeline;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.interferometry.FrameObservation;
import org.spindrift.sim.interferometry.InterferometryOutputs;
import org.spindrift.sim.interferometry.InterferometryPlots;
import org.spindrift.sim.interferometry.InterferometryResult;
import org.spindrift.sim.interferometry.ObservingSetup;
import org.spindrift.sim.light.LightResult;

/**
 * The interferometry stage of {@code spindrift run} (only when the scenario has an
 * {@code interferometer} section): (u, v) samples of the light stage's frames, model visibilities
 * of the unbeamed images plus the steady point source, station gains and thermal noise, closure
 * phases and log closure amplitudes ({@link FrameObservation}), their files and plots, and an
 * {@code interferometer} object in the manifest and the summary.
 */
public final class InterferometryRunStage implements RunStage {
    @Override public String name() {
        return "interferometer";
    }

    @Override public void run(RunContext ctx) throws IOException {
        if (ctx.scenario().interferometer() == null) {
            return;
        }
        LightResult r = ctx.results().light();
        if (r == null) {
            return;
        }
        if (ctx.progress()) {
            System.err.printf("spindrift: interferometer: %d frames, %d stations%n", r.timesM().length,
                    ctx.scenario().interferometer().stations().size());
        }
        ObservingSetup o = ObservingSetup.of(ctx.scenario());
        InterferometryResult res = FrameObservation.observe(o, r, ctx.scenario().name(), ctx.threads());
        InterferometryOutputs.write((n, w) -> ctx.archive().writeStream(n, w), res);
        InterferometryPlots.write((n, w) -> ctx.archive().writeStream(n, w), res, RunNotes.guard(ctx));
        ctx.results().interferometry(res);
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
