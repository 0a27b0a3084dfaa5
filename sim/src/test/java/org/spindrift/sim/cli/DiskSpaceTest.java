package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.ArchiveVerifier;
import org.spindrift.sim.pipeline.RunContext;
import org.spindrift.sim.pipeline.RunStage;
import org.spindrift.sim.run.RunLimits;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.ScenarioLoader;

/**
 * Disk space: the estimate bounds the files a run really writes; a run that would not fit is
 * refused before any work with one line naming the key that drives the size; a disk that fills
 * up half way (a real full tmpfs) leaves the old run and the user's files as they were.
 */
class DiskSpaceTest {
    @TempDir Path tmp;

    private static long size(Path p) throws IOException {
        try (Stream<Path> s = Files.walk(p)) {
            long n = 0;
            for (Path q : s.toList()) {
                n += Files.isRegularFile(q) ? Files.size(q) : 0;
            }
            return n;
        }
    }

    private static List<String> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test void theEstimateBoundsTheRealFilesAndTheCheckNamesTheKey() throws Exception {
        String text = DegenerateRunsTest.scenario("compact").replace("  snapshot_cadence: 4 M", "  snapshot_cadence: 1 M");
        Path file = Files.writeString(tmp.resolve("a.yaml"), text);
        Path out = tmp.resolve("out");
        CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet");
        ScenarioRun.Prepared p = ScenarioRun.prepare(ScenarioLoader.load(file));
        RunLimits.DiskEstimate e = RunLimits.diskEstimate(p);
        long snap = Files.size(out.resolve(ArchiveLayout.SNAPSHOTS));
        long images = Files.size(out.resolve(ArchiveLayout.IMAGES));
        // an estimate for refusing runs: never below what is written, and not absurdly above (factor 3)
        assertTrue(e.snapshots() >= snap && e.snapshots() < 3 * snap + 1e5, e + " vs " + snap);
        assertTrue(e.images() >= images && e.images() < 3 * images + 1e4, e + " vs " + images);
        assertTrue(e.total() >= size(out), e + " vs " + size(out));

        UserInputException x = assertThrows(UserInputException.class, () -> RunLimits.checkDisk(p, tmp, 1e5));
        assertTrue(x.getMessage().startsWith(file + ":"), x.getMessage());
        assertTrue(x.getMessage().contains("on disk") && x.getMessage().contains("0.100 MB free"), x.getMessage());

        Path big = Files.writeString(tmp.resolve("big.yaml"), text.replace("  pixels: 16", "  pixels: 1024"));
        ScenarioRun.Prepared pb = ScenarioRun.prepare(ScenarioLoader.load(big));
        x = assertThrows(UserInputException.class, () -> RunLimits.checkDisk(pb, tmp, 1e6));
        assertTrue(x.getMessage().contains(": imaging.pixels: ") && x.getMessage().contains("images.fits"), x.getMessage());
    }

    /** Mounts a small tmpfs (root only); skips with a message elsewhere, fails in CI (SPINDRIFT_REQUIRE_EXTERNAL=1). */
    private static Path mountTmpfs(Path dir, String size) throws Exception {
        Files.createDirectories(dir);
        Process pr = new ProcessBuilder("mount", "-t", "tmpfs", "-o", "size=" + size, "tmpfs", dir.toString())
                .redirectErrorStream(true).start();
        boolean ok = pr.waitFor(30, TimeUnit.SECONDS) && pr.exitValue() == 0;
        if (!ok) {
            String why = "cannot mount a tmpfs (needs root): the full-disk test is skipped";
            if ("1".equals(System.getenv("SPINDRIFT_REQUIRE_EXTERNAL"))) {
                throw new AssertionError(why + "; required because SPINDRIFT_REQUIRE_EXTERNAL=1");
            }
            Assumptions.abort(why);
        }
        return dir;
    }

    private static void umount(Path dir) throws Exception {
        new ProcessBuilder("umount", dir.toString()).redirectErrorStream(true).start().waitFor(30, TimeUnit.SECONDS);
    }

    @Test void aFullDiskLeavesTheOldRunAndTheUsersFilesAlone() throws Exception {
        Path disk = mountTmpfs(tmp.resolve("small"), "3m");
        try {
            Path notes = Files.writeString(disk.resolve("notes.txt"), "the user's own file");
            Path file = Files.writeString(tmp.resolve("a.yaml"), DegenerateRunsTest.scenario("single"));
            Path out = disk.resolve("run");
            CliCapture.run(0, "run", file.toString(), "-o", out.toString(), "--quiet");
            byte[] manifest = Files.readAllBytes(out.resolve(ArchiveLayout.MANIFEST));
            List<String> before = listing(disk);

            // refused up front: the estimate does not fit (one line, key and estimate, nothing written)
            Path big = Files.writeString(tmp.resolve("big.yaml"), DegenerateRunsTest.scenario("single")
                    .replace("  pixels: 16", "  pixels: 256"));
            String[] r = CliCapture.run(2, "run", big.toString(), "-o", out.toString(), "--quiet", "--overwrite");
            assertEquals(1, r[1].strip().lines().count(), r[1]);
            assertTrue(r[1].contains(big + ":") && r[1].contains("imaging.pixels") && r[1].contains("MB on disk"), r[1]);
            assertEquals(before, listing(disk));

            // the disk fills up half way through a run that passed the estimate: a stage writes until the
            // file system says no (a real ENOSPC from the tmpfs)
            List<RunStage> stages = new ArrayList<>(ScenarioRun.stages());
            stages.add(1, new RunStage() {
                @Override public String name() {
                    return "filler";
                }

                @Override public void run(RunContext ctx) throws IOException {
                    ctx.archive().writeStream("filler.bin", os -> {
                        byte[] block = new byte[64 * 1024];
                        for (int i = 0; i < 1000; i++) {
                            os.write(block);
                            os.flush();
                        }
                    });
                }
            });
            IOException full = assertThrows(IOException.class, () -> ScenarioRun.run(
                    ScenarioRun.prepare(ScenarioLoader.load(file)), new ScenarioRun.Options(out, 1, false, true), stages));
            assertTrue(String.valueOf(full.getMessage()).contains("No space left"), full.toString());
            assertEquals(before, listing(disk), "no build folder or partial file left");
            assertEquals("the user's own file", Files.readString(notes));
            assertTrue(java.util.Arrays.equals(manifest, Files.readAllBytes(out.resolve(ArchiveLayout.MANIFEST))));
            assertEquals(List.of(), ArchiveVerifier.problems(out), "the old run is sound");
        } finally {
            umount(disk);
        }
    }
}
