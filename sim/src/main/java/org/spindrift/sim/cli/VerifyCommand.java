package org.spindrift.sim.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.archive.ArchiveVerifier;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

/**
 * {@code spindrift verify RUN}: checks a finished run folder against its manifest (every file's
 * sha256, files the manifest does not list, snapshots.h5 and every snapshot in it, the light
 * files) and prints one line per problem. Reads only.
 */
@Command(name = "verify", mixinStandardHelpOptions = true,
        description = {"Verify a run folder: the manifest's keys and ranges, the sha256 of every file it lists,"
                + " files it does not list, that snapshots.h5 belongs to the run and every snapshot holds physical"
                + " values, complete CSV files and a readable image cube. Nothing is changed.",
            "Prints one line per problem (to stderr) and exits with status 2 when the run is damaged; prints one"
                + " line and exits with 0 when it is sound."})
public final class VerifyCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "RUN", description = "Run folder.")
    private Path folder;

    @picocli.CommandLine.Spec
    private picocli.CommandLine.Model.CommandSpec spec;

    @Override public Integer call() {
        List<String> problems = ArchiveVerifier.problems(folder);
        if (problems.isEmpty()) {
            spec.commandLine().getOut().println(folder + ": sound (every listed file matches its sha256)");
            spec.commandLine().getOut().flush();
            return 0;
        }
        java.io.PrintWriter err = spec.commandLine().getErr();
        for (String p : problems) {
            err.println("spindrift verify: " + p);
        }
        err.flush();
        return Main.EXIT_USAGE;
    }

    /** Registers {@code verify}. */
    public static final class Provider implements SubcommandProvider {
        @Override public String name() {
            return "verify";
        }

        @Override public Object command() {
            return new VerifyCommand();
        }
    }
}
