package org.spindrift.sim.fit;

import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.function.IntConsumer;
import java.util.stream.IntStream;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.MultivariateJacobianFunction;
import org.hipparchus.util.Pair;

/**
 * Weighted least squares with Hipparchus' {@link LevenbergMarquardtOptimizer} (Levenberg 1944;
 * Marquardt 1963; Moré 1978) on whitened residuals, from several starts (the first at the given
 * start values, the others drawn uniformly within the bounds from a seeded generator); the best
 * is kept. Parameters are kept inside their bounds by clamping (Hipparchus' ParameterValidator).
 * The Jacobian is a forward difference with steps of 1e-4 of each parameter's range (the model is
 * not differentiable in closed form), its columns evaluated in parallel with fixed assignment, so
 * the result does not depend on the thread count. Covariance = (J^T J)^-1 of the whitened
 * Jacobian at the best fit (e.g. Press et al. 2007, Numerical Recipes, sect. 15.5).
 */
public final class LeastSquaresFit {
    /** Relative step of the forward differences, of each parameter's range. */
    public static final double STEP = 1.0e-4;
    /** Relative tolerance of the cost and of the parameters at which a start stops (fits). */
    public static final double TOLERANCE = 1.0e-8;

    /** Residual function r(p) (whitened); may be called from several threads with its own model each. */
    public interface Residuals {
        /** Fills out with r(p); must be safe to call from several threads at once. */
        void evaluate(double[] p, double[] out);
    }

    /**
     * Result of the best start.
     *
     * @param best parameters
     * @param chiSquare sum of squared residuals at the best fit
     * @param covariance (J^T J)^-1 (null when singular)
     * @param evaluations model evaluations over all starts
     * @param startsChiSquare chi-square reached from each start
     */
    public record Result(double[] best, double chiSquare, double[][] covariance, int evaluations, double[] startsChiSquare) {
    }

    private LeastSquaresFit() {
    }

    /**
     * @param lo lower bounds (and hi upper)
     * @param start first start
     * @param m number of residuals
     * @param workers parallel workers
     * @param progress called after every start (may be null)
     */
    public static Result fit(Residuals r, int m, double[] lo, double[] hi, double[] start, int starts, int maxEvaluations,
                             long seed, int workers, IntConsumer progress) {
        return fit(r, m, lo, hi, start, starts, maxEvaluations, seed, workers, progress, TOLERANCE);
    }

    /**
     * As {@link #fit(Residuals, int, double[], double[], double[], int, int, long, int, IntConsumer)}
     * with a relative tolerance of the cost and of the parameters (the chi-square is then known to
     * about 2 x tolerance x chi-square).
     */
    public static Result fit(Residuals r, int m, double[] lo, double[] hi, double[] start, int starts, int maxEvaluations,
                             long seed, int workers, IntConsumer progress, double tolerance) {
        int k = lo.length;
        ForkJoinPool pool = new ForkJoinPool(Math.max(1, workers));
        int[] evals = new int[1];
        try {
            MultivariateJacobianFunction f = point -> {
                double[] p = point.toArray();
                double[][] cols = new double[k + 1][m];
                double[] steps = new double[k];
                double[][] pts = new double[k + 1][];
                pts[0] = p;
                for (int j = 0; j < k; j++) {
                    double s = STEP * (hi[j] - lo[j]);
                    double[] q = p.clone();
                    // step towards the inside of the bounds
                    q[j] = p[j] + s <= hi[j] ? p[j] + s : p[j] - s;
                    steps[j] = q[j] - p[j];
                    pts[j + 1] = q;
                }
                run(pool, () -> IntStream.range(0, k + 1).parallel().forEach(j -> r.evaluate(pts[j], cols[j])));
                evals[0] += k + 1;
                double[][] jac = new double[m][k];
                for (int j = 0; j < k; j++) {
                    for (int i = 0; i < m; i++) {
                        jac[i][j] = (cols[j + 1][i] - cols[0][i]) / steps[j];
                    }
                }
                return new Pair<RealVector, RealMatrix>(new ArrayRealVector(cols[0], false),
                        new Array2DRowRealMatrix(jac, false));
            };
            SplittableRandom rng = new SplittableRandom(seed);
            double bestChi = Double.POSITIVE_INFINITY;
            double[] best = start.clone();
            double[][] cov = null;
            double[] chis = new double[starts];
            for (int s = 0; s < starts; s++) {
                double[] p0 = new double[k];
                for (int j = 0; j < k; j++) {
                    p0[j] = s == 0 ? start[j] : lo[j] + (hi[j] - lo[j]) * rng.nextDouble();
                }
                LeastSquaresProblem problem = new LeastSquaresBuilder().model(f).target(new double[m])
                        .start(p0).maxEvaluations(maxEvaluations).maxIterations(maxEvaluations)
                        .parameterValidator(v -> {
                            double[] a = v.toArray();
                            for (int j = 0; j < k; j++) {
                                a[j] = Math.max(lo[j], Math.min(hi[j], a[j]));
                            }
                            return new ArrayRealVector(a, false);
                        }).build();
                LeastSquaresOptimizer.Optimum o;
                try {
                    o = new LevenbergMarquardtOptimizer().withCostRelativeTolerance(tolerance)
                            .withParameterRelativeTolerance(tolerance).optimize(problem);
                } catch (org.hipparchus.exception.MathIllegalStateException e) {
                    chis[s] = Double.NaN;     // evaluation budget exhausted from this start
                    if (progress != null) {
                        progress.accept(s + 1);
                    }
                    continue;
                }
                // the target is 0, so the residuals are -r: chi-square = |r|^2
                double chi = o.getCost() * o.getCost();
                chis[s] = chi;
                if (chi < bestChi) {
                    bestChi = chi;
                    best = o.getPoint().toArray();
                    try {
                        cov = o.getCovariances(1e-14).getData();
                    } catch (RuntimeException e) {
                        cov = null;
                    }
                }
                if (progress != null) {
                    progress.accept(s + 1);
                }
            }
            return new Result(best, bestChi, cov, evals[0], chis);
        } finally {
            pool.shutdown();
        }
    }

    static void run(ForkJoinPool pool, Runnable job) {
        try {
            pool.submit(job).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("fit interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException("fit failed: " + e.getCause(), e.getCause());
        }
    }
}
