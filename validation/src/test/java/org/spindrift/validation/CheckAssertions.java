package org.spindrift.validation;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Collectors;

/** Assertions on rows of the validation report. */
final class CheckAssertions {
    private CheckAssertions() {
    }

    /** Fails listing every failed row (measured, reference, tolerance) when a row fails or there is none. */
    static void assertAllPass(List<Check> checks) {
        assertFalse(checks.isEmpty());
        String failed = checks.stream().filter(c -> !c.passed())
                .map(c -> c.quantity() + ": measured " + c.measured() + " reference " + c.reference() + " tol "
                        + c.tolerance())
                .collect(Collectors.joining("\n"));
        assertTrue(failed.isEmpty(), failed);
    }
}
