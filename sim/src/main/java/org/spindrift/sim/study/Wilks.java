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

    /** @return the two-sided normal-equivalent significance in sigma of the statistic */
    public static double sigma(double deltaChiSquare, int k) {
        double p = pValue(deltaChiSquare, k);
        if (p >= 1) {
            return 0;
        }
        if (p > 0) {
            return -new NormalDistribution(0, 1).inverseCumulativeProbability(0.5 * p);
        }
        // beyond double precision: for k = 1 the equivalent is exactly sqrt(Delta chi^2); for larger k
        // this is its leading term as well (quoted as a lower bound)
        return FastMath.sqrt(deltaChiSquare);
    }
}
