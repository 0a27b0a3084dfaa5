package org.spindrift.sim.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.fit.FitRun;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code spindrift fit FIT_FILE [-o DIR] [--threads N] [--quiet]}: fits a scenario's free
 * parameters to astrometric (and photometric) data and writes the fit folder.
 */
@Command(name = "fit", mixinStandardHelpOptions = true,
        description = {"Fit a scenario's free parameters to a centroid track (and light curve): least squares"
                + " (Levenberg-Marquardt, several starts) or an ensemble sampler.",
            "Writes fit.json, posterior.csv, samples.h5 (sampling), plots/ and manifest.json.",
            "The fit file and its data are checked first (as by 'check'); nothing is written when they have an error."})
public final class FitCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FIT_FILE", description = "Fit file (YAML or JSON).")
    private Path file;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR",
            description = "Fit folder (default: fits/<fit name>).")
    private Path output;

    @Option(names = "--overwrite", description = "Replace an earlier run or fit in the output folder.")
    private boolean overwrite;

    @Option(names = "--threads", paramLabel = "N",
            description = "Worker threads (default: available processors). Results do not depend on it.")
    private Integer threads;

    @Option(names = "--quiet", description = "No progress bar or summary lines.")
    private boolean quiet;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    @Override public Integer call() throws IOException {
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1 || n > 1024) {
            throw new UserInputException("--threads " + n + ": allowed 1..1024");
        }
        FitRun.Prepared p = FitRun.prepare(file, n);
        Path out = output != null ? output : Path.of("fits", p.fit().name());
        boolean terminal = System.console() != null;
        FitRun.Result r = FitRun.run(p, new FitRun.Options(out, n, !quiet && terminal, overwrite));
        if (!quiet) {
            var w = spec.commandLine().getOut();
            for (int i = 0; i < r.names().size(); i++) {
                w.printf(Locale.ROOT, "%-45s %14.6g +- %.3g%n", r.names().get(i), r.best()[i], r.sigma()[i]);
            }
            w.printf(Locale.ROOT, "chi-square %.2f for %d degrees of freedom (reduced %.3f, p = %.3g)%n", r.chiSquare(),
                    r.dof(), r.chiSquare() / r.dof(), r.pValue());
            r.warnings().forEach(s -> w.println("warning: " + s));
            w.println("fit folder: " + r.folder());
            w.flush();
        }
        return 0;
    }

    /** Registers {@code fit}. */
    public static final class Provider implements SubcommandProvider {
        @Override public String name() {
            return "fit";
        }

        @Override public Object command() {
            return new FitCommand();
        }
    }
}
