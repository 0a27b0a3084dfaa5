package org.spindrift.sim.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.scenario.BlackHole;
import org.spindrift.shared.scenario.EmissionSum;
import org.spindrift.shared.scenario.Observer;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.light.Camera;
import org.spindrift.sim.light.EmissionChoice;
import org.spindrift.sim.light.EmissionMask;
import org.spindrift.sim.light.EmissionRenderer;
import org.spindrift.sim.light.EmitterHistory;
import org.spindrift.sim.light.FrameMoments;
import org.spindrift.sim.light.HistoryEmitters;
import org.spindrift.sim.light.LightSettings;
import org.spindrift.sim.light.LightStage;
import org.spindrift.sim.light.RayAccuracy;
import org.spindrift.sim.light.RayTable;
import org.spindrift.sim.light.TraceSettings;
import org.spindrift.sim.pipeline.LightRunStage;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioChecks;
import org.spindrift.sim.scenario.ScenarioLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code spindrift bench light}: the demo hot spot with more particles, evolved once (not timed
 * as part of the light figures), then a large ray table at spin 0.9 and inclination 60 deg (rays
 * per second), a sequence of frames at a smaller image size (frames per second), and the direct
 * Fourier sum of the interferometry stage (--frames frames of --vis-pixels^2 against --vis-points
 * (u, v) points each).
 */
@Command(name = "light", mixinStandardHelpOptions = true,
        description = {"Time the light layer: the demo hot spot (configs/hotspot-kerr.yaml) with --particles particles,"
                + " spin 0.9, inclination 60 deg; a --table-pixels^2 ray table, then --frames frames of"
                + " --frame-pixels^2 over the run."})
public final class BenchLightCommand implements Callable<Integer> {
    @Option(names = "--config", paramLabel = "FILE", defaultValue = "configs/hotspot-kerr.yaml",
            description = "Scenario with the hot spot (default: ${DEFAULT-VALUE}).")
    Path config;

    @Option(names = "--particles", paramLabel = "N", defaultValue = "20000",
            description = "Particles of the hot spot, 100..1000000 (default: ${DEFAULT-VALUE}).")
    int particles;

    @Option(names = "--table-pixels", paramLabel = "N", defaultValue = "256",
            description = "Pixels per side of the timed ray table, 16..2048 (default: ${DEFAULT-VALUE}).")
    int tablePixels;

    @Option(names = "--frame-pixels", paramLabel = "N", defaultValue = "128",
            description = "Pixels per side of the rendered frames, 16..1024 (default: ${DEFAULT-VALUE}).")
    int framePixels;

    @Option(names = "--frames", paramLabel = "N", defaultValue = "240",
            description = "Frames to render, 1..100000 (default: ${DEFAULT-VALUE}).")
    int frames;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Option(names = "--reference",
            description = "Also trace the large table on the general path (Hamilton's equations in the affine"
                    + " parameter for every metric), time both in this run, and compare both with the general path"
                    + " at a tight tolerance (1e-12) on every --accuracy-every-th pixel; the frames then use the"
                    + " particle sum and are checked against its per-sample loop.")
    boolean reference;

    @Option(names = "--accuracy-every", paramLabel = "K", defaultValue = "8",
            description = "With --reference: compare every K-th pixel in both directions, 1..64 (default: ${DEFAULT-VALUE}).")
    int accuracyEvery;

    @Option(names = "--emission", paramLabel = "KIND", defaultValue = "auto",
            description = "Frame emission: grid (each slice's particles on a grid of spacing 0.95 h, read by"
                    + " trilinear interpolation), particles (kernel sum over the particles) or auto (the grid when"
                    + " it resolves the thinnest source, as runs choose) (default: ${DEFAULT-VALUE}).")
    String emission;

    /** the emission sum --emission resolved to for the frames (true: grid) */
    private boolean gridded;

    @Option(names = "--compare-emission",
            description = "Also render the same frames with the other --emission kind, time both and print their"
                    + " differences (flux, centroid, image maximum and rms).")
    boolean compareEmission;

    @Option(names = "--vis-pixels", paramLabel = "N", defaultValue = "96",
            description = "Pixels per side of the frames of the visibility timing, 8..1024 (default: ${DEFAULT-VALUE}).")
    int visPixels;

    @Option(names = "--vis-points", paramLabel = "P", defaultValue = "2000",
            description = "(u, v) points per frame of the visibility timing, 1..100000 (default: ${DEFAULT-VALUE}).")
    int visPoints;

    private static final double SPIN = 0.9;
    private static final double INCLINATION = 60.0;

    @Override public Integer call() throws IOException {
        check(particles >= 100 && particles <= 1_000_000, "--particles must be in 100..1000000, got " + particles);
        check(tablePixels >= 16 && tablePixels <= 2048, "--table-pixels must be in 16..2048, got " + tablePixels);
        check(framePixels >= 16 && framePixels <= 1024, "--frame-pixels must be in 16..1024, got " + framePixels);
        check(frames >= 1 && frames <= 100_000, "--frames must be in 1..100000, got " + frames);
        check(accuracyEvery >= 1 && accuracyEvery <= 64, "--accuracy-every must be in 1..64, got " + accuracyEvery);
        check(List.of("auto", "grid", "particles").contains(emission),
                "--emission must be auto, grid or particles, got " + emission);
        check(visPixels >= 8 && visPixels <= 1024, "--vis-pixels must be in 8..1024, got " + visPixels);
        check(visPoints >= 1 && visPoints <= 100_000, "--vis-points must be in 1..100000, got " + visPoints);
        int nt = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        check(nt >= 1 && nt <= 1024, "--threads must be in 1..1024, got " + nt);
        LoadedScenario ls = ScenarioLoader.load(config);
        Scenario sc = ls.scenario();
        BlackHole bh = sc.blackHole().withSpin(SPIN);
        List<Source> src = sc.sources().stream().map(s -> s.withParticles(particles)).toList();
        sc = new Scenario(sc.name(), sc.description(), bh, new Observer(INCLINATION, sc.observer().positionAngleDeg()),
                src, sc.run().withDuration(sc.run().duration()), sc.imaging(), sc.instrument());
        ls = ls.with(sc);
        Path tmp = Files.createTempDirectory("spindrift-bench-light");
        try {
            long t0 = System.nanoTime();
            ScenarioRun.Prepared p = ScenarioRun.prepare(ls);
            ScenarioRun.Outcome o = ScenarioRun.run(p, new ScenarioRun.Options(tmp.resolve("run"), nt, false), List.of());
            double motion = seconds(t0);
            EmitterHistory h = new HistoryEmitters(o.history(), LightRunStage.spectralIndices(sc));
            LightSettings s = LightSettings.of(sc);
            double stop = p.captureRadius();
            System.out.printf(Locale.ROOT, "light bench: %s, a = %.1f, i = %.0f deg, %d particles, %d snapshots,"
                    + " %d threads (machine: %d cores)%n", config, SPIN, INCLINATION, particles, h.snapshots(), nt,
                    Runtime.getRuntime().availableProcessors());
            System.out.printf(Locale.ROOT, "  motion (set-up, not part of the light figures): %.1f s%n", motion);

            for (int n : new int[] {tablePixels, framePixels}) {
                Camera cam = s.withPixels(n).camera();
                double hK = LightStage.smoothingLength(cam);
                TraceSettings ts = LightStage.traceSettings(h, p.spacetime(), cam, stop, s.fieldOfViewM(), true, nt);
                double[] ref = null;
                if (reference && n == tablePixels) {
                    TraceSettings general = ts.withGeneralPath(true)
                            .withTolerance(LightStage.GENERAL_RTOL, LightStage.GENERAL_ATOL);
                    ref = timeTable("general path (reference)", p.spacetime(), cam, general, nt);
                }
                t0 = System.nanoTime();
                double c0 = cpu();
                EmissionMask mask = ts.mask();
                RayTable table = RayTable.trace(p.spacetime(), cam, ts, nt);
                double secs = seconds(t0);
                double cpuSecs = cpu() - c0;
                System.out.printf(Locale.ROOT, "  ray table %d x %d (fov %.0f M, emission mask %.1f%% of cells, %.2f to %.2f M"
                        + " from the centre): %.2f s (%.1f CPU s), %.0f pixels/s, %d samples, %d pixels refined with %d sub-rays,"
                        + " %.0f steps per pixel%n", n, n, s.fieldOfViewM(), 100 * mask.filling(), mask.innerRadius(),
                        mask.outerRadius(), secs, cpuSecs, table.rays() / secs,
                        table.samples(), table.refinedPixels(), table.subRays(), table.steps() / (double) table.rays());
                if (ref != null) {
                    System.out.printf(Locale.ROOT, "  speed-up over the general path: %.2fx wall, %.2fx CPU%n",
                            ref[0] / secs, ref[1] / cpuSecs);
                    accuracy(p.spacetime(), cam, ts, p.landmarks().get(ArchiveLayout.LM_ISCO_PROGRADE));
                }
                if (n != framePixels) {
                    continue;
                }
                EmissionChoice choice = EmissionChoice.of(EmissionSum.ofKey(emission), h, p.spacetime().spin(), hK);
                // with --reference the frames check the particle sum's shortcuts against its per-sample
                // loop (bit for bit), so the particle sum is timed whatever the choice
                gridded = choice.gridded() && !reference;
                System.out.printf(Locale.ROOT, "  emission sum: %s -> %s (grid spacing %.3f M%s)%s%n", emission,
                        choice.used(), choice.gridSpacingM(), Double.isNaN(choice.thinnestRmsM()) ? ""
                                : String.format(Locale.ROOT, ", thinnest source %.3f M rms", choice.thinnestRmsM()),
                        choice.gridded() && reference ? "; with --reference the frames use particles" : "");
                if (reference) {
                    compareFrames(p.spacetime(), cam, ts, table, h, hK, nt);
                }
                double[] d = table.delayRange();
                double tA = h.time(0) + d[1];
                double tB = h.time(h.snapshots() - 1) + d[0];
                float[][] imgs = new float[frames][n * n];
                double fast = 0;
                for (boolean old : reference ? new boolean[] {false, true} : new boolean[] {false}) {
                    t0 = System.nanoTime();
                    c0 = cpu();
                    double g0 = gcSeconds();
                    float[] img = new float[n * n];
                    int differ = 0;
                    double peak = 0, dFlux = 0, dCentroid = 0;
                    FrameMoments[] fm = new FrameMoments[frames];
                    try (EmissionRenderer r = new EmissionRenderer(table, h, p.spacetime(), hK, nt, old,
                            !old && gridded)) {
                        for (int f = 0; f < frames; f++) {
                            double t = frames == 1 ? tA : tA + (tB - tA) * f / (frames - 1);
                            r.render(t, old ? img : imgs[f]);
                            differ += old && !java.util.Arrays.equals(img, imgs[f]) ? 1 : 0;
                            if (old) {
                                fm[f] = FrameMoments.of(img, cam);
                                peak = Math.max(peak, fm[f].flux());
                            }
                        }
                        for (int f = 0; f < frames && old; f++) {
                            FrameMoments b = FrameMoments.of(imgs[f], cam);
                            dFlux = Math.max(dFlux, Math.abs(b.flux() - fm[f].flux()) / peak);
                            if (fm[f].flux() > 0.01 * peak) {
                                dCentroid = Math.max(dCentroid, Math.hypot(b.x() - fm[f].x(), b.y() - fm[f].y()));
                            }
                        }
                        secs = seconds(t0);
                        double[] sec = r.sectionSeconds();
                        System.out.printf(Locale.ROOT, "  %d frames of %d x %d, %s emission%s: %.2f s (%.1f CPU s, %.1f s in garbage"
                                        + " collection), %.1f frames/s (%d emission slices: %.2f s building, %.2f s"
                                        + " summing)%s%n", frames, n, n, old || !gridded ? "particles" : "grid",
                                old ? " (reference renderer)" : "",
                                secs, cpu() - c0, gcSeconds() - g0, frames / secs, r.slicesBuilt(), sec[0], sec[1], old ? String.format(Locale.ROOT,
                                        "; speed-up %.2fx wall; %d frames differ bit for bit, flux by at most"
                                        + " %.1e of the peak, centroid by at most %.1e M (frames above 1%% of the"
                                        + " peak)", secs / fast, differ, dFlux, dCentroid) : "");
                        fast = old ? fast : secs;
                    }
                }
                if (compareEmission) {
                    compareEmission(table, h, p.spacetime(), hK, nt, cam, imgs, tA, tB);
                }
            }
            System.out.println(org.spindrift.sim.interferometry.VisibilityBench.run(frames, visPixels, visPoints, nt));
        } finally {
            deleteTree(tmp);
        }
        return 0;
    }

    /**
     * Renders the same frames with the other emission kind, times it, and prints the largest
     * per-frame differences from the frames of --emission: flux relative to the frame's flux,
     * centroid in M and in % of the track radius (largest distance of the particle frames' centroid
     * from its mean), image maximum and rms difference relative to the frame's peak pixel; frames
     * above 1% of the peak flux.
     */
    private void compareEmission(RayTable table, EmitterHistory h, org.spindrift.sim.spacetime.Spacetime st,
                                 double hK, int nt, Camera cam, float[][] imgs, double tA, double tB) {
        boolean grid = !gridded;
        int n = cam.pixels();
        float[][] other = new float[frames][n * n];
        long t0 = System.nanoTime();
        double c0 = cpu();
        try (EmissionRenderer r = new EmissionRenderer(table, h, st, hK, nt, false, grid)) {
            for (int f = 0; f < frames; f++) {
                r.render(frames == 1 ? tA : tA + (tB - tA) * f / (frames - 1), other[f]);
            }
        }
        double secs = seconds(t0), cpuSecs = cpu() - c0;
        float[][] part = grid ? imgs : other, gr = grid ? other : imgs;
        FrameMoments[] mp = new FrameMoments[frames], mg = new FrameMoments[frames];
        double peak = 0, cx = 0, cy = 0;
        int bright = 0;
        for (int f = 0; f < frames; f++) {
            mp[f] = FrameMoments.of(part[f], cam);
            mg[f] = FrameMoments.of(gr[f], cam);
            peak = Math.max(peak, mp[f].flux());
        }
        for (int f = 0; f < frames; f++) {
            if (mp[f].flux() > 0.01 * peak) {
                cx += mp[f].x();
                cy += mp[f].y();
                bright++;
            }
        }
        cx /= Math.max(1, bright);
        cy /= Math.max(1, bright);
        double signed = 0;
        double track = 0, dFlux = 0, dCen = 0, dMax = 0, dRms = 0, sumFlux = 0;
        for (int f = 0; f < frames; f++) {
            if (mp[f].flux() > 0.01 * peak) {
                track = Math.max(track, Math.hypot(mp[f].x() - cx, mp[f].y() - cy));
            }
        }
        for (int f = 0; f < frames; f++) {
            if (!(mp[f].flux() > 0.01 * peak)) {
                continue;
            }
            sumFlux = Math.max(sumFlux, Math.abs(mg[f].flux() - mp[f].flux()) / peak);
            dFlux = Math.max(dFlux, Math.abs(mg[f].flux() - mp[f].flux()) / mp[f].flux());
            signed += (mg[f].flux() - mp[f].flux()) / mp[f].flux() / bright;
            dCen = Math.max(dCen, Math.hypot(mg[f].x() - mp[f].x(), mg[f].y() - mp[f].y()));
            double top = 0, mx = 0, ss = 0;
            for (int k = 0; k < n * n; k++) {
                top = Math.max(top, part[f][k]);
                double d = gr[f][k] - part[f][k];
                mx = Math.max(mx, Math.abs(d));
                ss += d * d;
            }
            dMax = Math.max(dMax, mx / top);
            dRms = Math.max(dRms, Math.sqrt(ss / (n * n)) / top);
        }
        System.out.printf(Locale.ROOT, "  the same %d frames, %s emission: %.2f s (%.1f CPU s); grid vs particles over"
                        + " %d frames above 1%% of the peak flux: flux %.2e of the frame's flux (%.2e of the peak),"
                        + " centroid %.2e M (%.2f%% of the track radius %.2f M), image max %.2e and rms %.2e of the"
                        + " frame's peak pixel; mean signed flux difference %.2e%n", frames, grid ? "grid" : "particles", secs, cpuSecs, bright, dFlux,
                sumFlux, dCen, 100 * dCen / track, track, dMax, dRms, signed);
    }

    /** Times one table; prints a line; @return wall and CPU seconds */
    private static double[] timeTable(String label, org.spindrift.sim.spacetime.Spacetime st, Camera cam,
                                      TraceSettings ts, int nt) {
        long t0 = System.nanoTime();
        double c0 = cpu();
        RayTable table = RayTable.trace(st, cam, ts, nt);
        double secs = seconds(t0);
        double cpuSecs = cpu() - c0;
        int n = cam.pixels();
        System.out.printf(Locale.ROOT, "  ray table %d x %d on the %s, tolerance %.0e: %.2f s (%.1f CPU s), %.0f pixels/s,"
                        + " %d samples, %d pixels refined with %d sub-rays, %.0f steps per pixel%n",
                n, n, label, ts.relativeTolerance(), secs, cpuSecs, table.rays() / secs, table.samples(),
                table.refinedPixels(), table.subRays(), table.steps() / (double) table.rays());
        return new double[] {secs, cpuSecs};
    }

    /** Both paths at their run tolerances against the general path at 1e-12, on every accuracyEvery-th pixel. */
    private void accuracy(org.spindrift.sim.spacetime.Spacetime st, Camera cam, TraceSettings ts, double isco) {
        TraceSettings tight = ts.withGeneralPath(true).withTolerance(1.0e-12, 1.0e-14);
        TraceSettings general = ts.withGeneralPath(true).withTolerance(LightStage.GENERAL_RTOL, LightStage.GENERAL_ATOL);
        System.out.printf(Locale.ROOT, "  accuracy against the general path at tolerance 1e-12, every %d-th pixel,"
                + " first %d equatorial crossings inside r = %.1f M (max / 99th percentile; g outside the ISCO, %.2f M):%n",
                accuracyEvery, RayAccuracy.CROSSINGS, ts.emissionRadius(), isco);
        for (Object[] c : new Object[][] {{"run path", ts}, {"general path", general}}) {
            TraceSettings t = (TraceSettings) c[1];
            RayAccuracy.Result r = RayAccuracy.compare(st, cam, t, tight, accuracyEvery, isco);
            for (int k = 0; k < RayAccuracy.CROSSINGS; k++) {
                System.out.printf(Locale.ROOT, "    %-12s tol %.0e, crossing %d: position %.1e / %.1e M, delay %.1e / %.1e M,"
                                + " g (circular orbit) %.1e / %.1e relative; %d rays%s%n",
                        c[0], t.relativeTolerance(), k + 1, r.positionMax()[k], r.position99()[k], r.delayMax()[k],
                        r.delay99()[k], r.redshiftMax()[k], r.redshift99()[k], r.crossings()[k],
                        k == 0 ? String.format(Locale.ROOT, " of %d (%d differ in crossings)", r.rays(), r.mismatched()) : "");
            }
        }
    }

    /**
     * Renders 12 frames spread over the run from the run's table and from a table traced on the
     * general path at the same size, and prints the largest differences of frame flux (relative
     * to the peak flux) and of the centroid (M).
     */
    private static void compareFrames(org.spindrift.sim.spacetime.Spacetime st, Camera cam, TraceSettings ts,
                                      RayTable table, EmitterHistory h, double hK, int nt) {
        TraceSettings general = ts.withGeneralPath(true).withTolerance(LightStage.GENERAL_RTOL, LightStage.GENERAL_ATOL);
        RayTable ref = RayTable.trace(st, cam, general, nt);
        int n = cam.pixels();
        double[] d = table.delayRange();
        double tA = h.time(0) + d[1];
        double tB = h.time(h.snapshots() - 1) + d[0];
        int frames = 12;
        FrameMoments[] a = new FrameMoments[frames];
        FrameMoments[] b = new FrameMoments[frames];
        for (int pass = 0; pass < 2; pass++) {
            try (EmissionRenderer r = new EmissionRenderer(pass == 0 ? table : ref, h, st, hK, nt)) {
                for (int f = 0; f < frames; f++) {
                    float[] img = new float[n * n];
                    r.render(tA + (tB - tA) * f / (frames - 1), img);
                    (pass == 0 ? a : b)[f] = FrameMoments.of(img, cam);
                }
            }
        }
        double peak = 0, dFlux = 0, dCentroid = 0;
        for (int f = 0; f < frames; f++) {
            peak = Math.max(peak, b[f].flux());
        }
        for (int f = 0; f < frames; f++) {
            dFlux = Math.max(dFlux, Math.abs(a[f].flux() - b[f].flux()) / peak);
            if (b[f].flux() > 0.01 * peak) {
                dCentroid = Math.max(dCentroid, Math.hypot(a[f].x() - b[f].x(), a[f].y() - b[f].y()));
            }
        }
        System.out.printf(Locale.ROOT, "  %d frames of %d x %d from the run's table vs the general path's table (%d vs %d"
                        + " sub-rays): flux differs by at most %.2e of the peak, centroid by at most %.2e M"
                        + " (frames above 1%% of the peak)%n", frames, n, n, table.subRays(), ref.subRays(), dFlux,
                dCentroid);
    }

    private static double seconds(long t0) {
        return (System.nanoTime() - t0) * 1e-9;
    }

    /** @return CPU seconds used by this process so far (all threads), NaN where unavailable */
    private static double cpu() {
        return ProcessHandle.current().info().totalCpuDuration().map(d -> d.toNanos() * 1e-9).orElse(Double.NaN);
    }

    /** @return seconds the garbage collectors report so far (pauses and concurrent work as each counts it) */
    private static double gcSeconds() {
        long ms = 0;
        for (java.lang.management.GarbageCollectorMXBean b
                : java.lang.management.ManagementFactory.getGarbageCollectorMXBeans()) {
            ms += Math.max(0, b.getCollectionTime());
        }
        return ms * 1e-3;
    }

    private static void check(boolean ok, String message) {
        if (!ok) {
            throw new UserInputException(message);
        }
    }

    private static void deleteTree(Path root) throws IOException {
        try (Stream<Path> w = Files.walk(root)) {
            for (Path q : w.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(q);
            }
        }
    }
}
