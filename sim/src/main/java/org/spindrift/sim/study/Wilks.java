package org.spindrift.sim.study;

import org.hipparchus.distribution.continuous.ChiSquaredDistribution;
import org.hipparchus.distribution.continuous.NormalDistribution;
import org.hipparchus.special.Gamma;
import org.hipparchus.util.FastMath;

/**
 * Significance of a likelihood-ratio statistic for nested models. By Wilks' theorem (Wilks 1938,
 * Ann. Math. Stat. 9, 60) Delta chi-square = -2 ln(L_ref / L_alt) follows a chi-square
 * distribution with k degrees of freedom (k extra parameters of the larger model) when the
 * smaller model is true; the p-value is its upper tail, quoted as the two-sided normal
 * equivalent n with 2 (1 - Phi(n)) = p (common practice, no source).
 *
 * <p>Wilks' theorem needs the reference value inside the parameter space. When one extra
 * parameter has its reference value on the boundary (a core length &gt;= 0 tested at 0), the
 * statistic follows instead the 50:50 mixture of chi-square with k - 1 and k degrees of freedom,
 * chi-square(0) being a point mass at 0 (Chernoff 1954, Ann. Math. Stat. 25, 573 for k = 1; Self
 * &amp; Liang 1987, JASA 82, 605, case of one boundary parameter and k - 1 interior ones):
 * p = (Q_{k-1} + Q_k) / 2 for Delta chi-square &gt; 0.
 */
public final class Wilks {
    private Wilks() {
    }

    /** @return p = P(chi^2_k >= deltaChiSquare) */
    public static double pValue(double deltaChiSquare, int k) {
        if (!(deltaChiSquare > 0)) {
            return 1.0;
        }
        double cdf = new ChiSquaredDistribution(k).cumulativeProbability(deltaChiSquare);
        // far in the tail 1 - cdf loses all digits: the regularised upper incomplete gamma function
        // Q(k/2, x/2) is the same tail computed directly (Abramowitz & Stegun 1964, eq. 26.4.19)
        return cdf < 1 - 1e-10 ? 1 - cdf : Gamma.regularizedGammaQ(0.5 * k, 0.5 * deltaChiSquare);
    }

    /**
     * @param boundary whether one extra parameter's reference value lies on the boundary of its range
     * @return p under Wilks' chi-square (boundary false) or the Chernoff / Self-Liang mixture
     *     (boundary true): P(T &gt;= deltaChiSquare), 1 at 0 (the mixture's point mass included)
     */
    public static double pValue(double deltaChiSquare, int k, boolean boundary) {
        if (!boundary) {
            return pValue(deltaChiSquare, k);
        }
        if (!(deltaChiSquare > 0)) {
            return 1.0;
        }
        return 0.5 * (pValue(deltaChiSquare, k) + (k > 1 ? pValue(deltaChiSquare, k - 1) : 0.0));
    }

    /**
     * @return the two-sided normal-equivalent significance n in sigma: the n with
     *     P(|Z| >= n) = P(chi^2_1 >= n^2) = p. Both tails are the regularised upper incomplete gamma
     *     function Q(s, x/2) (Abramowitz &amp; Stegun 1964, eq. 26.4.19), accurate far into the tail, so
     *     n is found by bisection on Q(1/2, n^2/2) = Q(k/2, Delta chi^2/2); for k = 1, n = sqrt(Delta chi^2).
     */
    public static double sigma(double deltaChiSquare, int k) {
        return sigma(deltaChiSquare, k, false);
    }

    /**
     * As {@link #sigma(double, int)} with the p-value of {@link #pValue(double, int, boolean)}.
     */
    public static double sigma(double deltaChiSquare, int k, boolean boundary) {
        if (!(deltaChiSquare > 0)) {
            return 0;
        }
        double p = pValue(deltaChiSquare, k, boundary);
        if (p >= 1) {
            return 0;
        }
        if (p > 1e-12) {
            return -new NormalDistribution(0, 1).inverseCumulativeProbability(0.5 * p);
        }
        double q = Gamma.regularizedGammaQ(0.5 * k, 0.5 * deltaChiSquare);
        if (boundary) {
            q = 0.5 * (q + (k > 1 ? Gamma.regularizedGammaQ(0.5 * (k - 1), 0.5 * deltaChiSquare) : 0.0));
        }
        double logP = FastMath.log(q);
        if (Double.isInfinite(logP)) {
            return FastMath.sqrt(deltaChiSquare);     // beyond double precision: the leading term
        }
        double lo = 0, hi = 40;
        for (int it = 0; it < 200; it++) {
            double mid = 0.5 * (lo + hi);
            if (FastMath.log(Gamma.regularizedGammaQ(0.5, 0.5 * mid * mid)) > logP) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
