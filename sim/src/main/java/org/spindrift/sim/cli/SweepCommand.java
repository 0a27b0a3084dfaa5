package org.spindrift.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.spindrift.shared.SubcommandProvider;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.sweep.SlurmArray;
import org.spindrift.sim.sweep.SweepCollector;
import org.spindrift.sim.sweep.SweepLayout;
import org.spindrift.sim.sweep.SweepPlan;
import org.spindrift.sim.sweep.SweepPlanner;
import org.spindrift.sim.sweep.SweepRunner;
import org.spindrift.sim.sweep.TaskState;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code spindrift sweep plan|run|slurm|status|collect}: many tasks (scenarios with some keys
 * varied) run on a workstation or as one Slurm array job (engine in org.spindrift.sim.sweep).
 */
@Command(name = "sweep", mixinStandardHelpOptions = true,
        description = {"Sweeps: a base scenario with some keys varied over a grid or a Latin hypercube, run locally or"
                + " as one Slurm array job.",
            "plan -> run (or slurm) -> status -> collect."},
        subcommands = {SweepCommand.Plan.class, SweepCommand.Run.class, SweepCommand.Slurm.class,
            SweepCommand.Status.class, SweepCommand.Collect.class})
public final class SweepCommand implements Runnable {
    @Spec
    CommandSpec spec;

    @Override public void run() {
        spec.commandLine().usage(System.out);
    }

    /** Registers {@code sweep}. */
    public static final class Provider implements SubcommandProvider {
        @Override public String name() {
            return "sweep";
        }

        @Override public Object command() {
            return new SweepCommand();
        }
    }

    static String mib(long bytes) {
        double m = bytes / 1048576.0;
        return m >= 1024 ? String.format(Locale.ROOT, "%.1f GiB", m / 1024) : String.format(Locale.ROOT, "%.0f MiB", m);
    }

    /** Refuses an option value outside lo..hi, naming the option. */
    static void range(String option, long v, long lo, long hi) {
        if (v < lo || v > hi) {
            throw new UserInputException(option + " " + v + ": allowed " + lo + ".." + hi);
        }
    }

    static int threadsOrDefault(Integer threads, int jobs) {
        if (threads != null) {
            range("--threads", threads, 1, 1024);
            return threads;
        }
        String slurm = System.getenv("SLURM_CPUS_PER_TASK");
        if (slurm != null && slurm.matches("\\d{1,4}") && Integer.parseInt(slurm) > 0) {
            return Math.max(1, Integer.parseInt(slurm) / jobs);
        }
        return Math.max(1, Runtime.getRuntime().availableProcessors() / jobs);
    }

    /** {@code sweep plan SWEEP_FILE -o DIR [--force]}. */
    @Command(name = "plan", mixinStandardHelpOptions = true,
            description = {"Expand a sweep file into task files under DIR/tasks/ and DIR/sweep.json (the plan, SHA-256 of"
                    + " the inputs, code version).",
                "Every task is checked as 'check' would before anything is written; more than 100000 tasks need --force."})
    static final class Plan implements Callable<Integer> {
        @Parameters(index = "0", paramLabel = "SWEEP_FILE", description = "Sweep file (YAML or JSON).")
        private Path file;

        @Option(names = {"-o", "--output"}, paramLabel = "DIR", required = true,
                description = "Sweep folder (new, empty, or holding this same sweep).")
        private Path output;

        @Option(names = "--force", description = "Allow more than 100000 tasks.")
        private boolean force;

        @Option(names = "--threads", paramLabel = "N", description = "Threads for checking the tasks (default: all).")
        private Integer threads;

        @Spec
        CommandSpec spec;

        @Override public Integer call() throws IOException {
            int n = threadsOrDefault(threads, 1);
            SweepPlanner.Result r = SweepPlanner.plan(file, output, force, n, System.console() != null);
            PrintWriter out = spec.commandLine().getOut();
            if (r.unchanged()) {
                out.println(output + ": already holds this sweep (" + r.tasks() + " tasks); nothing changed");
            } else {
                out.println(output + ": " + r.tasks() + " tasks planned and checked");
            }
            out.println("per task: about " + mib(r.heapMax()) + " of Java heap and " + mib(r.diskMax())
                    + " of disk at most; all run folders together about " + mib(r.diskTotal()));
            out.println("next: spindrift sweep run " + output + " [--jobs J]   or   spindrift sweep slurm " + output);
            out.flush();
            return 0;
        }
    }

    /** {@code sweep run DIR [--task K | --shard K/N] [--jobs J] [--threads T]}. */
    @Command(name = "run", mixinStandardHelpOptions = true,
            description = {"Run a sweep's tasks; finished ones (manifest present, checksums valid) are skipped, so running"
                    + " again resumes.",
                "Inside a Slurm array job (SLURM_ARRAY_TASK_ID and SLURM_ARRAY_TASK_COUNT set) element k of n runs the"
                    + " tasks t with t mod n = k.",
                "A failed task records why in DIR/status/ and the others go on; exit status 1 when any failed."})
    static final class Run implements Callable<Integer> {
        @Parameters(index = "0", paramLabel = "DIR", description = "Sweep folder made by 'sweep plan'.")
        private Path dir;

        @Option(names = "--task", paramLabel = "K", description = "Run only task K (0-based).")
        private Integer task;

        @Option(names = "--shard", paramLabel = "K/N", description = "Run the tasks t with t mod N = K.")
        private String shard;

        @Option(names = "--jobs", paramLabel = "J", defaultValue = "1",
                description = "Tasks run at the same time (default: 1).")
        private int jobs;

        @Option(names = "--threads", paramLabel = "T",
                description = "Threads per task (default: SLURM_CPUS_PER_TASK, else the processors / J). Results do not"
                        + " depend on it.")
        private Integer threads;

        @Option(names = "--quiet", description = "No progress bar.")
        private boolean quiet;

        @Option(names = "--skip-failed", description = "Leave tasks that failed before alone (default: try them again).")
        private boolean skipFailed;

        @Spec
        CommandSpec spec;

        @Override public Integer call() throws IOException {
            range("--jobs", jobs, 1, 256);
            if (task != null && shard != null) {
                throw new UserInputException("--task and --shard: give at most one of them");
            }
            int t = threadsOrDefault(threads, jobs);
            SweepPlan plan = SweepPlan.open(dir);
            PrintWriter out = spec.commandLine().getOut();
            List<Integer> tasks;
            String what;
            if (task != null) {
                if (task < 0 || task >= plan.tasks()) {
                    throw new UserInputException("--task " + task + ": the sweep has tasks 0.." + (plan.tasks() - 1));
                }
                tasks = List.of(task);
                what = "task " + task;
            } else if (shard != null) {
                Matcher m = Pattern.compile("(\\d{1,7})/(\\d{1,7})").matcher(shard);
                if (!m.matches()) {
                    throw new UserInputException("--shard " + shard + ": write K/N with 0 <= K < N, for example 3/10");
                }
                tasks = SweepRunner.shard(plan.tasks(), Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)));
                what = "shard " + shard;
            } else if (System.getenv("SLURM_ARRAY_TASK_ID") != null) {
                int id = envInt("SLURM_ARRAY_TASK_ID");
                int min = System.getenv("SLURM_ARRAY_TASK_MIN") == null ? 0 : envInt("SLURM_ARRAY_TASK_MIN");
                int count = System.getenv("SLURM_ARRAY_TASK_COUNT") == null ? plan.tasks() : envInt("SLURM_ARRAY_TASK_COUNT");
                tasks = SweepRunner.shard(plan.tasks(), id - min, count);
                what = "Slurm array element " + (id - min) + " of " + count;
            } else {
                tasks = new ArrayList<>();
                for (int k = 0; k < plan.tasks(); k++) {
                    tasks.add(k);
                }
                what = "all tasks";
            }
            String planned = plan.json().path("code_version").asText();
            if (!planned.equals(org.spindrift.shared.Version.get())) {
                out.println("note: the sweep was planned with code version " + planned + "; this is "
                        + org.spindrift.shared.Version.get() + " (tasks run now may differ from earlier ones)");
            }
            boolean progress = !quiet && System.console() != null;
            SweepRunner.Summary s = SweepRunner.run(plan, tasks, jobs, t, progress, skipFailed, out);
            out.println(plan.name() + " (" + what + ", " + tasks.size() + " task(s)): " + SweepRunner.describe(s));
            out.flush();
            return s.failed() > 0 ? 1 : 0;
        }

        private static int envInt(String name) {
            String v = System.getenv(name);
            try {
                return Integer.parseInt(v.strip());
            } catch (NumberFormatException e) {
                throw new UserInputException("environment variable " + name + " = '" + v + "' is not a whole number");
            }
        }
    }

    /** {@code sweep slurm DIR [...] [--dry-run]}. */
    @Command(name = "slurm", mixinStandardHelpOptions = true,
            description = {"Write DIR/submit.sbatch (one array job for the whole sweep) and submit it with sbatch.",
                "Memory per element comes from the plan's estimate unless --mem is given; the array is cut to the"
                    + " cluster's MaxArraySize (elements then run several tasks each)."})
    static final class Slurm implements Callable<Integer> {
        @Parameters(index = "0", paramLabel = "DIR", description = "Sweep folder made by 'sweep plan'.")
        private Path dir;

        @Option(names = "--partition", paramLabel = "P", description = "Slurm partition (default: the cluster's).")
        private String partition;

        @Option(names = "--time", paramLabel = "T",
                description = "Time limit per array element, Slurm's form: MM, HH:MM:SS or D-HH:MM (default: the"
                        + " partition's).")
        private String time;

        @Option(names = "--mem", paramLabel = "M",
                description = "Memory per array element, e.g. 1500M or 4G (default: estimated heap + 384M).")
        private String mem;

        @Option(names = "--cpus", paramLabel = "C", defaultValue = "1",
                description = "CPUs per array element = threads per task (default: 1).")
        private int cpus;

        @Option(names = "--max-parallel", paramLabel = "K", defaultValue = "0",
                description = "At most K elements at once (the %%K throttle; default: no throttle).")
        private int maxParallel;

        @Option(names = "--array-size", paramLabel = "A", defaultValue = "0",
                description = "Array elements (default: one per task, at most the cluster's MaxArraySize - 1).")
        private int arraySize;

        @Option(names = "--dry-run", description = "Write the script and print the sbatch command; submit nothing.")
        private boolean dryRun;

        @Spec
        CommandSpec spec;

        @Override public Integer call() throws IOException {
            range("--cpus", cpus, 1, 1024);
            if (maxParallel < 0 || maxParallel > 1_000_000) {
                throw new UserInputException("--max-parallel " + maxParallel + ": allowed 1..1000000 (0: no throttle)");
            }
            if (arraySize < 0 || arraySize > 10_000_000) {
                throw new UserInputException("--array-size " + arraySize + ": allowed 1..10000000");
            }
            if (partition != null && !partition.matches("[A-Za-z0-9_.,-]{1,64}")) {
                throw new UserInputException("--partition '" + partition + "': letters, digits, '_', '.', ',' and '-' only");
            }
            if (time != null && !time.matches("\\d{1,6}(:\\d{1,2}){0,2}|\\d{1,4}-\\d{1,2}(:\\d{1,2}){0,2}")) {
                throw new UserInputException("--time '" + time + "': use Slurm's form, e.g. 90, 01:30:00 or 2-00:00");
            }
            long memMiB = mem == null ? 0 : parseMem(mem);
            SweepPlan plan = SweepPlan.open(dir);
            SlurmArray.Job job = SlurmArray.write(plan, new SlurmArray.Options(partition, time, memMiB, cpus, maxParallel,
                    arraySize));
            PrintWriter out = spec.commandLine().getOut();
            out.println("wrote " + job.script() + ": " + plan.tasks() + " tasks in " + job.elements() + " array element(s), "
                    + job.memMiB() + " MiB and " + cpus + " CPU(s) each" + (maxParallel > 0 ? ", at most " + maxParallel
                    + " at once" : ""));
            if (dryRun) {
                out.println("submit with: sbatch " + job.script());
            } else {
                String id = SlurmArray.submit(job.script());
                out.println("submitted array job " + id + "; follow it with: spindrift sweep status " + dir);
            }
            out.flush();
            return 0;
        }

        static long parseMem(String s) {
            Matcher m = Pattern.compile("(\\d{1,9})([KMGT]?)", Pattern.CASE_INSENSITIVE).matcher(s.strip());
            if (!m.matches()) {
                throw new UserInputException("--mem '" + s + "': write a size such as 1500M or 4G");
            }
            long v = Long.parseLong(m.group(1));
            long mib = switch (m.group(2).toUpperCase(Locale.ROOT)) {
                case "K" -> (v + 1023) / 1024;
                case "G" -> v * 1024;
                case "T" -> v * 1024 * 1024;
                default -> v;
            };
            if (mib < 256) {
                throw new UserInputException("--mem '" + s + "': at least 256M per array element");
            }
            return mib;
        }
    }

    /** {@code sweep status DIR [--verify] [--list]}. */
    @Command(name = "status", mixinStandardHelpOptions = true,
            description = {"Count done, failed, started and pending tasks from the sweep folder alone (no scheduler"
                    + " accounting).", "Lists the failed tasks with their reasons."})
    static final class Status implements Callable<Integer> {
        @Parameters(index = "0", paramLabel = "DIR", description = "Sweep folder.")
        private Path dir;

        @Option(names = "--verify", description = "Also compare every file's SHA-256 with its manifest (reads every byte).")
        private boolean verify;

        @Option(names = "--list", description = "One line per task.")
        private boolean list;

        @Spec
        CommandSpec spec;

        @Override public Integer call() {
            SweepPlan plan = SweepPlan.open(dir);
            PrintWriter out = spec.commandLine().getOut();
            TaskState[] st = new TaskState[plan.tasks()];
            for (int t = 0; t < st.length; t++) {
                st[t] = TaskState.of(plan.layout(), plan.kind(), t, verify);
            }
            Map<TaskState, Integer> c = SweepCollector.counts(st);
            out.printf(Locale.ROOT, "%s: %d tasks: %d done, %d failed, %d started (running, or stopped without a trace),"
                    + " %d pending%n", plan.name(), st.length, c.get(TaskState.DONE), c.get(TaskState.FAILED),
                    c.get(TaskState.STARTED), c.get(TaskState.PENDING));
            int shown = 0;
            for (int t = 0; t < st.length; t++) {
                if (list) {
                    out.println(SweepLayout.taskName(t) + " " + st[t].key()
                            + (st[t] == TaskState.FAILED ? ": " + TaskState.reason(plan.layout(), t) : ""));
                } else if (st[t] == TaskState.FAILED && shown++ < 20) {
                    out.println(SweepLayout.taskName(t) + " failed: " + TaskState.reason(plan.layout(), t));
                }
            }
            out.flush();
            return 0;
        }
    }

    /** {@code sweep collect DIR [--plot OUTPUT]}. */
    @Command(name = "collect", mixinStandardHelpOptions = true,
            description = {"Write DIR/sweep.csv and DIR/sweep.h5: one row per task (task, state, axis values, headline"
                    + " outputs), and DIR/plots/OUTPUT_vs_AXIS.png for each numeric axis."})
    static final class Collect implements Callable<Integer> {
        @Parameters(index = "0", paramLabel = "DIR", description = "Sweep folder.")
        private Path dir;

        @Option(names = "--plot", paramLabel = "OUTPUT", defaultValue = "centroid_wander_uas",
                description = "Output to plot against each axis (default: ${DEFAULT-VALUE}).")
        private String plot;

        @Spec
        CommandSpec spec;

        @Override public Integer call() throws IOException {
            SweepPlan plan = SweepPlan.open(dir);
            SweepCollector.Table table = SweepCollector.read(plan);
            PrintWriter out = spec.commandLine().getOut();
            Map<TaskState, Integer> c = SweepCollector.counts(table.states());
            List<Path> plots = c.get(TaskState.DONE) > 0 ? SweepCollector.plot(plan, table, plot) : List.of();
            SweepCollector.write(plan, table);
            out.println("wrote " + dir.resolve(SweepLayout.CSV) + " and " + dir.resolve(SweepLayout.H5) + ": "
                    + plan.tasks() + " rows, " + c.get(TaskState.DONE) + " done" + (c.get(TaskState.DONE) < plan.tasks()
                    ? " (" + (plan.tasks() - c.get(TaskState.DONE)) + " not done: empty outputs)" : ""));
            for (Path p : plots) {
                out.println("plot: " + p);
            }
            out.flush();
            return 0;
        }
    }
}
