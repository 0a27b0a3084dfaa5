package org.spindrift.sim.light;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.run.RunContext;
import org.spindrift.sim.run.RunNotes;
import org.spindrift.sim.run.RunStage;
import org.spindrift.sim.scenario.ScenarioChecks;

/**
 * The light stage of {@code spindrift run}: ray table, frames, centroid track, light curve,
 * image cube, mock astrometry and their plots, written into the run folder; adds a {@code light}
 * object to the manifest and the summary.
 */
public final class LightRunStage implements RunStage {
    /** Key of the {@link LightResult} in the run's products. */
    public static final String RESULT = "light";

    /** Largest image cube kept in memory, in pixels (frames x N^2), about 2 GB of floats. */
    public static final long MAX_CUBE_PIXELS = 500_000_000L;

    /**
     * The image budget: frame cadences and image sizes whose cube would not fit in memory
     * (estimated from the run span plus a generous delay spread of 200 M) are refused. Checked by
     * {@code check} and before {@code run} starts.
     *
     * @return the problem in words, or null when the cube fits
     */
    public static String budgetProblem(LightSettings s, double t0, double t1, int snapshots) {
        double frames = frameEstimate(s, t0, t1, snapshots);
        double cube = frames * s.pixels() * (double) s.pixels() * (s.beamFwhmUas() > 0 ? 2 : 1);
        if (cube > MAX_CUBE_PIXELS) {
            return String.format(java.util.Locale.ROOT, "about %.3g frames of %d x %d pixels%s exceed the image"
                    + " budget of %d pixels; use a longer frame_cadence or fewer pixels", frames, s.pixels(), s.pixels(),
                    s.beamFwhmUas() > 0 ? " (twice: with and without the beam)" : "", MAX_CUBE_PIXELS);
        }
        return null;
    }

    /**
     * @return an upper estimate of the number of frames (the emission window widened by the largest
     *     expected delay spread of 200 M), before any ray is traced
     */
    public static double frameEstimate(LightSettings s, double t0, double t1, int snapshots) {
        double cadence = Double.isNaN(s.frameCadenceM()) ? (t1 - t0) / Math.max(1, snapshots - 1) : s.frameCadenceM();
        return (t1 - t0 + 200.0) / cadence + 1;
    }

    static void checkBudget(LightSettings s, double t0, double t1, int snapshots) {
        String problem = budgetProblem(s, t0, t1, snapshots);
        if (problem != null) {
            throw new org.spindrift.shared.UserInputException("imaging.frame_cadence / imaging.pixels: " + problem);
        }
    }

    @Override public String name() {
        return "light";
    }

    @Override public void run(RunContext ctx) throws IOException {
        LightSettings s = LightSettings.of(ctx.scenario());
        checkBudget(s, ctx.history().time(0), ctx.history().time(ctx.history().snapshots() - 1),
                ctx.history().snapshots());
        // rays stop where particles do: the capture radius (manifest landmarks.capture_radius)
        double capture = ctx.landmark(org.spindrift.shared.archive.ArchiveLayout.LM_CAPTURE_RADIUS);
        EmitterHistory h = new HistoryEmitters(ctx.history(), ctx.scenario().sources());
        if (ctx.progress()) {
            System.err.printf("spindrift: light: tracing %d x %d rays%n", s.pixels(), s.pixels());
        }
        LightResult r = LightStage.run(s, ctx.spacetime(), capture, h, ctx.threads());
        LightOutputs.write((name, w) -> ctx.archive().writeStream(name, w), r);
        LightPlots.write((name, w) -> ctx.archive().writeStream(name, w), r, RunNotes.guard(ctx));
        ctx.products().put(RESULT, r);
        ObjectNode m = ctx.manifest().putObject("light");
        m.put("lensing", s.lensing());
        m.put("pixels", s.pixels());
        m.put("field_of_view_M", s.fieldOfViewM());
        m.put("pixel_uas", r.camera().pixelSize() * s.uasPerM());
        m.put("camera_distance_M", r.camera().distance());
        m.put("emission_radius_M", r.emissionRadius());
        m.put("smoothing_length_M", r.smoothingLength());
        m.put("rays", r.table().rays());
        m.put("samples", r.table().samples());
        m.put("frames", r.timesM().length);
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
        sm.put("frames", r.timesM().length);
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
