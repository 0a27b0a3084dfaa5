package org.spindrift.sim.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;

/**
 * Property-based fuzzing of sweep files and sweep folders: the demo sweep mutated as the scenarios
 * are, through {@code sweep plan} (exit 0 and a folder {@code sweep status} reads, or exit 2 with one
 * line and nothing written); and a planned folder with one file truncated, bit-flipped or deleted,
 * through {@code sweep status --verify} (exit 0 or 2, no stack trace, no hang).
 */
class SweepFuzzTest {
    static Path work;
    static Path demo;

    @BeforeContainer static void setUp() throws IOException {
        work = Files.createTempDirectory("spindrift-sweep-fuzz");
        Path configs = Files.isDirectory(Path.of("..", "configs")) ? Path.of("..", "configs") : Path.of("configs");
        demo = configs.resolve("sweeps").resolve("radius-inclination.yaml");
        Files.createDirectories(work.resolve("sweeps"));
        Files.copy(configs.resolve("hotspot-kerr.yaml"), work.resolve("hotspot-kerr.yaml"));
    }

    @AfterContainer static void tearDown() throws IOException {
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
        List<String> before = Cli.listing(work);
        Cli.Result r = Cli.run(how, "sweep", "plan", file.toString(), "-o", out.toString());
        if (r.code() == 0) {
            Cli.runLines(how + " (status)", "sweep", "status", out.toString(), "--verify");
        } else {
            List<String> after = Cli.listing(work).stream().filter(n -> !lockOrSelf(n)).toList();
            assertEquals(before.stream().filter(n -> !lockOrSelf(n)).toList(), after, how + ": nothing written");
        }
        if (!keep) {
            Cli.delete(out);
            Files.delete(file);
        }
        return r;
    }

    @Provide Arbitrary<ScenarioFuzzTest.Case> mutated() {
        return Combinators.combine(Arbitraries.of(ScenarioFuzzTest.Mutation.class), Arbitraries.longs())
                .as((m, s) -> {
                    try {
                        return ScenarioFuzzTest.mutate(demo, m, s);
                    } catch (IOException e) {
                        throw new java.io.UncheckedIOException(e);
                    }
                });
    }

    @Property(tries = 20, seed = "20261203") void mutatedSweepFilesArePlannedOrRefusedInOneLine(
            @ForAll("mutated") ScenarioFuzzTest.Case c) throws Exception {
        plan(c.how(), c.bytes(), c.name(), false);
    }

    @Example void theDemoSweepPlans() throws Exception {
        assertEquals(0, plan("demo", Files.readAllBytes(demo), "demo.yaml", false).code());
    }

    @Property(tries = 12, seed = "20261203") void damagedSweepFoldersAreReportedWithoutTraces(
            @ForAll("damage") long seed) throws Exception {
        assertEquals(0, plan("demo", Files.readAllBytes(demo), "demo.yaml", true).code());
        Path out = work.resolve("out");
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

    @Provide Arbitrary<Long> damage() {
        return Arbitraries.longs();
    }
}
