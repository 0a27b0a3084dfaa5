package org.spindrift.sim.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OrbitCommandTest {
    private static String run(int expectedExit, String... args) {
        String[] r = CliCapture.run(expectedExit, args);
        return r[0] + r[1];
    }

    @Test
    void jsonHasExactlyTheDocumentedKeys(@TempDir Path dir) throws Exception {
        Path png = dir.resolve("orbit.png");
        String out = run(0, "orbit", "--family", "kerr", "--spin", "0.9", "--p", "8", "--e", "0.3",
                "--orbits", "4", "--json", "--plot", png.toString());
        JsonNode j = new ObjectMapper().readTree(out);
        List<String> keys = new ArrayList<>();
        j.fieldNames().forEachRemaining(keys::add);
        // the key list documented in README.md (orbit --json)
        assertEquals(List.of("energy", "angular_momentum", "carter", "period_radial", "period_azimuthal",
                "period_polar", "periastron_advance", "mass_shell_drift_max", "carter_drift_max", "advance_1pn",
                "advance_2pn", "advance_spin"), keys);
        assertTrue(j.get("period_polar").isNull(), "equatorial orbit has no polar period");
        assertEquals(6 * Math.PI / 8, j.get("advance_1pn").asDouble(), 1e-15); // Einstein 1915
        assertTrue(j.get("mass_shell_drift_max").asDouble() < 1e-10);
        assertTrue(Files.size(png) > 1000);
        byte[] head = Files.readAllBytes(png);
        assertEquals((byte) 0x89, head[0]); // PNG signature (ISO/IEC 15948)
        assertEquals('P', head[1]);
    }

    @Test
    void unboundElementsExitWithStatusTwo() {
        String below = run(2, "orbit", "--p", "6.5", "--e", "0.3");
        assertTrue(below.contains("separatrix") && below.contains("6.600000"), below);
        String hyper = run(2, "orbit", "--p", "10", "--e", "1.2");
        assertTrue(hyper.contains("[0, 1)"), hyper);
        assertTrue(!hyper.contains("Exception"), hyper);
    }

    @Test
    void helpStatesTheInclinationDefinition() {
        String help = run(0, "orbit", "--help");
        assertTrue(help.contains("cos(iota) = L / sqrt(L^2 + Q)"), help);
    }
}
