package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.Comparator;
import java.util.HexFormat;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import me.tongfei.progressbar.ProgressBar;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.Version;
import org.spindrift.shared.archive.AtomicFiles;
import org.spindrift.sim.run.ProgressBars;
import org.spindrift.sim.scenario.ConfigNode;

/**
 * {@code sweep plan}: expands a sweep file into tasks, checks every task with its kind's checks
 * (in parallel, the first failing task in task order reported), and only then writes the task
 * files and, last, {@code sweep.json}. A folder that holds another sweep, or anything else, is
 * refused; planning the same sweep again into its folder changes nothing.
 */
public final class SweepPlanner {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    private static final ObjectMapper COMPACT = new ObjectMapper();
    private static final String PARTIAL = ".tasks.partial";
    private static final Pattern KEY = Pattern.compile("^([A-Za-z_][A-Za-z0-9_\\-.\\[\\]]*)");

    /**
     * @param tasks number of tasks
     * @param unchanged the folder already held this very plan
     * @param heapMax largest heap of one task, bytes
     * @param diskMax largest run folder, bytes
     * @param diskTotal all run folders, bytes
     */
    public record Result(int tasks, boolean unchanged, long heapMax, long diskMax, long diskTotal) {
    }

    private SweepPlanner() {
    }

    /**
     * Plans a sweep into a folder.
     *
     * @param force allow more than {@link SweepFile#FORCE_LIMIT} tasks
     * @param threads workers for the checks (results do not depend on it)
     */
    public static Result plan(Path sweepFile, Path dir, boolean force, int threads) throws IOException {
        return plan(sweepFile, dir, force, threads, false);
    }

    /**
     * Plans a sweep into a folder, with a progress bar over the task checks when asked.
     */
    public static Result plan(Path sweepFile, Path dir, boolean force, int threads, boolean progress) throws IOException {
        SweepFile sf = SweepFile.load(sweepFile);
        long n = sf.taskCount();
        if (n > SweepFile.FORCE_LIMIT && !force) {
            throw new UserInputException(sweepFile + ": axes: the axes give " + n + " tasks; more than "
                    + SweepFile.FORCE_LIMIT + " need --force");
        }
        SweepLayout layout = new SweepLayout(dir);
        checkFolder(dir);
        List<ConfigNode[]> points = sf.points();
        int total = points.size();
        // every task's tree: axis paths are put in (errors name the axis), then checked by its kind
        TaskKind.Estimate[] est = new TaskKind.Estimate[total];
        String[] sha = new String[total];
        try (ProgressBar bar = ProgressBars.open(progress && total >= 20, "checking tasks", total)) {
            checkAll(sf, points, est, sha, Math.max(1, threads), bar);
        }
        long heapMax = 0;
        long diskMax = 0;
        long diskTotal = 0;
        for (TaskKind.Estimate e : est) {
            heapMax = Math.max(heapMax, e.heapBytes());
            diskMax = Math.max(diskMax, e.diskBytes());
            diskTotal += e.diskBytes();
        }
        ObjectNode plan = planJson(sf, points, sha, heapMax, diskMax, diskTotal);
        String planSha = sha256(COMPACT.writeValueAsBytes(plan.get("tasks")) );
        plan.put("plan_sha256", planSha);
        if (Files.isRegularFile(layout.plan())) {
            SweepPlan old = SweepPlan.open(dir);
            if (planSha.equals(old.json().path("plan_sha256").asText()) && sf.kind().name().equals(old.kind().name())) {
                return new Result(total, true, heapMax, diskMax, diskTotal);
            }
            throw new UserInputException("sweep folder " + dir + ": holds another sweep ('" + old.name() + "', "
                    + old.tasks() + " tasks, planned from " + old.json().path("sweep_file").asText()
                    + "); choose another folder with -o");
        }
        write(sf, points, layout, plan);
        return new Result(total, false, heapMax, diskMax, diskTotal);
    }

    /** Refuses a folder that is not empty and holds anything but a sweep (or an interrupted plan). */
    private static void checkFolder(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        if (!Files.isDirectory(dir)) {
            throw new UserInputException("sweep folder " + dir + ": exists and is not a folder; choose another with -o");
        }
        if (Files.isRegularFile(dir.resolve(SweepLayout.PLAN))) {
            return; // compared with the new plan once that is known
        }
        Set<String> ours = Set.of(PARTIAL, SweepLayout.TASKS);
        try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir)) {
            for (Path p : ds) {
                if (!ours.contains(p.getFileName().toString())) {
                    throw new UserInputException("sweep folder " + dir + ": holds files that are not a sweep's (for example "
                            + p.getFileName() + "); choose another folder with -o");
                }
            }
        }
    }

    private static void checkAll(SweepFile sf, List<ConfigNode[]> points, TaskKind.Estimate[] est, String[] sha,
            int threads, ProgressBar bar) throws IOException {
        int total = points.size();
        sf.taskTree(points.get(0)); // key paths that do not fit the base file: reported at the axis
        AtomicInteger next = new AtomicInteger();
        AtomicInteger firstBad = new AtomicInteger(Integer.MAX_VALUE);
        UserInputException[] errors = new UserInputException[total];
        ExecutorService pool = Workers.daemonPool(threads, "spindrift-plan");
        try {
            Future<?>[] fs = new Future<?>[threads];
            for (int w = 0; w < threads; w++) {
                fs[w] = pool.submit(() -> {
                    int i;
                    while ((i = next.getAndIncrement()) < total) {
                        if (i > firstBad.get()) {
                            return null;
                        }
                        ConfigNode tree = sf.taskTree(points.get(i)); // same structure for every task: checked first
                        try {
                            est[i] = sf.kind().check(sf.base(), tree);
                            sha[i] = sha256(taskBytes(tree));
                            if (bar != null) {
                                bar.step();
                            }
                        } catch (UserInputException e) {
                            errors[i] = e;
                            firstBad.accumulateAndGet(i, Math::min);
                        }
                    }
                    return null;
                });
            }
            Workers.awaitAll(java.util.Arrays.asList(fs));
        } finally {
            pool.shutdownNow();
        }
        int bad = firstBad.get();
        if (bad != Integer.MAX_VALUE) {
            throw taskError(sf, points, bad, errors[bad]);
        }
    }

    /**
     * Re-words a kind's check error for one task: a problem at an axis's key path (or a parent of
     * it) is reported at the axis's line in the sweep file; other problems at the base file's line.
     * Both say which task and which axis values.
     */
    static UserInputException taskError(SweepFile sf, List<ConfigNode[]> points, int task, UserInputException e) {
        String msg = e.getMessage();
        String label = sf.base().toString();
        String rest = msg;
        String where = label;
        if (msg.startsWith(label)) {
            Matcher m = Pattern.compile("^(:\\d+)?: ").matcher(msg.substring(label.length()));
            if (m.find()) {
                where = label + (m.group(1) == null ? "" : m.group(1));
                rest = msg.substring(label.length() + m.end());
            }
        }
        Matcher km = KEY.matcher(rest);
        String token = km.find() ? km.group(1) : "";
        List<SweepAxis> axes = sf.axes();
        StringBuilder values = new StringBuilder();
        ConfigNode[] p = points.get(task);
        SweepAxis hit = null;
        for (int j = 0; j < axes.size(); j++) {
            values.append(j == 0 ? "" : ", ").append(axes.get(j).key()).append(" = ").append(ConfigTrees.text(p[j]));
            if (hit == null && !token.isEmpty() && axes.get(j).key().relates(token)) {
                hit = axes.get(j);
            }
        }
        String context = " [task " + task + " of " + points.size() + ": " + values + "]";
        if (hit != null) {
            return new UserInputException(sf.file() + ":" + hit.line() + ": " + rest + context, e);
        }
        return new UserInputException(where + ": " + rest + context, e);
    }

    /** @return a task file's bytes: the tree as indented JSON */
    static byte[] taskBytes(ConfigNode tree) throws IOException {
        return JSON.writeValueAsBytes(ConfigTrees.toJson(tree));
    }

    private static ObjectNode planJson(SweepFile sf, List<ConfigNode[]> points, String[] sha, long heapMax, long diskMax,
            long diskTotal) throws IOException {
        ObjectNode m = JSON.createObjectNode();
        m.put("format", SweepLayout.FORMAT);
        m.put("format_version", SweepLayout.FORMAT_VERSION);
        m.put("code_version", Version.get());
        m.put("created_utc", Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
        m.put("name", sf.name());
        m.put("kind", sf.kind().name());
        m.put("sweep_file", sf.file().toAbsolutePath().normalize().toString());
        m.put("sweep_file_sha256", AtomicFiles.sha256(sf.file()));
        m.put("base_file", sf.base().toString());
        m.put("base_file_sha256", AtomicFiles.sha256(sf.base()));
        ArrayNode axes = m.putArray("axes");
        for (SweepAxis a : sf.axes()) {
            ObjectNode o = axes.addObject().put("key", a.key().toString()).put("spacing", a.spacing().key());
            if (a.sampled()) {
                o.put("from", a.from()).put("to", a.to());
            } else {
                ArrayNode v = o.putArray("values");
                a.values().forEach(x -> v.add(ConfigTrees.toJson(x)));
            }
        }
        if (sf.samples() > 0) {
            m.putObject("latin_hypercube").put("samples", sf.samples()).put("seed", sf.seed());
        }
        m.putObject("estimate").put("heap_bytes_max", heapMax).put("disk_bytes_max", diskMax)
                .put("disk_bytes_total", diskTotal);
        ArrayNode tasks = m.putArray("tasks");
        for (int i = 0; i < points.size(); i++) {
            ObjectNode t = tasks.addObject();
            t.put("task", i);
            ArrayNode v = t.putArray("values");
            for (ConfigNode x : points.get(i)) {
                v.add(ConfigTrees.toJson(x));
            }
            t.put("sha256", sha[i]);
        }
        return m;
    }

    private static void write(SweepFile sf, List<ConfigNode[]> points, SweepLayout layout, ObjectNode plan)
            throws IOException {
        Path dir = layout.dir();
        boolean created = !Files.exists(dir);
        Files.createDirectories(dir);
        Path partial = dir.resolve(PARTIAL);
        Path tasks = dir.resolve(SweepLayout.TASKS);
        boolean done = false;
        Thread cleanup = new Thread(() -> removeTree(partial), "spindrift-plan-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
        try {
            removeTree(partial);
            removeTree(tasks); // left by an interrupted plan (no sweep.json was written)
            Files.createDirectories(partial);
            for (int i = 0; i < points.size(); i++) {
                byte[] b = taskBytes(sf.taskTree(points.get(i)));
                Files.write(partial.resolve(SweepLayout.taskName(i) + ".json"), b);
            }
            Files.move(partial, tasks);
            AtomicFiles.write(layout.plan(), tmp -> JSON.writeValue(tmp.toFile(), plan));
            done = true;
        } finally {
            if (!done) {
                removeTree(partial);
                removeTree(tasks);
                if (created) {
                    try {
                        Files.deleteIfExists(dir);
                    } catch (IOException e) {
                        // not empty: leave it
                    }
                }
            }
            try {
                Runtime.getRuntime().removeShutdownHook(cleanup);
            } catch (IllegalStateException e) {
                // shutting down
            }
        }
    }

    static void removeTree(Path p) {
        if (!Files.exists(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        try (Stream<Path> s = Files.walk(p)) {
            for (Path q : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(q);
            }
        } catch (IOException e) {
            // best effort
        }
    }

    static String sha256(byte[] b) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
