package org.spindrift.sim.run;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import me.tongfei.progressbar.ProgressBar;
import org.spindrift.shared.Units;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.shared.scenario.RunSettings;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.ScenarioJson;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.analysis.AnalysisStage;
import org.spindrift.sim.analysis.PlotStage;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.EndState;
import org.spindrift.sim.motion.GeodesicEquations;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.Snapshot;
import org.spindrift.sim.motion.StepListener;
import org.spindrift.sim.motion.TurningPoints;
import org.spindrift.sim.scenario.FlareEnvelope;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioChecks;
import org.spindrift.sim.scenario.SourceSetup;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * One scenario run: check, place the sources, evolve them with the {@link BatchIntegrator},
 * keep the {@link ParticleHistory}, then write the run folder of DEVELOPERS.md through the
 * {@link RunStage}s (snapshots, analysis, plots, light), summary and manifest last.
 *
 * <p>Nothing is written before every check has passed and the particles have been evolved, so a
 * bad scenario leaves no folder. Every file goes through a temporary name; {@code manifest.json}
 * comes last, so an interrupted run leaves no folder that looks complete (and a shutdown hook
 * removes the temporary files of an interrupted run).
 */
public final class ScenarioRun {
    /** Product key of the per-particle {@code TurningPoints[]} recorded during the integration. */
    public static final String TURNING_POINTS = "motion.turning_points";

    /** Largest number of snapshots of a run. */
    public static final int MAX_SNAPSHOTS = 20_000;

    /**
     * @param output run folder
     * @param threads worker threads
     * @param progress show a progress bar (on a terminal, without --quiet)
     * @param overwrite replace a finished run in the folder (only once the new one is complete)
     */
    public record Options(Path output, int threads, boolean progress, boolean overwrite, double checkpointSeconds,
            boolean resume) {
        /** Default wall time between checkpoints, s. */
        public static final double CHECKPOINT_SECONDS = 600;

        /** Options with checkpoints every {@link #CHECKPOINT_SECONDS}, starting from the beginning. */
        public Options(Path output, int threads, boolean progress, boolean overwrite) {
            this(output, threads, progress, overwrite, CHECKPOINT_SECONDS, false);
        }

        /** Options that never replace a finished run. */
        public Options(Path output, int threads, boolean progress) {
            this(output, threads, progress, false);
        }
    }

    /**
     * A checked scenario ready to run: spacetime, landmarks, initial particles and snapshot times.
     *
     * @param loaded scenario
     * @param spacetime metric
     * @param landmarks landmarks (NaN where absent)
     * @param captureRadius where particles are stopped
     * @param placed initial particles
     * @param times snapshot times, M
     * @param secondsPerM GM/c^3, s
     * @param uasPerM angular size of 1 M, micro-arcseconds
     * @param warnings things the run does that the user may not expect, one line each
     *     ({@code FILE:LINE: key: problem}); printed and recorded in the manifest
     * @param requestedDurationM the duration the scenario asks for, M (the run ends at the last
     *     whole snapshot cadence within it, {@link #durationM})
     */
    public record Prepared(LoadedScenario loaded, Spacetime spacetime, Map<String, Double> landmarks,
            double captureRadius, SourceSetup.Placed placed, double[] times, double secondsPerM,
            double uasPerM, List<String> warnings, double requestedDurationM) {
        /** @return run duration, M */
        public double durationM() {
            return times[times.length - 1];
        }
    }

    /**
     * The outcome of a run.
     *
     * @param folder the run folder
     * @param history every particle at every snapshot
     * @param result integrator work counts and end states
     * @param integrationSeconds wall time of the integration (for benchmarks; not written anywhere)
     * @param outputSeconds wall time of the stages and the files after the integration
     * @param stageSeconds wall time of each stage, by name, in order
     */
    public record Outcome(Path folder, ParticleHistory history, BatchIntegrator.Result result, double integrationSeconds,
            double outputSeconds, Map<String, Double> stageSeconds) {
    }

    private ScenarioRun() {
    }

    /**
     * Checks a scenario against the metric and sets up the particles and the time grid; writes
     * nothing. Used by {@code check} and {@code run}.
     */
    public static Prepared prepare(LoadedScenario ls) {
        Scenario sc = ls.scenario();
        Spacetime st = ScenarioChecks.spacetime(ls);
        Landmarks lm = Landmarks.of(st);
        Map<String, Double> landmarks = new LinkedHashMap<>();
        lm.toMap().forEach((k, v) -> landmarks.put(k, v == null ? Double.NaN : v));
        double capture = lm.captureRadius();
        ScenarioChecks.checkSources(ls, st, capture);
        double secondsPerM = Units.timeUnitSeconds(sc.blackHole().massSolar());
        double uasPerM = Units.uasPerM(sc.blackHole().massSolar(), sc.blackHole().distanceMpc());
        SourceSetup.Placed placed = SourceSetup.place(sc, st, capture);
        double[] times = snapshotTimes(ls, secondsPerM, placed.centres()[0].periodM());
        int s = times.length;
        double cadence = times[1] - times[0];
        double duration = sc.run().duration().toM(secondsPerM, placed.centres()[0].periodM());
        List<String> warnings = new ArrayList<>();
        // the grid ends at the last whole cadence: the manifest records both durations; a cut of more
        // than 1 % of the run is worth a warning (durations in orbits are rarely whole cadences)
        if (duration - times[s - 1] > DURATION_CUT_WARNING * duration) {
            warnings.add(ls.error("run.duration", "the duration of " + fmt(duration) + " M is not a whole number of"
                    + " snapshot cadences (" + fmt(cadence) + " M): the run ends at the last whole one, "
                    + fmt(times[s - 1]) + " M").getMessage());
        }
        checkMemory(ls, sc.totalParticles(), s, Runtime.getRuntime().maxMemory());
        checkImaging(ls, sc, uasPerM, times, capture, warnings);
        return new Prepared(ls, st, landmarks, capture, placed, times, secondsPerM, uasPerM, List.copyOf(warnings),
                duration);
    }

    /**
     * The snapshot times of a scenario (0 to the duration at the snapshot cadence), M.
     *
     * @param firstPeriodM the first source centre's orbital period (what "1 orbit" means), M
     */
    public static double[] snapshotTimes(LoadedScenario ls, double secondsPerM, double firstPeriodM) {
        Scenario sc = ls.scenario();
        RunSettings run = sc.run();
        double duration = run.duration().toM(secondsPerM, firstPeriodM);
        if (!(duration > 0) || !Double.isFinite(duration)) {
            throw ls.error("run.duration", "gives no positive duration in M (" + duration + ")");
        }
        double cadence = run.snapshotCadence() == null ? duration / RunSettings.DEFAULT_SNAPSHOTS
                : run.snapshotCadence().toM(secondsPerM);
        double steps = duration / cadence;
        if (steps < 2) {
            throw ls.error("run.snapshot_cadence", "cadence " + run.snapshotCadence() + " = " + fmt(cadence)
                    + " M gives fewer than 3 snapshots over the duration of " + fmt(duration) + " M");
        }
        if (steps > MAX_SNAPSHOTS) {
            throw ls.error("run.snapshot_cadence", "cadence " + fmt(cadence) + " M gives " + (long) steps
                    + " snapshots over " + fmt(duration) + " M; at most " + MAX_SNAPSHOTS + " are allowed");
        }
        int s = (int) Math.floor(steps + 1e-9) + 1;
        double[] times = new double[s];
        for (int k = 0; k < s; k++) {
            times[k] = k * cadence;
        }
        return times;
    }

    /** Fraction of the requested duration lost to whole cadences above which the run warns. */
    static final double DURATION_CUT_WARNING = 0.01;

    /** Bytes of the particle history per particle and snapshot (see {@link ParticleHistory}), with the archive copy. */
    static final double HISTORY_BYTES = 61 + 88;

    /** Refuses a run whose particle history cannot fit in the Java heap (it would fail after the work). */
    static void checkMemory(LoadedScenario ls, long particles, int snapshots, double have) {
        double need = HISTORY_BYTES * particles * snapshots;
        if (need > 0.8 * have) {
            throw ls.error("run.snapshot_cadence", String.format(java.util.Locale.ROOT, "%d particles at %d snapshots"
                    + " need about %.3g GB of memory, more than the %.3g GB this Java process may use; use fewer"
                    + " particles, a longer snapshot_cadence, or more heap (SPINDRIFT_JAVA_OPTS=-Xmx...)", particles,
                    snapshots, need / 1e9, have / 1e9));
        }
    }

    /**
     * Estimated size of a run folder, bytes, by part.
     *
     * @param snapshots snapshots.h5 (kept particles x snapshots x 85 bytes, plus times and centres)
     * @param images images.fits (frames x pixels^2 x 4 bytes)
     * @param other CSV files (per particle, per source and snapshot, per frame; visibilities per
     *     frame and station pair), JSON files and plots
     */
    public record DiskEstimate(double snapshots, double images, double other) {
        /** @return the whole run folder, bytes */
        public double total() {
            return snapshots + images + other;
        }

        /** @return the scenario key that drives the largest part */
        public String key(Scenario sc) {
            if (snapshots >= images && snapshots >= other) {
                return sc.run().archiveSubsample() > 0 ? "run.archive_subsample" : "run.snapshot_cadence";
            }
            if (images >= other) {
                return sc.imaging().frameCadence() != null ? "imaging.frame_cadence" : "imaging.pixels";
            }
            return sc.interferometer() != null ? "interferometer" : "sources";
        }
    }

    /** Bytes per kept particle and snapshot in snapshots.h5: r, theta, phi, x, y, z, u[4] (float64), weight (float32), state. */
    static final int SNAPSHOT_BYTES = 6 * 8 + 4 * 8 + 4 + 1;

    /**
     * Room for plots, JSON files and file-system blocks, bytes: the plots of a one-particle run take
     * 0.7 MB together; the vector plots grow with the snapshots ({@link #PLOT_BYTES_PER_SNAPSHOT}).
     */
    static final double FIXED_BYTES = 1.5e6;

    /** Vector-plot bytes per source and snapshot (shape and lag curves). */
    static final double PLOT_BYTES_PER_SNAPSHOT = 1e3;

    /** @return the estimated size of the run folder of a prepared scenario */
    public static DiskEstimate diskEstimate(Prepared p) {
        Scenario sc = p.loaded().scenario();
        long particles = sc.totalParticles();
        int sub = sc.run().archiveSubsample();
        long kept = sub == 0 ? particles : Math.min(particles, sub);
        int s = p.times().length;
        int k = sc.sources().size();
        double snap = (double) SNAPSHOT_BYTES * kept * s + 8.0 * s + 24.0 * s * k + 4.0 * kept + 64e3;
        org.spindrift.sim.light.LightSettings light = org.spindrift.sim.light.LightSettings.of(sc);
        double frames = org.spindrift.sim.light.LightRunStage.frameEstimate(light, 0.0, p.durationM(), s);
        double images = frames * light.pixels() * (double) light.pixels() * 4 + 2880 * 2;
        // periods.csv ~200 B per particle, shear.csv ~300 B per source and snapshot, light CSVs ~400 B per frame
        double other = 200.0 * particles + (300.0 + PLOT_BYTES_PER_SNAPSHOT) * s * k + 400.0 * frames + FIXED_BYTES;
        if (sc.interferometer() != null) {
            int n = sc.interferometer().stations().size();
            // visibilities.csv and .uvfits (~400 B per frame and pair), closure files (~150 B per triangle, quadrangle)
            double pairs = n * (n - 1) / 2.0;
            double triangles = pairs * (n - 2) / 3.0;
            other += frames * (400.0 * pairs + 150.0 * triangles * (1 + Math.max(0, n - 3) / 2.0));
        }
        return new DiskEstimate(snap, images, other);
    }

    /**
     * Refuses a run whose folder would not fit in the free space where it is built (beside the
     * target folder; an old run there stays until the new one is complete, so it does not count).
     *
     * @param folder the run folder asked for
     */
    public static void checkDisk(Prepared p, Path folder) throws IOException {
        Path parent = folder.toAbsolutePath().normalize().getParent();
        while (parent != null && !java.nio.file.Files.exists(parent)) {
            parent = parent.getParent();
        }
        if (parent == null) {
            return; // the folder check reports it
        }
        checkDisk(p, parent, java.nio.file.Files.getFileStore(parent).getUsableSpace());
    }

    /** Refuses a run whose estimated folder is larger than free bytes at where. */
    public static void checkDisk(Prepared p, Path where, double free) {
        DiskEstimate e = diskEstimate(p);
        if (e.total() > free) {
            Scenario sc = p.loaded().scenario();
            throw p.loaded().error(e.key(sc), String.format(java.util.Locale.ROOT, "the run folder needs about %s on"
                    + " disk (snapshots.h5 %s, images.fits %s, other files %s), more than the %s free in %s; free some"
                    + " space, write elsewhere with -o, or keep fewer particles, snapshots or frames", size(e.total()),
                    size(e.snapshots()), size(e.images()), size(e.other()), size(free), where));
        }
    }

    private static String size(double bytes) {
        return bytes >= 1e9 ? String.format(java.util.Locale.ROOT, "%.3g GB", bytes / 1e9)
                : String.format(java.util.Locale.ROOT, "%.3g MB", bytes / 1e6);
    }

    /** The light stage's limits and the imaging settings that would give empty or meaningless output. */
    private static void checkImaging(LoadedScenario ls, Scenario sc, double uasPerM, double[] times,
            double captureRadius, List<String> warnings) {
        org.spindrift.sim.light.LightSettings light = org.spindrift.sim.light.LightSettings.of(sc);
        double duration = times[times.length - 1];
        String budget = org.spindrift.sim.light.LightRunStage.budgetProblem(light, 0.0, duration, times.length);
        if (budget != null) {
            String key = sc.imaging().frameCadence() != null ? "imaging.frame_cadence" : "imaging.pixels";
            throw ls.error(key, budget);
        }
        if (!Double.isNaN(light.frameCadenceM()) && light.frameCadenceM() > duration) {
            throw ls.error("imaging.frame_cadence", "cadence " + sc.imaging().frameCadence() + " = "
                    + fmt(light.frameCadenceM()) + " M is longer than the run (" + fmt(duration)
                    + " M): at most one or two frames; use a frame_cadence shorter than run.duration");
        }
        // the FITS pixel scale in degrees must be an ordinary (normal, non-zero) number
        double pixelDeg = light.fieldOfViewM() / light.pixels() * uasPerM / 3.6e9;
        if (!(pixelDeg >= Double.MIN_NORMAL * 1e6) || !Double.isFinite(pixelDeg)) {
            throw ls.error("imaging.field_of_view_M", "a pixel of " + fmt(light.fieldOfViewM() / light.pixels())
                    + " M subtends " + pixelDeg + " degrees at this distance, too small for an image's coordinates");
        }
        if (light.fieldOfViewM() < MIN_FIELD_OF_VIEW_M) {
            throw ls.error("imaging.field_of_view_M", "value " + light.fieldOfViewM() + " M is smaller than "
                    + fmt(MIN_FIELD_OF_VIEW_M) + " M: the emission kernel alone is 0.1 M wide, so every frame would be"
                    + " empty or one blurred pixel; allowed [" + fmt(MIN_FIELD_OF_VIEW_M) + ", 1e5] M");
        }
        if (0.5 * light.fieldOfViewM() < captureRadius) {
            warnings.add(ls.error("imaging.field_of_view_M", "the field of view (" + fmt(light.fieldOfViewM())
                    + " M across) lies inside the capture radius (" + fmt(captureRadius) + " M): frames show only gas"
                    + " passing in front of the hole, often nothing").getMessage());
        }
    }

    /** Smallest field of view, M. */
    public static final double MIN_FIELD_OF_VIEW_M = 1.0;

    /**
     * The stages after the particles have been evolved, in order. The light stage (ray table,
     * images.fits, centroid.csv, lightcurve.csv, mock_astrometry.csv) belongs here, after the
     * analysis and before the plots.
     */
    public static List<RunStage> stages() {
        List<RunStage> stages = new ArrayList<>();
        stages.add(new SnapshotStage());
        stages.add(new AnalysisStage());
        stages.add(new org.spindrift.sim.light.LightRunStage());
        stages.add(new org.spindrift.sim.interferometry.InterferometryStage());
        stages.add(new PlotStage());
        return stages;
    }

    /** Runs a prepared scenario and writes its folder. */
    public static Outcome run(Prepared p, Options o) throws IOException {
        return run(p, o, stages());
    }

    /**
     * Runs a prepared scenario through the given stages. The output folder is checked and locked
     * before the work starts (a second run into it is refused at once); the run is built beside
     * it and swapped in when complete, so a failed or stopped run leaves the folder as it was.
     */
    public static Outcome run(Prepared p, Options o, List<RunStage> stages) throws IOException {
        RunArchiveWriter.checkUsable(o.output(), o.overwrite()); // before the work, so a bad -o fails at once
        checkDisk(p, o.output());
        // failed: remove the new run's folder, the old run stays (the writer's own shutdown hook
        // does the same when the run is stopped with Ctrl-C or SIGTERM)
        RunArchiveWriter archive = RunArchiveWriter.create(o.output(), o.overwrite());
        boolean done = false;
        try {
            Outcome out = evolveAndWrite(p, o, stages, archive);
            done = true;
            return out;
        } finally {
            if (!done) {
                archive.abandon();
            }
        }
    }

    private static Outcome evolveAndWrite(Prepared p, Options o, List<RunStage> stages, RunArchiveWriter archive)
            throws IOException {
        Scenario sc = p.loaded().scenario();
        ObjectNode manifest = RunArchiveWriter.json().createObjectNode();
        for (String w : p.warnings()) {
            RunNotes.warn(manifest, w);
        }
        ParticleBatch batch = p.placed().batch();
        int n = batch.size();
        Spacetime st = p.spacetime();
        double[] q0 = carter(st, batch);
        BatchIntegrator.Config cfg = BatchIntegrator.Config.of(p.captureRadius())
                .withTolerance(sc.run().tolerance(), sc.run().tolerance()).withThreads(Math.max(1, o.threads()));
        BatchIntegrator integrator = new BatchIntegrator(st, cfg);
        HistorySink sink = new HistorySink(p, st);
        // periapsis and polar turning points of every particle, on the dense output (motion engine)
        TurningPoints[] turning = new TurningPoints[n];
        for (int i = 0; i < n; i++) {
            turning[i] = new TurningPoints(i);
        }
        StepListener events = (i, step) -> turning[i].step(i, step);
        BatchIntegrator.Result result;
        long t0 = System.nanoTime();
        Checkpoint cp = new Checkpoint(o.output(), Checkpoint.fingerprint(p.loaded().scenario()));
        int done = -1;
        if (o.resume() && cp.exists()) {
            done = cp.read(batch, turning, sink);
        } else {
            if (o.resume()) {
                System.err.println("spindrift: no checkpoint for " + o.output() + " yet: starting from the beginning");
            }
            cp.clear();
        }
        Stopper stopper = new Stopper(cp, batch, turning, sink, p, o);
        Runtime.getRuntime().addShutdownHook(stopper);
        try {
            int s = p.times().length;
            try (ProgressBar bar = ProgressBars.open(o.progress(), "evolving " + n + " particles", s)) {
                sink.bar = bar;
                if (done < s - 1) {
                    // the same barriers as an uninterrupted run: each particle resumes exactly where it stood
                    final int offset = done + 1;
                    double[] rest = Arrays.copyOfRange(p.times(), offset, s);
                    long[] last = {System.nanoTime()};
                    result = integrator.integrate(batch, rest, (k, t, snap) -> {
                        sink.accept(k + offset, t, snap);
                        boolean due = (System.nanoTime() - last[0]) * 1e-9 >= o.checkpointSeconds();
                        stopper.barrier(k + offset, due);
                        if (due) {
                            last[0] = System.nanoTime();
                        }
                    }, events);
                } else {
                    result = new BatchIntegrator.Result(0, 0, 0, batch.countByState());
                }
            }
            stopper.integrated();
        } catch (RuntimeException | Error e) {
            stopper.remove();
            throw e;
        }
        try {
        ParticleHistory history = sink.history();
        long t1 = System.nanoTime();

        Map<String, Double> stageSeconds = new LinkedHashMap<>();
        ObjectNode summary = RunArchiveWriter.json().createObjectNode();
        RunContext ctx = new RunContext(p.loaded(), st, p.landmarks(), p.secondsPerM(), p.uasPerM(),
                p.placed(), history, archive, manifest, summary, Math.max(1, o.threads()), o.progress(),
                new java.util.HashMap<>());
        ctx.products().put(TURNING_POINTS, turning);
        for (RunStage stage : stages) {
            long ts = System.nanoTime();
            stage.run(ctx);
            stageSeconds.put(stage.name(), (System.nanoTime() - ts) * 1e-9);
        }
        ObjectNode diag = diagnostics(st, batch, q0, result);
        if (done >= 0) {
            diag.put("resumed_after_snapshot", done);
        }
        summary.set("diagnostics", diag);
        archive.writeJson(ArchiveLayout.SUMMARY, summary);
        archive.finish(manifestBody(p, manifest, diag, result));
        stopper.finished();
        cp.clear();
        return new Outcome(archive.target(), history, result, (t1 - t0) * 1e-9, (System.nanoTime() - t1) * 1e-9,
                stageSeconds);
        } finally {
            stopper.remove();
        }
    }

    /**
     * Stops a run cleanly on SIGINT/SIGTERM (a shutdown hook): during the evolution the main thread
     * writes a checkpoint at the next snapshot barrier and the hook waits for it; after the
     * evolution the hook writes the final one itself (the data no longer change). Either way one
     * line says how to resume. Also writes the checkpoints that fall due at barriers.
     */
    static final class Stopper extends Thread {
        private static final long WAIT_S = 300;
        private final Checkpoint cp;
        private final ParticleBatch batch;
        private final TurningPoints[] turning;
        private final HistorySink sink;
        private final Prepared p;
        private final Options o;
        private final java.util.concurrent.CountDownLatch saved = new java.util.concurrent.CountDownLatch(1);
        private boolean requested;
        private boolean integrating = true;
        private boolean finished;
        private int savedAt = -1;

        Stopper(Checkpoint cp, ParticleBatch batch, TurningPoints[] turning, HistorySink sink, Prepared p, Options o) {
            super("spindrift-stop");
            this.cp = cp;
            this.batch = batch;
            this.turning = turning;
            this.sink = sink;
            this.p = p;
            this.o = o;
        }

        /** At the barrier after snapshot k (main thread): writes a checkpoint when due or asked to stop. */
        void barrier(int k, boolean due) {
            boolean stop;
            synchronized (this) {
                stop = requested;
            }
            if (due || stop) {
                save(k);
            }
            if (stop) {
                stopped(k);
                saved.countDown();
                while (true) { // the JVM is exiting: wait for it here, touching nothing more
                    try {
                        Thread.sleep(60_000);
                    } catch (InterruptedException e) {
                        // keep waiting
                    }
                }
            }
        }

        private void save(int k) {
            try {
                cp.write(k, batch, turning, sink);
                synchronized (this) {
                    savedAt = k;
                }
            } catch (IOException e) {
                System.err.println("spindrift: warning: cannot write the checkpoint in " + cp.folder() + " ("
                        + e.getMessage() + "); the run goes on");
            }
        }

        private void stopped(int k) {
            System.err.println("spindrift: stopped after snapshot " + (k + 1) + " of " + p.times().length
                    + "; checkpoint in " + cp.folder() + "; continue with: spindrift run " + p.loaded().file() + " -o "
                    + o.output() + " --resume");
        }

        /** The evolution is over (main thread). */
        void integrated() {
            synchronized (this) {
                integrating = false;
            }
        }

        /** The run folder is complete: nothing to save any more. */
        synchronized void finished() {
            finished = true;
        }

        void remove() {
            try {
                Runtime.getRuntime().removeShutdownHook(this);
            } catch (IllegalStateException e) {
                // shutting down: this hook is running
            }
        }

        @Override public void run() {
            boolean during;
            synchronized (this) {
                if (finished) {
                    return;
                }
                requested = true;
                during = integrating;
            }
            if (during) {
                try {
                    saved.await(WAIT_S, java.util.concurrent.TimeUnit.SECONDS);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
                return;
            }
            int last = p.times().length - 1;
            synchronized (this) {
                if (savedAt != last) {
                    save(last);
                }
            }
            stopped(last);
        }
    }

    /** Builds the history from the integrator's snapshots. */
    static final class HistorySink implements org.spindrift.sim.motion.SnapshotSink {
        private final Prepared p;
        private final Spacetime st;
        private final double[] g = new double[Spacetime.SIZE];
        private final int n;
        final double[][] r;
        final double[][] th;
        final double[][] ph;
        final double[][] ut;
        final double[][] ur;
        final double[][] uth;
        final double[][] uph;
        final float[][] w;
        final byte[][] state;
        private final FlareEnvelope[] env;
        private final double[] pr;
        private final double[] pth;
        ProgressBar bar;

        HistorySink(Prepared p, Spacetime st) {
            this.p = p;
            this.st = st;
            int s = p.times().length;
            n = p.placed().batch().size();
            r = new double[s][];
            th = new double[s][];
            ph = new double[s][];
            ut = new double[s][];
            ur = new double[s][];
            uth = new double[s][];
            uph = new double[s][];
            w = new float[s][];
            state = new byte[s][];
            List<Source> src = p.loaded().scenario().sources();
            env = new FlareEnvelope[src.size()];
            for (int k = 0; k < env.length; k++) {
                env[k] = new FlareEnvelope(src.get(k).emission().flare(), p.secondsPerM());
            }
            pr = new double[n];
            pth = new double[n];
        }

        /** Allocates the rows of snapshot k. */
        void allocate(int k) {
            r[k] = new double[n];
            th[k] = new double[n];
            ph[k] = new double[n];
            ut[k] = new double[n];
            ur[k] = new double[n];
            uth[k] = new double[n];
            uph[k] = new double[n];
            w[k] = new float[n];
            state[k] = new byte[n];
        }

        @Override public void accept(int k, double t, Snapshot snap) {
            allocate(k);
            snap.copyR(r[k]);
            snap.copyTheta(th[k]);
            snap.copyPhi(ph[k]);
            snap.copyPR(pr);
            snap.copyPTheta(pth);
            snap.copyStates(state[k]);
            int[] src = p.placed().sourceIndex();
            double[] base = p.placed().baseWeights();
            double[] f = new double[env.length];
            for (int j = 0; j < env.length; j++) {
                f[j] = env[j].at(t);
            }
            for (int i = 0; i < n; i++) {
                // raise the index: u^mu = g^{mu nu} p_nu (unit rest mass)
                st.inverse(r[k][i], th[k][i], g);
                double pt = snap.pT(i);
                double pphi = snap.pPhi(i);
                ut[k][i] = g[Spacetime.TT] * pt + g[Spacetime.TP] * pphi;
                ur[k][i] = g[Spacetime.RR] * pr[i];
                uth[k][i] = g[Spacetime.HH] * pth[i];
                uph[k][i] = g[Spacetime.TP] * pt + g[Spacetime.PP] * pphi;
                w[k][i] = state[k][i] == 0 ? (float) (base[i] * f[src[i]]) : 0f;
            }
            if (bar != null) {
                bar.stepTo(k + 1);
            }
        }

        ParticleHistory history() {
            return new ParticleHistory(p.times().clone(), r, th, ph, ut, ur, uth, uph, w, state,
                    p.placed().sourceIndex().clone(), st.spin());
        }
    }

    /** @return Carter constant of every particle (NaN if the metric is not separable) */
    private static double[] carter(Spacetime st, ParticleBatch b) {
        double[] q = new double[b.size()];
        for (int i = 0; i < b.size(); i++) {
            q[i] = st.separable() ? st.carter(b.theta(i), b.pTheta(i), -b.pT(i), b.pPhi(i), 1.0) : Double.NaN;
        }
        return q;
    }

    /** Max and median |H + 1/2|, Carter-constant drift, end states and failure reasons. */
    private static ObjectNode diagnostics(Spacetime st, ParticleBatch b, double[] q0, BatchIntegrator.Result res) {
        GeodesicEquations eq = new GeodesicEquations(st);
        int n = b.size();
        double[] dh = new double[n];
        double[] dq = new double[n];
        int m = 0;
        Map<String, Integer> failures = new LinkedHashMap<>();
        for (int i = 0; i < n; i++) {
            if (b.endState(i) == EndState.FAILED) {
                failures.merge(b.failure(i).name().toLowerCase(java.util.Locale.ROOT), 1, Integer::sum);
            }
            if (b.endState(i) != EndState.ALIVE) {
                continue;
            }
            dh[m] = Math.abs(eq.hamiltonian(b.r(i), b.theta(i), b.pT(i), b.pPhi(i), b.pR(i), b.pTheta(i)) + 0.5);
            double q = st.separable() ? st.carter(b.theta(i), b.pTheta(i), -b.pT(i), b.pPhi(i), 1.0) : Double.NaN;
            dq[m] = Math.abs(q - q0[i]) / Math.max(1.0, Math.abs(q0[i]));
            m++;
        }
        ObjectNode d = RunArchiveWriter.json().createObjectNode();
        double[] sh = Arrays.copyOf(dh, m);
        Arrays.sort(sh);
        put(d, "hamiltonian_error_max", m > 0 ? sh[m - 1] : Double.NaN);
        put(d, "hamiltonian_error_median", m > 0 ? sh[m / 2] : Double.NaN);
        if (st.separable()) {
            double[] sq = Arrays.copyOf(dq, m);
            Arrays.sort(sq);
            put(d, "carter_relative_drift_max", m > 0 ? sq[m - 1] : Double.NaN);
            put(d, "carter_relative_drift_median", m > 0 ? sq[m / 2] : Double.NaN);
        } else {
            d.putNull("carter_relative_drift_max");
            d.putNull("carter_relative_drift_median");
        }
        d.put("rhs_evaluations", res.evaluations());
        d.put("accepted_steps", res.acceptedSteps());
        d.put("rejected_steps", res.rejectedSteps());
        ObjectNode f = d.putObject("failures");
        failures.forEach(f::put);
        return d;
    }

    static void put(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) {
            o.put(k, v);
        } else {
            o.putNull(k);
        }
    }

    private static ObjectNode manifestBody(Prepared p, ObjectNode extra, ObjectNode diag, BatchIntegrator.Result res) {
        Scenario sc = p.loaded().scenario();
        ObjectNode m = RunArchiveWriter.json().createObjectNode();
        m.set("scenario", ScenarioJson.toJson(sc));
        m.put("scenario_file", p.loaded().file().toString());
        m.put("seed", sc.run().seed());
        ObjectNode bh = m.putObject("black_hole");
        bh.put("mass_solar", sc.blackHole().massSolar());
        bh.put("distance_Mpc", sc.blackHole().distanceMpc());
        bh.put("family", sc.blackHole().family());
        bh.put("spin", sc.blackHole().spin());
        ObjectNode par = bh.putObject("parameters");
        sc.blackHole().parameters().forEach(par::put);
        ObjectNode u = m.putObject("units");
        u.put("M_seconds", p.secondsPerM());
        u.put("M_metres", Units.lengthUnitMetres(sc.blackHole().massSolar()));
        u.put("M_uas", p.uasPerM());
        m.putObject("observer").put("inclination_deg", sc.observer().inclinationDeg())
                .put("position_angle_deg", sc.observer().positionAngleDeg());
        ObjectNode lm = m.putObject(ArchiveLayout.LANDMARKS);
        p.landmarks().forEach((k, v) -> put(lm, k, v));
        ObjectNode time = m.putObject("time");
        time.put("origin", "coordinate time t = 0 at the start of the run (emitter time)");
        time.put("duration_M", p.durationM());
        time.put("duration_requested_M", p.requestedDurationM());
        time.put("duration_min", p.durationM() * p.secondsPerM() / 60.0);
        time.put("snapshots", p.times().length);
        time.put("cadence_M", p.times()[1] - p.times()[0]);
        time.put("first_orbit_period_M", p.placed().centres()[0].periodM());
        ArrayNode sources = m.putArray("sources");
        int[] first = p.placed().firstIndex();
        int[] kept = SnapshotStage.keptPerSource(sc);
        int at = 0;
        for (int k = 0; k < sc.sources().size(); k++) {
            Source s = sc.sources().get(k);
            sources.addObject().put("name", s.name()).put("kind", s.kind().key()).put("particles", s.particles())
                    .put("kept", kept[k]).put("first_index", at).put("first_particle", first[k]);
            at += kept[k];
        }
        m.set("diagnostics", diag);
        ObjectNode es = m.putObject(ArchiveLayout.END_STATES);
        for (EndState e : EndState.values()) {
            es.put(e.key(), res.count(e));
        }
        extra.properties().forEach(e -> m.set(e.getKey(), e.getValue()));
        return m;
    }

    static String fmt(double v) {
        return String.format(java.util.Locale.ROOT, "%.6g", v);
    }
}
