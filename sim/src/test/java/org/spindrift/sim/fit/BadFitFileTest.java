package org.spindrift.sim.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.spindrift.sim.cli.Main;
import picocli.CommandLine;

/**
 * Broken fit files and data files: each gives exit status 2 from {@code fit} and {@code check},
 * one line naming the file and the key or column, and no fit folder.
 */
class BadFitFileTest {
    @TempDir Path tmp;

    static final String SCENARIO = String.join("\n",
            "scenario:",
            "  black_hole: {mass_solar: 1.0e6, distance: 1 kpc, family: kerr, spin: 0.5}",
            "  observer: {inclination_deg: 45, position_angle_deg: 10}",
            "  sources:",
            "    - name: spot",
            "      kind: hot_spot",
            "      particles: 10",
            "      shape: {sigma_M: 0.3}",
            "      orbit:",
            "        circular: {radius_M: 8.0, phi_deg: 0}",
            "  run: {duration: 1 orbits, snapshot_cadence: 5 M}",
            "  imaging: {field_of_view_M: 24, pixels: 16, frame_cadence: 5 M}",
            "");

    static final String GOOD = SCENARIO + String.join("\n",
            "data:",
            "  astrometry: data.csv",
            "free:",
            "  - key: sources[0].orbit.circular.radius_M",
            "    min: 6.5",
            "    max: 10",
            "  - key: observer.position_angle_deg",
            "    min: 0",
            "    max: 40",
            "    prior: normal",
            "    mean: 10",
            "    sigma: 5",
            "method: {kind: least_squares, starts: 1, max_evaluations: 30}",
            "");

    static String data(String header, String row3) {
        StringBuilder b = new StringBuilder(header + "\n");
        for (int i = 0; i < 8; i++) {
            b.append(i == 3 && row3 != null ? row3 : String.format(java.util.Locale.ROOT, "%.1f,0.5,0.5,1.0", 4.0 + i))
                    .append("\n");
        }
        return b.toString();
    }

    static final String HEADER = "t_obs_min,x_uas,y_uas,sigma_uas";

    static Stream<Arguments> broken() {
        return Stream.of(
                Arguments.of("unknown key path", GOOD.replace("circular.radius_M", "circular.radus_M"), null,
                        "free[0].key"),
                Arguments.of("bounds inverted", GOOD.replace("max: 10", "max: 6"), null, "free[0].max"),
                Arguments.of("prior outside bounds", GOOD.replace("mean: 10", "mean: 50"), null, "free[1].mean"),
                Arguments.of("unknown fit key", GOOD.replace("method:", "methd:"), null, "methd"),
                Arguments.of("missing list entry", GOOD.replace("sources[0].orbit", "sources[2].orbit"), null,
                        "free[0].key"),
                Arguments.of("log-uniform from zero", GOOD.replace("    max: 40\n    prior: normal\n    mean: 10\n"
                        + "    sigma: 5", "    max: 40\n    prior: log_uniform"), null, "free[1].min"),
                Arguments.of("odd walkers", GOOD.replace("method: {kind: least_squares, starts: 1, max_evaluations: 30}",
                        "method: {kind: sample, walkers: 9, steps: 20}"), null, "method.walkers"),
                Arguments.of("start outside bounds", GOOD.replace("    max: 10\n", "    max: 10\n    start: 12\n"), null,
                        "free[0].start"),
                Arguments.of("missing column", GOOD, data("t_obs_min,x_uas,north_uas,sigma_uas", null), "y_uas"),
                Arguments.of("NaN sigma", GOOD, data(HEADER, "7.0,0.5,0.5,NaN"), "sigma_uas"),
                Arguments.of("negative sigma", GOOD, data(HEADER, "7.0,0.5,0.5,-1"), "sigma_uas"),
                Arguments.of("unsorted times", GOOD, data(HEADER, "5.5,0.5,0.5,1.0"), "t_obs_min"),
                Arguments.of("time only in M", GOOD, data("t_obs_M,x_uas,y_uas,sigma_uas", null), "t_obs_M"),
                Arguments.of("correlation out of range", GOOD, data(HEADER + ",rho_xy", "7.0,0.5,0.5,1.0,1.5")
                        .replace("1.0\n", "1.0,0.1\n"), "rho_xy"),
                Arguments.of("data outside model time", GOOD, data(HEADER, "7.0,0.5,0.5,1.0")
                        .replace("11.0,0.5", "900.0,0.5"), "outside the model's time range"),
                Arguments.of("not a number in data", GOOD, data(HEADER, "7.0,abc,0.5,1.0"), "x_uas"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("broken")
    void oneLineExitTwoNothingWritten(String label, String fit, String csv, String mention) throws Exception {
        Path f = tmp.resolve("bad.yaml");
        Files.writeString(f, fit);
        Files.writeString(tmp.resolve("data.csv"), csv != null ? csv : data(HEADER, null));
        Path out = tmp.resolve("out");
        for (String[] args : new String[][] {{"fit", f.toString(), "-o", out.toString(), "--threads", "1"},
                {"check", f.toString()}}) {
            StringWriter err = new StringWriter();
            CommandLine cl = Main.commandLine();
            cl.setErr(new PrintWriter(err));
            cl.setOut(new PrintWriter(new StringWriter()));
            int code = cl.execute(args);
            String msg = err.toString().strip();
            assertEquals(2, code, label + ": " + msg);
            assertEquals(1, msg.lines().count(), label + ": one line: " + msg);
            assertTrue(msg.contains(mention), label + ": names '" + mention + "': " + msg);
            assertTrue(msg.contains("bad.yaml") || msg.contains("data.csv"), label + ": names the file: " + msg);
        }
        assertFalse(Files.exists(out), label + ": no fit folder");
    }

    @Test
    void goodFileChecks() throws Exception {
        Path f = tmp.resolve("good.yaml");
        Files.writeString(f, GOOD);
        Files.writeString(tmp.resolve("data.csv"), data(HEADER, null));
        StringWriter out = new StringWriter();
        CommandLine cl = Main.commandLine();
        cl.setOut(new PrintWriter(out));
        assertEquals(0, cl.execute("check", f.toString()), out.toString());
        assertTrue(out.toString().contains("2 free parameter(s), 8 astrometric epoch(s)"), out.toString());
    }
}
