package org.spindrift.sim.run;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spindrift.shared.Units;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.pipeline.RunContext;
import org.spindrift.sim.pipeline.RunNotes;
import org.spindrift.sim.pipeline.RunStage;
import org.spindrift.sim.pipeline.StageResults;
import org.spindrift.sim.pipeline.Stages;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioChecks;
import org.spindrift.sim.scenario.SourceSetup;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * One scenario run, put together from parts with one job each: {@link #prepare} checks the
 * scenario ({@link SnapshotGrid}, {@link RunLimits}) and places the sources; {@link #run} opens the
 * run folder, evolves the particles ({@link Evolution}, with a {@link Checkpoint} and the
 * {@link StopHook}), runs the {@link RunStage}s (snapshots, analysis, light, interferometry,
 * plots) and writes the summary and the manifest ({@link RunManifest}) last.
 *
 * <p>Nothing is written before every check has passed and the particles have been evolved, so a
 * bad scenario leaves no folder. Every file goes through a temporary name; {@code manifest.json}
 * comes last, so an interrupted run leaves no folder that looks complete (and a shutdown hook
 * removes the temporary files of an interrupted run).
 */
public final class ScenarioRun {
    /**
     * @param output run folder
     * @param threads worker threads
     * @param progress whether stages may print progress lines (on a terminal, without --quiet)
     * @param overwrite replace a finished run in the folder (only once the new one is complete)
     * @param checkpointSeconds wall time between checkpoints, s (0: at every snapshot)
     * @param resume continue from the checkpoint beside the folder, if there is one
     * @param listener hears the evolution's progress (the command line attaches a bar)
     */
    public record Options(Path output, int threads, boolean progress, boolean overwrite, double checkpointSeconds,
            boolean resume, ProgressListener listener) {
        /** Default wall time between checkpoints, s. */
        public static final double CHECKPOINT_SECONDS = 600;

        /** Options without a progress listener. */
        public Options(Path output, int threads, boolean progress, boolean overwrite, double checkpointSeconds,
                boolean resume) {
            this(output, threads, progress, overwrite, checkpointSeconds, resume, ProgressListener.NONE);
        }

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
        double[] times = SnapshotGrid.times(ls, secondsPerM, placed.centres()[0].periodM());
        double duration = sc.run().duration().toM(secondsPerM, placed.centres()[0].periodM());
        List<String> warnings = new ArrayList<>();
        String cut = SnapshotGrid.cutWarning(ls, duration, times);
        if (cut != null) {
            warnings.add(cut);
        }
        RunLimits.checkMemory(ls, sc.totalParticles(), times.length, Runtime.getRuntime().maxMemory());
        RunLimits.checkImaging(ls, sc, uasPerM, times, capture, warnings);
        return new Prepared(ls, st, landmarks, capture, placed, times, secondsPerM, uasPerM, List.copyOf(warnings),
                duration);
    }

    /** @return the standard stages, in order (a new list that callers may change) */
    public static List<RunStage> stages() {
        return Stages.standard();
    }

    /** Runs a prepared scenario through the standard stages and writes its folder. */
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
        RunLimits.checkDisk(p, o.output());
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
        ObjectNode manifest = RunArchiveWriter.json().createObjectNode();
        for (String w : p.warnings()) {
            RunNotes.warn(manifest, w);
        }
        Evolution evolution = new Evolution(p, o.threads());
        long t0 = System.nanoTime();
        Checkpoint cp = new Checkpoint(o.output(), Checkpoint.fingerprint(p.loaded().scenario()));
        int done = -1;
        if (o.resume() && cp.exists()) {
            done = evolution.restore(cp);
        } else {
            if (o.resume()) {
                System.err.println("spindrift: no checkpoint for " + o.output() + " yet: starting from the beginning");
            }
            cp.clear();
        }
        StopHook hook = new StopHook(cp, k -> evolution.save(cp, k), p.times().length,
                "spindrift run " + p.loaded().file() + " -o " + o.output() + " --resume");
        Runtime.getRuntime().addShutdownHook(hook);
        Evolution.Evolved evolved;
        try {
            long[] last = {System.nanoTime()};
            evolved = evolution.from(done, k -> {
                boolean due = (System.nanoTime() - last[0]) * 1e-9 >= o.checkpointSeconds();
                hook.barrier(k, due);
                if (due) {
                    last[0] = System.nanoTime();
                }
            }, o.listener());
            hook.integrated();
        } catch (RuntimeException | Error e) {
            hook.remove();
            throw e;
        }
        try {
            long t1 = System.nanoTime();
            Map<String, Double> stageSeconds = new LinkedHashMap<>();
            ObjectNode summary = RunArchiveWriter.json().createObjectNode();
            RunContext ctx = new RunContext(p.loaded(), p.spacetime(), p.landmarks(), p.secondsPerM(), p.uasPerM(),
                    p.placed(), evolved.history(), evolved.turningPoints(), archive, manifest, summary,
                    Math.max(1, o.threads()), o.progress(), new StageResults());
            for (RunStage stage : stages) {
                long ts = System.nanoTime();
                stage.run(ctx);
                stageSeconds.put(stage.name(), (System.nanoTime() - ts) * 1e-9);
            }
            ObjectNode diag = RunManifest.diagnostics(evolved, p.spacetime().separable(), p.placed().batch());
            summary.set("diagnostics", diag);
            archive.writeJson(ArchiveLayout.SUMMARY, summary);
            archive.finish(RunManifest.body(p, manifest, diag, evolved.result()));
            hook.finished();
            cp.clear();
            return new Outcome(archive.target(), evolved.history(), evolved.result(), (t1 - t0) * 1e-9,
                    (System.nanoTime() - t1) * 1e-9, stageSeconds);
        } finally {
            hook.remove();
        }
    }

}
