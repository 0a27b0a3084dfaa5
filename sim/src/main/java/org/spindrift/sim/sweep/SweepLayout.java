package org.spindrift.sim.sweep;

import java.nio.file.Path;
import java.util.Locale;

/**
 * Names inside a sweep folder:
 * <pre>
 * sweep.json                  the plan (written last by 'sweep plan')
 * tasks/task-000007.json      one task file per point (a complete file of the task kind)
 * runs/task-000007/           the task's run folder (manifest.json last)
 * status/task-000007.failed   why the task failed (JSON); status/task-000007.started while it runs
 * logs/                       the array job's output files
 * submit.sbatch               the array job script
 * sweep.csv, sweep.h5, plots/ the collected table and plots
 * </pre>
 */
public final class SweepLayout {
    public static final String PLAN = "sweep.json";
    public static final String TASKS = "tasks";
    public static final String RUNS = "runs";
    public static final String STATUS = "status";
    public static final String LOGS = "logs";
    public static final String SCRIPT = "submit.sbatch";
    public static final String CSV = "sweep.csv";
    public static final String H5 = "sweep.h5";
    public static final String PLOTS = "plots";
    /** The plan's format name and version. */
    public static final String FORMAT = "spindrift-sweep";
    public static final int FORMAT_VERSION = 1;

    private final Path dir;

    public SweepLayout(Path dir) {
        this.dir = dir;
    }

    public Path dir() {
        return dir;
    }

    /** @return the task's name, {@code task-000007} */
    public static String taskName(int task) {
        return String.format(Locale.ROOT, "task-%06d", task);
    }

    public Path plan() {
        return dir.resolve(PLAN);
    }

    public Path taskFile(int task) {
        return dir.resolve(TASKS).resolve(taskName(task) + ".json");
    }

    public Path runFolder(int task) {
        return dir.resolve(RUNS).resolve(taskName(task));
    }

    public Path failedRecord(int task) {
        return dir.resolve(STATUS).resolve(taskName(task) + ".failed");
    }

    public Path startedRecord(int task) {
        return dir.resolve(STATUS).resolve(taskName(task) + ".started");
    }
}
