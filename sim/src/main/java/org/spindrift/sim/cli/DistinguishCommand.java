package org.spindrift.sim.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.study.StudyFile;
import org.spindrift.sim.study.StudyRun;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code spindrift distinguish STUDY_FILE [-o DIR] [--jobs J] [--threads T]}: could an instrument
 * tell the study's truth spacetime from the reference (Kerr)? Runs every cell of the study and
 * writes distinguish.csv, distinguish.json and plots; an interrupted study resumes.
 */
@Command(name = "distinguish", mixinStandardHelpOptions = true,
        description = {"Could an instrument tell a Kerr-like spacetime from Kerr? For every cell of the study's grid"
                + " (deformation x beam x precision): mock data from the truth, fits of the reference and the truth"
                + " family, the likelihood-ratio statistic and its significance.",
            "Writes distinguish.csv, distinguish.json, plots/ and manifest.json; running again resumes."})
public final class DistinguishCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "STUDY_FILE", description = "Study file (YAML or JSON).")
    private Path file;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", description = "Study folder (default: studies/<name>).")
    private Path output;

    @Option(names = "--jobs", paramLabel = "J", description = "Cells at once (default 1).")
    private int jobs = 1;

    @Option(names = "--threads", paramLabel = "T",
            description = "Threads per cell (default: available processors / jobs). Results do not depend on it.")
    private Integer threads;

    @Option(names = "--quiet", description = "No progress bar or summary line.")
    private boolean quiet;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    @Override public Integer call() throws IOException {
        if (jobs < 1 || jobs > 1024) {
            throw new UserInputException("--jobs " + jobs + ": allowed 1..1024");
        }
        int t = threads == null ? Math.max(1, Runtime.getRuntime().availableProcessors() / jobs) : threads;
        if (t < 1 || t > 1024) {
            throw new UserInputException("--threads " + t + ": allowed 1..1024");
        }
        StudyFile s = StudyFile.load(file);
        Path out = output != null ? output : Path.of("studies", s.name());
        StudyRun.Summary r = StudyRun.run(s, out, jobs, t, !quiet && System.console() != null);
        if (!quiet) {
            var w = spec.commandLine().getOut();
            w.println(s.cells() + " cells (" + r.ran() + " run, " + r.skipped() + " already done): " + out);
            w.flush();
        }
        return 0;
    }

    /** Registers {@code distinguish}. */
    public static final class Provider implements SubcommandProvider {
        @Override public String name() {
            return "distinguish";
        }

        @Override public Object command() {
            return new DistinguishCommand();
        }
    }
}
