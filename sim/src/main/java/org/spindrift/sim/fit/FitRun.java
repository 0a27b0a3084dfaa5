package org.spindrift.sim.fit;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.function.IntConsumer;
import me.tongfei.progressbar.ProgressBar;
import org.hipparchus.distribution.continuous.ChiSquaredDistribution;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.RunArchiveWriter;
import org.spindrift.sim.run.ProgressBars;
import org.spindrift.sim.scenario.FitFile;
import org.spindrift.sim.scenario.FitFileLoader;

/**
 * A fit as a library call: fit file in, fit folder out, {@link Result} back. Checks the fit file
 * and its data (bad input: one-line {@link UserInputException}, nothing written), then runs the
 * method and writes fit.json, posterior.csv, samples.h5 and plots under temporary names with the
 * manifest last (run-folder rules).
 */
public final class FitRun {
    /**
     * @param output fit folder
     * @param threads worker threads (results do not depend on it)
     * @param progress show a progress bar
     * @param overwrite replace an earlier run or fit in the folder (otherwise a non-empty folder is refused)
     */
    public record Options(Path output, int threads, boolean progress, boolean overwrite) {
        /** Options that never replace an earlier folder. */
        public Options(Path output, int threads, boolean progress) {
            this(output, threads, progress, false);
        }
    }

    /**
     * A checked fit ready to run.
     *
     * @param fit the fit file
     * @param data its data
     * @param cache tables shared by the threads
     * @param start start values
     * @param startPrediction the model at the start values
     */
    public record Prepared(FitFile fit, FitData data, FitModel.Cache cache, double[] start,
                           FitModel.Prediction startPrediction) {
    }

    /**
     * What a fit found.
     *
     * @param folder the fit folder
     * @param names parameter key paths
     * @param best best fit (least squares) or posterior median (sampling)
     * @param sigma one-sigma errors
     * @param covariance covariance matrix
     * @param chiSquare chi-square at best
     * @param dof degrees of freedom
     * @param pValue probability of a chi-square at least this large
     * @param aic Akaike information criterion, chi^2 + 2k
     * @param bic Bayesian information criterion, chi^2 + k ln N
     * @param evaluations model evaluations
     * @param chain sampler chain (null for least squares)
     * @param tau integrated autocorrelation time per parameter (sampling; NaN otherwise)
     * @param warnings warnings (short chain, ...)
     */
    public record Result(Path folder, List<String> names, double[] best, double[] sigma, double[][] covariance,
                         double chiSquare, int dof, double pValue, double aic, double bic, long evaluations,
                         EnsembleSampler.Chain chain, double[] tau, List<String> warnings) {
    }

    private FitRun() {
    }

    /** Checks a fit file, its data and the model at the start values; writes nothing. */
    public static Prepared prepare(Path fitFile, int threads) {
        FitFile fit = FitFileLoader.load(fitFile);
        FitData data = FitData.read(fit.data().astrometry(), fit.data().photometry(), fit.data().fluxError());
        int k = fit.free().size();
        if (data.residuals() <= k) {
            throw new UserInputException(fitFile + ": free: " + k + " free parameters need more than " + k
                    + " data values; the data have " + data.residuals());
        }
        FitModel.Cache cache = new FitModel.Cache(threads);
        double[] start = new double[k];
        for (int i = 0; i < k; i++) {
            start[i] = fit.free().get(i).start();
        }
        FitModel m = new FitModel(fit, data, cache);
        FitModel.Prediction p;
        try {
            p = m.predict(start);
        } catch (UserInputException e) {
            throw new UserInputException(fitFile + ": free: at the start values: " + e.getMessage());
        }
        return new Prepared(fit, data, cache, start, p);
    }

    /** Runs a fit file and writes its folder. */
    public static Result run(Path fitFile, Options o) throws IOException {
        return run(prepare(fitFile, o.threads()), o);
    }

    /** Runs a prepared fit and writes its folder. */
    public static Result run(Prepared pr, Options o) throws IOException {
        RunArchiveWriter.checkUsable(o.output(), o.overwrite());
        FitFile fit = pr.fit();
        int k = fit.free().size();
        List<String> names = new ArrayList<>();
        double[] lo = new double[k], hi = new double[k];
        for (int i = 0; i < k; i++) {
            FitFile.Free f = fit.free().get(i);
            names.add(f.key());
            lo[i] = f.min();
            hi[i] = f.max();
        }
        ThreadLocal<FitModel> models = ThreadLocal.withInitial(() -> new FitModel(fit, pr.data(), pr.cache()));
        FitModel main = new FitModel(fit, pr.data(), pr.cache());
        int m = main.residualCount();
        long[] evals = {0};
        LeastSquaresFit.Residuals res = (p, out) -> models.get().residuals(p, out);
        List<String> warnings = new ArrayList<>();
        FitFile.Method me = fit.method();
        LeastSquaresFit.Result ls;
        try (ProgressBar bar = bar(o, "least squares", me.starts())) {
            ls = LeastSquaresFit.fit(res, m, lo, hi, pr.start(), me.starts(), me.maxEvaluations(), me.seed(),
                    o.threads(), step(bar));
        }
        evals[0] += ls.evaluations();
        double[] best = ls.best();
        double[][] cov = ls.covariance();
        EnsembleSampler.Chain chain = null;
        double[] tau = new double[k];
        Arrays.fill(tau, Double.NaN);
        double[] sigma = new double[k];
        if (me.kind() == FitFile.Kind.SAMPLE) {
            double[][] startW = walkers(best, cov, lo, hi, me.walkers(), me.seed());
            ThreadLocal<double[]> buf = ThreadLocal.withInitial(() -> new double[m]);
            try (ProgressBar bar = bar(o, "sampling", me.steps())) {
                chain = EnsembleSampler.run(p -> logPosterior(models.get(), fit, p, lo, hi, buf.get()), startW,
                        me.steps(), me.seed(), o.threads(), step(bar));
            }
            evals[0] += (long) me.walkers() * (me.steps() + 1);
            Summary s = summarise(chain, me.burnIn(), k);
            best = s.median;
            cov = s.covariance;
            int post = me.steps() - me.burnIn();
            for (int i = 0; i < k; i++) {
                tau[i] = EnsembleSampler.autocorrelationTime(chain.chain(), i, me.burnIn());
                // a chain needs some 50 autocorrelation times for a reliable tau (Foreman-Mackey et al. 2013, sect. 3)
                if (!(post >= 50 * tau[i])) {
                    warnings.add(String.format(Locale.ROOT, "%s: chain after burn-in (%d steps) is shorter than 50"
                            + " autocorrelation times (tau = %.1f); run longer", names.get(i), post, tau[i]));
                }
            }
        }
        for (int i = 0; i < k; i++) {
            sigma[i] = cov == null ? Double.NaN : FastMath.sqrt(cov[i][i]);
        }
        double[] r = new double[m];
        main.residuals(best, r);
        double chi2 = 0;
        for (double v : r) {
            chi2 += v * v;
        }
        int n = pr.data().residuals();
        int dof = n - k;
        double pValue = 1.0 - new ChiSquaredDistribution(dof).cumulativeProbability(chi2);
        // AIC = -2 ln L + 2k (Akaike 1974), BIC = -2 ln L + k ln N (Schwarz 1978); -2 ln L = chi^2 + const
        double aic = chi2 + 2 * k;
        double bic = chi2 + k * FastMath.log(n);
        Result result = new Result(o.output(), names, best, sigma, cov, chi2, dof, pValue, aic, bic, evals[0], chain, tau,
                warnings);
        FitModel.Prediction bestPrediction;
        try {
            bestPrediction = main.predict(best);
        } catch (UserInputException e) {
            bestPrediction = pr.startPrediction();
        }
        List<FitModel.Prediction> band = band(main, result, me.seed());
        FitOutputs.write(pr, result, bestPrediction, band, ls, o.overwrite());
        return result;
    }

    private static ProgressBar bar(Options o, String task, int max) {
        return ProgressBars.open(o.progress(), task, max);
    }

    private static IntConsumer step(ProgressBar bar) {
        return bar == null ? null : bar::stepTo;
    }

    /** Log posterior: -chi^2/2 plus the log priors (uniform: 0 inside the bounds; log-uniform: -ln p). */
    static double logPosterior(FitModel model, FitFile fit, double[] p, double[] lo, double[] hi, double[] buf) {
        double lp = 0;
        for (int i = 0; i < p.length; i++) {
            if (!(p[i] >= lo[i] && p[i] <= hi[i])) {
                return Double.NEGATIVE_INFINITY;
            }
            if (fit.free().get(i).prior() == FitFile.Prior.LOG_UNIFORM) {
                lp -= FastMath.log(p[i]);     // density ~ 1/p
            }
        }
        if (!model.residuals(p, buf)) {
            return Double.NEGATIVE_INFINITY;
        }
        double chi2 = 0;
        for (double v : buf) {
            chi2 += v * v;      // normal priors are in the residuals
        }
        return lp - 0.5 * chi2;
    }

    /** Walkers in a small Gaussian ball (a tenth of the one-sigma errors, or 1e-3 of the range) about the start, inside the bounds. */
    static double[][] walkers(double[] centre, double[][] cov, double[] lo, double[] hi, int w, long seed) {
        SplittableRandom rng = new SplittableRandom(seed ^ 0x5A3C_9E11L);
        int k = centre.length;
        double[][] out = new double[w][k];
        for (int j = 0; j < w; j++) {
            for (int i = 0; i < k; i++) {
                double s = cov != null && cov[i][i] > 0 ? 0.1 * FastMath.sqrt(cov[i][i]) : 1e-3 * (hi[i] - lo[i]);
                s = FastMath.min(s, 0.05 * (hi[i] - lo[i]));
                double v;
                int tries = 0;
                do {
                    v = centre[i] + s * gaussian(rng);
                } while ((v < lo[i] || v > hi[i]) && ++tries < 100);
                out[j][i] = FastMath.max(lo[i], FastMath.min(hi[i], v));
            }
        }
        return out;
    }

    /** @return a standard normal deviate (Box-Muller, Box &amp; Muller 1958) */
    static double gaussian(SplittableRandom rng) {
        double u = 1.0 - rng.nextDouble();
        return FastMath.sqrt(-2.0 * FastMath.log(u)) * FastMath.cos(2.0 * FastMath.PI * rng.nextDouble());
    }

    /** Posterior summary after burn-in: median and covariance. */
    record Summary(double[] median, double[][] covariance) {
    }

    static Summary summarise(EnsembleSampler.Chain c, int burn, int k) {
        double[][] flat = flat(c, burn);
        double[] med = new double[k];
        for (int i = 0; i < k; i++) {
            med[i] = percentile(flat[i], 50);
        }
        return new Summary(med, covariance(flat));
    }

    /** @return samples after burn-in, [parameter][sample] */
    static double[][] flat(EnsembleSampler.Chain c, int burn) {
        int steps = c.chain().length, w = c.chain()[0].length, k = c.chain()[0][0].length;
        double[][] out = new double[k][(steps - burn) * w];
        for (int s = burn; s < steps; s++) {
            for (int j = 0; j < w; j++) {
                for (int i = 0; i < k; i++) {
                    out[i][(s - burn) * w + j] = c.chain()[s][j][i];
                }
            }
        }
        return out;
    }

    /** @return the sample covariance (divisor n - 1) of [parameter][sample] */
    static double[][] covariance(double[][] flat) {
        int k = flat.length, n = flat[0].length;
        double[] mean = new double[k];
        for (int i = 0; i < k; i++) {
            for (double v : flat[i]) {
                mean[i] += v / n;
            }
        }
        double[][] c = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j <= i; j++) {
                double s = 0;
                for (int t = 0; t < n; t++) {
                    s += (flat[i][t] - mean[i]) * (flat[j][t] - mean[j]);
                }
                c[i][j] = c[j][i] = s / (n - 1);
            }
        }
        return c;
    }

    /** @return the q-th percentile (linear interpolation between order statistics, common practice) */
    public static double percentile(double[] v, double q) {
        double[] s = v.clone();
        Arrays.sort(s);
        double pos = q / 100.0 * (s.length - 1);
        int i = (int) FastMath.floor(pos);
        int j = FastMath.min(s.length - 1, i + 1);
        return s[i] + (pos - i) * (s[j] - s[i]);
    }

    /**
     * Up to 100 model predictions drawn from the posterior (sampling: chain samples after burn-in;
     * least squares: the Gaussian of the covariance), for the 68 % band of the plots.
     */
    static List<FitModel.Prediction> band(FitModel model, Result r, long seed) {
        List<FitModel.Prediction> out = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed ^ 0x77L);
        int k = r.best().length;
        double[][] draws = new double[100][];
        if (r.chain() != null) {
            double[][] flat = flat(r.chain(), r.chain().chain().length / 2);
            for (int d = 0; d < draws.length; d++) {
                int t = rng.nextInt(flat[0].length);
                draws[d] = new double[k];
                for (int i = 0; i < k; i++) {
                    draws[d][i] = flat[i][t];
                }
            }
        } else if (r.covariance() != null) {
            double[][] l;
            try {
                l = new org.hipparchus.linear.CholeskyDecomposition(new org.hipparchus.linear.Array2DRowRealMatrix(
                        r.covariance()), 1e-12, 0).getL().getData();
            } catch (RuntimeException e) {
                return out;
            }
            for (int d = 0; d < draws.length; d++) {
                double[] z = new double[k];
                for (int i = 0; i < k; i++) {
                    z[i] = gaussian(rng);
                }
                draws[d] = r.best().clone();
                for (int i = 0; i < k; i++) {
                    for (int j = 0; j <= i; j++) {
                        draws[d][i] += l[i][j] * z[j];
                    }
                }
            }
        } else {
            return out;
        }
        for (double[] p : draws) {
            try {
                out.add(model.predict(p));
            } catch (RuntimeException e) {
                // draws outside the valid region are left out of the band
            }
        }
        return out;
    }

    /** @return JSON of the result for fit.json */
    static ObjectNode json(Result r, FitFile fit, LeastSquaresFit.Result ls) {
        ObjectNode o = RunArchiveWriter.json().createObjectNode();
        o.put("format", "spindrift-fit");
        o.put("fit_file", fit.file().toString());
        o.put("method", fit.method().kind().name().toLowerCase(Locale.ROOT));
        ArrayNode ps = o.putArray("parameters");
        for (int i = 0; i < r.names().size(); i++) {
            ObjectNode p = ps.addObject();
            p.put("key", r.names().get(i));
            put(p, "value", r.best()[i]);
            put(p, "sigma", r.sigma()[i]);
            put(p, "min", fit.free().get(i).min());
            put(p, "max", fit.free().get(i).max());
            p.put("prior", fit.free().get(i).prior().name().toLowerCase(Locale.ROOT));
            put(p, "autocorrelation_time", r.tau()[i]);
        }
        ArrayNode cov = o.putArray("covariance");
        if (r.covariance() != null) {
            for (double[] row : r.covariance()) {
                ArrayNode a = cov.addArray();
                for (double v : row) {
                    a.add(v);
                }
            }
        }
        put(o, "chi_square", r.chiSquare());
        o.put("degrees_of_freedom", r.dof());
        put(o, "reduced_chi_square", r.chiSquare() / r.dof());
        put(o, "p_value", r.pValue());
        put(o, "aic", r.aic());
        put(o, "bic", r.bic());
        o.put("model_evaluations", r.evaluations());
        ArrayNode st = o.putArray("least_squares_starts_chi_square");
        for (double v : ls.startsChiSquare()) {
            if (Double.isFinite(v)) {
                st.add(v);
            } else {
                st.addNull();
            }
        }
        if (r.chain() != null) {
            ObjectNode s = o.putObject("sampler");
            s.put("walkers", fit.method().walkers());
            s.put("steps", fit.method().steps());
            s.put("burn_in", fit.method().burnIn());
            put(s, "acceptance_fraction", r.chain().acceptance());
            int post = fit.method().steps() - fit.method().burnIn();
            ArrayNode ess = s.putArray("effective_sample_size");
            for (double t : r.tau()) {
                if (Double.isFinite(t) && t > 0) {
                    ess.add(fit.method().walkers() * post / t);
                } else {
                    ess.addNull();
                }
            }
        }
        ArrayNode w = o.putArray("warnings");
        r.warnings().forEach(w::add);
        return o;
    }

    static void put(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) {
            o.put(k, v);
        } else {
            o.putNull(k);
        }
    }
}
