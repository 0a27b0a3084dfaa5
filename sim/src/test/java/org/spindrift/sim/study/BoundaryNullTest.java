package org.spindrift.sim.study;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.hipparchus.distribution.continuous.ChiSquaredDistribution;
import org.hipparchus.random.Well19937c;
import org.hipparchus.special.Erf;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spindrift.sim.fit.FitModel;

/**
 * The null distribution when the reference deformation sits on the boundary of the family's
 * range (a core length &gt;= 0 tested at 0): Chernoff's 50:50 mixture of chi-square(0) and
 * chi-square(1) (Chernoff 1954, Ann. Math. Stat. 25, 573), and for k extra parameters of which one
 * is on the boundary the mixture of chi-square(k - 1) and chi-square(k) (Self &amp; Liang 1987,
 * JASA 82, 605).
 */
class BoundaryNullTest {
    @TempDir Path tmp;

    /**
     * Closed forms: P(chi^2_1 &gt;= x) = erfc(sqrt(x / 2)) and P(chi^2_2 &gt;= x) = exp(-x / 2)
     * (Abramowitz &amp; Stegun 1964, eqs. 26.4.4 and 26.4.21 for even degrees), so on the boundary
     * p = erfc(sqrt(x/2)) / 2 for k = 1 and (erfc(sqrt(x/2)) + exp(-x/2)) / 2 for k = 2. Two-sided
     * normal equivalents: Delta chi^2 = 9 with k = 1 on the boundary is p = 1 - Phi(3) = 1.3499e-3,
     * i.e. 3.2052 sigma; 25 gives 5.1320 sigma (values computed with scipy.stats.norm.isf).
     */
    @Test
    void mixtureMatchesClosedForms() {
        for (double x : new double[] {0.3, 1.0, 4.0, 9.0, 25.0, 60.0}) {
            double q1 = Erf.erfc(FastMath.sqrt(0.5 * x));
            double q2 = FastMath.exp(-0.5 * x);
            assertEquals(0.5 * q1, Wilks.pValue(x, 1, true), 1e-8 * 0.5 * q1);
            assertEquals(0.5 * (q1 + q2), Wilks.pValue(x, 2, true), 1e-8 * 0.5 * (q1 + q2));
            assertEquals(q1, Wilks.pValue(x, 1, false), 1e-8 * q1);
        }
        assertEquals(1.0, Wilks.pValue(0.0, 1, true), "the point mass at 0: P(T >= 0) = 1");
        assertEquals(3.2052, Wilks.sigma(9.0, 1, true), 1e-3);
        assertEquals(5.1320, Wilks.sigma(25.0, 1, true), 1e-3);
        assertEquals(2.7014, Wilks.sigma(9.0, 2, true), 1e-3);
        // far in the tail (p about 1e-89) the boundary still halves p: a larger significance
        assertTrue(Wilks.sigma(400.0, 1, true) > Wilks.sigma(400.0, 1, false) + 0.01);
        assertEquals(0.0, Wilks.sigma(0.0, 1, true));
        // the contour of the map uses the same null: 3 sigma on the boundary needs Delta chi^2 = 7.74 (scipy)
        double at = StudyOutputs.contour(9.0, 1.0, 1, true, 3.0);
        assertEquals(FastMath.sqrt(9.0 / 7.7405), at, 1e-3);
    }

    /**
     * Simulated nulls through the study's own profile step: a linear model whose chi-square in the
     * deformation d &gt;= 0 is chi2_min + (d - d_hat)^2 / s_d^2 with d_hat ~ N(0, s_d) (the truth at
     * 0), profiled at the nodes 0, step, 2 step with the vertex allowed only at d &gt;= 0, as
     * {@link CellStudy} does. The statistic chi2(0) - profile minimum follows the 50:50 mixture:
     * half the draws are 0, the positive ones follow chi-square(1); Kolmogorov-Smirnov against the
     * mixture's CDF (0.5 + 0.5 F_1) on 4000 draws, 1 % critical value 1.63 / sqrt(n) (Smirnov 1948,
     * Ann. Math. Stat. 19, 279; value from memory; conservative with the point mass).
     */
    @Test
    void profiledNullsFollowChernoffMixture() {
        Well19937c rng = new Well19937c(20261203);
        int n = 4000;
        double sd = 0.2, step = 0.5;
        double[] nodes = {0.0, step, 2 * step};
        double[] t = new double[n];
        int zeros = 0;
        for (int i = 0; i < n; i++) {
            double dHat = sd * rng.nextGaussian();
            double base = 40.0 + 3.0 * rng.nextGaussian();
            double[] c = new double[3];
            for (int j = 0; j < 3; j++) {
                c[j] = base + (nodes[j] - dHat) * (nodes[j] - dHat) / (sd * sd);
            }
            double alt = CellStudy.profileMinimum(nodes, c, step, v -> v >= 0);
            t[i] = FastMath.max(0.0, c[0] - FastMath.min(alt, c[0]));
            zeros += t[i] < 1e-9 ? 1 : 0;
        }
        assertEquals(0.5, (double) zeros / n, 0.03, "half the statistics at 0");
        Arrays.sort(t);
        ChiSquaredDistribution chi = new ChiSquaredDistribution(1);
        double dmax = 0;
        for (int i = 0; i < n; i++) {
            double f = t[i] < 1e-9 ? 0.5 : 0.5 + 0.5 * chi.cumulativeProbability(t[i]);
            double below = t[i] < 1e-9 ? 0.0 : f;
            dmax = FastMath.max(dmax, FastMath.max((i + 1.0) / n - f, below - (double) i / n));
        }
        assertTrue(dmax < 1.63 / FastMath.sqrt(n), "KS D = " + dmax);
        // and Wilks' chi-square(1) alone is rejected by the same test
        double dWilks = 0;
        for (int i = 0; i < n; i++) {
            double f = chi.cumulativeProbability(t[i]);
            dWilks = FastMath.max(dWilks, FastMath.max((i + 1.0) / n - f, f - (double) i / n));
        }
        assertTrue(dWilks > 1.63 / FastMath.sqrt(n), "chi-square(1) does not fit on the boundary: D = " + dWilks);
    }

    /**
     * The boundary is recognised from the family's own range: a Hayward core length (non-negative)
     * tested at 0 is on it; the Johannsen-Psaltis epsilon3 (either sign) at 0 is not.
     */
    @Test
    void boundaryFromTheFamilysRange() throws Exception {
        assertTrue(onBoundary("hayward", "core_length"));
        assertFalse(onBoundary("johannsen-psaltis", "epsilon3"));
    }

    private boolean onBoundary(String family, String key) throws Exception {
        String scenario = DistinguishTest.SCENARIO.replace("family: johannsen-psaltis", "family: " + family)
                .replace("epsilon3: 0.0", key + ": 0.0");
        Files.writeString(tmp.resolve("truth.yaml"), scenario);
        Path f = tmp.resolve("study.yaml");
        Files.writeString(f, DistinguishTest.study("[0.5]", "[1.0]", 1, DistinguishTest.PA)
                .replace("epsilon3", key).replace("step: 0.5", "step: 0.1"));
        StudyFile s = StudyFile.load(f);
        CellStudy c = new CellStudy(s, new FitModel.Cache(1), 1);
        return c.referenceOnBoundary(s.truth());
    }
}
