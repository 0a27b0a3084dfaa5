package org.spindrift.sim.cli;

import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.ScenarioLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

/**
 * {@code spindrift check FILE}: reads and checks a scenario file (syntax, keys, types, ranges,
 * and the checks that need the metric) without running it or writing anything.
 */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Check a scenario or fit file without running it: unknown or missing keys, wrong types,"
                + " out-of-range values, orbits the metric does not allow.",
            "Exit status 0 when the file is good, 2 with one message naming file, line and key otherwise."})
public final class CheckCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "Scenario file (YAML or JSON).")
    private Path file;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    private java.io.PrintWriter out() {
        return spec.commandLine().getOut();
    }

    @Override public Integer call() {
        if (org.spindrift.sim.scenario.FitFileLoader.isFitFile(file)) {
            org.spindrift.sim.fit.FitRun.Prepared f = org.spindrift.sim.fit.FitRun.prepare(file,
                    Runtime.getRuntime().availableProcessors());
            out().printf(Locale.ROOT, "%s: ok: fit '%s', %d free parameter(s), %d astrometric epoch(s), %d flux point(s),"
                    + " method %s%n", file, f.fit().name(), f.fit().free().size(), f.data().timeMin().length,
                    f.data().flux().length, f.fit().method().kind().name().toLowerCase(Locale.ROOT));
            out().flush();
            return 0;
        }
        ScenarioRun.Prepared p = ScenarioRun.prepare(ScenarioLoader.load(file));
        Scenario sc = p.loaded().scenario();
        double spm = p.secondsPerM();
        out().printf(Locale.ROOT, "%s: ok: scenario '%s', %s a = %s, %d source(s), %d particles%n", file, sc.name(),
                sc.blackHole().family(), fmt(sc.blackHole().spin()), sc.sources().size(), sc.totalParticles());
        out().printf(Locale.ROOT, "  1 M = %.4g s = %.4g micro-arcsec; duration %.1f M = %.1f min, %d snapshots%n",
                spm, p.microarcsecPerM(), p.durationM(), p.durationM() * spm / 60, p.times().length);
        for (int k = 0; k < sc.sources().size(); k++) {
            Source s = sc.sources().get(k);
            out().printf(Locale.ROOT, "  source %s: %s, %d particles, centre period %.1f M = %.1f min%n", s.name(),
                    s.kind().key(), s.particles(), p.placed().centres()[k].periodM(),
                    p.placed().centres()[k].periodM() * spm / 60);
        }
        out().flush();
        return 0;
    }

    private static String fmt(double v) {
        return Double.toString(v);
    }

    /** Registers {@code check}. */
    public static final class Provider implements SubcommandProvider {
        @Override public String name() {
            return "check";
        }

        @Override public Object command() {
            return new CheckCommand();
        }
    }
}
