package org.spindrift.sim.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/**
 * {@code spindrift bench}: performance measurements (never run as tests). Each benchmark is a
 * subcommand listed in {@code subcommands}.
 */
@Command(name = "bench", mixinStandardHelpOptions = true,
        description = "Benchmarks of the engine (timings; the machine's load affects them, compare ratios within one run).",
        subcommands = {BenchMotionCommand.class, BenchRunCommand.class, BenchLightCommand.class, BenchFitCommand.class})
public final class BenchCommand implements Runnable {
    @Spec
    CommandSpec spec;

    @Override public void run() {
        spec.commandLine().usage(System.out);
    }
}
