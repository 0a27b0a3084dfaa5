package org.spindrift.sim.numerics;

import java.util.function.DoubleUnaryOperator;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;

/**
 * The one root finder for a bracketed sign change of a function of one variable. Two ways in:
 * <ul>
 *   <li>{@link #locate}: bisection down to the resolution of the variable (the bracket ends are
 *       at most two ulps apart), for cheap functions such as an event function on an
 *       integrator's continuous extension. It never leaves the bracket, needs no derivative,
 *       allocates nothing and always takes the same path for the same input (bisection:
 *       Press et al. 2007, Numerical Recipes, 3rd ed., section 9.1).</li>
 *   <li>{@link #polish}: Hipparchus' bracketing n-th order Brent solver, for functions that
 *       are expensive to evaluate (spacetime landmarks); it allocates a little per call.</li>
 * </ul>
 * An instance keeps the two ends of the last bracket, so the caller can choose the side it
 * needs ({@link #after} where g has left its sign at the start, or the middle); use one
 * instance per thread.
 */
public final class BracketedRoot {
    /** Bisection halvings at most: 2^-200 of any double interval is below its resolution. */
    private static final int MAX_HALVINGS = 200;
    /** Evaluations {@link #polish} may spend. */
    private static final int MAX_EVAL = 500;

    private double before;
    private double after;

    /**
     * Narrows [a, b] by bisection to the sign change of g. A point stays on the side of a while
     * g there has the strict sign of g(a); a point where g is exactly zero counts as past the
     * change (near the root g is quantised to a few ulps, so exact zeros do occur).
     *
     * @param g the function; g(b) must lie on the other side from g(a)
     * @param a start of the bracket
     * @param ga g(a), already known to the caller
     * @param b end of the bracket, b &gt; a
     * @return the end of the final bracket where g has left the side of g(a) (also {@link #after})
     */
    public double locate(DoubleUnaryOperator g, double a, double ga, double b) {
        double lo = a;
        double hi = b;
        final boolean startPositive = ga > 0;
        for (int it = 0; it < MAX_HALVINGS && hi - lo > 2 * Math.ulp(hi); it++) {
            final double mid = 0.5 * (lo + hi);
            final double gm = g.applyAsDouble(mid);
            if (startPositive ? gm > 0 : gm < 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        before = lo;
        after = hi;
        return hi;
    }

    /** @return the end of the last {@link #locate} bracket on the side of g(a) */
    public double before() {
        return before;
    }

    /** @return the end of the last {@link #locate} bracket past the sign change */
    public double after() {
        return after;
    }

    /** @return the middle of the last {@link #locate} bracket */
    public double middle() {
        return 0.5 * (before + after);
    }

    /**
     * Root of an expensive function in [lo, hi], where it changes sign, to about 1e-15
     * relative with Hipparchus' BracketingNthOrderBrentSolver (order 5, either side).
     */
    public static double polish(DoubleUnaryOperator f, double lo, double hi) {
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(1e-15, 1e-15, 0.0, 5);
        return solver.solve(MAX_EVAL, f::applyAsDouble, lo, hi, AllowedSolution.ANY_SIDE);
    }
}
