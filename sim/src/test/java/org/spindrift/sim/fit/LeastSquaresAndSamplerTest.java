package org.spindrift.sim.fit;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;

/** The fit engine's two methods against problems with known answers. */
class LeastSquaresAndSamplerTest {
    /**
     * NIST Statistical Reference Datasets, nonlinear regression, "Misra1a" (lower difficulty):
     * y = b1 (1 - exp(-b2 x)), 14 observations, start 1 (b1 = 500, b2 = 1e-4). Certified values
     * (NIST StRD, recalled from memory): b1 = 2.3894212918E+02 (sd 2.7070075241E+00),
     * b2 = 5.5015643181E-04 (sd 7.2668688436E-06), residual sum of squares 1.2455138894E-01.
     */
    @Test
    void misra1aCertifiedValues() {
        double[] x = {77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0};
        double[] y = {10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.40, 75.47, 81.78};
        LeastSquaresFit.Residuals r = (p, out) -> {
            for (int i = 0; i < x.length; i++) {
                out[i] = p[0] * (1 - FastMath.exp(-p[1] * x[i])) - y[i];
            }
        };
        LeastSquaresFit.Result res = LeastSquaresFit.fit(r, x.length, new double[] {100, 1e-4}, new double[] {600, 1e-3},
                new double[] {500, 1e-4}, 3, 5000, 1L, 2, null);
        assertEquals(2.3894212918E+02, res.best()[0], 1e-4 * 2.389e2, "b1 (NIST certified)");
        assertEquals(5.5015643181E-04, res.best()[1], 1e-4 * 5.5e-4, "b2 (NIST certified)");
        assertEquals(1.2455138894E-01, res.chiSquare(), 1e-6, "residual sum of squares (NIST certified)");
        // unit weights: the certified standard deviations are sqrt(s^2 C_ii), s^2 = RSS / (n - p)
        double s2 = res.chiSquare() / (x.length - 2);
        assertEquals(2.7070075241E+00, FastMath.sqrt(s2 * res.covariance()[0][0]), 0.01 * 2.707, "sd(b1) (NIST)");
        assertEquals(7.2668688436E-06, FastMath.sqrt(s2 * res.covariance()[1][1]), 0.01 * 7.267e-6, "sd(b2) (NIST)");
    }

    /**
     * The stretch-move sampler on a correlated 2-D Gaussian (mean (1, -2), sigmas 1 and 2,
     * correlation 0.8): sample mean and covariance within four Monte Carlo standard errors
     * (error of a mean sigma sqrt(tau / N), of a variance var sqrt(2 tau / N); common practice,
     * no source), and the same chain for 1 and 2 threads.
     */
    @Test
    void correlatedGaussian() {
        double s1 = 1, s2 = 2, rho = 0.8;
        double det = s1 * s1 * s2 * s2 * (1 - rho * rho);
        double i11 = s2 * s2 / det, i22 = s1 * s1 / det, i12 = -rho * s1 * s2 / det;
        java.util.function.ToDoubleFunction<double[]> lp = p -> {
            double a = p[0] - 1, b = p[1] + 2;
            return -0.5 * (i11 * a * a + 2 * i12 * a * b + i22 * b * b);
        };
        int w = 32, steps = 3000, burn = 500;
        double[][] start = new double[w][2];
        java.util.SplittableRandom rng = new java.util.SplittableRandom(5);
        for (int k = 0; k < w; k++) {
            start[k][0] = 1 + 0.1 * (rng.nextDouble() - 0.5);
            start[k][1] = -2 + 0.1 * (rng.nextDouble() - 0.5);
        }
        EnsembleSampler.Chain c = EnsembleSampler.run(lp, start, steps, 11L, 2, null);
        EnsembleSampler.Chain c1 = EnsembleSampler.run(lp, start, steps, 11L, 1, null);
        for (int s = 0; s < steps; s += 97) {
            for (int k = 0; k < w; k++) {
                assertArrayEquals(c.chain()[s][k], c1.chain()[s][k], 0.0, "thread-count independent");
            }
        }
        double[][] flat = FitRun.flat(c, burn);
        double[][] cov = FitRun.covariance(flat);
        int n = flat[0].length;
        double[] mean = {0, 0};
        for (int i = 0; i < 2; i++) {
            for (double v : flat[i]) {
                mean[i] += v / n;
            }
        }
        double tau = Math.max(EnsembleSampler.autocorrelationTime(c.chain(), 0, burn),
                EnsembleSampler.autocorrelationTime(c.chain(), 1, burn));
        assertTrue(tau > 1 && tau < 200, "autocorrelation time " + tau);
        // tau is in steps of the ensemble: effective samples = walkers x steps / tau
        double neff = (double) w * (steps - burn) / tau;
        assertEquals(1.0, mean[0], 4 * s1 / Math.sqrt(neff), "mean x");
        assertEquals(-2.0, mean[1], 4 * s2 / Math.sqrt(neff), "mean y");
        assertEquals(s1 * s1, cov[0][0], 4 * s1 * s1 * Math.sqrt(2 / neff), "var x");
        assertEquals(s2 * s2, cov[1][1], 4 * s2 * s2 * Math.sqrt(2 / neff), "var y");
        assertEquals(rho * s1 * s2, cov[0][1], 4 * s1 * s2 * Math.sqrt((1 + rho * rho) / neff), "cov xy");
        assertTrue(c.acceptance() > 0.2 && c.acceptance() < 0.9, "acceptance " + c.acceptance());
    }
}
