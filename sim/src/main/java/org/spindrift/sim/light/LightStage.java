package org.spindrift.sim.light;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The light stage of a run (DESIGN section 7): traces the ray table once, renders the frames with
 * slow light, measures flux, centroid and moments, and applies the instrument (beam, steady
 * point source, astrometric noise).
 *
 * <p>Observer-time origin: t_o = t_e + delay, with the delay the ray's elapsed coordinate time
 * minus the flat travel time from the camera plane and the leading Shapiro term
 * (see {@link RayTracer}); a photon emitted at coordinate time t_e from the sky plane through the
 * hole far from it arrives at t_o = t_e. Frames cover the observer times for which every sample
 * sees an emission time inside the particle history, at the frame cadence (the snapshot cadence
 * when none is given).
 */
public final class LightStage {
    /** Sample spacing along rays in units of the smoothing length. */
    static final double SAMPLES_PER_H = 0.5;

    private LightStage() {
    }

    /**
     * Runs the stage.
     *
     * @param stopRadius inner stop radius of the rays (horizon plus margin, or surface), M
     * @param threads worker threads (the results do not depend on it)
     */
    public static LightResult run(LightSettings s, Spacetime st, double stopRadius, EmitterHistory history,
                                  int threads) {
        Camera cam = s.camera();
        double h = smoothingLength(cam);
        double rEm = emissionRadius(history, h, s.fieldOfViewM(), stopRadius);
        TraceSettings ts = TraceSettings.of(rEm, stopRadius, SAMPLES_PER_H * h, s.lensing())
                .withTolerance(1.0e-8, 1.0e-10);
        long t0 = System.nanoTime();
        RayTable table = RayTable.trace(st, cam, ts, threads);
        double secs = (System.nanoTime() - t0) * 1e-9;
        double[] times = frameTimes(history, table.delayRange(), s.frameCadenceM());
        int n = cam.pixels();
        float[][] images = new float[times.length][];
        List<FrameMoments> moments = new ArrayList<>(times.length);
        GaussianBeam beam = s.beamFwhmUas() > 0
                ? new GaussianBeam(s.beamFwhmUas() / (s.uasPerM() * cam.pixelSize()), n) : null;
        try (EmissionRenderer r = new EmissionRenderer(table, history, st, h, threads)) {
            for (int f = 0; f < times.length; f++) {
                float[] img = new float[n * n];
                r.render(times[f], img);
                moments.add(FrameMoments.of(img, cam));
                if (beam != null) {
                    beam.apply(img, img);
                }
                images[f] = img;
            }
        }
        double mean = 0;
        for (FrameMoments m : moments) {
            mean += m.flux();
        }
        mean /= FastMath.max(1, moments.size());
        // steady point source at the hole, flux ratio f to the mean flare flux: the apparent
        // centroid is F c / (F + F_s) (flux-weighted mean, common practice)
        double fs = s.steadyFluxRatio() * mean;
        double[] sx = new double[times.length];
        double[] sy = new double[times.length];
        for (int f = 0; f < times.length; f++) {
            FrameMoments m = moments.get(f);
            double tot = m.flux() + fs;
            sx[f] = tot > 0 && m.flux() > 0 ? m.flux() * m.x() / tot : 0.0;
            sy[f] = tot > 0 && m.flux() > 0 ? m.flux() * m.y() / tot : 0.0;
        }
        LightResult.MockAstrometry mock = s.noiseUas() > 0 ? mock(s, times, sx, sy) : null;
        return new LightResult(s, cam, times, moments, images, fs, sx, sy, mock, h, rEm,
                new LightResult.TableStats(table.rays(), table.samples(), table.steps(), secs));
    }

    /** Kernel smoothing length: one pixel, at least 0.1 M. */
    static double smoothingLength(Camera cam) {
        return FastMath.max(0.1, cam.pixelSize());
    }

    /**
     * Emission radius: the largest radius any alive particle reaches, plus the kernel support and
     * a margin, at least 3 M beyond the stop radius and at most the larger of the field of view
     * and 20 M (farther particles rarely lens into the field).
     */
    static double emissionRadius(EmitterHistory h, double smoothing, double fov, double stopRadius) {
        double rMax = 0;
        for (int s = 0; s < h.snapshots(); s++) {
            for (int p = 0; p < h.particles(); p++) {
                if (h.state(s, p) == EmitterHistory.ALIVE) {
                    rMax = FastMath.max(rMax, h.r(s, p));
                }
            }
        }
        double r = rMax + 2.0 * smoothing + 0.5;
        return FastMath.min(FastMath.max(r, stopRadius + 3.0), FastMath.max(fov, 20.0));
    }

    /** Frame times with full emission coverage, at the cadence (the snapshot cadence if NaN). */
    static double[] frameTimes(EmitterHistory h, double[] delays, double cadence) {
        int ns = h.snapshots();
        double first = h.time(0);
        double last = h.time(ns - 1);
        double dt = Double.isNaN(cadence) ? (last - first) / FastMath.max(1, ns - 1) : cadence;
        double lo = first + delays[1];
        double hi = last + delays[0];
        if (hi - lo < dt) {
            // the run is shorter than the spread of delays: render the whole span (edges partial)
            lo = first + delays[0];
            hi = last + delays[1];
        }
        int count = (int) FastMath.floor((hi - lo) / dt + 1e-9) + 1;
        double[] t = new double[count];
        for (int i = 0; i < count; i++) {
            t[i] = lo + i * dt;
        }
        return t;
    }

    private static LightResult.MockAstrometry mock(LightSettings s, double[] t, double[] x, double[] y) {
        double step = s.noiseCadenceMin() / s.minutesPerM();
        int count = (int) FastMath.floor((t[t.length - 1] - t[0]) / step + 1e-9) + 1;
        double sigma = s.noiseUas() / s.uasPerM();
        Random rng = new Random(s.seed() ^ 0x5DEECE66DL);   // own stream, fixed by the scenario seed
        double[] tm = new double[count], mx = new double[count], my = new double[count];
        for (int i = 0; i < count; i++) {
            double te = t[0] + i * step;
            tm[i] = te;
            mx[i] = interpolate(t, x, te) + sigma * rng.nextGaussian();
            my[i] = interpolate(t, y, te) + sigma * rng.nextGaussian();
        }
        return new LightResult.MockAstrometry(tm, mx, my, s.noiseUas());
    }

    /** Linear interpolation on an increasing grid. */
    static double interpolate(double[] t, double[] v, double te) {
        if (t.length == 1 || te <= t[0]) {
            return v[0];
        }
        int j = 1;
        while (j < t.length - 1 && t[j] < te) {
            j++;
        }
        double f = (te - t[j - 1]) / (t[j] - t[j - 1]);
        return v[j - 1] + FastMath.min(1.0, f) * (v[j] - v[j - 1]);
    }
}
