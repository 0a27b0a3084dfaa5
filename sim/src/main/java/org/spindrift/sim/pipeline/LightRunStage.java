package org.spindrift.sim.pipeline;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.light.EmissionChoice;
import org.spindrift.sim.light.EmitterHistory;
import org.spindrift.sim.light.FrameBudget;
import org.spindrift.sim.light.FrameMoments;
import org.spindrift.sim.light.HistoryEmitters;
import org.spindrift.sim.light.LightOutputs;
import org.spindrift.sim.light.LightPlots;
import org.spindrift.sim.light.LightResult;
import org.spindrift.sim.light.LightSettings;
import org.spindrift.sim.light.LightStage;

/**
 * The light stage of {@code spindrift run}: ray table, frames, centroid track, light curve,
 * image cube, mock astrometry and their plots, written into the run folder; adds a {@code light}
 * object to the manifest and the summary; the {@link LightResult} goes to {@link StageResults#light()}.
 */
public final class LightRunStage implements RunStage {
    /** @return the spectral index of each source of a scenario, in its order */
    public static double[] spectralIndices(Scenario sc) {
        double[] alpha = new double[sc.sources().size()];
        for (int k = 0; k < alpha.length; k++) {
            alpha[k] = sc.sources().get(k).emission().spectralIndex();
        }
        return alpha;
    }

    @Override public String name() {
        return "light";
    }

    @Override public void run(RunContext ctx) throws IOException {
        LightSettings s = LightSettings.of(ctx.scenario());
        FrameBudget.check(s, ctx.history().time(0), ctx.history().time(ctx.history().snapshots() - 1),
                ctx.history().snapshots());
        // rays stop where particles do: the capture radius (manifest landmarks.capture_radius)
        double capture = ctx.landmark(org.spindrift.shared.archive.ArchiveLayout.LM_CAPTURE_RADIUS);
        EmitterHistory h = new HistoryEmitters(ctx.history(), spectralIndices(ctx.scenario()));
        if (ctx.progress()) {
            System.err.printf("spindrift: light: tracing %d x %d rays%n", s.pixels(), s.pixels());
        }
        EmissionChoice sum = EmissionChoice.of(ctx.scenario().imaging().emissionSum(), h, ctx.spacetime().spin(),
                LightStage.smoothingLength(s.camera()));
        LightResult r = LightStage.run(s, ctx.spacetime(), capture, h, ctx.threads(), sum.gridded());
        LightOutputs.write((name, w) -> ctx.archive().writeStream(name, w), r);
        LightPlots.write((name, w) -> ctx.archive().writeStream(name, w), r, RunNotes.guard(ctx));
        ctx.results().light(r);
        ObjectNode m = ctx.manifest().putObject(org.spindrift.shared.archive.ArchiveLayout.K_LIGHT);
        m.put("lensing", s.lensing());
        // what summed the emission: a grid per emission time, or the particles (also when a grid was
        // asked for but the sources have different spectral indices); with auto, the measure it went by
        m.put("emission_sum", sum.used());
        m.put("emission_sum_asked", sum.asked().key());
        m.put("grid_spacing_M", sum.gridSpacingM());
        if (Double.isFinite(sum.thinnestRmsM())) {
            m.put("thinnest_source_rms_M", sum.thinnestRmsM());
        }
        m.put("pixels", s.pixels());
        m.put("field_of_view_M", s.fieldOfViewM());
        m.put("pixel_uas", r.camera().pixelSize() * s.uasPerM());
        m.put("camera_distance_M", r.camera().distance());
        m.put("emission_radius_M", r.emissionRadius());
        m.put("smoothing_length_M", r.smoothingLength());
        m.put("rays", r.table().rays());
        m.put("samples", r.table().samples());
        m.put(org.spindrift.shared.archive.ArchiveLayout.K_FRAMES, r.timesM().length);
        m.put("time_origin", "observer time = emission coordinate time + ray delay; delay = elapsed coordinate"
                + " time from the camera plane at distance d minus d + 2 M ln(d/M)");
        m.put("steady_source_flux", r.steadyFlux());
        if (r.coveredFrom() <= r.coveredTo()) {
            m.putArray("fully_covered_min").add(r.coveredFrom() * s.minutesPerM()).add(r.coveredTo() * s.minutesPerM());
        } else {
            // the delays across the field span more than the run: no frame sees all the light
            m.putNull("fully_covered_min");
            RunNotes.warn(ctx, ctx.loaded().error("imaging.field_of_view_M", String.format(java.util.Locale.ROOT,
                    "no frame is fully covered: light delays across the field span %.4g M, more than the run's %.4g M,"
                            + " so every frame may miss light (use a smaller field of view or a longer run.duration)",
                    r.coveredFrom() - r.coveredTo() + ctx.history().time(ctx.history().snapshots() - 1)
                            - ctx.history().time(0), ctx.history().time(ctx.history().snapshots() - 1)
                            - ctx.history().time(0))).getMessage());
        }
        ObjectNode sm = ctx.summary().putObject("light");
        sm.put(org.spindrift.shared.archive.ArchiveLayout.K_FRAMES, r.timesM().length);
        if (r.timesM().length > 0) {
            sm.put("t_first_min", r.timesM()[0] * s.minutesPerM());
            sm.put("t_last_min", r.timesM()[r.timesM().length - 1] * s.minutesPerM());
        }
        double maxOff = 0, mean = 0, peak = 0;
        for (FrameMoments fm : r.moments()) {
            mean += fm.flux() / r.moments().size();
            peak = FastMath.max(peak, fm.flux());
        }
        // largest offset among frames brighter than 1% of the peak (fainter centroids are noise)
        for (FrameMoments fm : r.moments()) {
            if (!Double.isNaN(fm.x()) && fm.flux() >= 0.01 * peak) {
                maxOff = FastMath.max(maxOff, FastMath.hypot(fm.x(), fm.y()));
            }
        }
        sm.put("max_centroid_offset_uas", maxOff * s.uasPerM());
        sm.put("peak_over_mean_flux", mean > 0 ? peak / mean : 0.0);
    }
}
