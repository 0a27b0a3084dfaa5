package org.spindrift.sim.study;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ConcurrentHashMap;
import org.hipparchus.random.Well19937c;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.UserInputException;
import org.spindrift.sim.fit.FitData;
import org.spindrift.sim.fit.FitModel;
import org.spindrift.sim.fit.LeastSquaresFit;
import org.spindrift.sim.scenario.FitFile;
import org.spindrift.sim.scenario.ScenarioTree;

/**
 * One cell of a study (a deformation, a beam, a precision): mock data from the truth through the
 * fit engine's fast compact-source model, least-squares fits of the reference model and of the
 * truth family, the likelihood-ratio statistic over noise realisations and the noise-free
 * ("expected") statistic.
 *
 * <p>The truth family's fit frees the deformation too. A new deformation value means a new
 * spacetime and a newly traced ray table, so instead of moving it continuously the fit profiles
 * it: the other parameters are fitted at three deformation nodes one {@code step} apart about the
 * truth (shifted up where the family does not allow values below), and the minimum of the
 * parabola through the three profile chi-squares is taken (the profile is exactly quadratic where
 * the model is linear in the deformation over the nodes; the vertex is used within one step
 * outside the nodes, else the smallest node). The tables of the nodes are traced once per cell
 * and reused by every realisation.
 */
public final class CellStudy {
    /** Largest number of model evaluations per least-squares start. */
    static final int MAX_EVALUATIONS = 2000;
    /**
     * Relative tolerance of the least-squares fits: chi-square to about 2e-6 of itself, far below
     * the spread of the statistic over realisations (of order sqrt(2 Delta chi-square) + 1).
     */
    static final double TOLERANCE = 1.0e-6;

    /**
     * @param cell the cell
     * @param epochsMin epoch times (observer time, minutes from the truth run's start)
     * @param extra extra parameters of the truth family (the deformation: 1)
     * @param expected noise-free Delta chi-square
     * @param delta Delta chi-square per realisation
     * @param truthValues truth values of the reference's free parameters
     * @param referenceBest reference best fit to the noise-free data
     * @param referenceMedian median reference best fit over the realisations
     * @param truthX truth centroid at the epochs, micro-arcseconds (and y)
     * @param referenceX best reference (noise-free) centroid at the epochs (and y)
     * @param evaluations model evaluations
     * @param boundary whether the reference deformation lies on the boundary of the family's range
     *     (the significance then uses the Chernoff mixture, see {@link Wilks})
     */
    public record Result(StudyFile.Cell cell, double[] epochsMin, int extra, double expected, double[] delta,
                         double[] truthValues, double[] referenceBest, double[] referenceMedian, double[] truthX,
                         double[] truthY, double[] referenceX, double[] referenceY, long evaluations,
                         boolean boundary) {
        /** @return the q-th percentile of the realisations' Delta chi-square */
        public double deltaPercentile(double q) {
            return percentile(delta, q);
        }

        /** @return the significance of the noise-free statistic, sigma */
        public double expectedSigma() {
            return Wilks.sigma(expected, extra, boundary);
        }

        /** @return the significance of the median statistic, sigma */
        public double medianSigma() {
            return Wilks.sigma(deltaPercentile(50), extra, boundary);
        }
    }

    /**
     * Noise-free fits shared by the cells of one process that differ only in precision: uniform
     * astrometric weights do not move a best fit, so the fits to the exact truth are done once at
     * 1 micro-arcsecond and their chi-square scales as 1/sigma^2 (common practice, no source).
     * Without photometry only; the cells then also start their realisations' fits from these
     * optima, once each (the noise-free fits carry the study's extra starts; in the demo this
     * saved about a fifth of the steps per fit).
     */
    public static final class Shared {
        private final Map<String, CompletableFuture<NoiseFree>> fits = new ConcurrentHashMap<>();
    }

    /**
     * Fits to the noise-free truth at unit sigma.
     *
     * @param reference the reference's best fit (chi-square at 1 micro-arcsecond)
     * @param nodes best fits of the truth family at the profile nodes (null at the reference value)
     * @param evaluations model evaluations of these fits
     */
    record NoiseFree(LeastSquaresFit.Result reference, LeastSquaresFit.Result[] nodes, long evaluations) {
    }

    private final StudyFile study;
    private final FitModel.Cache cache;
    private final int threads;
    private final Shared shared;
    private long evaluations;

    /** @param cache tables shared by the cells of one process */
    public CellStudy(StudyFile study, FitModel.Cache cache, int threads) {
        this(study, cache, threads, new Shared());
    }

    /**
     * @param cache tables shared by the cells of one process
     * @param shared noise-free fits shared by the cells of one process
     */
    public CellStudy(StudyFile study, FitModel.Cache cache, int threads, Shared shared) {
        this.study = study;
        this.cache = cache;
        this.threads = threads;
        this.shared = shared;
    }

    /** Runs one cell. @throws UserInputException when the campaign does not fit in the truth's run */
    public Result run(StudyFile.Cell cell) {
        ScenarioTree truth = study.truthTree(cell.deformation(), cell.beamUas());
        double[] t = epochs(truth);
        FitData zero = data(t, new double[t.length], new double[t.length], null, cell.sigmaUas(), Double.NaN);
        FitModel.Prediction tp = new FitModel(fitFile(truth, List.of()), zero, cache).predict(new double[0]);
        double[] fluxTruth = null;
        double sflux = Double.NaN;
        if (!Double.isNaN(study.fluxError())) {
            FitData withFlux = data(t, tp.x(), tp.y(), new double[t.length], cell.sigmaUas(), 1.0);
            fluxTruth = new FitModel(fitFile(truth, List.of()), withFlux, cache).predict(new double[0]).flux();
            double peak = 0;
            for (double f : fluxTruth) {
                peak = FastMath.max(peak, FastMath.abs(f));
            }
            sflux = study.fluxError() * peak;
        }
        int k = study.free().size();
        double[] truthValues = new double[k];
        for (int i = 0; i < k; i++) {
            truthValues[i] = study.free().get(i).start();
        }
        ScenarioTree reference = truth.with(study.deformationKey(), study.referenceValue());
        double[] nodes = nodes(truth, cell.deformation());

        // noise-free data: the truth family reaches chi-square 0 at the truth
        FitData exact = data(t, tp.x(), tp.y(), fluxTruth, cell.sigmaUas(), sflux);
        double[] refStart = truthValues;
        double[][] nodeStart = {truthValues, truthValues, truthValues};
        int laterStarts = study.starts();
        double expected;
        double[] refExactBest;
        if (fluxTruth == null) {
            NoiseFree nf = noiseFree(cell, t, tp, reference, truth, nodes);
            expected = nf.reference().chiSquare() / (cell.sigmaUas() * cell.sigmaUas());
            refExactBest = nf.reference().best();
            refStart = refExactBest;
            for (int j = 0; j < 3; j++) {
                if (nf.nodes()[j] != null) {
                    nodeStart[j] = nf.nodes()[j].best();
                }
            }
            // the realisations start once, at the noise-free optima (which carry the study's starts)
            laterStarts = 1;
            synchronized (this) {
                evaluations += nf.evaluations();
            }
        } else {
            LeastSquaresFit.Result refExact = fit(reference, exact, truthValues, study.starts());
            expected = refExact.chiSquare();
            refExactBest = refExact.best();
        }
        FitModel.Prediction rp = new FitModel(fitFile(reference, study.free()), exact, cache).predict(refExactBest);

        int n = study.realisations();
        double[] delta = new double[n];
        double[][] refBest = new double[k][n];
        for (int r = 0; r < n; r++) {
            FitData d = noisy(t, tp, fluxTruth, cell, sflux, r);
            LeastSquaresFit.Result ref = fit(reference, d, refStart, laterStarts);
            double[] chi = new double[3];
            for (int j = 0; j < 3; j++) {
                chi[j] = nodes[j] == study.referenceValue() ? ref.chiSquare()
                        : fit(truth.with(study.deformationKey(), nodes[j]), d, nodeStart[j], laterStarts).chiSquare();
            }
            double alt = profileMinimum(nodes, chi, study.step(), v -> allowed(truth, v));
            // the reference is one point of the profile: the statistic is never negative (rounding aside)
            delta[r] = FastMath.max(0.0, ref.chiSquare() - FastMath.min(alt, ref.chiSquare()));
            for (int i = 0; i < k; i++) {
                refBest[i][r] = ref.best()[i];
            }
        }
        double[] refMedian = new double[k];
        for (int i = 0; i < k; i++) {
            refMedian[i] = percentile(refBest[i], 50);
        }
        return new Result(cell, t, 1, expected, delta, truthValues, refExactBest, refMedian, tp.x(),
                tp.y(), rp.x(), rp.y(), evaluations, referenceOnBoundary(truth));
    }

    /**
     * The reference's noise-free chi-square fitted directly at the cell's own precision (no shared
     * fit): what the shared unit-sigma fit divided by sigma^2 stands for.
     */
    double noiseFreeChiSquareDirect(StudyFile.Cell cell) {
        ScenarioTree truth = study.truthTree(cell.deformation(), cell.beamUas());
        double[] t = epochs(truth);
        FitData zero = data(t, new double[t.length], new double[t.length], null, cell.sigmaUas(), Double.NaN);
        FitModel.Prediction tp = new FitModel(fitFile(truth, List.of()), zero, cache).predict(new double[0]);
        double[] start = new double[study.free().size()];
        for (int i = 0; i < start.length; i++) {
            start[i] = study.free().get(i).start();
        }
        return fit(truth.with(study.deformationKey(), study.referenceValue()),
                data(t, tp.x(), tp.y(), null, cell.sigmaUas(), Double.NaN), start, study.starts()).chiSquare();
    }

    /** Checks that the campaign fits in the truth's run for a cell (traces its table; writes nothing). */
    public void checkCampaign(StudyFile.Cell cell) {
        epochs(study.truthTree(cell.deformation(), cell.beamUas()));
    }

    /** Epochs every cadence over the campaign from the truth's first frame; the campaign must fit in its run. */
    private double[] epochs(ScenarioTree truth) {
        double first;
        double last;
        try {
            // the frames' time range does not depend on the data; a probe at time 0 may fall outside it
            var ls = truth.load();
            var fr = FitModel.frames(ls, cache, new org.spindrift.sim.light.CompactSourceModel());
            double mpm = org.spindrift.shared.Units.timeUnitSeconds(ls.scenario().blackHole().massSolar()) / 60.0;
            first = fr.timesM()[0] * mpm;
            last = fr.timesM()[fr.timesM().length - 1] * mpm;
        } catch (UserInputException e) {
            throw new UserInputException(study.file() + ": truth: " + e.getMessage());
        }
        // a margin of 5 % of the frames' span at either end: the fitted models' frames start and end at
        // slightly different observer times (light travel times change with the parameters)
        double margin = 0.05 * (last - first);
        int n = (int) FastMath.floor(study.campaignMin() / study.cadenceMin() + 1e-9) + 1;
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = first + margin + i * study.cadenceMin();
        }
        if (t[n - 1] > last - margin + 1e-9) {
            throw new UserInputException(String.format(Locale.ROOT, "%s: instrument.campaign_min: a campaign of %.6g min"
                    + " is longer than the truth scenario's run allows (%.6g min of frames less 5 %% at either end);"
                    + " lengthen run.duration there", study.file(), study.campaignMin(), 0.9 * (last - first)));
        }
        return t;
    }

    /** @return the three profile nodes: one step either side of d, or d and two steps up where d - step is not allowed */
    private double[] nodes(ScenarioTree truth, double d) {
        double s = study.step();
        if (allowed(truth, d - s)) {
            return new double[] {d - s, d, d + s};
        }
        if (!allowed(truth, d + 2 * s)) {
            throw new UserInputException(study.file() + ": deformation.step: the nodes " + d + " + (0, 1, 2) x " + s
                    + " are not all allowed by the truth family; choose a smaller step");
        }
        return new double[] {d, d + s, d + 2 * s};
    }

    /**
     * @return whether the reference deformation is allowed but a value a thousandth of a step
     *     below or above it is not: the null hypothesis then sits on the boundary of the family
     */
    boolean referenceOnBoundary(ScenarioTree truth) {
        double r = study.referenceValue(), e = 1e-3 * study.step();
        return allowed(truth, r) && (!allowed(truth, r - e) || !allowed(truth, r + e));
    }

    private boolean allowed(ScenarioTree truth, double v) {
        try {
            org.spindrift.sim.scenario.ScenarioChecks.spacetime(truth.with(study.deformationKey(), v).load());
            return true;
        } catch (UserInputException | IllegalArgumentException e) {
            return false;
        }
    }

    /**
     * Minimum of the parabola through three equally spaced profile points (x0 &lt; x1 &lt; x2), used
     * when it is convex and its vertex lies within one step outside the nodes and is allowed;
     * otherwise the smallest point. Vertex of the interpolating parabola: x1 - h (c2 - c0) / (2 (c0 -
     * 2 c1 + c2)), value c1 - (c2 - c0)^2 / (8 (c0 - 2 c1 + c2)) (e.g. Press et al. 2007, Numerical
     * Recipes, eq. 10.3.1).
     */
    static double profileMinimum(double[] x, double[] c, double h, java.util.function.DoublePredicate allowed) {
        double smallest = FastMath.min(c[0], FastMath.min(c[1], c[2]));
        double curv = c[0] - 2 * c[1] + c[2];
        if (!(curv > 0)) {
            return smallest;
        }
        double xv = x[1] - h * (c[2] - c[0]) / (2 * curv);
        if (xv < x[0] - h || xv > x[2] + h || !allowed.test(xv)) {
            return smallest;
        }
        return FastMath.min(smallest, c[1] - (c[2] - c[0]) * (c[2] - c[0]) / (8 * curv));
    }

    /**
     * The noise-free fits of a cell's deformation and beam at 1 micro-arcsecond, done once per
     * process (the first cell to ask computes them, others wait).
     */
    private NoiseFree noiseFree(StudyFile.Cell cell, double[] t, FitModel.Prediction tp, ScenarioTree reference,
                                ScenarioTree truth, double[] nodes) {
        String key = cell.deformation() + "|" + cell.beamUas();
        CompletableFuture<NoiseFree> mine = new CompletableFuture<>();
        CompletableFuture<NoiseFree> f = shared.fits.putIfAbsent(key, mine);
        if (f == null) {
            try {
                FitData unit = data(t, tp.x(), tp.y(), null, 1.0, Double.NaN);
                int k = study.free().size();
                double[] start = new double[k];
                for (int i = 0; i < k; i++) {
                    start[i] = study.free().get(i).start();
                }
                long[] ev = new long[1];
                LeastSquaresFit.Result ref = fitCounted(reference, unit, start, study.starts(), ev);
                LeastSquaresFit.Result[] nf = new LeastSquaresFit.Result[3];
                for (int j = 0; j < 3; j++) {
                    if (nodes[j] != study.referenceValue() && nodes[j] != cell.deformation()) {
                        nf[j] = fitCounted(truth.with(study.deformationKey(), nodes[j]), unit, start, study.starts(), ev);
                    }
                }
                mine.complete(new NoiseFree(ref, nf, ev[0]));
            } catch (RuntimeException e) {
                mine.completeExceptionally(e);
                shared.fits.remove(key, mine);
                throw e;
            }
            f = mine;
        }
        try {
            return f.join();
        } catch (java.util.concurrent.CompletionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            throw e;
        }
    }

    private LeastSquaresFit.Result fit(ScenarioTree tree, FitData d, double[] start, int starts) {
        long[] ev = new long[1];
        LeastSquaresFit.Result r = fitCounted(tree, d, start, starts, ev);
        synchronized (this) {
            evaluations += ev[0];
        }
        return r;
    }

    /** A least-squares fit of the study's free parameters from start (more starts drawn in the bounds). */
    private LeastSquaresFit.Result fitCounted(ScenarioTree tree, FitData d, double[] start, int starts, long[] ev) {
        FitFile ff = fitFile(tree, study.free());
        ThreadLocal<FitModel> models = ThreadLocal.withInitial(() -> new FitModel(ff, d, cache));
        int k = study.free().size();
        double[] lo = new double[k], hi = new double[k];
        for (int i = 0; i < k; i++) {
            FitFile.Free f = study.free().get(i);
            lo[i] = f.min();
            hi[i] = f.max();
        }
        LeastSquaresFit.Result r = LeastSquaresFit.fit((p, out) -> models.get().residuals(p, out), d.residuals(), lo, hi,
                start, starts, MAX_EVALUATIONS, study.seed(), threads, null, TOLERANCE);
        ev[0] += r.evaluations();
        return r;
    }

    private FitFile fitFile(ScenarioTree tree, List<FitFile.Free> free) {
        return new FitFile(study.file(), study.name(), tree, new FitFile.Data(null, null, Double.NaN, 0.0, 1.0), free,
                new FitFile.Method(FitFile.Kind.LEAST_SQUARES, study.starts(), MAX_EVALUATIONS, study.seed(), 0, 0, 0));
    }

    /** Data with the truth plus Gaussian noise, realisation r (a seeded stream per cell and realisation). */
    private FitData noisy(double[] t, FitModel.Prediction tp, double[] flux, StudyFile.Cell cell, double sflux, int r) {
        Well19937c rng = new Well19937c(new int[] {(int) study.seed(), (int) (study.seed() >>> 32), cell.index(), r});
        int n = t.length;
        double[] x = new double[n], y = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = tp.x()[i] + cell.sigmaUas() * rng.nextGaussian();
            y[i] = tp.y()[i] + cell.sigmaUas() * rng.nextGaussian();
        }
        double[] f = null;
        if (flux != null) {
            f = new double[n];
            for (int i = 0; i < n; i++) {
                f[i] = flux[i] + sflux * rng.nextGaussian();
            }
        }
        return data(t, x, y, f, cell.sigmaUas(), sflux);
    }

    private static FitData data(double[] t, double[] x, double[] y, double[] flux, double sigma, double sflux) {
        int n = t.length;
        double[] s = new double[n];
        Arrays.fill(s, sigma);
        double[] empty = new double[0];
        if (flux == null) {
            return new FitData(t, x, y, s, s.clone(), new double[n], empty, empty, empty);
        }
        double[] sf = new double[n];
        Arrays.fill(sf, sflux);
        return new FitData(t, x, y, s, s.clone(), new double[n], t, flux, sf);
    }

    /** @return the q-th percentile (the fit engine's: linear between order statistics) */
    static double percentile(double[] v, double q) {
        return v.length == 0 ? Double.NaN : org.spindrift.sim.fit.FitRun.percentile(v, q);
    }

    /** @return the evaluations so far */
    public long evaluations() {
        return evaluations;
    }

    static List<String> names(StudyFile s) {
        List<String> out = new ArrayList<>();
        s.free().forEach(f -> out.add(f.key()));
        return out;
    }
}
