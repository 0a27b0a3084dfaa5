package org.spindrift.sim.numerics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.junit.jupiter.api.Test;

class BracketedRootTest {
    /** Resolution of the bisection: the final bracket is at most two ulps wide (its contract). */
    private static final int BRACKET_ULPS = 2;

    @Test
    void bisectionBracketsTheZeroOfCosineAtHalfPi() {
        BracketedRoot root = new BracketedRoot();
        // cos changes sign once in [1, 2], at pi/2 (common practice, no source)
        double after = root.locate(Math::cos, 1.0, Math.cos(1.0), 2.0);
        assertEquals(after, root.after());
        assertTrue(root.after() - root.before() <= BRACKET_ULPS * Math.ulp(after), "bracket too wide");
        assertTrue(Math.cos(root.before()) > 0 && Math.cos(root.after()) <= 0, "the bracket must straddle the zero");
        assertEquals(Math.PI / 2, root.middle(), BRACKET_ULPS * Math.ulp(Math.PI / 2));
    }

    @Test
    void bisectionAgreesWithHipparchusOnARisingCubic() {
        // x^3 - 2 rises through zero at the cube root of 2; reference: Hipparchus' bracketing Brent solver
        double ref = new BracketingNthOrderBrentSolver(0.0, 1e-15, 0.0, 5).solve(200, x -> x * x * x - 2, 0.0, 3.0,
                AllowedSolution.ANY_SIDE);
        BracketedRoot root = new BracketedRoot();
        double after = root.locate(x -> x * x * x - 2, 0.0, -2.0, 3.0);
        assertEquals(Math.cbrt(2.0), ref, 1e-15);
        assertEquals(ref, after, 4 * Math.ulp(ref));
        assertTrue(root.before() * root.before() * root.before() - 2 < 0, "before is on the side of g(a)");
    }

    @Test
    void anExactZeroCountsAsPastTheChange() {
        // a step function that is exactly zero on [0.5, 1]: the change happens where g first reaches zero
        BracketedRoot falling = new BracketedRoot();
        double t = falling.locate(x -> x < 0.5 ? 1.0 : 0.0, 0.0, 1.0, 1.0);
        assertEquals(0.5, t, 2 * Math.ulp(0.5));
        assertTrue(t >= 0.5);
        BracketedRoot rising = new BracketedRoot();
        t = rising.locate(x -> x < 0.25 ? -1.0 : 0.0, 0.0, -1.0, 1.0);
        assertTrue(t >= 0.25 && t - 0.25 <= 2 * Math.ulp(0.25), "t = " + t);
    }

    @Test
    void polishFindsTheRootOfAnExpensiveFunctionToMachinePrecision() {
        // x - exp(-x) = 0 at the omega constant 0.5671432904097838 (Lambert W(1); value from memory)
        double w = BracketedRoot.polish(x -> x - Math.exp(-x), 0.0, 1.0);
        assertEquals(0.5671432904097838, w, 1e-15);
    }
}
