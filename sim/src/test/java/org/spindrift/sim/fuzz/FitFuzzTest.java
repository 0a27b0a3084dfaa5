package org.spindrift.sim.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Fuzzing (seeded generated cases) of fit files and their data: the fit demo (with a synthetic centroid
 * track as its data) mutated as the scenario files are, and its data CSV truncated, bit-flipped,
 * given non-UTF-8 bytes, non-finite numbers or a removed column, through {@code check}: exit 0,
 * or exit 2 with one line; never another status, a stack trace, a hang or a file written.
 */
class FitFuzzTest {
    static Path work;
    static Path fitDemo;
    static byte[] data;

    @BeforeAll static void setUp() throws IOException {
        work = Files.createTempDirectory("spindrift-fit-fuzz");
        Path configs = Files.isDirectory(Path.of("..", "configs")) ? Path.of("..", "configs") : Path.of("configs");
        fitDemo = configs.resolve("fit-demo.yaml");
        Path check = Files.createDirectories(work.resolve("check"));
        Files.copy(configs.resolve("fit-demo-truth.yaml"), check.resolve("fit-demo-truth.yaml"));
        // synthetic centroid track (round invented values): 40 epochs 15 min apart on a circle of 20 uas
        StringBuilder b = new StringBuilder("t_obs_min,t_obs_M,x_uas,y_uas,sigma_uas\n");
        for (int i = 0; i < 40; i++) {
            double t = 15.0 * i;
            b.append(String.format(Locale.ROOT, "%.1f,%.3f,%.4f,%.4f,0.3%n", t, t * 60 / 2462.6,
                    20 * Math.cos(t / 100), 20 * Math.sin(t / 100)));
        }
        data = b.toString().getBytes(StandardCharsets.UTF_8);
        Files.createDirectories(work.resolve("runs").resolve("fit-demo-truth"));
    }

    @AfterAll static void tearDown() throws IOException {
        Cli.delete(work);
    }

    private static Path dataFile() {
        return work.resolve("runs").resolve("fit-demo-truth").resolve("mock_astrometry.csv");
    }

    enum DataDamage {
        NONE, TRUNCATE, FLIP_BITS, NON_UTF8, NON_FINITE, DROP_COLUMN, DELETE, EMPTY
    }

    static byte[] damage(DataDamage d, long seed) {
        Random rnd = new Random(seed);
        byte[] b = data.clone();
        switch (d) {
            case TRUNCATE -> b = Arrays.copyOf(b, rnd.nextInt(b.length));
            case FLIP_BITS -> {
                for (int j = 0; j < 1 + rnd.nextInt(6); j++) {
                    b[rnd.nextInt(b.length)] ^= (byte) (1 << rnd.nextInt(8));
                }
            }
            case NON_UTF8 -> b[rnd.nextInt(b.length)] = (byte) (0x80 + rnd.nextInt(0x80));
            case NON_FINITE -> {
                String[] lines = new String(b, StandardCharsets.UTF_8).split("\n");
                int row = 1 + rnd.nextInt(lines.length - 1);
                String[] f = lines[row].split(",");
                f[rnd.nextInt(f.length)] = new String[] {"NaN", "Infinity", "-inf", "1e400", "", "x"}[rnd.nextInt(6)];
                lines[row] = String.join(",", f);
                b = (String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8);
            }
            case DROP_COLUMN -> {
                int c = rnd.nextInt(5);
                StringBuilder s = new StringBuilder();
                for (String l : new String(b, StandardCharsets.UTF_8).split("\n")) {
                    List<String> f = new java.util.ArrayList<>(Arrays.asList(l.split(",")));
                    f.remove(c);
                    s.append(String.join(",", f)).append('\n');
                }
                b = s.toString().getBytes(StandardCharsets.UTF_8);
            }
            case EMPTY -> b = new byte[0];
            default -> {
            }
        }
        return b;
    }

    /** A fit case: the fit file's mutation (or none) and the data's damage. */
    record Case(ScenarioFuzzTest.Mutation fileMutation, long fileSeed, DataDamage dataDamage, long dataSeed) {
    }

    static void check(Case c) throws Exception {
        Path check = work.resolve("check");
        Path fit = check.resolve("fit.yaml");
        String how = c.toString();
        if (c.fileMutation() == null) {
            Files.copy(fitDemo, fit, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        } else {
            ScenarioFuzzTest.Case m = ScenarioFuzzTest.mutate(fitDemo, c.fileMutation(), c.fileSeed());
            fit = check.resolve(m.name().replace("case", "fit"));
            Files.write(fit, m.bytes());
            how = m.how() + " / data " + c.dataDamage();
        }
        Files.deleteIfExists(dataFile());
        if (c.dataDamage() != DataDamage.DELETE) {
            Files.write(dataFile(), damage(c.dataDamage(), c.dataSeed()));
        }
        List<String> before = Cli.listing(work);
        Cli.Result r = Cli.run(how, "check", fit.toString());
        assertEquals(before, Cli.listing(work), how + ": check writes nothing");
        if (c.fileMutation() == null && c.dataDamage() == DataDamage.NONE) {
            assertEquals(0, r.code(), r.err());
        }
        if (r.code() == 0) {
            assertTrue(r.out().contains(": ok: fit"), how + ": " + r.out());
        }
        Files.delete(fit);
    }

    /** @return a mutation of the fit file (none with probability 0.4), a data damage, and their seeds */
    static Case drawCase(SplittableRandom rnd) {
        ScenarioFuzzTest.Mutation m = Draw.oneOfOrNull(rnd, 0.4, ScenarioFuzzTest.Mutation.values());
        long fileSeed = rnd.nextLong();
        return new Case(m, fileSeed, Draw.oneOf(rnd, DataDamage.values()), rnd.nextLong());
    }

    @TestFactory Stream<DynamicTest> damagedFitFilesAndDataAreCheckedOrRefusedInOneLine() {
        return Draw.cases(25, Draw.SEED, FitFuzzTest::drawCase, c -> "fit " + (c.fileMutation() == null ? "unchanged"
                : c.fileMutation() + " seed " + c.fileSeed()) + " / data " + c.dataDamage() + " seed " + c.dataSeed(),
                FitFuzzTest::check);
    }

    @Test void theUndamagedFitChecks() throws Exception {
        check(new Case(null, 0, DataDamage.NONE, 0));
    }
}
