package org.spindrift.sim.cli;

import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.run.RunLimits;
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
                + " out-of-range values, orbits the metric does not allow, and every limit run enforces (image"
                + " budget, snapshot count, memory). Warnings (one line each) go to stderr.",
            "Exit status 0 when the file is good, 2 with one message naming file, line and key otherwise."})
public final class CheckCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "Scenario file (YAML or JSON).")
    private Path file;

    @picocli.CommandLine.Option(names = {"-o", "--output"}, paramLabel = "DIR",
            description = "Also check that 'run -o DIR' could write this folder (nothing is created).")
    private Path output;

    @picocli.CommandLine.Option(names = "--overwrite", description = "With -o: as 'run --overwrite'.")
    private boolean overwrite;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    private java.io.PrintWriter out() {
        return spec.commandLine().getOut();
    }

    @Override public Integer call() throws java.io.IOException {
        if (org.spindrift.sim.study.StudyFile.isStudyFile(file)) {
            org.spindrift.sim.study.StudyFile st = org.spindrift.sim.study.StudyFile.load(file);
            out().printf(Locale.ROOT, "%s: ok: study '%s', %d cell(s) (%d deformation(s) x %d beam(s) x %d precision(s)),"
                    + " %d free reference parameter(s), %d realisation(s) per cell%n", file, st.name(), st.cells(),
                    st.deformations().length, st.beamsUas().length, st.sigmasUas().length, st.free().size(),
                    st.realisations());
            out().flush();
            return 0;
        }
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
        if (output != null) {
            org.spindrift.shared.archive.RunArchiveWriter.checkUsable(output, overwrite);
            RunLimits.checkDisk(p, output);
        }
        for (String w : p.warnings()) {
            System.err.println("spindrift: warning: " + w);
        }
        Scenario sc = p.loaded().scenario();
        double spm = p.secondsPerM();
        out().printf(Locale.ROOT, "%s: ok: scenario '%s', %s a = %s, %d source(s), %d particles%n", file, sc.name(),
                sc.blackHole().family(), fmt(sc.blackHole().spin()), sc.sources().size(), sc.totalParticles());
        out().printf(Locale.ROOT, "  1 M = %.4g s = %.4g micro-arcseconds; duration %.1f M = %.1f min, %d snapshots%n",
                spm, p.uasPerM(), p.durationM(), p.durationM() * spm / 60, p.times().length);
        for (int k = 0; k < sc.sources().size(); k++) {
            Source s = sc.sources().get(k);
            out().printf(Locale.ROOT, "  source %s: %s, %d particles, centre period %.1f M = %.1f min%n", s.name(),
                    s.kind().key(), s.particles(), p.placed().centres()[k].periodM(),
                    p.placed().centres()[k].periodM() * spm / 60);
        }
        RunLimits.DiskEstimate disk = RunLimits.diskEstimate(p);
        out().printf(Locale.ROOT, "  disk: about %.3g MB (snapshots.h5 %.3g MB, images.fits %.3g MB, other files %.3g MB)%n",
                disk.total() / 1e6, disk.snapshots() / 1e6, disk.images() / 1e6, disk.other() / 1e6);
        if (sc.interferometer() != null) {
            org.spindrift.sim.interferometry.ObservingSetup o = org.spindrift.sim.interferometry.ObservingSetup.of(sc);
            double fringe = o.wavelength() / o.array().longestBaseline() * org.spindrift.shared.Units.UAS_PER_RAD;
            double pixel = sc.imaging().fieldOfViewM() / sc.imaging().pixels() * p.uasPerM();
            out().printf(Locale.ROOT, "  interferometer: %d stations%s, %.4g GHz; smallest fringe spacing lambda/B_max"
                    + " = %.3g uas (image pixel %.3g uas, field %.3g uas)%n", o.array().stations(),
                    sc.interferometer().arrayFile() == null ? "" : " from " + sc.interferometer().arrayFile(),
                    o.frequencyHz() * 1e-9, fringe, pixel, sc.imaging().fieldOfViewM() * p.uasPerM());
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
