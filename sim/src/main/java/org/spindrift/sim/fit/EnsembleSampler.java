package org.spindrift.sim.fit;

import java.util.SplittableRandom;
import java.util.concurrent.ForkJoinPool;
import java.util.function.IntConsumer;
import java.util.function.ToDoubleFunction;
import java.util.stream.IntStream;
import org.hipparchus.util.FastMath;

/**
 * Affine-invariant ensemble sampler with the stretch move (Goodman &amp; Weare 2010, Comm. App.
 * Math. Comp. Sci. 5, 65, eqs. 7-11): walker X_k moves to Y = X_j + Z (X_k - X_j) with X_j a
 * walker of the other half of the ensemble, Z drawn from g(z) ~ 1/sqrt(z) on [1/a, a] (a = 2),
 * accepted with probability min(1, Z^(n-1) p(Y)/p(X_k)). The ensemble is split into two halves
 * updated in turn, so the walkers of one half can be evaluated in parallel (the parallel
 * variant of Foreman-Mackey et al. 2013, PASP 125, 306, sect. 3). Each walker's random numbers
 * come from a generator seeded by (seed, step, walker), so the chain is reproducible and
 * independent of the thread count.
 */
public final class EnsembleSampler {
    /** Stretch scale a (Goodman &amp; Weare 2010 recommend 2). */
    public static final double A = 2.0;

    /**
     * The chain.
     *
     * @param chain [step][walker][parameter]
     * @param logProb [step][walker]
     * @param acceptance fraction of accepted proposals
     */
    public record Chain(double[][][] chain, double[][] logProb, double acceptance) {
    }

    private EnsembleSampler() {
    }

    /**
     * @param logProb log posterior (up to a constant; -infinity outside the support); called from several threads
     * @param start [walker][parameter] initial positions (finite log posterior)
     * @param progress called with the number of finished steps (may be null)
     */
    public static Chain run(ToDoubleFunction<double[]> logProb, double[][] start, int steps, long seed, int threads,
                            IntConsumer progress) {
        int w = start.length;
        int n = start[0].length;
        int half = w / 2;
        double[][] x = new double[w][];
        double[] lp = new double[w];
        ForkJoinPool pool = new ForkJoinPool(Math.max(1, threads));
        double[][][] chain = new double[steps][w][];
        double[][] lps = new double[steps][w];
        long accepted = 0;
        try {
            LeastSquaresFit.run(pool, () -> IntStream.range(0, w).parallel().forEach(k -> {
                x[k] = start[k].clone();
                lp[k] = logProb.applyAsDouble(x[k]);
            }));
            double[][] prop = new double[w][n];
            double[] z = new double[w];
            double[] u = new double[w];
            double[] lpNew = new double[w];
            for (int s = 0; s < steps; s++) {
                for (int h = 0; h < 2; h++) {
                    final int from = h * half, other = (1 - h) * half;
                    final int step = s;
                    for (int k = from; k < from + half; k++) {
                        SplittableRandom rng = new SplittableRandom(mix(seed, step, k));
                        // z from g(z) ~ 1/sqrt(z) on [1/a, a]: z = ((a - 1) u + 1)^2 / a (inverse CDF)
                        double v = (A - 1.0) * rng.nextDouble() + 1.0;
                        z[k] = v * v / A;
                        int j = other + rng.nextInt(half);
                        u[k] = rng.nextDouble();
                        for (int c = 0; c < n; c++) {
                            prop[k][c] = x[j][c] + z[k] * (x[k][c] - x[j][c]);
                        }
                    }
                    LeastSquaresFit.run(pool, () -> IntStream.range(from, from + half).parallel()
                            .forEach(k -> lpNew[k] = logProb.applyAsDouble(prop[k])));
                    for (int k = from; k < from + half; k++) {
                        double q = (n - 1) * FastMath.log(z[k]) + lpNew[k] - lp[k];
                        if (lpNew[k] > Double.NEGATIVE_INFINITY && FastMath.log(u[k]) < q) {
                            x[k] = prop[k].clone();
                            lp[k] = lpNew[k];
                            accepted++;
                        }
                    }
                }
                for (int k = 0; k < w; k++) {
                    chain[s][k] = x[k].clone();
                    lps[s][k] = lp[k];
                }
                if (progress != null) {
                    progress.accept(s + 1);
                }
            }
        } finally {
            pool.shutdown();
        }
        return new Chain(chain, lps, accepted / (double) ((long) steps * w));
    }

    /** @return a seed for (seed, step, walker) (SplitMix64 finaliser, Steele et al. 2014) */
    static long mix(long seed, long step, long walker) {
        long z = seed * 0x9E3779B97F4A7C15L + step * 0xBF58476D1CE4E5B9L + walker * 0x94D049BB133111EBL;
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /**
     * Integrated autocorrelation time of one parameter from the walker-averaged chain, with
     * Sokal's automatic window M = smallest m with m >= c tau(m), c = 5 (Sokal 1997, in: Functional
     * Integration, Cargese lectures, sect. 3; the estimator recommended for ensembles by
     * Goodman &amp; Weare 2010, sect. 4).
     *
     * @param from first step used (after burn-in)
     */
    public static double autocorrelationTime(double[][][] chain, int param, int from) {
        int t = chain.length - from;
        int w = chain[0].length;
        double[] f = new double[t];
        for (int s = 0; s < t; s++) {
            double m = 0;
            for (int k = 0; k < w; k++) {
                m += chain[from + s][k][param];
            }
            f[s] = m / w;
        }
        double mean = 0;
        for (double v : f) {
            mean += v;
        }
        mean /= t;
        double c0 = 0;
        for (double v : f) {
            c0 += (v - mean) * (v - mean);
        }
        c0 /= t;
        if (!(c0 > 0)) {
            return Double.NaN;
        }
        double tau = 1.0;
        for (int m = 1; m < t; m++) {
            double cm = 0;
            for (int s = 0; s + m < t; s++) {
                cm += (f[s] - mean) * (f[s + m] - mean);
            }
            tau += 2.0 * cm / t / c0;
            if (m >= 5.0 * tau) {
                return tau;
            }
        }
        return tau;
    }
}
