package org.spindrift.sim.cli;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.scenario.EmissionSum;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.shared.scenario.TimeSpan;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code spindrift bench run}: a whole scenario run (set-up, integration, snapshots, analysis,
 * plots, manifest) of the first demo config scaled to 2 x 10^4 particles over 5 orbits; reports
 * wall time, peak memory and particle-steps per second.
 */
@Command(name = "run", mixinStandardHelpOptions = true,
        description = {"Time a whole scenario run: configs/hotspot-kerr.yaml with its first source scaled to"
                + " --particles particles over --orbits orbits. Reports wall time, peak memory (JVM heap pools and"
                + " the process's resident set) and particle-steps per second. The run folder goes to a temporary"
                + " folder that is removed afterwards unless --keep is given."})
public final class BenchRunCommand implements Callable<Integer> {
    @Option(names = "--config", paramLabel = "FILE", defaultValue = "configs/hotspot-kerr.yaml",
            description = "Scenario file (default: ${DEFAULT-VALUE}).")
    Path config;

    @Option(names = "--particles", paramLabel = "N", defaultValue = "20000",
            description = "Particles of the first source, 1..5000000 (default: ${DEFAULT-VALUE}).")
    int particles;

    @Option(names = "--orbits", paramLabel = "N", defaultValue = "5",
            description = "Duration in orbits of the first source's centre, 0.1..100 (default: ${DEFAULT-VALUE}).")
    double orbits;

    @Option(names = "--emission", paramLabel = "SUM", description = "Emission sum of the light stage: auto,"
            + " particles or grid (default: the config's imaging.emission_sum).")
    String emission;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: available processors).")
    Integer threads;

    @Option(names = "--keep", paramLabel = "DIR", description = "Write the run folder here and keep it.")
    Path keep;

    @Option(names = "--skip", paramLabel = "STAGE", split = ",",
            description = "Leave out run stages by name (for example light), to time the rest.")
    List<String> skip = List.of();

    @Override public Integer call() throws IOException {
        if (particles < 1 || particles > 5_000_000) {
            throw new UserInputException("--particles " + particles + ": allowed 1..5000000");
        }
        if (!(orbits >= 0.1 && orbits <= 100)) {
            throw new UserInputException("--orbits " + orbits + ": allowed 0.1..100");
        }
        int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1 || n > 1024) {
            throw new UserInputException("--threads " + n + ": allowed 1..1024");
        }
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            pool.resetPeakUsage();
        }
        if (emission != null && !List.of("auto", "particles", "grid").contains(emission)) {
            throw new UserInputException("--emission " + emission + ": allowed auto, particles, grid");
        }
        long t0 = System.nanoTime();
        LoadedScenario ls = ScenarioLoader.load(config);
        Scenario sc = ls.scenario();
        List<Source> src = new java.util.ArrayList<>(sc.sources());
        src.set(0, src.get(0).withParticles(particles));
        sc = sc.withSources(src).withRun(sc.run().withDuration(new TimeSpan(orbits, TimeSpan.Unit.ORBITS)));
        if (emission != null) {
            sc = sc.withImaging(sc.imaging().withEmissionSum(EmissionSum.ofKey(emission)));
        }
        ScenarioRun.Prepared p = ScenarioRun.prepare(ls.with(sc));
        double setup = (System.nanoTime() - t0) * 1e-9;
        // a run folder inside a fresh temporary folder, so its lock file goes with it
        Path scratch = keep != null ? null : Files.createTempDirectory("spindrift-bench-");
        Path out = keep != null ? keep : scratch.resolve("run");
        ScenarioRun.Outcome o;
        String used;
        try {
            List<org.spindrift.sim.pipeline.RunStage> stages = new java.util.ArrayList<>(ScenarioRun.stages());
            stages.removeIf(st -> skip.contains(st.name()));
            o = ScenarioRun.run(p, new ScenarioRun.Options(out, n, false), stages);
            // the sum the light stage used, from the run's manifest
            used = new com.fasterxml.jackson.databind.ObjectMapper().readTree(out.resolve(ArchiveLayout.MANIFEST).toFile())
                    .path(ArchiveLayout.K_LIGHT).path("emission_sum").asText("none");
        } finally {
            if (keep == null) {
                delete(scratch);
            }
        }
        double wall = (System.nanoTime() - t0) * 1e-9;
        long heapPeak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP && pool.getPeakUsage() != null) {
                heapPeak += pool.getPeakUsage().getUsed();
            }
        }
        long rss = peakResidentKib();
        long steps = o.result().acceptedSteps();
        System.out.printf(Locale.ROOT, "bench run: %s, %d particles, %.1f orbits (%.0f M), %d snapshots, %d threads on %d"
                + " cores, emission sum: %s%s%n", config, sc.totalParticles(), orbits, p.durationM(), p.times().length, n,
                Runtime.getRuntime().availableProcessors(), sc.imaging().emissionSum().key() + " -> " + used,
                skip.isEmpty() ? "" : ", skipping " + String.join(",", skip));
        System.out.printf(Locale.ROOT, "  wall time        %8.2f s  (set-up %.2f s, integration %.2f s, output %.2f s)%n",
                wall, setup, o.integrationSeconds(), o.outputSeconds());
        StringBuilder st = new StringBuilder();
        o.stageSeconds().forEach((k, v) -> st.append(String.format(Locale.ROOT, " %s %.2f s,", k, v)));
        System.out.println("  output stages   " + st.substring(0, Math.max(0, st.length() - 1)));
        System.out.printf(Locale.ROOT, "  particle-steps   %,d accepted (%,d rejected): %.3g steps/s in the integration%n",
                steps, o.result().rejectedSteps(), steps / o.integrationSeconds());
        System.out.printf(Locale.ROOT, "  peak memory      %.0f MiB JVM heap (sum of pool peaks)%s%n", heapPeak / 1048576.0,
                rss > 0 ? String.format(Locale.ROOT, ", %.0f MiB resident (VmHWM)", rss / 1024.0) : "");
        System.out.printf(Locale.ROOT, "  end states       alive %d, captured %d, escaped %d, failed %d%n",
                o.result().endStates()[0], o.result().endStates()[1], o.result().endStates()[2], o.result().endStates()[3]);
        return 0;
    }

    /** @return the process's peak resident set size in KiB from /proc/self/status (Linux), or -1 */
    private static long peakResidentKib() {
        try {
            for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
                if (line.startsWith("VmHWM:")) {
                    return Long.parseLong(line.replaceAll("[^0-9]", ""));
                }
            }
        } catch (IOException | RuntimeException e) {
            // not Linux
        }
        return -1;
    }

    private static void delete(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> w = Files.walk(dir)) {
            for (Path q : (Iterable<Path>) w.sorted(Comparator.reverseOrder())::iterator) {
                Files.deleteIfExists(q);
            }
        }
    }
}
