package org.spindrift.sim.light;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.hipparchus.util.FastMath;
import org.spindrift.sim.history.Chunked;
import org.spindrift.sim.spacetime.MassFunctionSpacetime;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The light stage of a run: traces the ray table once, renders the frames with
 * slow light, measures flux, centroid and moments, and applies the instrument (beam, steady
 * point source, astrometric noise).
 *
 * <p>Observer-time origin: t_o = t_e + delay, with the delay the ray's elapsed coordinate time
 * minus the flat travel time from the camera plane and the leading Shapiro term
 * (see {@link RayTracer}); a photon emitted at coordinate time t_e from the sky plane through the
 * hole far from it arrives at t_o = t_e. Frames run at the frame cadence (the snapshot cadence
 * when none is given) from t_first + d_lo to t_last + d_hi, where t_first, t_last are the first
 * and last snapshot times and d_lo, d_hi the 2nd and 98th percentiles of the delays of the
 * samples in the radial range the gas occupies; emission before the first and after the last
 * snapshot counts as zero (the gas is not there), so the first and last frames may miss light
 * from the far side.
 */
public final class LightStage {
    /** Relative and absolute tolerance of the general path (Hamilton's equations, affine parameter). */
    public static final double GENERAL_RTOL = 1.0e-8, GENERAL_ATOL = 1.0e-10;
    /** Tolerances of the separated path (Kerr and the mass-function family), chosen by `bench light --reference`. */
    public static final double SEPARATED_RTOL = 1.0e-8, SEPARATED_ATOL = 1.0e-10;

    /** Sample spacing along rays in units of the smoothing length. */
    public static final double SAMPLES_PER_H = 1.0;

    private LightStage() {
    }

    /**
     * Runs the stage.
     *
     * @param captureRadius where rays stop, M ({@link org.spindrift.sim.spacetime.Landmarks#captureRadius()})
     * @param threads worker threads (the results do not depend on it)
     */
    public static LightResult run(LightSettings s, Spacetime st, double captureRadius, EmitterHistory history,
                                  int threads) {
        return run(s, st, captureRadius, history, threads, false);
    }

    /**
     * As {@link #run(LightSettings, Spacetime, double, EmitterHistory, int)}, with the choice of
     * emission sum.
     *
     * @param gridded true: gridded emission per emission time ({@link GriddedEmission}; particles
     *     with different spectral indices are summed one by one all the same)
     */
    public static LightResult run(LightSettings s, Spacetime st, double captureRadius, EmitterHistory history,
                                  int threads, boolean gridded) {
        Camera cam = s.camera();
        double h = smoothingLength(cam);
        TraceSettings ts = traceSettings(history, st, cam, captureRadius, s.fieldOfViewM(), s.lensing(), threads);
        long t0 = System.nanoTime();
        RayTable table = RayTable.trace(st, cam, ts, threads);
        double secs = (System.nanoTime() - t0) * 1e-9;
        double[] rRange = radialRange(history);
        double[] times = frameTimes(history, table.delayQuantiles(rRange[0] - 2 * h, rRange[1] + 2 * h, 0.02, 0.98),
                s.frameCadenceM());
        int n = cam.pixels();
        float[][] images = new float[times.length][];
        float[][] raw = beamOn(s) ? new float[times.length][] : images;
        List<FrameMoments> moments = new ArrayList<>(times.length);
        GaussianBeam beam = beamOn(s)
                ? new GaussianBeam(s.beamFwhmUas() / (s.uasPerM() * cam.pixelSize()), n) : null;
        try (EmissionRenderer r = new EmissionRenderer(table, history, st, h, threads, false, gridded)) {
            for (int f = 0; f < times.length; f++) {
                float[] img = new float[n * n];
                r.render(times[f], img);
                moments.add(FrameMoments.of(img, cam));
                raw[f] = img;
                if (beam != null) {
                    float[] b = new float[n * n];
                    beam.apply(img, b);
                    images[f] = b;
                } else {
                    images[f] = img;
                }
            }
        }
        double[] flux = new double[times.length], cx = new double[times.length], cy = new double[times.length];
        for (int f = 0; f < times.length; f++) {
            flux[f] = moments.get(f).flux();
            cx[f] = moments.get(f).x();
            cy[f] = moments.get(f).y();
        }
        double coveredFrom = history.time(0) + table.delayRange()[1];
        double coveredTo = history.time(history.snapshots() - 1) + table.delayRange()[0];
        double fs = s.steadyFluxRatio() * meanCoveredFlux(times, flux, coveredFrom, coveredTo);
        double[] sx = new double[times.length];
        double[] sy = new double[times.length];
        withSteadySource(flux, cx, cy, fs, sx, sy);
        double[] ax = sx, ay = sy;
        if (beamOn(s)) {
            // what the instrument reports: the peak of the beam-convolved image with the steady source
            ax = new double[times.length];
            ay = new double[times.length];
            beamPeaks(raw, cam, GaussianBeam.sigmaOf(s.beamFwhmUas() / s.uasPerM()), fs, ax, ay, threads);
        }
        LightResult.MockAstrometry mock = s.noiseUas() > 0 ? mock(s, times, ax, ay) : null;
        return new LightResult(s, cam, times, moments, images, raw, fs, sx, sy, ax, ay, mock, h, ts.emissionRadius(),
                new LightResult.TableStats(table.rays(), table.samples(), table.steps(), secs),
                coveredFrom, coveredTo);
    }

    /**
     * Beam-peak positions of unbeamed frames: per frame the peak of the image convolved with a
     * circular Gaussian beam of standard deviation sigmaM (M), with the steady point source of flux
     * fs (flux units: intensity sum times pixel area) at the hole ({@link BeamAstrometry}); 0 for a
     * frame with no flux at all.
     *
     * @param x out: east offsets, M (and y north)
     */
    static void beamPeaks(float[][] raw, Camera cam, double sigmaM, double fs, double[] x, double[] y) {
        beamPeaks(raw, cam, sigmaM, fs, x, y, 1);
    }

    /** As {@link #beamPeaks(float[][], Camera, double, double, double[], double[])}, frames on threads. */
    static void beamPeaks(float[][] raw, Camera cam, double sigmaM, double fs, double[] x, double[] y, int threads) {
        double steady = fs / (cam.pixelSize() * cam.pixelSize());
        // frames in fixed chunks, one search (with its scratch arrays) per chunk; each frame's peak
        // depends on that frame only
        int chunks = Math.min(raw.length, 32);
        Chunked.forEach(chunks, threads, c -> {
            BeamAstrometry beam = new BeamAstrometry(sigmaM);
            double[] p = new double[2];
            for (int f = Chunked.start(c, chunks, raw.length); f < Chunked.start(c + 1, chunks, raw.length); f++) {
                boolean any = beam.peak(raw[f], cam, steady, p);
                x[f] = any ? p[0] : 0.0;
                y[f] = any ? p[1] : 0.0;
            }
        });
    }

    /**
     * Mean flare flux over the frames in the fully covered observer-time interval [from, to]
     * (over all frames when none is covered): the reference of the steady source's flux ratio.
     */
    public static double meanCoveredFlux(double[] times, double[] flux, double from, double to) {
        double mean = 0;
        int count = 0;
        for (int f = 0; f < times.length; f++) {
            if (times[f] >= from - 1e-9 && times[f] <= to + 1e-9) {
                mean += flux[f];
                count++;
            }
        }
        if (count == 0) {
            for (double v : flux) {
                mean += v;
            }
            count = flux.length;
        }
        return mean / FastMath.max(1, count);
    }

    /**
     * Centroid with a steady point source of flux fs at the hole: the flux-weighted mean
     * F c / (F + F_s) (common practice); 0 where the flare has no flux.
     *
     * @param flux flare flux per frame, with its centroid cx, cy (M)
     * @param sx out: east offset with the steady source, M (and sy north)
     */
    public static void withSteadySource(double[] flux, double[] cx, double[] cy, double fs, double[] sx, double[] sy) {
        for (int f = 0; f < flux.length; f++) {
            double tot = flux[f] + fs;
            sx[f] = tot > 0 && flux[f] > 0 ? flux[f] * cx[f] / tot : 0.0;
            sy[f] = tot > 0 && flux[f] > 0 ? flux[f] * cy[f] / tot : 0.0;
        }
    }

    /**
     * The ray settings of a run: emission radius and mask from the particle history, sample
     * spacing from the smoothing length, relative tolerance 1e-8.
     */
    public static TraceSettings traceSettings(EmitterHistory history, Spacetime st, Camera cam, double captureRadius,
                                              double fov, boolean lensing) {
        return traceSettings(history, st, cam, captureRadius, fov, lensing, 1);
    }

    /** As {@link #traceSettings(EmitterHistory, Spacetime, Camera, double, double, boolean)}, the mask on threads. */
    public static TraceSettings traceSettings(EmitterHistory history, Spacetime st, Camera cam, double captureRadius,
                                              double fov, boolean lensing, int threads) {
        double h = smoothingLength(cam);
        double rEm = emissionRadius(history, h, fov, captureRadius);
        EmissionMask mask = EmissionMask.of(history, st.spin(), rEm, 2.0 * h, threads);
        boolean separated = st instanceof MassFunctionSpacetime;
        return TraceSettings.of(rEm, captureRadius, SAMPLES_PER_H * h, lensing)
                .withTolerance(separated ? SEPARATED_RTOL : GENERAL_RTOL, separated ? SEPARATED_ATOL : GENERAL_ATOL)
                .withMask(mask);
    }

    private static boolean beamOn(LightSettings s) {
        return s.beamFwhmUas() > 0;
    }

    /** @return smallest and largest radius of alive particles over the history */
    static double[] radialRange(EmitterHistory h) {
        double lo = Double.POSITIVE_INFINITY, hi = 0;
        for (int s = 0; s < h.snapshots(); s++) {
            for (int p = 0; p < h.particles(); p++) {
                if (h.state(s, p) == EmitterHistory.ALIVE) {
                    lo = FastMath.min(lo, h.r(s, p));
                    hi = FastMath.max(hi, h.r(s, p));
                }
            }
        }
        return lo <= hi ? new double[] {lo, hi} : new double[] {0.0, Double.POSITIVE_INFINITY};
    }

    /** Kernel smoothing length: one pixel, at least 0.1 M. */
    public static double smoothingLength(Camera cam) {
        return FastMath.max(0.1, cam.pixelSize());
    }

    /**
     * Emission radius: the largest radius any alive particle reaches, plus the kernel support and
     * a margin, at least 3 M beyond the capture radius and at most the larger of the field of view
     * and 20 M (farther particles rarely lens into the field).
     */
    public static double emissionRadius(EmitterHistory h, double smoothing, double fov, double captureRadius) {
        double rMax = 0;
        for (int s = 0; s < h.snapshots(); s++) {
            for (int p = 0; p < h.particles(); p++) {
                if (h.state(s, p) == EmitterHistory.ALIVE) {
                    rMax = FastMath.max(rMax, h.r(s, p));
                }
            }
        }
        double r = rMax + 2.0 * smoothing + 0.5;
        return FastMath.min(FastMath.max(r, captureRadius + 3.0), FastMath.max(fov, 20.0));
    }

    /** Frame times from t_first + delays[0] to t_last + delays[1] at the cadence (the snapshot cadence if NaN). */
    static double[] frameTimes(EmitterHistory h, double[] delays, double cadence) {
        int ns = h.snapshots();
        double first = h.time(0);
        double last = h.time(ns - 1);
        double dt = Double.isNaN(cadence) ? (last - first) / FastMath.max(1, ns - 1) : cadence;
        double lo = first + delays[0];
        double hi = last + delays[1];
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
