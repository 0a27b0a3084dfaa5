package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.RunArchive;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.sim.pipeline.RunContext;
import org.spindrift.sim.pipeline.RunNotes;
import org.spindrift.sim.pipeline.RunStage;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.ScenarioLoader;

/**
 * The command line's side of the run-folder guarantees: a finished run is replaced only with
 * --overwrite and survives every failure of the new one; a locked folder is refused; every limit
 * of {@code run} is reported by {@code check} with FILE:LINE before any work; unwritable folders
 * are refused up front; silent nonsense is refused or reported.
 */
class RunFolderCliTest {
    @TempDir Path tmp;

    private Path scenario(String name, String text) throws IOException {
        return Files.writeString(tmp.resolve(name), text);
    }

    private static String single() {
        return DegenerateRunsTest.scenario("single");
    }

    private static List<String> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static void oneLine(String err, String... parts) {
        assertEquals(1, err.strip().lines().count(), err);
        for (String p : parts) {
            assertTrue(err.contains(p), "'" + p + "' in: " + err);
        }
    }

    @Test void aFinishedRunIsReplacedOnlyWithOverwriteAndSurvivesEveryFailure() throws Exception {
        Path file = scenario("a.yaml", single());
        Path out = tmp.resolve("out");
        CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet");
        byte[] manifest = Files.readAllBytes(out.resolve(ArchiveLayout.MANIFEST));

        // without --overwrite: refused, nothing touched
        String[] r = CliCapture.run(2, "run", file.toString(), "-o", out.toString(), "--quiet");
        oneLine(r[1], "holds a finished run", "--overwrite");

        // the image budget: refused before any work, by check too, with file and line
        Path huge = scenario("huge.yaml", single().replace("  pixels: 16", "  pixels: 4096\n  frame_cadence: 0.5 M"));
        r = CliCapture.run(2, "run", huge.toString(), "-o", out.toString(), "--quiet", "--overwrite");
        oneLine(r[1], huge + ":", "imaging.frame_cadence", "image budget");
        r = CliCapture.run(2, "check", huge.toString());
        oneLine(r[1], huge + ":", "imaging.frame_cadence", "image budget");

        // a full disk half way through the new run (simulated): the old run stays
        List<RunStage> failing = new ArrayList<>(ScenarioRun.stages());
        failing.add(2, new RunStage() {
            @Override public String name() {
                return "disk-full";
            }

            @Override public void run(RunContext ctx) throws IOException {
                ctx.archive().writeStream(ArchiveLayout.CENTROID, os -> {
                    os.write("t,x\n0,".getBytes());
                    throw new IOException("No space left on device");
                });
            }
        });
        assertThrows(IOException.class, () -> ScenarioRun.run(ScenarioRun.prepare(ScenarioLoader.load(file)),
                new ScenarioRun.Options(out, 1, false, true), failing));
        assertArrayEquals(manifest, Files.readAllBytes(out.resolve(ArchiveLayout.MANIFEST)));
        try (RunArchive a = RunArchive.open(out, true)) {
            assertTrue(a.has(ArchiveLayout.SNAPSHOTS));
        }
        assertEquals(List.of(".out.spindrift-lock", "a.yaml", "huge.yaml", "out"), listing(tmp), "no build folder left");

        // with --overwrite and a complete run: replaced
        Path other = scenario("b.yaml", single().replace("  tolerance: 1.0e-8", "  tolerance: 1.0e-8\n  seed: 77"));
        CliCapture.run(0, "run", other.toString(), "-o", out.toString(), "--quiet", "--overwrite");
        try (RunArchive a = RunArchive.open(out, true)) {
            assertEquals(77, a.seed());
        }
    }

    @Test void aFolderAnotherRunHoldsIsRefusedAtOnce() throws Exception {
        Path file = scenario("a.yaml", single());
        Path out = tmp.resolve("busy");
        RunArchiveWriter other = RunArchiveWriter.create(out);
        try {
            String[] r = CliCapture.run(2, "run", file.toString(), "-o", out.toString(), "--quiet");
            oneLine(r[1], "another run is writing it");
        } finally {
            other.abandon();
        }
        assertFalse(Files.exists(out));
    }

    /** SIGTERM (as Ctrl-C, through the shutdown hook) part way: the old run is intact and the new one gone. */
    @Test void aStoppedRunLeavesTheOldRunIntact() throws Exception {
        Path file = scenario("a.yaml", single());
        Path out = tmp.resolve("out");
        CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet");
        byte[] manifest = Files.readAllBytes(out.resolve(ArchiveLayout.MANIFEST));
        // long enough to be stopped: many particles over many orbits
        Path slow = scenario("slow.yaml", single().replace("particles: 1", "particles: 4000")
                .replace("duration: 40 M", "duration: 4000 M").replace("snapshot_cadence: 4 M", "snapshot_cadence: 20 M"));
        String java = ProcessHandle.current().info().command().orElse("java");
        Process p = new ProcessBuilder(java, "-Djava.awt.headless=true", "-cp", System.getProperty("java.class.path"),
                Main.class.getName(), "run", slow.toString(), "-o", out.toString(), "--quiet", "--overwrite",
                "--threads", "1").redirectErrorStream(true).redirectOutput(tmp.resolve("child.log").toFile()).start();
        Path building = tmp.resolve(".out.spindrift-new");
        for (int i = 0; i < 1200 && !Files.exists(building) && p.isAlive(); i++) {
            Thread.sleep(50);
        }
        Thread.sleep(500); // into the integration
        assertTrue(p.isAlive(), "the child run is still working: " + Files.readString(tmp.resolve("child.log")));
        assertTrue(Files.exists(building), "the new run is being built beside the old one");
        p.destroy(); // SIGTERM: the JVM runs its shutdown hooks
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        assertFalse(Files.exists(building), "the stopped run's folder is removed");
        assertArrayEquals(manifest, Files.readAllBytes(out.resolve(ArchiveLayout.MANIFEST)));
        try (RunArchive a = RunArchive.open(out, true)) {
            assertTrue(a.has(ArchiveLayout.SNAPSHOTS));
        }
    }

    @Test void unwritableOutputFoldersAreRefusedBeforeAnyWork() throws Exception {
        Path file = scenario("a.yaml", single());
        Path notAFolder = Files.writeString(tmp.resolve("notes.txt"), "mine");
        String[] r = CliCapture.run(2, "check", file.toString(), "-o", notAFolder.resolve("run").toString());
        oneLine(r[1], "notes.txt is a file, not a folder");
        r = CliCapture.run(2, "run", file.toString(), "-o", notAFolder.resolve("run").toString(), "--quiet");
        oneLine(r[1], "notes.txt is a file, not a folder");
        r = CliCapture.run(2, "run", file.toString(), "-o", notAFolder.toString(), "--quiet");
        oneLine(r[1], "exists and is not a folder");
        assertEquals("mine", Files.readString(notAFolder));
        assertEquals(List.of("a.yaml", "notes.txt"), listing(tmp));
    }

    @Test void oversizedScenarioFilesAreRefusedBeforeParsing() throws Exception {
        // one long string, as in a pasted data column: refused by size, not parsed
        Path big = scenario("big.yaml", "name: x\ndescription: \"" + "a".repeat(1 << 20) + "\"\n");
        String[] r = CliCapture.run(2, "check", big.toString());
        oneLine(r[1], "big.yaml", "1 MiB");
    }

    @Test void silentNonsenseIsRefusedOrReported() throws Exception {
        for (String fov : new String[] {"1.0e-6", "4.9e-324"}) {
            Path f = scenario("fov.yaml", single().replace("field_of_view_M: 24", "field_of_view_M: " + fov));
            String[] r = CliCapture.run(2, "check", f.toString());
            oneLine(r[1], "fov.yaml:23:", "imaging.field_of_view_M");
        }
        Path cadence = scenario("cadence.yaml", single().replace("  pixels: 16", "  pixels: 16\n  frame_cadence: 50 M"));
        oneLine(CliCapture.run(2, "check", cadence.toString())[1], "cadence.yaml:25:", "imaging.frame_cadence",
                "longer than the run");

        // 41 M at a cadence of 4 M: the run ends at 40 M, and says so
        Path rounded = scenario("rounded.yaml", single().replace("duration: 40 M", "duration: 41 M"));
        String[] r = CliCapture.run(0, "check", rounded.toString());
        assertTrue(r[1].contains("rounded.yaml:19: run.duration") && r[1].contains("ends at the last whole one, 40"),
                r[1]);
        Path out = tmp.resolve("rounded-run");
        r = CliCapture.run(0, "run", rounded.toString(), "-o", out.toString(), "--quiet");
        try (RunArchive a = RunArchive.open(out, true)) {
            String warnings = a.manifest().get(RunNotes.WARNINGS).toString();
            assertTrue(warnings.contains("run.duration"), warnings);
            assertEquals(41.0, a.manifest().path("time").path("duration_requested_M").asDouble());
            assertEquals(40.0, a.manifest().path("time").path("duration_M").asDouble(), 1e-12);
            // a 24 M field: light delays across it span more than the 40 M run, so no frame is fully covered
            assertTrue(warnings.contains("no frame is fully covered"), warnings);
            assertTrue(a.manifest().path("light").path("fully_covered_min").isNull());
        }
    }

    @Test void nonFiniteNumbersAndAnchorsAreNamedPlainly() throws Exception {
        String[][] cases = {
            {"nan.yaml", single().replace("spin: 0.0", "spin: .nan"), "nan.yaml:6: black_hole.spin: numbers must be finite"},
            {"inf.yaml", single().replace("inclination_deg: 30", "inclination_deg: -.Inf"),
                "inf.yaml:8: observer.inclination_deg: numbers must be finite"},
            {"nan.json", "{\"name\": \"x\", \"black_hole\": {\"mass_solar\": NaN}}",
                "nan.json:1: black_hole.mass_solar: numbers must be finite"},
            {"alias.yaml", single().replace("  spin: 0.0", "  spin: &a 0.0").replace("inclination_deg: 30",
                    "inclination_deg: *a"), "anchors and aliases (&name, *name) are not supported"},
        };
        for (String[] c : cases) {
            String[] r = CliCapture.run(2, "check", scenario(c[0], c[1]).toString());
            oneLine(r[1], c[2]);
        }
    }
}
