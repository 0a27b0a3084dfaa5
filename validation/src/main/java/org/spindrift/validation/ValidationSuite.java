package org.spindrift.validation;

import java.util.ArrayList;
import java.util.List;

/** All validation checks, in report order. */
public final class ValidationSuite {
    /** A run of the suite: the checks and the Schwarzschild series for the plots. */
    public record Run(List<Check> checks, MotionChecks.Series series) {
        public boolean allPassed() {
            return checks.stream().allMatch(Check::passed);
        }
    }

    private ValidationSuite() {
    }

    /** Runs every check (motion, then light; a few seconds). */
    public static Run run() {
        MotionChecks.Series s = MotionChecks.schwarzschildSeries();
        List<Check> all = new ArrayList<>(MotionChecks.schwarzschild(s));
        all.addAll(MotionChecks.lenseThirring());
        all.addAll(MotionChecks.kerr());
        all.addAll(MotionChecks.hipparchus());
        all.addAll(LightChecks.all());
        return new Run(all, s);
    }
}
