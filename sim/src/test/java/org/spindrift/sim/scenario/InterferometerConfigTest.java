package org.spindrift.sim.scenario;

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
import org.spindrift.shared.scenario.Interferometer;

/** The interferometer section and the array file: strict reading, one-line errors, exit status 2. */
class InterferometerConfigTest {
    @TempDir Path tmp;

    static final String STATIONS = String.join("\n",
            "    - name: Ka",
            "      x_m: 6371000",
            "      y_m: 0",
            "      z_m: 0",
            "      sefd_jy: 5000",
            "    - name: Kb",
            "      x_m: 0",
            "      y_m: 6371000",
            "      z_m: 0",
            "      sefd_jy: 7000",
            "      elevation_limit_deg: 15",
            "");

    static final String SECTION = String.join("\n",
            "interferometer:",
            "  frequency_ghz: 230",
            "  bandwidth_ghz: 2",
            "  right_ascension_deg: 150",
            "  declination_deg: -12",
            "  peak_flux_jy: 0.8",
            "");

    static String inline(String extra) {
        return BadConfigTest.GOOD + SECTION + extra + "  stations:\n" + STATIONS;
    }

    static Stream<Arguments> broken() {
        return Stream.of(
                Arguments.of("typo.yaml", inline("  frequency_gz: 3\n"), "interferometer.frequency_gz",
                        "did you mean 'frequency_ghz'"),
                Arguments.of("off-earth.yaml", inline("").replace("x_m: 6371000", "x_m: 100"),
                        "interferometer.stations[0].z_m", "surface"),
                Arguments.of("twice.yaml", inline("").replace("name: Kb", "name: Ka"), "interferometer.stations[1].name",
                        "used twice"),
                Arguments.of("one-station.yaml", BadConfigTest.GOOD + SECTION + "  stations:\n"
                        + STATIONS.substring(0, STATIONS.indexOf("    - name: Kb")), "interferometer.stations",
                        "at least 2"),
                Arguments.of("both.yaml", inline("  array_file: a.yaml\n"), "interferometer.array_file", "exactly one"),
                Arguments.of("scans.yaml", inline("  scan_length: 10 min\n  scan_cadence: 5 min\n"),
                        "interferometer.scan_cadence", "at least scan_length"),
                Arguments.of("bandwidth.yaml", inline("").replace("bandwidth_ghz: 2", "bandwidth_ghz: 60").replace("frequency_ghz: 230", "frequency_ghz: 50"),
                        "interferometer.bandwidth_ghz", "smaller than frequency_ghz"),
                Arguments.of("sefd.yaml", inline("").replace("sefd_jy: 5000", "sefd_jy: -5"),
                        "interferometer.stations[0].sefd_jy", "out of range"),
                Arguments.of("dec.yaml", inline("").replace("declination_deg: -12", "declination_deg: 95"),
                        "interferometer.declination_deg", "[-90, 90]"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("broken")
    void brokenSectionGivesOneLineAndExit2(String name, String content, String keyPath, String problem) throws Exception {
        Path f = tmp.resolve(name);
        Files.writeString(f, content);
        String[] err = new String[1];
        assertEquals(2, BadConfigTest.cli(err, "check", f.toString()), err[0]);
        String line = err[0].strip();
        assertFalse(line.contains("\n"), line);
        assertTrue(line.contains(f + ":"), "names the file: " + line);
        assertTrue(line.contains(keyPath), "names " + keyPath + ": " + line);
        assertTrue(line.contains(problem), "says " + problem + ": " + line);
        Path out = tmp.resolve("out-" + name);
        assertEquals(2, BadConfigTest.cli(err, "run", f.toString(), "-o", out.toString(), "--quiet"));
        assertFalse(Files.exists(out));
    }

    @Test void arrayFileReadsLikeTheInlineStationsAndItsErrorsNameIt() throws Exception {
        Path inl = tmp.resolve("inline.yaml");
        Files.writeString(inl, inline(""));
        Files.createDirectories(tmp.resolve("arrays"));
        Path arr = tmp.resolve("arrays/test-array.yaml");
        Files.writeString(arr, "stations:\n" + STATIONS);
        Path ref = tmp.resolve("ref.yaml");
        Files.writeString(ref, BadConfigTest.GOOD + SECTION + "  array_file: arrays/test-array.yaml\n");
        Interferometer a = ScenarioLoader.load(inl).scenario().interferometer();
        Interferometer b = ScenarioLoader.load(ref).scenario().interferometer();
        assertEquals(a.stations(), b.stations());
        assertEquals("arrays/test-array.yaml", b.arrayFile());
        assertEquals(15.0, a.stations().get(1).elevationLimitDeg());
        assertEquals(Interferometer.DEFAULT_ELEVATION_LIMIT_DEG, a.stations().get(0).elevationLimitDeg());
        assertEquals(10.0, a.startSiderealTimeH(), 1e-12, "default: the right ascension, 150 deg = 10 h");
        // a typo in the array file: the message names the array file, its line (11: "stations:" is line 1) and the key
        Files.writeString(arr, "stations:\n" + STATIONS.replace("      sefd_jy: 7000", "      sefd: 7000"));
        String[] err = new String[1];
        assertEquals(2, BadConfigTest.cli(err, "check", ref.toString()));
        assertTrue(err[0].strip().contains(arr + ":11: stations[1].sefd"), err[0]);
        Files.delete(arr);
        assertEquals(2, BadConfigTest.cli(err, "check", ref.toString()));
        assertTrue(err[0].contains("no such file") && err[0].contains("test-array.yaml"), err[0]);
    }
}
