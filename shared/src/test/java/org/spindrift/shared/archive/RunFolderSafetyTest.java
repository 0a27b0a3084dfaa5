package org.spindrift.shared.archive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.UserInputException;

/**
 * What the run-folder writer guarantees: one run at a time per folder, digests of the bytes as
 * written, the new run swapped in only when complete (and only when asked to replace one), and
 * nothing it did not write deleted or followed.
 */
class RunFolderSafetyTest {
    @TempDir Path tmp;

    static final byte[] PNG_BYTES = {(byte) 0x89, 'P', 'N', 'G', 1, 2, 3};

    /** A finished run with a CSV and a plot; @return the manifest's files object */
    static JsonNode finishedRun(Path dir, String csv, boolean overwrite) throws Exception {
        RunArchiveWriter w = RunArchiveWriter.create(dir, overwrite);
        w.writeText(ArchiveLayout.PERIODS, csv);
        w.writeStream("plots/positions.png", out -> out.write(PNG_BYTES));
        w.finish(RunArchiveWriter.json().createObjectNode().put("seed", 1));
        try (RunArchive a = RunArchive.open(dir)) {
            return a.manifest().get("files");
        }
    }

    static String sha256(byte[] b) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
    }

    static List<String> names(Path dir) throws Exception {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test void digestsAreOfTheBytesAsWrittenNotReadBack() throws Exception {
        Path run = tmp.resolve("run");
        RunArchiveWriter w = RunArchiveWriter.create(run);
        w.writeText(ArchiveLayout.PERIODS, "a,b\n1,2\n");
        // another process changes the file after it was written: the old code re-read it at the end
        // and vouched for the changed bytes
        Files.writeString(w.resolve(ArchiveLayout.PERIODS), "a,b\n9,9\n");
        w.finish(RunArchiveWriter.json().createObjectNode());
        try (RunArchive a = RunArchive.open(run)) {
            // SHA-256 of the written bytes by the JDK's own MessageDigest (FIPS 180-4)
            assertEquals(sha256("a,b\n1,2\n".getBytes(StandardCharsets.UTF_8)), a.files().get(ArchiveLayout.PERIODS));
            UserInputException e = assertThrows(UserInputException.class, a::verifyChecksums);
            assertTrue(e.getMessage().contains(ArchiveLayout.PERIODS), e.getMessage());
        }
    }

    @Test void aSecondWriterIsRefusedWhileTheFirstHoldsTheFolder() throws Exception {
        Path run = tmp.resolve("run");
        RunArchiveWriter first = RunArchiveWriter.create(run);
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchiveWriter.create(run, true));
        assertTrue(e.getMessage().contains("another run is writing it"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
        first.writeText(ArchiveLayout.PERIODS, "x\n");
        first.finish(RunArchiveWriter.json().createObjectNode());
        // released: the next run may replace it
        finishedRun(run, "y\n", true);
    }

    @Test void theLockHoldsAgainstAnotherProcess() throws Exception {
        Path run = tmp.resolve("shared");
        String java = ProcessHandle.current().info().command().orElse("java");
        Process child = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"),
                LockHolder.class.getName(), run.toString()).redirectErrorStream(true).start();
        try (BufferedReader r = new BufferedReader(new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8))) {
            assertEquals("locked", r.readLine(), "child took the lock");
            UserInputException e = assertThrows(UserInputException.class, () -> RunArchiveWriter.create(run));
            assertTrue(e.getMessage().contains("another run is writing it"), e.getMessage());
            assertFalse(Files.exists(run), "the refused run created nothing");
        } finally {
            child.getOutputStream().close();
            assertTrue(child.waitFor(60, TimeUnit.SECONDS));
        }
        finishedRun(run, "x\n", false);
    }

    @Test void aFinishedRunIsReplacedOnlyWithOverwriteAndOnlyWhenTheNewOneIsComplete() throws Exception {
        Path run = tmp.resolve("run");
        JsonNode old = finishedRun(run, "old\n", false);
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchiveWriter.create(run));
        assertTrue(e.getMessage().contains("--overwrite"), e.getMessage());
        RunArchiveWriter w = RunArchiveWriter.create(run, true);
        w.writeText(ArchiveLayout.PERIODS, "new\n");
        assertEquals("old\n", Files.readString(run.resolve(ArchiveLayout.PERIODS)), "old run untouched while the new one is built");
        w.abandon(); // the run failed or was stopped
        assertEquals("old\n", Files.readString(run.resolve(ArchiveLayout.PERIODS)));
        try (RunArchive a = RunArchive.open(run)) {
            a.verifyChecksums();
            assertEquals(old, a.manifest().get("files"));
        }
        assertEquals(List.of(".run.spindrift-lock", "run"), names(tmp), "the build folder is gone");
        // with --overwrite and a complete run: swapped in, old files gone
        RunArchiveWriter w2 = RunArchiveWriter.create(run, true);
        w2.writeText(ArchiveLayout.SHEAR, "s\n");
        w2.finish(RunArchiveWriter.json().createObjectNode());
        assertEquals(List.of(ArchiveLayout.MANIFEST, ArchiveLayout.SHEAR), names(run));
        assertEquals(List.of(".run.spindrift-lock", "run"), names(tmp));
    }

    @Test void foldersHoldingAnythingElseAreRefusedAndLeftAlone() throws Exception {
        // user file under plots/ beside a finished run
        Path a = tmp.resolve("a");
        finishedRun(a, "x\n", false);
        Files.writeString(a.resolve("plots/my-figure.png"), "mine");
        assertRefused(a, "plots/my-figure.png");
        assertEquals("mine", Files.readString(a.resolve("plots/my-figure.png")));

        // plots is a link to a folder outside the run
        Path outside = Files.createDirectories(tmp.resolve("outside"));
        Files.writeString(outside.resolve("positions.png"), "not ours");
        Path b = tmp.resolve("b");
        finishedRun(b, "x\n", false);
        deleteTree(b.resolve(ArchiveLayout.PLOTS));
        Files.createSymbolicLink(b.resolve(ArchiveLayout.PLOTS), outside);
        assertRefused(b, "symbolic link");
        assertEquals("not ours", Files.readString(outside.resolve("positions.png")));

        // user files named like run files, no manifest
        Path c = Files.createDirectories(tmp.resolve("c"));
        Files.writeString(c.resolve(ArchiveLayout.PERIODS), "my periods");
        assertRefused(c, ArchiveLayout.PERIODS);
        assertEquals("my periods", Files.readString(c.resolve(ArchiveLayout.PERIODS)));

        // a manifest.json of some other program
        Path d = Files.createDirectories(tmp.resolve("d"));
        Files.writeString(d.resolve(ArchiveLayout.MANIFEST), "{\"name\": \"my web app\"}");
        assertRefused(d, "not written by Spindrift");
        assertEquals("{\"name\": \"my web app\"}", Files.readString(d.resolve(ArchiveLayout.MANIFEST)));

        // the output folder itself a link
        Path e = tmp.resolve("e");
        Files.createSymbolicLink(e, outside);
        assertRefused(e, "symbolic link");

        // a user file put into the folder while the new run was being built: the swap is refused
        Path f = tmp.resolve("f");
        finishedRun(f, "x\n", false);
        RunArchiveWriter w = RunArchiveWriter.create(f, true);
        w.writeText(ArchiveLayout.PERIODS, "new\n");
        Files.writeString(f.resolve("notes.txt"), "mine");
        assertThrows(UserInputException.class, () -> w.finish(RunArchiveWriter.json().createObjectNode()));
        w.abandon();
        assertEquals("x\n", Files.readString(f.resolve(ArchiveLayout.PERIODS)));
        assertEquals("mine", Files.readString(f.resolve("notes.txt")));
    }

    @Test void unwritableOutputFoldersAreRefusedBeforeAnythingIsCreated() throws Exception {
        Path file = Files.writeString(tmp.resolve("results.txt"), "x");
        UserInputException e = assertThrows(UserInputException.class,
                () -> RunArchiveWriter.checkUsable(file.resolve("run"), false));
        assertTrue(e.getMessage().contains("is a file, not a folder"), e.getMessage());
        e = assertThrows(UserInputException.class, () -> RunArchiveWriter.checkUsable(file, false));
        assertTrue(e.getMessage().contains("not a folder"), e.getMessage());
        // a read-only parent: permission bits for an ordinary user; root ignores those, so as root
        // the parent is a tmpfs mounted read-only (the kernel refuses writes even to root)
        Path ro = Files.createDirectories(tmp.resolve("ro"));
        boolean root = "root".equals(System.getProperty("user.name"));
        if (root) {
            Process pr = new ProcessBuilder("mount", "-t", "tmpfs", "-o", "ro,size=64k", "tmpfs", ro.toString())
                    .redirectErrorStream(true).start();
            boolean mounted = pr.waitFor(30, TimeUnit.SECONDS) && pr.exitValue() == 0;
            Assumptions.assumeTrue(mounted, "running as root without the right to mount a read-only tmpfs");
        } else {
            assertTrue(ro.toFile().setWritable(false, false));
        }
        try {
            e = assertThrows(UserInputException.class, () -> RunArchiveWriter.create(ro.resolve("run")));
            assertTrue(e.getMessage().contains("not writable"), e.getMessage());
            assertFalse(Files.exists(ro.resolve("run")));
        } finally {
            if (root) {
                new ProcessBuilder("umount", ro.toString()).redirectErrorStream(true).start()
                        .waitFor(30, TimeUnit.SECONDS);
            } else {
                ro.toFile().setWritable(true, false);
            }
        }
    }

    @Test void aBuildFolderLeftByAKilledRunIsClearedButAForeignOneIsNot() throws Exception {
        Path run = tmp.resolve("run");
        Path stale = Files.createDirectories(tmp.resolve(".run.spindrift-new"));
        Files.writeString(stale.resolve(RunFolders.BUILD_MARK), "");
        Files.writeString(stale.resolve(".periods.csv.partial"), "half");
        finishedRun(run, "x\n", false);
        assertFalse(Files.exists(stale));
        Path other = tmp.resolve("other");
        Path notOurs = Files.createDirectories(tmp.resolve(".other.spindrift-new"));
        Files.writeString(notOurs.resolve("data.txt"), "mine");
        assertRefused(other, "not made by Spindrift");
        assertEquals("mine", Files.readString(notOurs.resolve("data.txt")));
        assertNotEquals(List.of(), names(notOurs));
    }

    private static void assertRefused(Path dir, String why) throws Exception {
        UserInputException e = assertThrows(UserInputException.class, () -> RunArchiveWriter.create(dir, true));
        assertTrue(e.getMessage().contains(why), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line");
    }

    private static void deleteTree(Path p) throws Exception {
        try (Stream<Path> s = Files.walk(p)) {
            for (Path q : s.sorted(java.util.Comparator.reverseOrder()).toList()) {
                Files.delete(q);
            }
        }
    }
}
