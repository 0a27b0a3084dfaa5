package org.spindrift.sim.run;

import java.io.IOException;
import java.util.Arrays;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.history.HistoryRecorder;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.motion.BatchIntegrator;
import org.spindrift.sim.motion.MotionDiagnostics;
import org.spindrift.sim.motion.ParticleBatch;
import org.spindrift.sim.motion.StepListener;
import org.spindrift.sim.motion.TurningPoints;
import org.spindrift.sim.scenario.FlareEnvelope;

/**
 * The evolution of a prepared run: the {@link BatchIntegrator} steps the placed particles over the
 * snapshot grid; at each snapshot barrier the {@link HistoryRecorder} keeps the particles, the
 * {@link MotionDiagnostics} their health, and a caller's barrier may write a checkpoint; a
 * {@link StepListener} feeds the {@link TurningPoints} of every particle on the dense output.
 * Writes nothing itself, so {@link #inMemory} gives a history without a run folder.
 */
public final class Evolution {
    /**
     * The evolved particles.
     *
     * @param history every particle at every snapshot
     * @param turningPoints periapsis and polar turning points of every particle
     * @param diagnostics mass-shell and Carter-constant health over the snapshots
     * @param result integrator work counts (since the resume) and end states
     * @param resumedAfter the snapshot a checkpoint had finished, -1 for a run from the start
     */
    public record Evolved(ParticleHistory history, TurningPoints[] turningPoints, MotionDiagnostics diagnostics,
            BatchIntegrator.Result result, int resumedAfter) {
    }

    /** Hears the barrier after snapshot k, on the main thread, with the workers idle. */
    @FunctionalInterface
    interface Barrier {
        void after(int k);
    }

    private final ScenarioRun.Prepared p;
    private final ParticleBatch batch;
    private final HistoryRecorder recorder;
    private final TurningPoints[] turning;
    private final MotionDiagnostics diagnostics;
    private final BatchIntegrator integrator;

    /** Sets up the evolution of a prepared run (its particle batch is evolved in place). */
    Evolution(ScenarioRun.Prepared p, int threads) {
        this.p = p;
        this.batch = p.placed().batch();
        int n = batch.size();
        List<Source> src = p.loaded().scenario().sources();
        DoubleUnaryOperator[] env = new DoubleUnaryOperator[src.size()];
        for (int k = 0; k < env.length; k++) {
            env[k] = new FlareEnvelope(src.get(k).emission().flare(), p.secondsPerM());
        }
        this.recorder = new HistoryRecorder(p.times(), p.spacetime(), p.placed().sourceIndex(),
                p.placed().baseWeights(), env);
        this.turning = new TurningPoints[n];
        for (int i = 0; i < n; i++) {
            turning[i] = new TurningPoints(i);
        }
        // Q_0 of the diagnostics from the initial state (a resume places the particles again first)
        this.diagnostics = new MotionDiagnostics(p.spacetime(), batch);
        double tol = p.loaded().scenario().run().tolerance();
        this.integrator = new BatchIntegrator(p.spacetime(), BatchIntegrator.Config.of(p.captureRadius())
                .withTolerance(tol, tol).withThreads(Math.max(1, threads)));
    }

    /**
     * Evolves a prepared run in memory: no checkpoint, no files, no progress.
     *
     * @param threads worker threads (the result does not depend on them)
     */
    public static Evolved inMemory(ScenarioRun.Prepared p, int threads) {
        return new Evolution(p, threads).from(-1, k -> { }, ProgressListener.NONE);
    }

    /** Writes a checkpoint after snapshot k. */
    void save(Checkpoint cp, int k) throws IOException {
        cp.write(k, batch, turning, recorder, diagnostics);
    }

    /** @return the snapshot the checkpoint had finished, its state restored */
    int restore(Checkpoint cp) {
        return cp.read(batch, turning, recorder, diagnostics);
    }

    /**
     * Evolves from the barrier after snapshot {@code done} (-1: from the start) to the end, with
     * the same barriers as an uninterrupted run, so each particle resumes exactly where it stood.
     */
    Evolved from(int done, Barrier barrier, ProgressListener progress) {
        int s = p.times().length;
        StepListener events = (i, step) -> turning[i].step(i, step);
        BatchIntegrator.Result result;
        progress.begin("evolving " + batch.size() + " particles", s, done + 1);
        try {
            if (done < s - 1) {
                final int offset = done + 1;
                double[] rest = Arrays.copyOfRange(p.times(), offset, s);
                result = integrator.integrate(batch, rest, (k, t, snap) -> {
                    recorder.accept(k + offset, t, snap);
                    diagnostics.accept(k + offset, t, snap);
                    progress.advance(k + offset + 1);
                    barrier.after(k + offset);
                }, events);
            } else {
                result = new BatchIntegrator.Result(0, 0, 0, batch.countByState());
            }
        } finally {
            progress.end();
        }
        return new Evolved(recorder.history(), turning, diagnostics, result, done);
    }
}
