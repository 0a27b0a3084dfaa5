package org.spindrift.sim.cli;

import java.io.PrintWriter;
import java.util.ServiceLoader;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.Version;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * The {@code spindrift} command line. Subcommands are found with {@link ServiceLoader} through
 * {@link SubcommandProvider} (see {@code META-INF/services} in each module), so the viewer and
 * the validation suite add theirs without the engine depending on them.
 *
 * <p>Exit status: 0 success, 1 a failed check or internal error, 2 bad input (options, files).
 */
@Command(name = "spindrift", mixinStandardHelpOptions = true, versionProvider = Main.VersionProvider.class,
        description = "Flares from the surroundings of supermassive black holes: geodesic motion of gas,"
                + " ray-traced light, centroid tracks and light curves.",
        subcommands = {CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    /** Exit status for bad user input. */
    public static final int EXIT_USAGE = 2;
    /** Exit status when a file cannot be written or read (full disk, permissions). */
    public static final int EXIT_FAILURE = 1;

    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    @Override public void run() {
        spec.commandLine().usage(System.out);
    }

    /** Version string for {@code --version}. */
    public static final class VersionProvider implements CommandLine.IVersionProvider {
        @Override public String[] getVersion() {
            return new String[] {"spindrift " + Version.get()};
        }
    }

    /** @return the configured command line with every subcommand found on the class path */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        for (SubcommandProvider p : ServiceLoader.load(SubcommandProvider.class)) {
            cl.addSubcommand(p.name(), p.command());
        }
        cl.setParameterExceptionHandler((ex, args) -> {
            PrintWriter err = ex.getCommandLine().getErr();
            err.println(ex.getCommandLine().getCommandSpec().qualifiedName() + ": " + ex.getMessage()
                    + " (see --help)");
            err.flush();
            return EXIT_USAGE;
        });
        cl.setExecutionExceptionHandler((ex, c, parsed) -> {
            Throwable t = ex;
            while (t != null && !(t instanceof UserInputException)) {
                t = t.getCause();
            }
            if (t != null) {
                c.getErr().println(c.getCommandSpec().qualifiedName() + ": " + t.getMessage());
                c.getErr().flush();
                return EXIT_USAGE;
            }
            Throwable io = ex;
            while (io != null && !(io instanceof java.io.IOException)) {
                io = io.getCause();
            }
            if (io != null) {
                // the disk or the file system failed (full disk, permissions changed during the run)
                String m = io.getMessage() == null ? io.getClass().getSimpleName() : io.getMessage().lines().findFirst()
                        .orElse("");
                if (m.contains("No space left on device") || m.contains("Disk quota exceeded")) {
                    // the user can act on it like on bad input: nothing of the run is left, an old run is intact
                    c.getErr().println(c.getCommandSpec().qualifiedName() + ": the disk is full (" + m + "); nothing"
                            + " was written and an earlier run in the folder is unchanged: free some space or write"
                            + " elsewhere with -o");
                    c.getErr().flush();
                    return EXIT_USAGE;
                }
                c.getErr().println(c.getCommandSpec().qualifiedName() + ": cannot write or read a file: "
                        + io.getClass().getSimpleName() + ": " + m);
                c.getErr().flush();
                return EXIT_FAILURE;
            }
            Throwable oom = ex;
            while (oom != null && !(oom instanceof OutOfMemoryError)) {
                oom = oom.getCause();
            }
            if (oom != null) {
                c.getErr().println(c.getCommandSpec().qualifiedName() + ": out of memory (" + (Runtime.getRuntime()
                        .maxMemory() >> 20) + " MiB of heap): give Java more memory, e.g. SPINDRIFT_JAVA_OPTS=-Xmx8g,"
                        + " or use fewer threads or pixels");
                c.getErr().flush();
                return EXIT_FAILURE;
            }
            throw ex;
        });
        return cl;
    }

    /** @return the exit status of running the command line on args */
    public static int execute(String... args) {
        return commandLine().execute(args);
    }

    public static void main(String[] args) {
        System.exit(execute(args));
    }
}
