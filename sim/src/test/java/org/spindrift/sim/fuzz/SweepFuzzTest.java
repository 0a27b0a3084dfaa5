package org.spindrift.sim.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Fuzzing (seeded generated cases) of sweep files and sweep folders: the demo sweep mutated as the scenarios
 * are, through {@code sweep plan} (exit 0 and a folder {@code sweep status} reads, or exit 2 with one
 * line and nothing written); and a planned folder with one file truncated, bit-flipped or deleted,
 * through {@code sweep status --verify} (exit 0 or 2, no stack trace, no hang).
 */
class SweepFuzzTest {
    static Path work;
    static Path demo;

    @BeforeAll static void setUp() throws IOException {
        work = Files.createTempDirectory("spindrift-sweep-fuzz");
        Path configs = Files.isDirectory(Path.of("..", "configs")) ? Path.of("..", "configs") : Path.of("configs");
        demo = configs.resolve("sweeps").resolve("radius-inclination.yaml");
        Files.createDirectories(work.resolve("sweeps"));
        Files.copy(configs.resolve("hotspot-kerr.yaml"), work.resolve("hotspot-kerr.yaml"));
    }

    @AfterAll static void tearDown() throws IOException {
        Cli.delete(work);
    }

    private static boolean lockOrSelf(String n) {
        return n.endsWith("-lock");
    }

    /** Plans one sweep file; @return the result (the folder is removed afterwards unless kept) */
    static Cli.Result plan(String how, byte[] bytes, String name, boolean keep) throws Exception {
        Path file = work.resolve("sweeps").resolve(name);
        Files.write(file, bytes);
        Path out = work.resolve("out");
        Cli.Result r;
        try {
            List<String> before = Cli.listing(work);
            r = Cli.run(how, "sweep", "plan", file.toString(), "-o", out.toString());
            if (r.code() == 0) {
                Cli.runLines(how + " (status)", "sweep", "status", out.toString(), "--verify");
            } else {
                List<String> after = Cli.listing(work).stream().filter(n -> !lockOrSelf(n)).toList();
                assertEquals(before.stream().filter(n -> !lockOrSelf(n)).toList(), after, how + ": nothing written");
            }
        } catch (Throwable t) {
            // cleared after a failure too, so the next case starts from the pristine set-up
            Cli.delete(out);
            Files.deleteIfExists(file);
            throw t;
        }
        if (!keep) {
            Cli.delete(out);
            Files.delete(file);
        }
        return r;
    }

    @TestFactory Stream<DynamicTest> mutatedSweepFilesArePlannedOrRefusedInOneLine() {
        return Draw.cases(20, Draw.SEED, rnd -> new ScenarioFuzzTest.Draft(demo, Draw.oneOf(rnd,
                ScenarioFuzzTest.Mutation.values()), rnd.nextLong()), ScenarioFuzzTest.Draft::toString, d -> {
                    ScenarioFuzzTest.Case c = ScenarioFuzzTest.mutate(demo, d.mutation(), d.seed());
                    plan(c.how(), c.bytes(), c.name(), false);
                });
    }

    @Test void theDemoSweepPlans() throws Exception {
        assertEquals(0, plan("demo", Files.readAllBytes(demo), "demo.yaml", false).code());
    }

    @TestFactory Stream<DynamicTest> damagedSweepFoldersAreReportedWithoutTraces() {
        return Draw.cases(12, Draw.SEED, SplittableRandom::nextLong, seed -> "demo sweep folder damage seed " + seed,
                SweepFuzzTest::damagedSweepFolder);
    }

    /** Plans the demo sweep, damages one file of the folder as the seed says, and reads it with --verify. */
    static void damagedSweepFolder(long seed) throws Exception {
        Path out = work.resolve("out");
        try {
            damageAndRead(seed, out);
        } finally {
            // the same clean-up after a failure, so the next case starts from the pristine set-up
            Cli.delete(out);
            Files.deleteIfExists(work.resolve("sweeps").resolve("demo.yaml"));
        }
    }

    private static void damageAndRead(long seed, Path out) throws Exception {
        assertEquals(0, plan("demo", Files.readAllBytes(demo), "demo.yaml", true).code());
        List<Path> files;
        try (Stream<Path> s = Files.walk(out)) {
            files = s.filter(Files::isRegularFile).sorted().toList();
        }
        Random rnd = new Random(seed);
        Path f = files.get(rnd.nextInt(files.size()));
        byte[] b = Files.readAllBytes(f);
        String how = out.relativize(f) + " seed " + seed;
        switch (rnd.nextInt(3)) {
            case 0 -> Files.write(f, Arrays.copyOf(b, b.length == 0 ? 0 : rnd.nextInt(b.length)));
            case 1 -> {
                if (b.length > 0) {
                    b[rnd.nextInt(b.length)] ^= (byte) (1 << rnd.nextInt(8));
                }
                Files.write(f, b);
            }
            default -> Files.delete(f);
        }
        Cli.Result r = Cli.runLines(how, "sweep", "status", out.toString(), "--verify");
        assertTrue(r.code() == 0 || !r.err().isBlank(), how);
        Cli.delete(out);
        Files.delete(work.resolve("sweeps").resolve("demo.yaml"));
    }
}
