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
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
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
     */
    public record Options(Path output, int threads, boolean progress) {
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
     * @param microarcsecPerM angular size of 1 M, micro-arcseconds
     */
    public record Prepared(LoadedScenario loaded, Spacetime spacetime, Map<String, Double> landmarks,
            double captureRadius, SourceSetup.Placed placed, double[] times, double secondsPerM,
            double microarcsecPerM) {
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
        double capture = ScenarioChecks.captureRadius(st, landmarks);
        ScenarioChecks.checkSources(ls, st, capture);
        double secondsPerM = Units.timeUnitSeconds(sc.blackHole().massSolar());
        double uasPerM = Units.microarcsecPerM(sc.blackHole().massSolar(), sc.blackHole().distanceKpc());
        SourceSetup.Placed placed = SourceSetup.place(sc, st, capture);
        double[] times = snapshotTimes(ls, secondsPerM, placed.centres()[0].periodM());
        return new Prepared(ls, st, landmarks, capture, placed, times, secondsPerM, uasPerM);
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
        stages.add(new PlotStage());
        return stages;
    }

    /** Runs a prepared scenario and writes its folder. */
    public static Outcome run(Prepared p, Options o) throws IOException {
        return run(p, o, stages());
    }

    /** Runs a prepared scenario through the given stages. */
    public static Outcome run(Prepared p, Options o, List<RunStage> stages) throws IOException {
        RunArchiveWriter.checkUsable(o.output()); // before the work, so a bad -o fails at once
        Scenario sc = p.loaded().scenario();
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
        try (ProgressBar bar = o.progress() ? new ProgressBarBuilder().setTaskName("evolving " + n + " particles")
                .setInitialMax(p.times().length).setStyle(ProgressBarStyle.ASCII)
                .setConsumer(new ConsoleProgressBarConsumer(System.err)).setUpdateIntervalMillis(250).build() : null) {
            sink.bar = bar;
            result = integrator.integrate(batch, p.times(), sink, events);
        }
        ParticleHistory history = sink.history();
        long t1 = System.nanoTime();

        Path folder = o.output();
        RunArchiveWriter archive = RunArchiveWriter.create(folder);
        Map<String, Double> stageSeconds = new LinkedHashMap<>();
        // stopped (Ctrl-C, SIGTERM) or failed: remove what this run wrote, so nothing looks complete
        Thread cleanup = new Thread(archive::abandon, "spindrift-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
        boolean done = false;
        try {
            ObjectNode manifest = RunArchiveWriter.json().createObjectNode();
            ObjectNode summary = RunArchiveWriter.json().createObjectNode();
            RunContext ctx = new RunContext(p.loaded(), st, p.landmarks(), p.secondsPerM(), p.microarcsecPerM(),
                    p.placed(), history, archive, manifest, summary, Math.max(1, o.threads()), o.progress(),
                    new java.util.HashMap<>());
            ctx.products().put(TURNING_POINTS, turning);
            for (RunStage stage : stages) {
                long ts = System.nanoTime();
                stage.run(ctx);
                stageSeconds.put(stage.name(), (System.nanoTime() - ts) * 1e-9);
            }
            ObjectNode diag = diagnostics(st, batch, q0, result);
            summary.set("diagnostics", diag);
            archive.writeJson(ArchiveLayout.SUMMARY, summary);
            archive.finish(manifestBody(p, manifest, diag, result));
            done = true;
        } finally {
            if (!done) {
                archive.abandon();
            }
            try {
                Runtime.getRuntime().removeShutdownHook(cleanup);
            } catch (IllegalStateException e) {
                // shutting down already
            }
        }
        return new Outcome(folder, history, result, (t1 - t0) * 1e-9, (System.nanoTime() - t1) * 1e-9, stageSeconds);
    }

    /** Builds the history from the integrator's snapshots. */
    private static final class HistorySink implements org.spindrift.sim.motion.SnapshotSink {
        private final Prepared p;
        private final Spacetime st;
        private final double[] g = new double[Spacetime.SIZE];
        private final int n;
        private final double[][] r;
        private final double[][] th;
        private final double[][] ph;
        private final double[][] ut;
        private final double[][] ur;
        private final double[][] uth;
        private final double[][] uph;
        private final float[][] w;
        private final byte[][] state;
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

        @Override public void accept(int k, double t, Snapshot snap) {
            r[k] = new double[n];
            th[k] = new double[n];
            ph[k] = new double[n];
            ut[k] = new double[n];
            ur[k] = new double[n];
            uth[k] = new double[n];
            uph[k] = new double[n];
            w[k] = new float[n];
            state[k] = new byte[n];
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

    /** Max and median |H + 1/2|, Carter-constant drift, end states and failure reasons (DESIGN section 5). */
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
        bh.put("distance_kpc", sc.blackHole().distanceKpc());
        bh.put("family", sc.blackHole().family());
        bh.put("spin", sc.blackHole().spin());
        ObjectNode par = bh.putObject("parameters");
        sc.blackHole().parameters().forEach(par::put);
        ObjectNode u = m.putObject("units");
        u.put("M_seconds", p.secondsPerM());
        u.put("M_metres", Units.lengthUnitMetres(sc.blackHole().massSolar()));
        u.put("M_microarcsec", p.microarcsecPerM());
        m.putObject("observer").put("inclination_deg", sc.observer().inclinationDeg())
                .put("position_angle_deg", sc.observer().positionAngleDeg());
        ObjectNode lm = m.putObject("landmarks");
        p.landmarks().forEach((k, v) -> put(lm, k, v));
        put(lm, "capture_radius", p.captureRadius());
        ObjectNode time = m.putObject("time");
        time.put("origin", "coordinate time t = 0 at the start of the run (emitter time)");
        time.put("duration_M", p.durationM());
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
        ObjectNode es = m.putObject("end_states");
        for (EndState e : EndState.values()) {
            es.put(e.name().toLowerCase(java.util.Locale.ROOT), res.count(e));
        }
        extra.fields().forEachRemaining(e -> m.set(e.getKey(), e.getValue()));
        return m;
    }

    static String fmt(double v) {
        return String.format(java.util.Locale.ROOT, "%.6g", v);
    }
}
