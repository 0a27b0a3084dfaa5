package org.spindrift.sim.fit;

import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import org.hipparchus.util.FastMath;
import org.spindrift.shared.Units;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.scenario.BlackHole;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Sense;
import org.spindrift.shared.scenario.VelocityModel;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.shared.scenario.SourceShape;
import org.spindrift.sim.light.Camera;
import org.spindrift.sim.light.CentreTrack;
import org.spindrift.sim.light.CompactSourceModel;
import org.spindrift.sim.light.GaussianBeam;
import org.spindrift.sim.light.LightSettings;
import org.spindrift.sim.light.LightStage;
import org.spindrift.sim.light.RayTable;
import org.spindrift.sim.light.TraceSettings;
import org.spindrift.sim.run.SnapshotGrid;
import org.spindrift.sim.scenario.FitFile;
import org.spindrift.sim.scenario.FlareEnvelope;
import org.spindrift.sim.scenario.LoadedScenario;
import org.spindrift.sim.scenario.ScenarioChecks;
import org.spindrift.sim.scenario.ScenarioTree;
import org.spindrift.sim.scenario.SourceSetup;
import org.spindrift.sim.spacetime.CircularOrbits;
import org.spindrift.sim.spacetime.Landmarks;
import org.spindrift.sim.spacetime.Spacetime;

/**
 * The fit's forward model: free-parameter values -> scenario (set at their key paths in the
 * scenario tree and checked by the scenario loader and checks) -> the centres' geodesics -> the
 * compact-source light model on a ray table -> model values at the data epochs -> whitened
 * residuals. Ray tables are cached by (spacetime, inclination, image settings, emission radius)
 * in a {@link Cache} shared by every thread's model; position angle, mass, distance, orbit,
 * phase, flare, steady source and time offset reuse them. One instance per thread.
 */
public final class FitModel {
    /** Residual given to every data point where the parameters give no valid model. */
    public static final double INVALID_RESIDUAL = 1.0e4;

    /** Spacetimes, capture radii and ray tables shared by the threads of one fit. */
    public static final class Cache {
        /** Ray tables kept: a fit that moves spin, inclination or a deformation traces a table per value. */
        static final int TABLES_KEPT = 8;
        private final RecentTables<String, Object[]> spacetimes = new RecentTables<>(64);
        private final RecentTables<String, CompactSourceModel.Index> tables = new RecentTables<>(TABLES_KEPT);
        private final int threads;
        private final RayTable.Refinement refinement;
        private final AtomicInteger traced = new AtomicInteger();

        /** @param threads threads for tracing tables (results do not depend on it) */
        public Cache(int threads) {
            this(threads, null);
        }

        /**
         * @param threads threads for tracing tables (results do not depend on it)
         * @param refinement sub-pixel refinement of the tables (null: the model's own rule)
         */
        public Cache(int threads, RayTable.Refinement refinement) {
            this.threads = threads;
            this.refinement = refinement;
        }

        /** @return tables traced so far */
        public int tablesTraced() {
            return traced.get();
        }
    }

    /**
     * What the model gives at a set of parameter values.
     *
     * @param x east offsets at the astrometric epochs, micro-arcseconds (and y)
     * @param flux model flux at the flux epochs (data units)
     * @param frames the model's frames (M; null when invalid)
     * @param uasPerM micro-arcseconds per M
     * @param minutesPerM minutes per M
     * @param timeOffsetMin the data's time offset, minutes
     */
    public record Prediction(double[] x, double[] y, double[] flux, CompactSourceModel.Frames frames, double uasPerM,
                             double minutesPerM, double timeOffsetMin, double fluxScale) {
    }

    private final FitFile fit;
    private final FitData data;
    private final Cache cache;
    private final CompactSourceModel light = new CompactSourceModel();
    private final List<FitFile.Free> free;

    public FitModel(FitFile fit, FitData data, Cache cache) {
        this.fit = fit;
        this.data = data;
        this.cache = cache;
        this.free = fit.free();
    }

    /** @return the number of residuals (data points plus normal priors) */
    public int residualCount() {
        int n = data.residuals();
        for (FitFile.Free f : free) {
            if (f.prior() == FitFile.Prior.NORMAL) {
                n++;
            }
        }
        return n;
    }

    /** @return the scenario at the parameter values (checked; UserInputException when not valid) */
    public LoadedScenario scenario(double[] p) {
        ScenarioTree t = fit.scenario();
        for (int i = 0; i < p.length; i++) {
            String k = free.get(i).key();
            if (!k.startsWith("data.")) {
                t = t.with(k, p[i]);
            }
        }
        return t.load();
    }

    private double dataParameter(double[] p, String key, double dflt) {
        for (int i = 0; i < p.length; i++) {
            if (free.get(i).key().equals(key)) {
                return p[i];
            }
        }
        return dflt;
    }

    /**
     * Evaluates the model.
     *
     * @throws UserInputException when the parameters give no valid scenario (orbit inside the
     *     ISCO, no horizon, ...)
     */
    public Prediction predict(double[] p) {
        return onTableNodes(p, 0);
    }

    /**
     * Grid step of a free parameter that changes the ray table (spin, inclination, the family's
     * deformation parameters), 0 for the others: the model at such a parameter's value is the
     * linear interpolation between the two grid values around it, so a fit that moves it traces a
     * table per grid value visited rather than one per value tried (the change of the track between
     * neighbouring grid values is small and smooth in them; the interpolation error is measured in
     * FitModelTableNodesTest).
     */
    static double tableStep(FitFile.Free f) {
        String k = f.key();
        if (k.equals("black_hole.spin")) {
            return SPIN_STEP;
        }
        if (k.equals("observer.inclination_deg")) {
            return INCLINATION_STEP_DEG;
        }
        return k.startsWith("black_hole.parameters.") ? (f.max() - f.min()) / 100.0 : 0.0;
    }

    /** Grid step of a free spin. */
    static final double SPIN_STEP = 0.01;
    /** Grid step of a free inclination, degrees. */
    static final double INCLINATION_STEP_DEG = 0.5;

    /** The prediction with the table parameters from index {@code from} on put on their grids. */
    private Prediction onTableNodes(double[] p, int from) {
        for (int i = from; i < p.length; i++) {
            double step = tableStep(free.get(i));
            if (step > 0) {
                FitFile.Free f = free.get(i);
                double v = FastMath.max(f.min(), FastMath.min(f.max(), p[i]));
                double lo = FastMath.min(f.max(), f.min() + FastMath.floor((v - f.min()) / step) * step);
                double hi = FastMath.min(f.max(), lo + step);
                double[] q = p.clone();
                q[i] = lo;
                Prediction a = onTableNodes(q, i + 1);
                if (!(hi > lo) || v == lo) {
                    return a;
                }
                q[i] = hi;
                Prediction b = onTableNodes(q, i + 1);
                return blend(a, b, (v - lo) / (hi - lo));
            }
        }
        return predictAt(p);
    }

    /** @return (1 - w) a + w b for the data-space values; frames and units of the nearer one */
    private static Prediction blend(Prediction a, Prediction b, double w) {
        double[] x = a.x().clone(), y = a.y().clone(), f = a.flux().clone();
        for (int i = 0; i < x.length; i++) {
            x[i] += w * (b.x()[i] - x[i]);
            y[i] += w * (b.y()[i] - y[i]);
        }
        for (int i = 0; i < f.length; i++) {
            f[i] += w * (b.flux()[i] - f[i]);
        }
        Prediction n = w < 0.5 ? a : b;
        return new Prediction(x, y, f, n.frames(), n.uasPerM(), n.minutesPerM(), n.timeOffsetMin(), n.fluxScale());
    }

    /** The prediction at exactly these parameter values (one table for their spacetime and inclination). */
    Prediction predictAt(double[] p) {
        LoadedScenario ls = scenario(p);
        Scenario sc = ls.scenario();
        BlackHole bh = sc.blackHole();
        double spm = Units.timeUnitSeconds(bh.massSolar());
        double uasPerM = Units.uasPerM(bh.massSolar(), bh.distanceMpc());
        CompactSourceModel.Frames fr = frames(ls, cache, light);
        double offset = dataParameter(p, FitFile.TIME_OFFSET, fit.data().timeOffsetMin());
        double scale = dataParameter(p, FitFile.FLUX_SCALE, fit.data().fluxScale());
        double minPerM = spm / 60.0;
        int n = data.timeMin().length;
        double[] x = new double[n], y = new double[n];
        double t0 = fr.timesM()[0], t1 = fr.timesM()[fr.timesM().length - 1];
        for (int i = 0; i < n; i++) {
            double t = (data.timeMin()[i] + offset) / minPerM;
            if (t < t0 - 1e-9 || t > t1 + 1e-9) {
                throw new UserInputException(String.format(java.util.Locale.ROOT, "data epoch %.6g min (with the time"
                        + " offset %.6g min) lies outside the model's time range [%.6g, %.6g] min", data.timeMin()[i],
                        offset, t0 * minPerM, t1 * minPerM));
            }
            x[i] = fr.xAt(t) * uasPerM;
            y[i] = fr.yAt(t) * uasPerM;
        }
        int nf = data.flux().length;
        double[] f = new double[nf];
        for (int i = 0; i < nf; i++) {
            double t = (data.fluxTimeMin()[i] + offset) / minPerM;
            if (t < t0 - 1e-9 || t > t1 + 1e-9) {
                throw new UserInputException(String.format(java.util.Locale.ROOT, "flux epoch %.6g min lies outside the"
                        + " model's time range [%.6g, %.6g] min", data.fluxTimeMin()[i], t0 * minPerM, t1 * minPerM));
            }
            f[i] = scale * fr.fluxWithSteadyAt(t);
        }
        return new Prediction(x, y, f, fr, uasPerM, minPerM, offset, scale);
    }

    /**
     * The compact-source frames of a checked scenario on its run's frame grid (observer time in M,
     * offsets in M): the fast counterpart of a run's centroid.csv and lightcurve.csv.
     *
     * @throws UserInputException when the scenario's orbits are not allowed by its metric
     */
    public static CompactSourceModel.Frames frames(LoadedScenario ls, Cache cache, CompactSourceModel light) {
        return frames(ls, cache, light, null);
    }

    /** As {@link #frames(LoadedScenario, Cache, CompactSourceModel)} at given observer times (M; null: the run's grid). */
    public static CompactSourceModel.Frames frames(LoadedScenario ls, Cache cache, CompactSourceModel light,
                                                   double[] atTimes) {
        Scenario sc = ls.scenario();
        BlackHole bh = sc.blackHole();
        String bhKey = bh.family() + "|" + bh.spin() + "|" + bh.parameters() + "|" + bh.allowHorizonless();
        Object[] stc = cache.spacetimes.get(bhKey, () -> {
            Spacetime st = ScenarioChecks.spacetime(ls);
            return new Object[] {st, Landmarks.of(st).captureRadius()};
        });
        Spacetime st = (Spacetime) stc[0];
        double capture = (Double) stc[1];
        ScenarioChecks.checkSources(ls, st, capture);
        double spm = Units.timeUnitSeconds(bh.massSolar());
        SourceSetup.Centre[] centres = SourceSetup.centres(sc, st, capture);
        double[] times = SnapshotGrid.times(ls, spm, centres[0].periodM());
        double tEnd = times[times.length - 1];
        double trackCadence = FastMath.min(0.5, centres[0].periodM() / 400.0);
        CentreTrack track = centreTrack(sc, centres, st, capture, tEnd, trackCadence, 1.0e-10);
        LightSettings ls0 = LightSettings.of(sc);
        Camera cam = new Camera(ls0.inclinationDeg(), 0.0, ls0.fieldOfViewM(), ls0.pixels(),
                Math.max(LightSettings.CAMERA_DISTANCE_M, 100.0 * ls0.fieldOfViewM()));
        double h = LightStage.smoothingLength(cam);
        CompactSourceModel.Spot[] spots = new CompactSourceModel.Spot[sc.sources().size()];
        double cut = 0;
        for (int k = 0; k < spots.length; k++) {
            Source s = sc.sources().get(k);
            double sigma = sigma(s.shape());
            double shear = 0;
            if (s.orbit() instanceof CentreOrbit.Circular circ && s.velocity().kind() == VelocityModel.Kind.SHEAR) {
                shear = CompactSourceModel.shearRate(circ.radiusM(), st.spin(),
                        CircularOrbits.omegaDerivative(st, circ.radiusM(), circ.sense() == Sense.PROGRADE));
            }
            spots[k] = new CompactSourceModel.Spot(sigma, s.emission().weight(),
                    new FlareEnvelope(s.emission().flare(), spm), shear);
            cut = FastMath.max(cut, CompactSourceModel.CUT_SIGMAS
                    * FastMath.sqrt(sigma * sigma + CompactSourceModel.KERNEL_VARIANCE * h * h));
        }
        double rMax = track.radialRange()[1];
        if (!Double.isFinite(rMax)) {
            throw new UserInputException("no centre stays on its orbit");
        }
        // emission radius as a run's (LightStage.emissionRadius), in steps of 2 M so nearby orbits share a table
        double rNeed = rMax + cut + 0.5;
        double rEm = FastMath.min(FastMath.max(2.0 * FastMath.ceil(rNeed / 2.0), capture + 3.0),
                FastMath.max(ls0.fieldOfViewM(), 20.0));
        double cell = FastMath.max(0.25, 0.5 * cut);
        RayTable.Refinement rule = cache.refinement != null ? cache.refinement
                : CompactSourceModel.refinement(cam, spots);
        String tKey = bhKey + "|" + ls0.inclinationDeg() + "|" + ls0.fieldOfViewM() + "|" + ls0.pixels() + "|"
                + ls0.lensing() + "|" + rEm + "|" + capture + "|" + cell + "|" + rule;
        CompactSourceModel.Index index = cache.tables.get(tKey, () -> {
            TraceSettings ts = TraceSettings.of(rEm, capture, LightStage.SAMPLES_PER_H * h, ls0.lensing())
                    .withTolerance(1.0e-8, 1.0e-10);
            cache.traced.incrementAndGet();
            return new CompactSourceModel.Index(RayTable.trace(st, cam, ts, cache.threads, rule), cell);
        });
        double cadence = sc.imaging().frameCadence() == null ? times[1] - times[0] : sc.imaging().frameCadence().toM(spm);
        // with a beam the model reports the beam-convolved image's peak, as a run's mock data do
        double beamSigmaM = GaussianBeam.sigmaOf(sc.instrument().beamFwhmUas()) / Units.uasPerM(bh.massSolar(),
                bh.distanceMpc());
        return atTimes != null
                ? light.frames(index, track, spots, sc.observer().positionAngleDeg(), atTimes,
                        sc.instrument().steadySourceFluxRatio(), beamSigmaM)
                : light.frames(index, track, spots, sc.observer().positionAngleDeg(), cadence,
                        sc.instrument().steadySourceFluxRatio(), beamSigmaM);
    }

    /** Gaussian size of a source per axis: sigma of a ball, the rms of an ellipsoid's axes. */
    static double sigma(SourceShape shape) {
        if (shape instanceof SourceShape.Ball b) {
            return b.sigmaM();
        }
        SourceShape.Ellipsoid e = (SourceShape.Ellipsoid) shape;
        return FastMath.sqrt((e.radialM() * e.radialM() + e.azimuthalM() * e.azimuthalM()
                + e.verticalM() * e.verticalM()) / 3.0);
    }

    /**
     * Whitened residuals (model - data) / error: per astrometric epoch the Cholesky-whitened pair
     * r1 = dx/sx, r2 = (dy/sy - rho r1)/sqrt(1 - rho^2) (so r1^2 + r2^2 is the bivariate Gaussian's
     * chi-square), then the flux points, then (p - mean)/sigma for normal priors. Parameters that
     * give no valid model get {@link #INVALID_RESIDUAL} everywhere.
     *
     * @return whether the model was valid
     */
    public boolean residuals(double[] p, double[] out) {
        Prediction pr;
        try {
            pr = predict(p);
        } catch (UserInputException | IllegalArgumentException | IllegalStateException e) {
            java.util.Arrays.fill(out, INVALID_RESIDUAL);
            return false;
        }
        fill(pr, p, out);
        return true;
    }

    /** Residuals of a prediction (see {@link #residuals}). */
    public void fill(Prediction pr, double[] p, double[] out) {
        int n = data.timeMin().length;
        int j = 0;
        for (int i = 0; i < n; i++) {
            double r1 = (pr.x()[i] - data.x()[i]) / data.sx()[i];
            double rho = data.rho()[i];
            double r2 = ((pr.y()[i] - data.y()[i]) / data.sy()[i] - rho * r1) / FastMath.sqrt(1 - rho * rho);
            out[j++] = r1;
            out[j++] = r2;
        }
        for (int i = 0; i < data.flux().length; i++) {
            out[j++] = (pr.flux()[i] - data.flux()[i]) / data.sflux()[i];
        }
        for (int i = 0; i < free.size(); i++) {
            FitFile.Free f = free.get(i);
            if (f.prior() == FitFile.Prior.NORMAL) {
                out[j++] = (p[i] - f.mean()) / f.sigma();
            }
        }
    }

    /** @return the data */
    public FitData data() {
        return data;
    }

    /** @return the fit file */
    public FitFile fit() {
        return fit;
    }

    /**
     * @return the evolved centres of a scenario's sources, started as {@link SourceSetup#centres}
     *     starts them (see {@link CentreTrack#of})
     */
    public static CentreTrack centreTrack(Scenario sc, SourceSetup.Centre[] centres, Spacetime st, double capture,
            double tEnd, double cadence, double tolerance) {
        double[][] starts = new double[centres.length][];
        double[] alpha = new double[centres.length];
        for (int k = 0; k < centres.length; k++) {
            starts[k] = centres[k].start();
            alpha[k] = sc.sources().get(k).emission().spectralIndex();
        }
        return CentreTrack.of(starts, alpha, st, capture, tEnd, cadence, tolerance);
    }
}
