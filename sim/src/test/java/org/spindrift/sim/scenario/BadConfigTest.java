package org.spindrift.sim.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.spindrift.sim.cli.Main;
import picocli.CommandLine;

/**
 * A table of broken scenario files: each gives exit status 2 from {@code check} and from
 * {@code run}, one line naming the file and the key, and no output folder.
 */
class BadConfigTest {
    @TempDir Path tmp;

    /** A small valid scenario the broken ones are derived from. */
    static final String GOOD = String.join("\n",
            "name: tiny",
            "black_hole:",
            "  mass_solar: 1.0e6",
            "  distance: 1 kpc",
            "  family: kerr",
            "  spin: 0.5",
            "observer:",
            "  inclination_deg: 45",
            "sources:",
            "  - name: spot",
            "    kind: hot_spot",
            "    particles: 8",
            "    shape:",
            "      sigma_M: 0.3",
            "    orbit:",
            "      circular:",
            "        radius_M: 8.0",
            "    emission:",
            "      flare:",
            "        kind: gaussian",
            "        peak: 10 min",
            "        width: 3 min",
            "run:",
            "  duration: 20 M",
            "  snapshot_cadence: 5 M",
            "  tolerance: 1.0e-8",
            "");

    static final String ELEMENTS = "      elements:\n        p_M: 10\n        e: 0.5\n";

    static String swap(String from, String to) {
        if (!GOOD.contains(from)) {
            throw new IllegalArgumentException("not in the base scenario: " + from);
        }
        return GOOD.replace(from, to);
    }

    static Stream<Arguments> broken() {
        String circ = "      circular:\n        radius_M: 8.0\n";
        return Stream.of(
                Arguments.of("unknown-key.yaml", swap("    particles: 8", "    particle: 8"), "sources[0].particle",
                        "did you mean 'particles'"),
                Arguments.of("wrong-unit.yaml", swap("peak: 10 min", "peak: 10 s"), "sources[0].emission.flare.peak",
                        "unit 's'"),
                Arguments.of("spin-above-1.yaml", swap("spin: 0.5", "spin: 1.2"), "black_hole.spin", "|a| <= 1"),
                Arguments.of("negative-size.yaml", swap("sigma_M: 0.3", "sigma_M: -0.3"), "sources[0].shape.sigma_M",
                        "out of range"),
                Arguments.of("unbound-orbit.yaml", swap(circ, ELEMENTS.replace("e: 0.5", "e: 1.2")),
                        "sources[0].orbit.elements.e", "out of range"),
                Arguments.of("no-source.yaml", GOOD.substring(0, GOOD.indexOf("sources:")) + "sources: []\n"
                        + GOOD.substring(GOOD.indexOf("run:")), "sources", "at least 1"),
                Arguments.of("empty.yaml", "", "", "empty"),
                Arguments.of("missing-key.yaml", swap("  mass_solar: 1.0e6\n", ""), "black_hole.mass_solar",
                        "missing required key"),
                Arguments.of("wrong-type.yaml", swap("particles: 8", "particles: many"), "sources[0].particles",
                        "must be a number"),
                Arguments.of("inclination.yaml", swap("inclination_deg: 45", "inclination_deg: 200"),
                        "observer.inclination_deg", "[0, 180]"),
                Arguments.of("family.yaml", swap("family: kerr", "family: kerrr"), "black_hole.family",
                        "not a known family"),
                Arguments.of("inside-horizon.yaml", swap("radius_M: 8.0", "radius_M: 1.5"),
                        "sources[0].orbit.circular.radius_M", "capture radius"),
                // Kerr a = 0.5: horizon 1.866 M, prograde photon orbit 2.347 M (BPT 1972 eq. 2.18)
                Arguments.of("inside-photon-orbit.yaml", swap("radius_M: 8.0", "radius_M: 2.1"),
                        "sources[0].orbit.circular.radius_M", "no prograde circular orbit"),
                Arguments.of("no-time-unit.yaml", swap("duration: 20 M", "duration: 20"), "run.duration", "needs a unit"),
                Arguments.of("duplicate.yaml", swap("  spin: 0.5\n", "  spin: 0.5\n  spin: 0.6\n"), "", "duplicate key"),
                Arguments.of("syntax.yaml", swap("  spin: 0.5\n", "  spin: [0.5\n"), "", "not valid YAML"),
                Arguments.of("two-shapes.yaml", swap("sigma_M: 0.3", "sigma_M: 0.3\n      axes_M: [1, 1, 1]"),
                        "sources[0].shape", "exactly one of sigma_M"),
                Arguments.of("ring-radii.yaml", swap("kind: hot_spot", "kind: ring").replace("sigma_M: 0.3",
                        "inner_radius_M: 9\n      outer_radius_M: 7"), "sources[0].shape.outer_radius_M", "at least inner_radius_M"),
                Arguments.of("tolerance.yaml", swap("tolerance: 1.0e-8", "tolerance: 0.5"), "run.tolerance",
                        "out of range"),
                Arguments.of("superluminal.yaml", swap(circ, "      zamo_velocity:\n        r_M: 8\n        v_phi: 0.8\n"
                        + "        v_r: 0.7\n"), "sources[0].orbit.zamo_velocity", "below 1"),
                Arguments.of("old-local-key.yaml", swap(circ, "      local:\n        r_M: 8\n"),
                        "sources[0].orbit.local", "use 'sources[0].orbit.zamo_velocity'"),
                Arguments.of("old-flare-start.yaml", swap("kind: gaussian\n        peak: 10 min\n        width: 3 min",
                        "kind: exponential\n        start: 10 min\n        rise: 3 min\n        decay: 3 min"),
                        "sources[0].emission.flare.start", "use 'sources[0].emission.flare.peak'"),
                Arguments.of("no-horizon.yaml", swap("family: kerr", "family: hayward\n  parameters:\n"
                        + "    core_length: 1.5"), "black_hole.parameters.core_length", "no horizon"),
                Arguments.of("below-separatrix.yaml", swap(circ, ELEMENTS.replace("p_M: 10", "p_M: 3.5")),
                        "sources[0].orbit.elements.p_M", "no bound orbit"),
                Arguments.of("unknown-model.yaml", swap("    emission:", "    velocity:\n      model: turbulent\n"
                        + "    emission:"), "sources[0].velocity.model", "allowed: rigid, shear, thermal"),
                Arguments.of("too-many-snapshots.yaml", swap("snapshot_cadence: 5 M", "snapshot_cadence: 0.0001 M"),
                        "run.snapshot_cadence", "at most"),
                Arguments.of("old-distance-key.yaml", swap("  distance: 1 kpc", "  distance_kpc: 1"),
                        "black_hole.distance_kpc", "use 'black_hole.distance'"),
                Arguments.of("distance-no-unit.yaml", swap("distance: 1 kpc", "distance: 1"), "black_hole.distance",
                        "needs a unit"),
                Arguments.of("distance-unit.yaml", swap("distance: 1 kpc", "distance: 1 ly"), "black_hole.distance",
                        "allowed units: Mpc, kpc or pc"),
                Arguments.of("distance-range.yaml", swap("distance: 1 kpc", "distance: -3 Mpc"), "black_hole.distance",
                        "out of range"),
                Arguments.of("not-a-mapping.yaml", "- just\n- a list\n", "", "must be a mapping"));
    }

    /** @return exit status, with stderr in err[0] */
    static int cli(String[] err, String... args) {
        CommandLine cl = Main.commandLine();
        StringWriter sw = new StringWriter();
        cl.setErr(new PrintWriter(sw, true));
        cl.setOut(new PrintWriter(new StringWriter(), true));
        int code = cl.execute(args);
        err[0] = sw.toString();
        return code;
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("broken")
    void brokenFileGivesExit2AndNoFolder(String name, String content, String keyPath, String problem) throws Exception {
        Path f = tmp.resolve(name);
        Files.writeString(f, content, StandardCharsets.UTF_8);
        String[] err = new String[1];
        assertEquals(2, cli(err, "check", f.toString()), err[0]);
        String line = err[0].strip();
        assertFalse(line.contains("\n"), "one line: " + line);
        assertTrue(line.contains(f.toString()), "names the file: " + line);
        assertTrue(line.contains(keyPath), "names the key '" + keyPath + "': " + line);
        assertTrue(line.contains(problem), "says '" + problem + "': " + line);
        assertFalse(line.contains("Exception"), "no stack trace: " + line);
        Path out = tmp.resolve("out-" + name);
        assertEquals(2, cli(err, "run", f.toString(), "-o", out.toString(), "--quiet"), err[0]);
        assertFalse(Files.exists(out), "no output folder for " + name);
    }

    @Test void foreignOutputFolderIsRefusedAndKept() throws Exception {
        Path f = tmp.resolve("good.yaml");
        Files.writeString(f, GOOD);
        Path out = tmp.resolve("thesis");
        Files.createDirectories(out);
        Files.writeString(out.resolve("chapter1.tex"), "precious");
        String[] err = new String[1];
        assertEquals(2, cli(err, "run", f.toString(), "-o", out.toString(), "--quiet"));
        assertTrue(err[0].contains("Spindrift did not write") && err[0].contains("chapter1.tex"), err[0]);
        assertEquals("precious", Files.readString(out.resolve("chapter1.tex")));
        assertEquals(2, cli(err, "run", f.toString(), "-o", out.resolve("chapter1.tex").toString(), "--quiet"));
        assertTrue(err[0].contains("not a folder"), err[0]);
    }

    @Test void lineNumberPointsAtTheKey() throws Exception {
        Path f = tmp.resolve("typo.yaml");
        Files.writeString(f, swap("    particles: 8", "    particle: 8"));
        String[] err = new String[1];
        assertEquals(2, cli(err, "check", f.toString()));
        // "particle" is on line 12 of the file (1-based)
        assertTrue(err[0].contains(f + ":12:"), err[0]);
    }

    @Test void binaryGarbageIsRefused() throws Exception {
        byte[] junk = new byte[512];
        new Random(7).nextBytes(junk);
        junk[10] = 0;
        Path f = tmp.resolve("garbage.yaml");
        Files.write(f, junk);
        String[] err = new String[1];
        assertEquals(2, cli(err, "check", f.toString()));
        assertTrue(err[0].contains("binary") || err[0].contains("UTF-8"), err[0]);
        assertEquals(2, cli(err, "run", f.toString(), "-o", tmp.resolve("g").toString(), "--quiet"));
        assertFalse(Files.exists(tmp.resolve("g")));
    }

    @Test void jsonWorksAndBrokenJsonIsRefused() throws Exception {
        Path ok = tmp.resolve("ok.json");
        Files.writeString(ok, "{\"black_hole\": {\"mass_solar\": 1e6, \"distance\": \"1 kpc\", \"spin\": 0.5},"
                + " \"observer\": {\"inclination_deg\": 10}, \"sources\": [{\"kind\": \"hot_spot\", \"particles\": 4,"
                + " \"shape\": {\"sigma_M\": 0.2}, \"orbit\": {\"circular\": {\"radius_M\": 9}}}],"
                + " \"run\": {\"duration\": \"30 M\"}}");
        String[] err = new String[1];
        assertEquals(0, cli(err, "check", ok.toString()), err[0]);
        Path bad = tmp.resolve("bad.json");
        Files.writeString(bad, "{\"black_hole\": {\"mass_solar\": 1e6,}}");
        assertEquals(2, cli(err, "check", bad.toString()));
        assertTrue(err[0].contains("not valid JSON") && err[0].contains(bad + ":1"), err[0]);
    }

    @Test void goodFileChecksClean() throws Exception {
        Path f = tmp.resolve("good.yaml");
        Files.writeString(f, GOOD);
        String[] err = new String[1];
        assertEquals(0, cli(err, "check", f.toString()), err[0]);
        assertEquals("", err[0]);
    }
}
