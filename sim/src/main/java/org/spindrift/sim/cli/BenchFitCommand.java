package org.spindrift.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveColumns;
import org.spindrift.sim.fit.FitModel;
import org.spindrift.sim.fit.FitRun;
import org.spindrift.sim.light.CompactSourceModel;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code spindrift bench fit}: an invented compact hot spot (1e6 solar masses at 1 kpc, r = 8 M,
 * a = 0.5, i = 45 deg, 64 x 64 ray table), mock data of --epochs epochs made by the fast model
 * itself plus noise; times one model evaluation with the table reused and with a new spin (new
 * table), a 6-parameter least-squares fit and an ensemble-sampler run.
 */
@Command(name = "fit", mixinStandardHelpOptions = true,
        description = {"Time the fit engine: one model evaluation of --epochs epochs with the ray table reused and"
                + " with a new spin (retrace), a 6-parameter least-squares fit, --walkers x --steps sampling."})
public final class BenchFitCommand implements Callable<Integer> {
    /** Columns of the synthetic astrometry files (those the fit reads). */
    private static final java.util.List<String> FIT_COLUMNS = java.util.List.of(ArchiveColumns.T_OBS_MIN,
            ArchiveColumns.X_UAS, ArchiveColumns.Y_UAS, ArchiveColumns.SIGMA_UAS);
    @Option(names = "--epochs", paramLabel = "N", defaultValue = "100", description = "Data epochs (default: ${DEFAULT-VALUE}).")
    int epochs;

    @Option(names = "--walkers", paramLabel = "N", defaultValue = "32", description = "Walkers (default: ${DEFAULT-VALUE}).")
    int walkers;

    @Option(names = "--steps", paramLabel = "N", defaultValue = "2000", description = "Sampler steps (default: ${DEFAULT-VALUE}).")
    int steps;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: available processors).")
    Integer threads;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    static final String SCENARIO = String.join("\n",
            "name: bench-fit",
            "description: INVENTED compact hot spot for the fit benchmark (round synthetic values)",
            "black_hole: {mass_solar: 1.0e6, distance: 1 kpc, family: kerr, spin: 0.5}",
            "observer: {inclination_deg: 45, position_angle_deg: 20}",
            "sources:",
            "  - name: spot",
            "    kind: hot_spot",
            "    particles: 100",
            "    shape: {sigma_M: 0.3}",
            "    orbit:",
            "      circular: {radius_M: 8.0, phi_deg: 0}",
            "    velocity: {model: shear}",
            "    emission:",
            "      spectral_index: 1.0",
            "      flare: {kind: gaussian, peak: 12 min, width: 6 min}",
            "run: {duration: 2 orbits, snapshot_cadence: 2 M}",
            "imaging: {field_of_view_M: 24, pixels: 64, frame_cadence: 2 M}",
            "instrument: {steady_source_flux_ratio: 0.3}",
            "");

    static final String FREE = String.join("\n",
            "free:",
            "  - {key: \"sources[0].orbit.circular.radius_M\", min: 6.5, max: 10, start: 8.3}",
            "  - {key: \"sources[0].orbit.circular.phi_deg\", min: -40, max: 40, start: 5}",
            "  - {key: observer.position_angle_deg, min: 0, max: 40, start: 15}",
            "  - {key: black_hole.mass_solar, min: 8.0e5, max: 1.2e6, start: 1.05e6}",
            "  - {key: instrument.steady_source_flux_ratio, min: 0, max: 1, start: 0.4}",
            "  - {key: data.time_offset_min, min: -3, max: 3, start: 0.5}",
            "");

    @Override public Integer call() throws IOException {
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (epochs < 10 || epochs > 100000 || walkers < 12 || walkers % 2 != 0 || steps < 10) {
            throw new UserInputException("--epochs 10..100000, --walkers even >= 12, --steps >= 10");
        }
        PrintWriter out = spec.commandLine().getOut();
        Path dir = Files.createTempDirectory("spindrift-bench-fit");
        try {
            Files.writeString(dir.resolve("truth.yaml"), SCENARIO);
            // placeholder data at the truth to build the model, then mock data from the model itself
            StringBuilder csv = new StringBuilder(ArchiveColumns.header(FIT_COLUMNS) + "\n");
            for (int i = 0; i < epochs; i++) {
                csv.append(String.format(Locale.ROOT, "%.6f,0,0,1%n", 4.0 + 16.0 * i / (epochs - 1)));
            }
            Files.writeString(dir.resolve("data.csv"), csv.toString());
            Path fit = dir.resolve("fit.yaml");
            Files.writeString(fit, "scenario: truth.yaml\ndata: {astrometry: data.csv}\n" + FREE
                    + "method: {kind: least_squares, starts: 1, seed: 1}\n");
            FitRun.Prepared p0 = FitRun.prepare(fit, n);
            double[] truth = {8.0, 0.0, 20.0, 1.0e6, 0.3, 0.0};
            FitModel.Prediction pt = new FitModel(p0.fit(), p0.data(), p0.cache()).predict(truth);
            Random rng = new Random(1);
            csv = new StringBuilder(ArchiveColumns.header(FIT_COLUMNS) + "\n");
            for (int i = 0; i < epochs; i++) {
                csv.append(String.format(Locale.ROOT, "%.6f,%.6f,%.6f,2%n", p0.data().timeMin()[i],
                        pt.x()[i] + 2 * rng.nextGaussian(), pt.y()[i] + 2 * rng.nextGaussian()));
            }
            Files.writeString(dir.resolve("data.csv"), csv.toString());
            FitRun.Prepared p = FitRun.prepare(fit, n);
            FitModel m = new FitModel(p.fit(), p.data(), p.cache());
            double[] r = new double[m.residualCount()];
            double[] q = truth.clone();
            for (int i = 0; i < 60; i++) {          // warm-up: until the JIT has compiled the evaluation's loops
                q[0] = 8.0 + 0.001 * i;
                m.residuals(q, r);
            }
            int reps = 60;
            long t0 = System.nanoTime();
            for (int i = 0; i < reps; i++) {
                q[0] = 8.0 + 0.0015 * i;
                q[2] = 20 + 0.05 * i;
                q[3] = 1.0e6 * (1 + 5e-4 * i);
                m.residuals(q, r);
            }
            double evalMs = (System.nanoTime() - t0) * 1e-6 / reps;
            int traced0 = p.cache().tablesTraced();
            // a new spin: one evaluation of the model at the truth with a fresh table cache (spacetime,
            // landmarks, centre track, ray table and its index, frames), two spins, the mean
            double retraceS = 0;
            for (String spin : new String[] {"0.55", "0.6"}) {
                Path sc = dir.resolve("spin.yaml");
                Files.writeString(sc, SCENARIO.replace("spin: 0.5}", "spin: " + spin + "}"));
                LoadedScenario ls = ScenarioLoader.load(sc);
                t0 = System.nanoTime();
                FitModel.frames(ls, new FitModel.Cache(n), new CompactSourceModel());
                retraceS += (System.nanoTime() - t0) * 1e-9 / 2;
            }
            out.printf(Locale.ROOT, "machine: %d processors available, %d threads used (compare within one run: the load of"
                    + " other processes changes wall-clock figures)%n", Runtime.getRuntime().availableProcessors(), n);
            out.printf(Locale.ROOT, "one evaluation, %d epochs, table reused (orbit, position angle, mass changed): %.2f ms"
                    + " (tables traced during these: %d)%n", epochs, evalMs, p.cache().tablesTraced() - traced0);
            out.printf(Locale.ROOT, "one evaluation with a new spin (new ray table %d x %d traced and indexed): %.2f s%n",
                    64, 64, retraceS);
            out.flush();
            t0 = System.nanoTime();
            FitRun.Result ls = FitRun.run(FitRun.prepare(fit, n), new FitRun.Options(dir.resolve("ls"), n, false));
            double lsS = (System.nanoTime() - t0) * 1e-9;
            out.printf(Locale.ROOT, "6-parameter least-squares fit (1 start, outputs included): %.1f s, %d evaluations,"
                    + " chi2 %.1f for %d dof%n", lsS, ls.evaluations(), ls.chiSquare(), ls.dof());
            out.flush();
            Files.writeString(fit, "scenario: truth.yaml\ndata: {astrometry: data.csv}\n" + FREE + "method: {kind: sample,"
                    + " starts: 1, seed: 1, walkers: " + walkers + ", steps: " + steps + ", burn_in: " + steps / 4 + "}\n");
            t0 = System.nanoTime();
            FitRun.Result s = FitRun.run(FitRun.prepare(fit, n), new FitRun.Options(dir.resolve("sample"), n,
                    System.console() != null));
            double sS = (System.nanoTime() - t0) * 1e-9;
            out.printf(Locale.ROOT, "sampler %d walkers x %d steps (after a 1-start least-squares fit, outputs included):"
                    + " %.1f s, %d evaluations, acceptance %.2f%n", walkers, steps, sS, s.evaluations(),
                    s.chain().acceptance());
            out.flush();
        } finally {
            try (Stream<Path> w = Files.walk(dir)) {
                w.sorted(Comparator.reverseOrder()).forEach(f -> f.toFile().delete());
            }
        }
        return 0;
    }
}
