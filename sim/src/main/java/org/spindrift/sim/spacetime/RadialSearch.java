package org.spindrift.sim.spacetime;

import java.util.function.DoubleUnaryOperator;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;
import org.spindrift.sim.numerics.BracketedRoot;

/**
 * Outermost root of a function of r: walk a geometric grid inwards from r_hi to r_lo, bracket
 * the first sign change and polish it with the shared root finder ({@link BracketedRoot#polish},
 * Hipparchus' bracketing Brent solver). Optionally
 * also catches double roots (a local minimum of f touching zero, as for extremal horizons) with
 * Hipparchus' Brent optimiser. Used by {@link Horizons} and {@link Landmarks}.
 */
final class RadialSearch {
    /** Grid points per decade of r: fine enough to separate the landmarks of every family. */
    static final int POINTS_PER_DECADE = 400;
    private static final int MAX_EVAL = 500;
    /** A minimum of f below this counts as touching zero (double root). */
    private static final double TOUCH = 1e-12;

    private RadialSearch() {
    }

    /**
     * @param f the function; NaN ends the search (the quantity ceases to exist further in)
     * @param rHi outer end of the search, rHi > rLo > 0
     * @param rLo inner end
     * @param touch also accept double roots
     * @return the outermost root in [rLo, rHi], or NaN if there is none
     */
    static double outermostRoot(DoubleUnaryOperator f, double rHi, double rLo, boolean touch) {
        final int n = Math.max(8, (int) Math.ceil(POINTS_PER_DECADE * Math.log10(rHi / rLo)));
        final double ratio = Math.pow(rLo / rHi, 1.0 / n);
        double rPrev2 = Double.NaN;
        double fPrev2 = Double.NaN;
        double rPrev = rHi;
        double fPrev = f.applyAsDouble(rHi);
        if (Double.isNaN(fPrev)) {
            return Double.NaN;
        }
        if (fPrev == 0.0) {
            return rHi;
        }
        for (int i = 1; i <= n; i++) {
            final double r = i == n ? rLo : rHi * Math.pow(ratio, i);
            final double fr = f.applyAsDouble(r);
            if (Double.isNaN(fr)) {
                return rootBeforeEdge(f, r, rPrev, fPrev);
            }
            if (fr == 0.0) {
                return r;
            }
            if ((fr < 0.0) != (fPrev < 0.0)) {
                return solve(f, r, rPrev);
            }
            if (touch && !Double.isNaN(fPrev2) && fPrev < fPrev2 && fPrev <= fr && fPrev > 0.0) {
                double root = touching(f, r, rPrev2);
                if (!Double.isNaN(root)) {
                    return root;
                }
            }
            rPrev2 = rPrev;
            fPrev2 = fPrev;
            rPrev = r;
            fPrev = fr;
        }
        return Double.NaN;
    }

    /**
     * The quantity ends (NaN) between nan and ok: locate the edge of its domain by bisection and
     * look for a sign change between the edge and ok, so that landmarks crowded into one grid
     * cell next to the edge (near-extremal Kerr: horizon, photon orbit and ISCO within 0.3%)
     * are not lost.
     */
    private static double rootBeforeEdge(DoubleUnaryOperator f, double nan, double ok, double fOk) {
        double lo = nan;
        double hi = ok;
        double fHi = fOk;
        for (int i = 0; i < 200 && hi - lo > 1e-15 * hi; i++) {
            double mid = 0.5 * (lo + hi);
            double fm = f.applyAsDouble(mid);
            if (Double.isNaN(fm)) {
                lo = mid;
            } else if ((fm < 0.0) != (fOk < 0.0) || fm == 0.0) {
                return fm == 0.0 ? mid : solve(f, mid, ok);
            } else {
                hi = mid;
                fHi = fm;
            }
        }
        return fHi == 0.0 ? hi : Double.NaN;
    }

    /** @return the root of f in [lo, hi], where f changes sign */
    static double solve(DoubleUnaryOperator f, double lo, double hi) {
        return BracketedRoot.polish(f, lo, hi);
    }

    /** @return the location of the minimum of f in [lo, hi] */
    static UnivariatePointValuePair minimum(DoubleUnaryOperator f, double lo, double hi) {
        BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-14);
        return opt.optimize(new MaxEval(MAX_EVAL), new UnivariateObjectiveFunction(f::applyAsDouble),
                GoalType.MINIMIZE, new SearchInterval(lo, hi));
    }

    /** A positive local minimum of f between lo and hi that touches or dips below zero. */
    private static double touching(DoubleUnaryOperator f, double lo, double hi) {
        UnivariatePointValuePair min = minimum(f, lo, hi);
        if (min.getValue() < 0.0) {
            return solve(f, min.getPoint(), hi);
        }
        return min.getValue() <= TOUCH ? min.getPoint() : Double.NaN;
    }
}
