package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.PrintWriter;
import java.net.InetAddress;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import me.tongfei.progressbar.ProgressBar;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.AtomicFiles;
import org.spindrift.sim.run.ProgressBars;

/**
 * {@code sweep run}: runs a selection of a sweep's tasks, J at a time with T threads each. A task
 * whose run folder is complete (manifest present, checksums valid) is skipped, so running again
 * resumes; a task that fails records why in {@code status/} and the others go on.
 */
public final class SweepRunner {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    /** What happened to one task. */
    private enum Kind { RAN, SKIPPED, SKIPPED_FAILED, FAILED }

    private record Outcome(Kind kind, String reason) {
    }

    /**
     * @param ran tasks run to completion now
     * @param skipped tasks found complete
     * @param failed tasks that failed now
     * @param skippedFailed tasks left alone because they had failed before (with skipFailed)
     */
    public record Summary(int ran, int skipped, int failed, int skippedFailed) {
        public Summary(int ran, int skipped, int failed) {
            this(ran, skipped, failed, 0);
        }
    }

    private SweepRunner() {
    }

    /**
     * @return the tasks of shard k of n: task numbers t with t mod n = k (strided, so that
     *     neighbouring grid points, often of similar cost, land on different shards)
     */
    public static List<Integer> shard(int tasks, int k, int n) {
        if (n < 1 || k < 0 || k >= n) {
            throw new UserInputException("--shard " + k + "/" + n + ": needs 0 <= K < N");
        }
        List<Integer> out = new ArrayList<>();
        for (int t = k; t < tasks; t += n) {
            out.add(t);
        }
        return out;
    }

    /** Runs the selected tasks. */
    public static Summary run(SweepPlan plan, List<Integer> tasks, int jobs, int threads, boolean progress,
            PrintWriter log) throws IOException {
        return run(plan, tasks, jobs, threads, progress, false, log);
    }

    /**
     * Runs the selected tasks.
     *
     * @param skipFailed leave tasks that failed before alone (their failure record stays)
     */
    public static Summary run(SweepPlan plan, List<Integer> tasks, int jobs, int threads, boolean progress,
            boolean skipFailed, PrintWriter log) throws IOException {
        SweepLayout layout = plan.layout();
        Files.createDirectories(layout.dir().resolve(SweepLayout.RUNS));
        Files.createDirectories(layout.dir().resolve(SweepLayout.STATUS));
        AtomicInteger ran = new AtomicInteger();
        AtomicInteger skipped = new AtomicInteger();
        AtomicInteger failed = new AtomicInteger();
        AtomicInteger skippedFailed = new AtomicInteger();
        ExecutorService pool = Workers.daemonPool(jobs, "spindrift-sweep-task");
        try (ProgressBar bar = ProgressBars.open(progress, "sweep " + plan.name(), tasks.size())) {
            List<Future<?>> fs = new ArrayList<>();
            for (int t : tasks) {
                fs.add(pool.submit(() -> {
                    long t0 = System.nanoTime();
                    Outcome outcome = runOne(plan, t, threads, skipFailed);
                    switch (outcome.kind()) {
                        case RAN -> ran.incrementAndGet();
                        case SKIPPED -> skipped.incrementAndGet();
                        case SKIPPED_FAILED -> skippedFailed.incrementAndGet();
                        default -> failed.incrementAndGet();
                    }
                    synchronized (log) {
                        if (outcome.kind() == Kind.RAN && bar == null) {
                            // one line per task where no progress bar shows (array job logs, pipes)
                            log.printf(Locale.ROOT, "%s: done in %.1f s%n", SweepLayout.taskName(t),
                                    (System.nanoTime() - t0) * 1e-9);
                        } else if (outcome.kind() == Kind.FAILED) {
                            log.println(SweepLayout.taskName(t) + ": failed: " + outcome.reason());
                        }
                        log.flush();
                    }
                    if (bar != null) {
                        bar.step();
                    }
                    return null;
                }));
            }
            Workers.awaitAll(fs);
        } finally {
            pool.shutdownNow();
        }
        return new Summary(ran.get(), skipped.get(), failed.get(), skippedFailed.get());
    }

    /** Runs one task unless it is complete (or failed before, with skipFailed). */
    private static Outcome runOne(SweepPlan plan, int t, int threads, boolean skipFailed) throws IOException {
        SweepLayout layout = plan.layout();
        Path folder = layout.runFolder(t);
        if (plan.kind().complete(folder, true)) {
            return new Outcome(Kind.SKIPPED, "");
        }
        if (skipFailed && Files.isRegularFile(layout.failedRecord(t))) {
            return new Outcome(Kind.SKIPPED_FAILED, "");
        }
        Files.deleteIfExists(layout.failedRecord(t));
        AtomicFiles.write(layout.startedRecord(t), tmp -> JSON.writeValue(tmp.toFile(), record(t, null)));
        String reason;
        try {
            Path file = layout.taskFile(t);
            if (!Files.isRegularFile(file)) {
                reason = "task file " + file + " is missing";
            } else if (!AtomicFiles.sha256(file).equals(plan.taskSha256(t))) {
                reason = "task file " + file + " changed since the sweep was planned (its SHA-256 differs from sweep.json)";
            } else {
                plan.kind().run(file, folder, threads);
                reason = "";
            }
        } catch (UserInputException e) {
            reason = e.getMessage() == null || e.getMessage().isBlank() ? "bad input" : e.getMessage();
        } catch (OutOfMemoryError e) {
            reason = "out of memory (" + e.getMessage() + "): give the task more memory (sweep slurm --mem, or"
                    + " SPINDRIFT_JAVA_OPTS=-Xmx... for a local run)";
        } catch (Exception | StackOverflowError e) {
            reason = e.getClass().getSimpleName() + ": " + e.getMessage();
        }
        if (!reason.isEmpty()) {
            final String why = reason.replace('\n', ' ');
            AtomicFiles.write(layout.failedRecord(t), tmp -> JSON.writeValue(tmp.toFile(), record(t, why)));
        }
        Files.deleteIfExists(layout.startedRecord(t));
        return new Outcome(reason.isEmpty() ? Kind.RAN : Kind.FAILED, reason);
    }

    private static ObjectNode record(int t, String reason) {
        ObjectNode o = JSON.createObjectNode();
        o.put("task", t);
        if (reason != null) {
            o.put("reason", reason);
        }
        o.put("time_utc", Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
        String host;
        try {
            host = InetAddress.getLocalHost().getHostName();
        } catch (IOException e) {
            host = "unknown";
        }
        o.put("host", host);
        o.put("pid", ProcessHandle.current().pid());
        String job = System.getenv("SLURM_ARRAY_JOB_ID");
        if (job != null) {
            o.put("slurm_array_job_id", job);
            o.put("slurm_array_task_id", System.getenv("SLURM_ARRAY_TASK_ID"));
        }
        return o;
    }

    /** @return a one-line summary */
    public static String describe(Summary s) {
        return String.format(Locale.ROOT, "%d run, %d already done, %d failed", s.ran(), s.skipped(), s.failed())
                + (s.skippedFailed() > 0 ? ", " + s.skippedFailed() + " failed before and left alone" : "");
    }
}
