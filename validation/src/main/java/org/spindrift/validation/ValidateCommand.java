package org.spindrift.validation;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.spindrift.shared.UserInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code spindrift validate}: runs the validation suite and writes the report. */
@Command(name = "validate", mixinStandardHelpOptions = true,
        description = {"Run the validation suite (periastron advance vs the exact Schwarzschild result and the"
                + " post-Newtonian expansions, Kerr periods vs quadrature, trajectories vs Hipparchus; the Kerr"
                + " shadow edge, light deflection and face-on image radius of the ray tracer) and write"
                + " report.md and plots into the output folder.",
            "Exit status 0 when every check passes, 1 when one fails."})
public final class ValidateCommand implements Callable<Integer> {
    @Option(names = {"-o", "--output"}, paramLabel = "DIR", defaultValue = "validation-report",
            description = "Output folder (created if needed; default: ${DEFAULT-VALUE}).")
    Path output;

    @Override public Integer call() throws IOException {
        if (Files.exists(output) && !Files.isDirectory(output)) {
            throw new UserInputException("-o " + output + ": exists and is not a folder");
        }
        return report(output, ValidationSuite.run());
    }

    /** Writes the report of a run and prints the failures; @return the exit status (1 if a check failed) */
    static int report(Path output, ValidationSuite.Run run) throws IOException {
        ValidationReport.write(output, run.checks(), run.series());
        long failed = run.checks().stream().filter(c -> !c.passed()).count();
        for (Check c : run.checks()) {
            if (!c.passed()) {
                System.out.printf(Locale.ROOT, "FAIL %s: %s measured %.15g, reference %.15g, tolerance %.3e%n", c.group(),
                        c.quantity(), c.measured(), c.reference(), c.tolerance());
            }
        }
        System.out.printf(Locale.ROOT, "validate: %d checks, %d passed, %d failed; report in %s%n", run.checks().size(),
                run.checks().size() - failed, failed, output.resolve("report.md"));
        return failed == 0 ? 0 : 1;
    }
}
