package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.sweep.ScenarioTaskKind;
import org.spindrift.sim.sweep.SweepFixtures;
import org.spindrift.sim.sweep.SweepLayout;
import org.spindrift.sim.sweep.SweepPlan;
import org.spindrift.sim.sweep.TaskState;

/** The array job script as written by {@code sweep slurm --dry-run}, and Slurm's array variables. */
class SweepSlurmScriptTest {
    @TempDir Path tmp;

    @Test void dryRunWritesAValidArrayScriptWithAbsolutePaths() throws Exception {
        Path f = SweepFixtures.sweep(tmp, "five", "observer.inclination_deg: [10, 20, 30, 40, 50]");
        Path dir = tmp.resolve("S");
        CliCapture.run(0, "sweep", "plan", f.toString(), "-o", dir.toString());
        String out = CliCapture.run(0, "sweep", "slurm", dir.toString(), "--dry-run", "--partition", "short", "--time",
                "00:10:00", "--max-parallel", "3", "--array-size", "2", "--cpus", "2")[0];
        assertTrue(out.contains("5 tasks in 2 array element(s)"), out);
        String s = Files.readString(dir.resolve(SweepLayout.SCRIPT));
        long heapMiB = (SweepPlan.open(dir).heapBytes() + (1 << 20) - 1) >> 20;
        for (String line : new String[] {"#SBATCH --array=0-1%3", "#SBATCH --partition=short", "#SBATCH --time=00:10:00",
            "#SBATCH --cpus-per-task=2", "#SBATCH --mem=" + (Math.max(256, heapMiB) + 384) + "M",
            "#SBATCH --chdir=" + dir.toAbsolutePath(), "-Xmx" + Math.max(256, heapMiB) + "m",
            "org.spindrift.sim.cli.Main sweep run '" + dir.toAbsolutePath() + "' --threads 2"}) {
            assertTrue(s.contains(line), line + " in\n" + s);
        }
        assertTrue(s.contains("exec '" + Path.of(System.getProperty("java.home"), "bin", "java") + "'"), s);
        assertTrue(Files.isDirectory(dir.resolve(SweepLayout.LOGS)), "Slurm does not create the output folder itself");
        // bash accepts the script (common practice: bash -n parses without running)
        Process p = new ProcessBuilder("bash", "-n", dir.resolve(SweepLayout.SCRIPT).toString()).redirectErrorStream(true)
                .start();
        String err = new String(p.getInputStream().readAllBytes());
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        assertEquals(0, p.exitValue(), err);
    }

    /** A child JVM with Slurm's array variables set runs exactly its element's tasks (t mod count = id - min). */
    @Test void slurmArrayVariablesSelectTheElementsTasks() throws Exception {
        Path f = SweepFixtures.sweep(tmp, "three", "observer.inclination_deg: [10, 40, 70]");
        Path dir = tmp.resolve("S");
        CliCapture.run(0, "sweep", "plan", f.toString(), "-o", dir.toString());
        ProcessBuilder pb = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Djava.awt.headless=true", "-cp", System.getProperty("java.class.path"), "org.spindrift.sim.cli.Main",
                "sweep", "run", dir.toString(), "--threads", "1").redirectErrorStream(true);
        pb.environment().put("SLURM_ARRAY_TASK_ID", "5");
        pb.environment().put("SLURM_ARRAY_TASK_MIN", "4");
        pb.environment().put("SLURM_ARRAY_TASK_COUNT", "2");
        pb.environment().remove("SLURM_CPUS_PER_TASK");
        Process p = pb.start();
        String out = new String(p.getInputStream().readAllBytes());
        assertTrue(p.waitFor(600, TimeUnit.SECONDS), out);
        assertEquals(0, p.exitValue(), out);
        assertTrue(out.contains("Slurm array element 1 of 2, 1 task(s)"), out);
        SweepLayout l = new SweepLayout(dir);
        ScenarioTaskKind k = new ScenarioTaskKind();
        assertEquals(TaskState.PENDING, TaskState.of(l, k, 0, false));
        assertEquals(TaskState.DONE, TaskState.of(l, k, 1, true));
        assertEquals(TaskState.PENDING, TaskState.of(l, k, 2, false));
    }
}
