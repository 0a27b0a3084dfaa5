package org.spindrift.sim.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.run.ProgressListener;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code spindrift run FILE [-o DIR] [--threads N] [--quiet]}: checks the scenario, evolves its
 * sources and writes the run folder (DEVELOPERS.md, run archive layout).
 */
@Command(name = "run", mixinStandardHelpOptions = true,
        description = {"Run a scenario: evolve every source on geodesics, trace the light to the observer and"
                + " write the run folder:",
            "  manifest.json        scenario echo, landmarks, diagnostics, sha256 of every file (written last)",
            "  snapshots.h5         particle snapshots (HDF5)",
            "  summary.json         periods, periastron advance, shapes, light summary per source",
            "  periods.csv          periods and advance of every particle",
            "  shear.csv            shape, orientation, lag profile per source and snapshot",
            "  centroid.csv         flux-weighted centroid on the sky (micro-arcseconds) vs observer time, and the",
            "                       reported position (with a beam: the beam-convolved image's peak)",
            "  lightcurve.csv       total flux vs observer time",
            "  mock_astrometry.csv  reported position with astrometric noise (only when instrument noise is set)",
            "  images.fits          image cube (x, y, observer time) with a WCS header",
            "  visibilities.csv     (only with an interferometer) visibilities per frame and station pair",
            "  closure_phases.csv   closure phases on every triangle, with errors (interferometer)",
            "  closure_amplitudes.csv  log closure amplitudes on every quadrangle, with errors (interferometer)",
            "  visibilities.uvfits  the visibilities in the random-groups UVFITS layout (interferometer)",
            "  plots/               positions.png, shape.png, shape.svg, lag.png, lag.svg, periods.png,",
            "                       light_track.png, light_offsets.png, light_curve.png, light_images.png;",
            "                       with an interferometer uv_coverage.png, visibility_amplitude.png,",
            "                       closure_phases.png",
            "The file is checked first (as by 'check'); nothing is written when it has an error.",
            "Checkpoints of the evolution are written every --checkpoint-every (beside the folder); Ctrl-C or SIGTERM"
                + " stops with a checkpoint and says how to continue (--resume).",
            "",
            "What a run guarantees: the output folder is locked (a second run into it is refused);"
                + " the run is built in a hidden folder beside it (.DIR.spindrift-new) and moved in only when"
                + " complete, manifest.json last with the sha256 of every file as written; a finished run"
                + " there is replaced only with --overwrite, and stays intact if the new run fails or is"
                + " stopped; a folder holding anything Spindrift did not write (or a link) is refused;"
                + " a plot that cannot be drawn is reported and listed in the manifest, the data files stay."})
public final class RunCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "Scenario file (YAML or JSON).")
    private Path file;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR",
            description = "Run folder (default: runs/<scenario name>). It must not exist, be empty, or hold a"
                    + " finished run (with --overwrite).")
    private Path output;

    @Option(names = "--overwrite",
            description = "Replace a finished run in the folder, once the new run is complete (the old one stays"
                    + " if the new run fails).")
    private boolean overwrite;

    @Option(names = "--threads", paramLabel = "N",
            description = "Worker threads (default: available processors). Results do not depend on it.")
    private Integer threads;

    @Option(names = "--quiet", description = "No progress bar or summary lines.")
    private boolean quiet;

    @Option(names = "--checkpoint-every", paramLabel = "TIME", defaultValue = "10 min",
            description = "Wall time between checkpoints of the evolution, e.g. '10 min', '30 s', '1 h'; 0 = at every"
                    + " snapshot (default: ${DEFAULT-VALUE}). Kept beside the run folder (.DIR.spindrift-checkpoint)"
                    + " until the run is complete.")
    private String checkpointEvery;

    @Option(names = "--resume",
            description = "Continue from the last checkpoint of a run into the same folder that was stopped or"
                    + " killed (the same scenario file); the result is bitwise the same as an uninterrupted run.")
    private boolean resume;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    private java.io.PrintWriter out() {
        return spec.commandLine().getOut();
    }

    @Override public Integer call() throws IOException {
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1 || n > 1024) {
            throw new UserInputException("--threads " + n + ": allowed 1..1024");
        }
        LoadedScenario ls = ScenarioLoader.load(file);
        Path out = output != null ? output : Path.of("runs", ls.scenario().name());
        long t0 = System.nanoTime();
        ScenarioRun.Prepared p = ScenarioRun.prepare(ls);
        boolean terminal = System.console() != null;
        boolean progress = !quiet && terminal;
        ScenarioRun.Outcome o = ScenarioRun.run(p, new ScenarioRun.Options(out, n, progress, overwrite,
                seconds(checkpointEvery), resume, progress ? new ProgressBarListener() : ProgressListener.NONE));
        if (!quiet) {
            double s = (System.nanoTime() - t0) * 1e-9;
            out().printf(Locale.ROOT, "%s: %d particles over %.1f min (%.0f M), %d snapshots, %.1f s%n",
                    ls.scenario().name(), o.history().particles(), p.durationM() * p.secondsPerM() / 60,
                    p.durationM(), o.history().snapshots(), s);
            out().printf(Locale.ROOT, "end states: alive %d, captured %d, escaped %d, failed %d%n",
                    o.result().endStates()[0], o.result().endStates()[1], o.result().endStates()[2],
                    o.result().endStates()[3]);
            out().println("run folder: " + o.folder());
        }
        out().flush();
        return 0;
    }

    /** @return a wall time such as "10 min", "30 s", "1 h" or "0" in seconds */
    static double seconds(String text) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("\\s*([0-9]+(?:\\.[0-9]*)?)\\s*(s|min|h)?\\s*")
                .matcher(text);
        if (!m.matches() || (m.group(2) == null && Double.parseDouble(m.group(1)) != 0)) {
            throw new UserInputException("--checkpoint-every '" + text + "': a wall time with a unit, e.g. '10 min',"
                    + " '30 s', '1 h', or 0 for every snapshot");
        }
        double v = Double.parseDouble(m.group(1));
        return m.group(2) == null ? 0 : v * switch (m.group(2)) {
            case "min" -> 60;
            case "h" -> 3600;
            default -> 1;
        };
    }

    /** Registers {@code run}. */
    public static final class Provider implements SubcommandProvider {
        @Override public String name() {
            return "run";
        }

        @Override public Object command() {
            return new RunCommand();
        }
    }
}
