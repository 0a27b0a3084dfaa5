package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.spindrift.sim.sweep.SweepFixtures;

/**
 * Bad sweep input: one line naming the sweep file, the axis line and the key path, exit status 2,
 * and no sweep folder left behind.
 */
class SweepCommandErrorsTest {
    @TempDir Path tmp;

    static Stream<Arguments> broken() {
        return Stream.of(
                // name, axes line, expected text, line of the axis in the sweep file
                Arguments.of("unknown-key", "black_hole.spn: [0.1, 0.2]", "black_hole.spn: unknown key 'spn' (did you mean 'spin'?)", 4),
                Arguments.of("unknown-section", "blackhole.spin: [0.1]", "unknown key 'blackhole' (did you mean 'black_hole'?)", 4),
                Arguments.of("empty-list", "black_hole.spin: []", "empty axis", 4),
                Arguments.of("empty-count", "black_hole.spin: {from: 0, to: 0.5, count: 0}", "empty axis", 4),
                Arguments.of("spin-out-of-range", "black_hole.spin: {from: 0.5, to: 1.5, count: 3}",
                        "black_hole.spin = 1.5 is out of range: |a| <= 1", 4),
                Arguments.of("inclination-out-of-range", "observer.inclination_deg: [10, 200]",
                        "observer.inclination_deg: value 200 is out of range; allowed [0, 180]", 4),
                Arguments.of("orbit-inside-photon-orbit", "sources[0].orbit.circular.radius_M: [8, 2.0]",
                        "no prograde circular orbit at r = 2.000 M", 4),
                Arguments.of("no-such-entry", "sources[3].particles: [10]", "sources has 1 entry, so there is no sources[3]", 4),
                Arguments.of("not-a-key-path", "\"black_hole..spin\": [0.1]", "is not a key path", 4),
                Arguments.of("log-of-zero", "black_hole.spin: {from: 0, to: 0.5, count: 3, spacing: log}",
                        "a log spacing needs from > 0", 4),
                Arguments.of("sampled-without-hypercube", "black_hole.spin: {from: 0, to: 0.5}", "latin_hypercube", 4));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("broken")
    void badSweepFilesGiveOneLineAndNoFolder(String name, String axis, String expected, int line) throws Exception {
        Path f = SweepFixtures.sweep(tmp, name, "run.seed: [7]", axis);
        // the axis of interest is the second one, on line 5 of the sweep file
        Path dir = tmp.resolve("out-" + name);
        String err = CliCapture.run(2, "sweep", "plan", f.toString(), "-o", dir.toString())[1];
        assertEquals(1, err.strip().lines().count(), err);
        assertTrue(err.contains(expected), err);
        assertTrue(err.contains(f + ":" + (line + 1) + ":"), err);
        assertFalse(Files.exists(dir), "no sweep folder after bad input");
    }

    @Test void aMissingBaseFileIsNamedAtItsKey() throws Exception {
        Path f = tmp.resolve("nobase.yaml");
        Files.writeString(f, "name: nobase\nbase: missing.yaml\naxes:\n  black_hole.spin: [0.1]\n");
        String err = CliCapture.run(2, "sweep", "plan", f.toString(), "-o", tmp.resolve("N").toString())[1];
        assertTrue(err.contains(f + ":2: base: no file"), err);
        assertFalse(Files.exists(tmp.resolve("N")));
    }

    @Test void tooManyTasksNeedForce() throws Exception {
        Path f = SweepFixtures.sweep(tmp, "huge", "black_hole.spin: {from: 0, to: 0.5, count: 400}",
                "observer.inclination_deg: {from: 0, to: 90, count: 300}");
        String err = CliCapture.run(2, "sweep", "plan", f.toString(), "-o", tmp.resolve("H").toString())[1];
        assertTrue(err.contains("120000 tasks; more than 100000 need --force"), err);
        assertFalse(Files.exists(tmp.resolve("H")));
    }

    @Test void aFolderHoldingAnotherSweepOrOtherFilesIsRefused() throws Exception {
        Path a = SweepFixtures.sweep(tmp, "a", "black_hole.spin: [0.1]");
        Path dir = tmp.resolve("S");
        CliCapture.run(0, "sweep", "plan", a.toString(), "-o", dir.toString());
        String before = Files.readString(dir.resolve("sweep.json"));
        Path b = SweepFixtures.sweep(tmp, "b", "black_hole.spin: [0.2]");
        String err = CliCapture.run(2, "sweep", "plan", b.toString(), "-o", dir.toString())[1];
        assertTrue(err.contains("holds another sweep ('a'"), err);
        assertEquals(before, Files.readString(dir.resolve("sweep.json")), "the first sweep is untouched");

        Path other = tmp.resolve("other");
        Files.createDirectories(other);
        Files.writeString(other.resolve("notes.txt"), "mine");
        err = CliCapture.run(2, "sweep", "plan", b.toString(), "-o", other.toString())[1];
        assertTrue(err.contains("holds files that are not a sweep's (for example notes.txt)"), err);
        assertEquals("mine", Files.readString(other.resolve("notes.txt")));
    }

    @Test void badRunAndSlurmOptionsNameTheOption() throws Exception {
        Path a = SweepFixtures.sweep(tmp, "a", "black_hole.spin: [0.1, 0.2]");
        Path dir = tmp.resolve("S");
        CliCapture.run(0, "sweep", "plan", a.toString(), "-o", dir.toString());
        assertTrue(CliCapture.run(2, "sweep", "run", dir.toString(), "--task", "2")[1].contains("--task 2: the sweep has tasks 0..1"));
        assertTrue(CliCapture.run(2, "sweep", "run", dir.toString(), "--shard", "2/2")[1].contains("--shard 2/2"));
        assertTrue(CliCapture.run(2, "sweep", "run", dir.toString(), "--shard", "x")[1].contains("--shard x"));
        assertTrue(CliCapture.run(2, "sweep", "slurm", dir.toString(), "--mem", "lots", "--dry-run")[1].contains("--mem 'lots'"));
        assertTrue(CliCapture.run(2, "sweep", "slurm", dir.toString(), "--time", "soon", "--dry-run")[1].contains("--time 'soon'"));
        assertTrue(CliCapture.run(2, "sweep", "status", tmp.toString())[1].contains("no sweep.json"));
    }
}
