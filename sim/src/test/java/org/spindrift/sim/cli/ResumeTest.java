package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.ArchiveVerifier;

/**
 * Checkpoints and resume: a run killed with SIGKILL at seeded random moments (and once stopped
 * with SIGTERM, which must say how to resume) and resumed each time ends with snapshots.h5,
 * images.fits and every CSV file bitwise identical to an uninterrupted run.
 */
class ResumeTest {
    @TempDir Path tmp;

    /** Snapshots of the scenario below: 2400 M at 20 M. */
    static final int SNAPSHOTS = 121;

    /** @return the last snapshot the checkpoint's history files hold, -1 without any */
    private static int lastRow(Path checkpoint) throws IOException {
        if (!Files.isDirectory(checkpoint)) {
            return -1;
        }
        try (var s = Files.list(checkpoint)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> n.matches("rows-\\d+-\\d+\\.bin"))
                    .mapToInt(n -> Integer.parseInt(n.substring(12, 18))).max().orElse(-1);
        } catch (java.nio.file.NoSuchFileException | java.io.UncheckedIOException e) {
            return -1; // removed by the run as it completed
        }
    }

    /**
     * Waits until the checkpoint holds snapshot {@code row} or the process ends.
     *
     * @return true when the process is still running and has checkpointed that far
     */
    private static boolean reachesRow(Process p, Path checkpoint, int row) throws Exception {
        while (p.isAlive()) {
            if (lastRow(checkpoint) >= row) {
                return true;
            }
            Thread.sleep(2);
        }
        return false;
    }

    private Process child(Path file, Path out, Path log, String... extra) throws IOException {
        String java = ProcessHandle.current().info().command().orElse("java");
        List<String> cmd = new ArrayList<>(List.of(java, "-Djava.awt.headless=true", "-cp",
                System.getProperty("java.class.path"), Main.class.getName(), "run", file.toString(), "-o",
                out.toString(), "--quiet", "--threads", "1", "--checkpoint-every", "0"));
        cmd.addAll(List.of(extra));
        return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
    }

    @Test void killedAndResumedRunsEqualAnUninterruptedOneBitForBit() throws Exception {
        String text = DegenerateRunsTest.scenario("single").replace("particles: 1", "particles: 1500")
                .replace("duration: 40 M", "duration: 2400 M").replace("snapshot_cadence: 4 M", "snapshot_cadence: 20 M")
                .replace("pixels: 16", "pixels: 12");
        Path file = Files.writeString(tmp.resolve("a.yaml"), text);
        Path reference = tmp.resolve("reference");
        CliCapture.run(0, "run", file.toString(), "-o", reference.toString(), "--quiet", "--threads", "1");

        Path out = tmp.resolve("out");
        Path checkpoint = tmp.resolve(".out.spindrift-checkpoint");
        Random rnd = new Random(20261203);
        int interruptions = 0;
        boolean sawCheckpoint = false;
        boolean complete = false;
        boolean midEvolution = false;
        List<Integer> where = new ArrayList<>();
        for (int attempt = 0; attempt < 12 && !complete; attempt++) {
            Path log = tmp.resolve("child" + attempt + ".log");
            boolean last = attempt >= 4;
            Process p = child(file, out, log, attempt == 0 ? new String[0] : new String[] {"--resume"});
            if (!last) {
                // The first three interruptions land at seeded snapshots of the evolution (watched
                // through the checkpoint, so the outcome does not depend on the machine's speed);
                // the fourth after a seeded delay, wherever the run then is (often the light stage).
                boolean stopped = attempt < 3
                        ? reachesRow(p, checkpoint, 10 + 30 * attempt + rnd.nextInt(25))
                        : !p.waitFor(rnd.nextInt(1500), TimeUnit.MILLISECONDS);
                if (stopped) {
                    if (attempt == 2) {
                        p.destroy(); // SIGTERM: a checkpoint and one line saying how to resume
                        assertTrue(p.waitFor(120, TimeUnit.SECONDS));
                        String said = Files.readString(log);
                        if (!Files.exists(out.resolve(ArchiveLayout.MANIFEST))) {
                            assertTrue(said.contains("--resume") && said.contains("checkpoint"), said);
                            assertEquals(1, said.strip().lines().filter(l -> l.contains("--resume")).count(), said);
                            assertTrue(Files.exists(checkpoint.resolve("state.bin")), said);
                        }
                    } else {
                        p.destroyForcibly(); // SIGKILL
                        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
                    }
                    interruptions++;
                    sawCheckpoint |= Files.exists(checkpoint.resolve("state.bin"));
                    int row = lastRow(checkpoint);
                    midEvolution |= row >= 0 && row < SNAPSHOTS - 1;
                    where.add(row);
                }
            }
            if (!p.isAlive() || last) {
                assertTrue(p.waitFor(300, TimeUnit.SECONDS));
            }
            // finished, or killed between the swap and the removal of the checkpoint
            complete = Files.exists(out.resolve(ArchiveLayout.MANIFEST));
            if (p.exitValue() == 0) {
                assertTrue(complete, Files.readString(log));
            }
        }
        assertTrue(complete, "the run completed");
        assertTrue(interruptions >= 2, "interrupted " + interruptions + " times");
        assertTrue(sawCheckpoint, "a checkpoint was written before an interruption");
        assertTrue(midEvolution, "at least one interruption during the evolution; last checkpointed snapshots: " + where);
        assertFalse(Files.exists(tmp.resolve(".out.spindrift-new")), "no build folder left");
        assertEquals(List.of(), ArchiveVerifier.problems(out));
        List<String> compared = new ArrayList<>();
        try (var s = Files.list(reference)) {
            for (Path f : s.toList()) {
                String name = f.getFileName().toString();
                if (name.endsWith(".csv") || name.equals(ArchiveLayout.SNAPSHOTS) || name.equals(ArchiveLayout.IMAGES)) {
                    assertArrayEquals(Files.readAllBytes(f), Files.readAllBytes(out.resolve(name)), name);
                    compared.add(name);
                }
            }
        }
        assertTrue(compared.containsAll(List.of(ArchiveLayout.SNAPSHOTS, ArchiveLayout.IMAGES, ArchiveLayout.CENTROID,
                ArchiveLayout.PERIODS, ArchiveLayout.SHEAR)), compared.toString());
        // the diagnostics' per-particle maxima travel in the checkpoint: the resumed run reports the whole run
        com.fasterxml.jackson.databind.ObjectMapper json = new com.fasterxml.jackson.databind.ObjectMapper();
        com.fasterxml.jackson.databind.JsonNode d0 = json.readTree(reference.resolve(ArchiveLayout.MANIFEST).toFile())
                .path("diagnostics");
        com.fasterxml.jackson.databind.JsonNode d1 = json.readTree(out.resolve(ArchiveLayout.MANIFEST).toFile())
                .path("diagnostics");
        for (String key : List.of("hamiltonian_error_max", "hamiltonian_error_median", "carter_drift_max",
                "carter_drift_median")) {
            assertTrue(d0.has(key), key + " in " + d0);
            assertEquals(d0.get(key), d1.get(key), key);
        }
    }

    /** A checkpoint of another scenario or a damaged one: one line, exit 2, nothing written; the right one resumes. */
    @Test void foreignOrDamagedCheckpointsAreRefusedInOneLine() throws Exception {
        String text = DegenerateRunsTest.scenario("single");
        Path file = Files.writeString(tmp.resolve("a.yaml"), text);
        Path out = tmp.resolve("out");
        // a run that fails after its evolution keeps its checkpoint (checkpoints at every snapshot)
        List<org.spindrift.sim.pipeline.RunStage> failing = new ArrayList<>(org.spindrift.sim.run.ScenarioRun.stages());
        failing.add(0, new org.spindrift.sim.pipeline.RunStage() {
            @Override public String name() {
                return "failing";
            }

            @Override public void run(org.spindrift.sim.pipeline.RunContext ctx) throws IOException {
                throw new IOException("simulated failure");
            }
        });
        org.junit.jupiter.api.Assertions.assertThrows(IOException.class, () -> org.spindrift.sim.run.ScenarioRun.run(
                org.spindrift.sim.run.ScenarioRun.prepare(org.spindrift.sim.scenario.ScenarioLoader.load(file)),
                new org.spindrift.sim.run.ScenarioRun.Options(out, 1, false, false, 0, false), failing));
        Path state = tmp.resolve(".out.spindrift-checkpoint").resolve("state.bin");
        assertTrue(Files.exists(state));

        Path other = Files.writeString(tmp.resolve("b.yaml"), text.replace("tolerance: 1.0e-8", "tolerance: 1.0e-9"));
        String[] r = CliCapture.run(2, "run", other.toString(), "-o", out.toString(), "--quiet", "--resume");
        assertEquals(1, r[1].strip().lines().count(), r[1]);
        assertTrue(r[1].contains("another scenario"), r[1]);

        byte[] good = Files.readAllBytes(state);
        byte[] bad = good.clone();
        bad[bad.length / 2] ^= 0x10;
        Files.write(state, bad);
        r = CliCapture.run(2, "run", file.toString(), "-o", out.toString(), "--quiet", "--resume");
        assertEquals(1, r[1].strip().lines().count(), r[1]);
        assertTrue(r[1].contains("damaged"), r[1]);
        assertFalse(Files.exists(out));

        Files.write(state, good);
        CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet", "--resume");
        assertEquals(List.of(), ArchiveVerifier.problems(out));
        assertFalse(Files.exists(state.getParent()), "the checkpoint is removed once the run is complete");
    }
}
