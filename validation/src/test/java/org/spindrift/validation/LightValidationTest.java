package org.spindrift.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.spindrift.validation.CheckAssertions.assertAllPass;

import java.util.List;
import org.junit.jupiter.api.Test;

/** The light checks of {@code spindrift validate}, run in the build. */
class LightValidationTest {
    @Test
    void shadowEdgeMatchesSyngeAndBardeen() {
        List<Check> checks = LightChecks.shadow();
        assertEquals(1 + LightChecks.KERR_SHADOW_INCLINATIONS_DEG.length * LightChecks.SHADOW_FRACTIONS.length,
                checks.size());
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
