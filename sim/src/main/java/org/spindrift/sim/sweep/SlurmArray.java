package org.spindrift.sim.sweep;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.AtomicFiles;

/**
 * {@code sweep slurm}: one Slurm array job for a sweep. Array element k of A runs
 * {@code sweep run DIR} with Slurm's SLURM_ARRAY_TASK_ID / SLURM_ARRAY_TASK_COUNT, that is the
 * tasks t with t mod A = k, so A may be smaller than the number of tasks (clusters cap the array
 * size with MaxArraySize). The script calls this very Java and class path by absolute paths, so
 * the jobs run the code that planned the sweep without rebuilding anything.
 */
public final class SlurmArray {
    /** Memory of the JVM beside its heap (metaspace, code cache, thread stacks, plotting): our allowance. */
    static final long JVM_OVERHEAD = 384L << 20;
    /** Array size used when the cluster's MaxArraySize cannot be read (Slurm's default is 1001). */
    static final int DEFAULT_MAX_ARRAY = 1000;

    /**
     * Options of the array job.
     *
     * @param partition partition (null: the cluster's default)
     * @param time time limit per array element as Slurm writes it (null: the partition's default)
     * @param memMiB memory per array element, MiB (0: from the plan's estimate)
     * @param cpus CPUs per array element (= threads of each task)
     * @param maxParallel at most this many elements at once (0: no throttle)
     * @param arraySize array elements (0: the number of tasks, at most the cluster's MaxArraySize)
     */
    public record Options(String partition, String time, long memMiB, int cpus, int maxParallel, int arraySize) {
    }

    /**
     * The job as written.
     *
     * @param script path of submit.sbatch
     * @param elements array elements
     * @param memMiB memory per element
     * @param heapMiB Java heap per element
     */
    public record Job(Path script, int elements, long memMiB, long heapMiB) {
    }

    private SlurmArray() {
    }

    /** Writes {@code submit.sbatch}. */
    public static Job write(SweepPlan plan, Options o) throws IOException {
        SweepLayout layout = plan.layout();
        Path dir = layout.dir().toAbsolutePath().normalize();
        int tasks = plan.tasks();
        int maxArray = o.arraySize() > 0 ? o.arraySize() : Math.min(tasks, maxArraySize());
        int elements = Math.max(1, Math.min(tasks, maxArray));
        long heapMiB = Math.max(256, (plan.heapBytes() + (1 << 20) - 1) >> 20);
        long memMiB = o.memMiB() > 0 ? o.memMiB() : heapMiB + (JVM_OVERHEAD >> 20);
        if (o.memMiB() > 0) {
            heapMiB = Math.max(128, o.memMiB() - (JVM_OVERHEAD >> 20));
        }
        Files.createDirectories(dir.resolve(SweepLayout.LOGS));
        StringBuilder s = new StringBuilder();
        s.append("#!/bin/bash\n");
        s.append("# Spindrift sweep '").append(plan.name()).append("': ").append(tasks).append(" tasks as one array job of ")
                .append(elements).append(" element(s);\n");
        s.append("# element k runs the tasks t with t mod ").append(elements)
                .append(" = k. Written by 'spindrift sweep slurm'; submit with: sbatch ")
                .append(dir.resolve(SweepLayout.SCRIPT)).append('\n');
        s.append("#SBATCH --job-name=").append(jobName(plan.name())).append('\n');
        s.append("#SBATCH --array=0-").append(elements - 1).append(o.maxParallel() > 0 ? "%" + o.maxParallel() : "")
                .append('\n');
        s.append("#SBATCH --ntasks=1\n");
        s.append("#SBATCH --cpus-per-task=").append(o.cpus()).append('\n');
        s.append("#SBATCH --mem=").append(memMiB).append("M\n");
        if (o.time() != null) {
            s.append("#SBATCH --time=").append(o.time()).append('\n');
        }
        if (o.partition() != null) {
            s.append("#SBATCH --partition=").append(o.partition()).append('\n');
        }
        s.append("#SBATCH --chdir=").append(dir).append('\n');
        s.append("#SBATCH --output=").append(dir.resolve(SweepLayout.LOGS)).append("/array-%A_%a.out\n");
        s.append("set -eu\n");
        s.append("exec ").append(shell(javaExecutable())).append(" -Xmx").append(heapMiB).append("m")
                .append(" -Djava.awt.headless=true -cp ").append(shell(classPath()))
                .append(" org.spindrift.sim.cli.Main sweep run ").append(shell(dir.toString()))
                .append(" --threads ").append(o.cpus()).append('\n');
        Path script = dir.resolve(SweepLayout.SCRIPT);
        byte[] bytes = s.toString().getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(script, tmp -> Files.write(tmp, bytes));
        script.toFile().setExecutable(true);
        return new Job(script, elements, memMiB, heapMiB);
    }

    /** Submits the script with sbatch; @return the job id */
    public static String submit(Path script) throws IOException {
        String sbatch = onPath("sbatch");
        if (sbatch == null) {
            throw new UserInputException("sbatch not found on PATH: run this on a Slurm login node, or use --dry-run to"
                    + " write " + script + " only");
        }
        List<String> cmd = List.of(sbatch, "--parsable", script.toString());
        String out = run(cmd, 120);
        Matcher m = Pattern.compile("^(\\d+)").matcher(out.strip());
        if (!m.find()) {
            throw new UserInputException("sbatch did not accept " + script + ": " + out.strip().replace('\n', ' '));
        }
        return m.group(1);
    }

    /** @return the cluster's largest array size (MaxArraySize - 1), or the default when it cannot be read */
    static int maxArraySize() {
        String scontrol = onPath("scontrol");
        if (scontrol == null) {
            return DEFAULT_MAX_ARRAY;
        }
        try {
            String out = run(List.of(scontrol, "show", "config"), 30);
            Matcher m = Pattern.compile("(?m)^MaxArraySize\\s*=\\s*(\\d+)").matcher(out);
            if (m.find()) {
                return Math.max(1, Integer.parseInt(m.group(1)) - 1);
            }
        } catch (IOException | UserInputException | NumberFormatException e) {
            // fall back to Slurm's default
        }
        return DEFAULT_MAX_ARRAY;
    }

    private static String run(List<String> cmd, int timeoutS) throws IOException {
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        try {
            if (!p.waitFor(timeoutS, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                throw new UserInputException(cmd.get(0) + " did not answer within " + timeoutS + " s");
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted", e);
        }
        if (p.exitValue() != 0) {
            throw new UserInputException(Path.of(cmd.get(0)).getFileName() + " failed (exit " + p.exitValue() + "): "
                    + out.strip().replace('\n', ' '));
        }
        return out;
    }

    /** @return the absolute path of a program on PATH, or null */
    public static String onPath(String program) {
        String path = System.getenv("PATH");
        if (path == null) {
            return null;
        }
        for (String d : path.split(File.pathSeparator)) {
            Path p = Path.of(d.isEmpty() ? "." : d, program);
            if (Files.isExecutable(p) && !Files.isDirectory(p)) {
                return p.toAbsolutePath().toString();
            }
        }
        return null;
    }

    /** @return the java executable of this JVM */
    static String javaExecutable() {
        return Path.of(System.getProperty("java.home"), "bin", "java").toAbsolutePath().toString();
    }

    /** @return this JVM's class path with every entry made absolute */
    static String classPath() {
        List<String> out = new ArrayList<>();
        for (String e : System.getProperty("java.class.path").split(File.pathSeparator)) {
            if (!e.isEmpty()) {
                out.add(Path.of(e).toAbsolutePath().normalize().toString());
            }
        }
        return String.join(File.pathSeparator, out);
    }

    private static String jobName(String name) {
        String n = "spindrift-" + name;
        return n.length() > 60 ? n.substring(0, 60) : n;
    }

    /** @return the text quoted for bash (single quotes) */
    static String shell(String s) {
        return "'" + s.replace("'", "'\\''") + "'";
    }
}
