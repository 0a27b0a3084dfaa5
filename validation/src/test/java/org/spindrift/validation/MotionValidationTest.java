package org.spindrift.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.spindrift.validation.CheckAssertions.assertAllPass;

import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The checks of {@code spindrift validate}, run in the build. */
class MotionValidationTest {
    private static MotionChecks.Series series;

    @BeforeAll
    static void measure() {
        series = MotionChecks.schwarzschildSeries();
    }

    @Test
    void schwarzschildAdvanceMatchesCutlerKennefickPoissonAndPostNewtonianSlopes() {
        List<Check> checks = MotionChecks.schwarzschild(series);
        assertEquals(MotionChecks.SERIES_P.length + 2, checks.size());
        assertAllPass(checks);
    }

    @Test
    void spinTermIsTheLeadingKerrCorrection() {
        List<Check> checks = MotionChecks.lenseThirring();
        assertEquals(2 * MotionChecks.LT_P.length, checks.size());
        assertAllPass(checks);
    }

    @Test
    void kerrPeriodsAndAdvanceMatchQuadrature() {
        List<Check> checks = MotionChecks.kerr();
        // 2 equatorial cases x 5 checks + 2 inclined cases x 6 checks
        assertEquals(22, checks.size());
        assertAllPass(checks);
    }

    @Test
    void trajectoriesAgreeWithHipparchus() {
        List<Check> checks = MotionChecks.hipparchus();
        assertEquals(MotionChecks.KERR_CASES.size() + 1, checks.size());
        assertAllPass(checks);
    }

    @Test
    void aCheckWithAWrongReferenceFails() {
        Check c = new Check("g", "q", 1.0, "s", 1.0 + 2e-9, 1e-9);
        assertFalse(c.passed());
        assertTrue(new Check("g", "q", 1.0, "s", 1.0 + 5e-10, 1e-9).passed());
    }
}
