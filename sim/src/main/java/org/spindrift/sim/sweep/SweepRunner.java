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
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.AtomicFiles;

/**
 * {@code sweep run}: runs a selection of a sweep's tasks, J at a time with T threads each. A task
 * whose run folder is complete (manifest present, checksums valid) is skipped, so running again
 * resumes; a task that fails records why in {@code status/} and the others go on.
 */
public final class SweepRunner {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    /**
     * @param ran tasks run to completion now
     * @param skipped tasks found complete
     * @param failed tasks that failed now
     */
    public record Summary(int ran, int skipped, int failed) {
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
        SweepLayout layout = plan.layout();
        Files.createDirectories(layout.dir().resolve(SweepLayout.RUNS));
        Files.createDirectories(layout.dir().resolve(SweepLayout.STATUS));
        AtomicInteger ran = new AtomicInteger();
        AtomicInteger skipped = new AtomicInteger();
        AtomicInteger failed = new AtomicInteger();
        ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, jobs), r -> {
            Thread t = new Thread(r, "spindrift-sweep-task");
            t.setDaemon(true);
            return t;
        });
        try (ProgressBar bar = progress ? new ProgressBarBuilder().setTaskName("sweep " + plan.name())
                .setInitialMax(tasks.size()).setStyle(ProgressBarStyle.ASCII)
                .setConsumer(new ConsoleProgressBarConsumer(System.err)).setUpdateIntervalMillis(500).build() : null) {
            List<Future<?>> fs = new ArrayList<>();
            for (int t : tasks) {
                fs.add(pool.submit(() -> {
                    String outcome = runOne(plan, t, threads);
                    switch (outcome) {
                        case "" -> ran.incrementAndGet();
                        case "skip" -> skipped.incrementAndGet();
                        default -> failed.incrementAndGet();
                    }
                    synchronized (log) {
                        if (!outcome.isEmpty() && !outcome.equals("skip")) {
                            log.println(SweepLayout.taskName(t) + ": failed: " + outcome);
                            log.flush();
                        }
                    }
                    if (bar != null) {
                        bar.step();
                    }
                    return null;
                }));
            }
            for (Future<?> f : fs) {
                try {
                    f.get();
                } catch (java.util.concurrent.ExecutionException e) {
                    throw new IllegalStateException(e.getCause());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new IOException("interrupted", e);
                }
            }
        } finally {
            pool.shutdownNow();
        }
        return new Summary(ran.get(), skipped.get(), failed.get());
    }

    /** @return "" when run, "skip" when already complete, else the reason of the failure */
    private static String runOne(SweepPlan plan, int t, int threads) throws IOException {
        SweepLayout layout = plan.layout();
        Path folder = layout.runFolder(t);
        if (plan.kind().complete(folder, true)) {
            return "skip";
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
            reason = e.getMessage();
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
        return reason;
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
        return String.format(Locale.ROOT, "%d run, %d already done, %d failed", s.ran(), s.skipped(), s.failed());
    }
}
