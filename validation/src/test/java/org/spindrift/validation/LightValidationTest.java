package org.spindrift.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/** The light checks of {@code spindrift validate}, run in the build. */
class LightValidationTest {
    private static void assertAllPass(List<Check> checks) {
        assertFalse(checks.isEmpty());
        String failed = checks.stream().filter(c -> !c.passed())
                .map(c -> c.quantity() + ": measured " + c.measured() + " reference " + c.reference() + " tol "
                        + c.tolerance())
                .collect(Collectors.joining("\n"));
        assertTrue(failed.isEmpty(), failed);
    }

    @Test
    void shadowEdgeMatchesSyngeAndBardeen() {
        List<Check> checks = LightChecks.shadow();
        assertEquals(1 + LightChecks.SHADOW_FRACTIONS.length, checks.size());
        assertAllPass(checks);
    }

    @Test
    void deflectionMatchesDarwinAndEpsteinShapiro() {
        List<Check> checks = LightChecks.deflection();
        assertEquals(3 * LightChecks.DEFLECTION_B.length, checks.size());
        assertAllPass(checks);
    }

    @Test
    void faceOnImageRadiusMatchesQuadrature() {
        List<Check> checks = LightChecks.faceOn();
        assertEquals(LightChecks.FACE_ON_RADII.length, checks.size());
        assertAllPass(checks);
    }
}
