package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class LandmarksCommandTest {
    /** @return {stdout, stderr} */
    private static String[] run(int expectedExit, String... args) {
        return CliCapture.run(expectedExit, args);
    }

    @Test
    void jsonHasTheDocumentedKeys(@TempDir Path dir) throws Exception {
        Path png = dir.resolve("kerr.png");
        String out = run(0, "landmarks", "--family", "kerr", "--spin", "0.9", "--json", "--plot", png.toString())[0];
        JsonNode j = new ObjectMapper().readTree(out);
        List<String> keys = new ArrayList<>();
        j.fieldNames().forEachRemaining(keys::add);
        // the keys documented in README.md (landmarks --json)
        assertEquals(List.of("horizon_outer", "ergosurface_equator", "isco_prograde", "isco_retrograde",
                "photon_orbit_prograde", "photon_orbit_retrograde", "marginally_bound_prograde", "omega_max_radius",
                "omega_max_value", "capture_radius"), keys);
        // BPT 1972 eq. 2.21 at a = 0.9 (value computed from the closed form, see LandmarksTest)
        assertEquals(2.3208830417618, j.get("isco_prograde").asDouble(), 1e-9);
        assertTrue(j.get("omega_max_radius").isNull());
        byte[] head = Files.readAllBytes(png);
        assertTrue(head.length > 10_000);
        assertEquals((byte) 0x89, head[0]); // PNG signature (ISO/IEC 15948)
        assertEquals('P', head[1]);
        try (var files = Files.list(dir)) {
            assertEquals(1, files.count(), "no temporary file left");
        }
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = ';', value = {
        "--family kerr --spin 0.5", "--family kerr-newman --spin 0.5 --charge 0.6",
        "--family hayward --spin 0.5 --core-length 0.4", "--family bardeen --spin 0.5 --core-charge 0.3",
        "--family mass-series --spin 0.5 --series 2=0.5,3=-0.1", "--family jp --spin 0.5 --epsilon3 1.5",
        "--family johannsen-psaltis --spin 0.5 --epsilon3 1.5"})
    void everyFamilyAnswers(String args) throws Exception {
        List<String> argv = new ArrayList<>(List.of("landmarks", "--json", "--at", "8"));
        argv.addAll(List.of(args.split(" ")));
        JsonNode j = new ObjectMapper().readTree(run(0, argv.toArray(new String[0]))[0]);
        double rh = j.get("horizon_outer").asDouble();
        // common practice, no source: horizon < photon orbit < marginally bound < ISCO for a spin-0.5 hole
        assertTrue(rh > 1.0 && rh < j.get("photon_orbit_prograde").asDouble(), args);
        assertTrue(j.get("photon_orbit_prograde").asDouble() < j.get("marginally_bound_prograde").asDouble(), args);
        assertTrue(j.get("marginally_bound_prograde").asDouble() < j.get("isco_prograde").asDouble(), args);
        assertTrue(j.get("isco_prograde").asDouble() < j.get("isco_retrograde").asDouble(), args);
        JsonNode orbit = j.get("circular_orbits").get(0);
        assertEquals("prograde", orbit.get("sense").asText());
        assertTrue(orbit.get("energy").asDouble() < 1.0 && orbit.get("epicyclic_radial_squared").asDouble() > 0, args);
    }

    @Test
    void horizonlessHaywardTableShowsTheOmegaMaximum() {
        String out = run(0, "landmarks", "--family", "hayward", "--spin", "0.9", "--core-length", "1",
                "--allow-horizonless", "--at", "3")[0];
        // r^3 = 10 l^2 (derived in LandmarksTest)
        assertTrue(out.contains("Omega maximum at r           " + String.format("%.10f", Math.cbrt(10.0))), out);
        assertTrue(out.contains("(no horizon)"), out);
        assertTrue(out.contains("prograde"), out);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = ';', value = {
        "--spin 1.2;--spin = 1.2 is out of range: |a| <= 1 for kerr (use --allow-horizonless for a naked singularity)",
        "--spin 7 --allow-horizonless;--spin = 7 is out of range: |a| <= 5",
        "--family kerr-newman --spin 0.9 --charge 0.8;--charge = 0.8 with --spin = 0.9 is out of range: a^2 + Q^2 <= 1"
                + " for kerr-newman (use --allow-horizonless for a horizonless object)",
        "--family hayward --spin 0.5 --core-length -1;--core-length = -1 is out of range: 0 <= core_length <= 10",
        "--family bardeen --spin 0.5;--core-charge is required for family bardeen",
        "--family kerr --charge 0.3;--charge does not apply to family kerr (it belongs to family kerr-newman)",
        "--family mass-series --series 2=x;--series: coefficient 'x' in term '2=x' is not a number",
        "--family mass-series --series 20=0.1;--series: power 20 is out of range: k in 1..12",
        "--family jp --spin 0.5 --epsilon3 -7;--epsilon3 = -7 is out of range: epsilon3 > -(1 + sqrt(1 - a^2))^3"
                + " = -6.4976 at --spin = 0.5 (use --allow-horizonless for a horizonless object)",
        "--family schwarzschild;--family = schwarzschild is not a known family: one of kerr, kerr-newman, hayward,"
                + " bardeen, mass-series, johannsen-psaltis (alias jp)",
        "--at -3;--at radius -3.0 is out of range: 0 < r <= 1e6 M",
    })
    void badParametersExitWithStatusTwoAndOneLine(String args, String message) {
        List<String> argv = new ArrayList<>(List.of("landmarks"));
        argv.addAll(List.of(args.split(" ")));
        String[] io = run(2, argv.toArray(new String[0]));
        assertEquals("", io[0], "no partial output");
        assertEquals("spindrift landmarks: " + message, io[1].strip());
        assertFalse(io[1].strip().contains("\n"));
    }

    @Test
    void horizonThresholdsAreInTheMessage(@TempDir Path dir) {
        Path png = dir.resolve("x.png");
        String err = run(2, "landmarks", "--family", "hayward", "--spin", "0.9", "--core-length", "1",
                "--plot", png.toString())[1].strip();
        assertTrue(err.startsWith("spindrift landmarks: --core-length = 1 with --spin = 0.9 leaves no horizon:"
                + " core_length <= 0."), err);
        assertTrue(err.endsWith("(use --allow-horizonless for a horizonless object)"), err);
        assertFalse(Files.exists(png), "no output file on bad input");
        String jp = run(2, "landmarks", "--family", "jp", "--spin", "0.9", "--epsilon3", "2")[1].strip();
        assertTrue(jp.contains("--epsilon3 = 2 with --spin = 0.9 leaves no closed horizon"), jp);
    }
}
