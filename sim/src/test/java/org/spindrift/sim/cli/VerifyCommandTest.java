package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.shared.archive.ArchiveLayout;

/** {@code verify RUN}: exit 0 and one line for a sound run; one line per problem and exit 2 otherwise. */
class VerifyCommandTest {
    @TempDir static Path tmp;
    static Path run;

    @BeforeAll static void runOnce() throws IOException {
        Path file = Files.writeString(tmp.resolve("a.yaml"), DegenerateRunsTest.scenario("single"));
        run = tmp.resolve("run");
        CliCapture.run(0, "run", file.toString(), "-o", run.toString(), "--quiet");
    }

    /** @return a fresh copy of the finished run to damage */
    static Path copy(Path from, Path to) throws IOException {
        try (var s = Files.walk(from)) {
            for (Path p : s.toList()) {
                Path q = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(q);
                } else {
                    Files.copy(p, q);
                }
            }
        }
        return to;
    }

    static void flip(Path file, long at) throws IOException {
        try (RandomAccessFile f = new RandomAccessFile(file.toFile(), "rw")) {
            f.seek(at);
            int b = f.read();
            f.seek(at);
            f.write(b ^ 0x5a);
        }
    }

    @Test void aSoundRunGivesOneLineAndStatusZero() {
        String[] r = CliCapture.run(0, "verify", run.toString());
        assertEquals(1, r[0].strip().lines().count(), r[0]);
        assertTrue(r[0].contains("sound"), r[0]);
        assertEquals("", r[1]);
    }

    @Test void everyProblemIsOneLineAndTheStatusIsTwo() throws IOException {
        Path d = copy(run, tmp.resolve("damaged"));
        flip(d.resolve(ArchiveLayout.SNAPSHOTS), Files.size(d.resolve(ArchiveLayout.SNAPSHOTS)) / 2);
        Files.delete(d.resolve(ArchiveLayout.LIGHTCURVE));
        Path centroid = d.resolve(ArchiveLayout.CENTROID);
        byte[] c = Files.readAllBytes(centroid);
        Files.write(centroid, java.util.Arrays.copyOf(c, c.length - 7));
        Files.writeString(d.resolve("notes.txt"), "mine");
        String[] r = CliCapture.run(2, "verify", d.toString());
        List<String> lines = r[1].strip().lines().toList();
        assertTrue(lines.stream().anyMatch(l -> l.contains(ArchiveLayout.SNAPSHOTS) && l.contains("sha256")), r[1]);
        assertTrue(lines.stream().anyMatch(l -> l.contains(ArchiveLayout.LIGHTCURVE) && l.contains("missing")), r[1]);
        assertTrue(lines.stream().anyMatch(l -> l.contains(ArchiveLayout.CENTROID) && l.contains("sha256")), r[1]);
        assertTrue(lines.stream().anyMatch(l -> l.contains("notes.txt") && l.contains("not listed")), r[1]);
        assertTrue(lines.size() >= 4, r[1]);
        assertTrue(lines.stream().allMatch(l -> l.startsWith("spindrift verify: run folder " + d)), r[1]);
        assertTrue(!r[1].contains("\tat ") && !r[1].contains("Exception"), r[1]);
    }

    @Test void aMissingOrForeignFolderIsOneLine() throws IOException {
        String[] r = CliCapture.run(2, "verify", tmp.resolve("nothing").toString());
        assertEquals(1, r[1].strip().lines().count(), r[1]);
        Path d = copy(run, tmp.resolve("nomanifest"));
        Files.writeString(d.resolve(ArchiveLayout.MANIFEST), "{\"format\": \"spindrift-run\", \"format_vers");
        r = CliCapture.run(2, "verify", d.toString());
        assertEquals(1, r[1].strip().lines().count(), r[1]);
        assertTrue(r[1].contains(ArchiveLayout.MANIFEST), r[1]);
    }
}
