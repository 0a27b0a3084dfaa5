package org.spindrift.sim.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.ArchiveVerifier;
import org.spindrift.shared.archive.LightArchive;
import org.spindrift.shared.archive.RunArchive;

/**
 * Fuzzing (seeded generated cases) of the run-archive readers: a finished run with one file truncated,
 * bit-flipped, zeroed in part or deleted. {@code verify} answers exit 2 with one line per problem
 * (exit 0 only when no byte changed); the readers without the sha256 check (as {@code view
 * --no-verify} uses them) return values or one line naming the file, never another exception or
 * a hang. Cases that once failed are replayed from {@code src/test/resources/fuzz-corpus/archives}.
 */
class ArchiveFuzzTest {
    static Path work;
    static Path pristine;
    static List<String> files;

    @BeforeAll static void runOnce() throws Exception {
        work = Files.createTempDirectory("spindrift-archive-fuzz");
        Path file = Files.writeString(work.resolve("small.yaml"), ScenarioFuzzTest.SMALL);
        pristine = work.resolve("pristine");
        Cli.Result r = Cli.run("the pristine run", "run", file.toString(), "-o", pristine.toString(), "--quiet");
        assertEquals(0, r.code());
        try (Stream<Path> s = Files.walk(pristine)) {
            files = s.filter(Files::isRegularFile).map(p -> pristine.relativize(p).toString()).sorted().toList();
        }
    }

    @AfterAll static void tearDown() throws IOException {
        Cli.delete(work);
    }

    enum Damage {
        TRUNCATE, FLIP_BITS, ZERO_BLOCK, DELETE, APPEND_GARBAGE
    }

    /** One damaged copy: which file, how, and the seed. */
    record Case(String file, Damage damage, long seed) {
    }

    /** @return a file (weighted), a damage and a seed */
    static Case drawDamage(SplittableRandom rnd) {
        // snapshots.h5 and the manifest more often: their readers are the most complex
        String file = switch (Draw.weighted(rnd, 4, 2, 1, 2)) {
            case 0 -> ArchiveLayout.SNAPSHOTS;
            case 1 -> ArchiveLayout.MANIFEST;
            case 2 -> ArchiveLayout.IMAGES;
            default -> Draw.oneOf(rnd, files);
        };
        return new Case(file, Draw.oneOf(rnd, Damage.values()), rnd.nextLong());
    }

    /** @return a damaged copy of the pristine run, and whether any byte changed */
    static boolean damage(Path dir, Case c) throws IOException {
        try (Stream<Path> s = Files.walk(pristine)) {
            for (Path p : s.toList()) {
                Path q = dir.resolve(pristine.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(q);
                } else {
                    Files.copy(p, q);
                }
            }
        }
        Path f = dir.resolve(c.file());
        byte[] b = Files.readAllBytes(f);
        byte[] d;
        Random rnd = new Random(c.seed());
        switch (c.damage()) {
            case TRUNCATE -> d = Arrays.copyOf(b, rnd.nextInt(b.length));
            case FLIP_BITS -> {
                d = b.clone();
                int k = 1 + rnd.nextInt(8);
                for (int j = 0; j < k; j++) {
                    d[rnd.nextInt(d.length)] ^= (byte) (1 << rnd.nextInt(8));
                }
            }
            case ZERO_BLOCK -> {
                d = b.clone();
                int at = rnd.nextInt(d.length);
                Arrays.fill(d, at, Math.min(d.length, at + 1 + rnd.nextInt(512)), (byte) 0);
            }
            case APPEND_GARBAGE -> {
                d = Arrays.copyOf(b, b.length + 1 + rnd.nextInt(100));
                for (int j = b.length; j < d.length; j++) {
                    d[j] = (byte) rnd.nextInt(256);
                }
            }
            case DELETE -> {
                Files.delete(f);
                return true;
            }
            default -> throw new IllegalStateException();
        }
        Files.write(f, d);
        return !Arrays.equals(b, d);
    }

    /** Reads everything the viewer reads, without the sha256 comparison. */
    static void readAll(Path dir) {
        try (RunArchive a = RunArchive.open(dir, false)) {
            a.times();
            a.sourceIndex();
            a.centreTracks();
            for (int s = 0; s < a.snapshotCount(); s++) {
                a.r(s);
                a.theta(s);
                a.phi(s);
                a.positions(s);
                a.velocities(s);
                a.timeComponents(s);
                a.weights(s);
                a.states(s);
                a.centres(s);
            }
        }
        LightArchive.readTrack(dir);
        LightArchive.readCube(dir);
    }

    static void check(Case c) throws Exception {
        Path dir = work.resolve("case");
        Cli.delete(dir);
        boolean changed = damage(dir, c);
        try {
            Cli.Result r = Cli.runLines(c.toString(), "verify", dir.toString());
            // the manifest holds the checksums, not its own: a changed byte there that leaves a valid manifest
            // (a letter of the scenario echo, say) cannot be told from the original
            boolean undetectable = c.file().equals(ArchiveLayout.MANIFEST) && c.damage() != Damage.DELETE
                    && validJson(dir.resolve(ArchiveLayout.MANIFEST));
            if (changed && !undetectable) {
                assertEquals(2, r.code(), c + ": a damaged run must not verify: " + r.out());
                assertTrue(r.err().lines().anyMatch(l -> l.contains(c.file().equals(ArchiveLayout.MANIFEST)
                        ? "manifest" : c.file())), c + ": the damaged file is named: " + r.err());
            }
            Future<?> f = Executors.newSingleThreadExecutor(t -> {
                Thread th = new Thread(t, "fuzz-read");
                th.setDaemon(true);
                return th;
            }).submit(() -> readAll(dir));
            try {
                f.get(Cli.BOUND_S, TimeUnit.SECONDS);
            } catch (TimeoutException e) {
                f.cancel(true);
                fail(c + ": the readers did not answer within " + Cli.BOUND_S + " s");
            } catch (ExecutionException e) {
                Throwable t = e.getCause();
                if (!(t instanceof UserInputException)) {
                    fail(c + ": a reader threw " + t, t);
                }
                String m = t.getMessage();
                assertEquals(1, m.lines().count(), c + ": one line: " + m);
                assertFalse(m.isBlank());
                assertTrue(m.contains(dir.toString()), c + ": the message names the run folder or file: " + m);
            }
        } finally {
            Cli.delete(dir);
        }
    }

    private static boolean validJson(Path p) {
        try {
            new com.fasterxml.jackson.databind.ObjectMapper().enable(
                    com.fasterxml.jackson.databind.DeserializationFeature.FAIL_ON_TRAILING_TOKENS).readTree(p.toFile());
            return true;
        } catch (IOException e) {
            return false;
        }
    }

    @TestFactory Stream<DynamicTest> damagedArchivesAreReportedInOneLinePerProblem() {
        return Draw.cases(30, Draw.SEED, ArchiveFuzzTest::drawDamage, c -> c.file() + " " + c.damage() + " seed "
                + c.seed(), ArchiveFuzzTest::check);
    }

    /** Damage that once broke the contract: "file damage seed" per line. */
    @Test void corpus() throws Exception {
        Path corpus = Path.of("src", "test", "resources", "fuzz-corpus", "archives.txt");
        List<String> lines = Files.readAllLines(corpus, StandardCharsets.UTF_8).stream()
                .filter(l -> !l.isBlank() && !l.startsWith("#")).toList();
        for (String l : lines) {
            String[] f = l.trim().split("\\s+");
            check(new Case(f[0], Damage.valueOf(f[1]), Long.parseLong(f[2])));
        }
    }

    @Test void aPristineRunVerifies() {
        assertEquals(List.of(), ArchiveVerifier.problems(pristine));
    }
}
