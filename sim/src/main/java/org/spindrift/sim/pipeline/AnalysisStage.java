package org.spindrift.sim.pipeline;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.util.List;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.scenario.CentreOrbit;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.shared.scenario.Source;
import org.spindrift.sim.analysis.AnalysisResult;
import org.spindrift.sim.analysis.LagProfile;
import org.spindrift.sim.analysis.ParticlePeriods;
import org.spindrift.sim.analysis.ShearShape;
import org.spindrift.sim.analysis.Stats;
import org.spindrift.sim.history.Chunked;
import org.spindrift.sim.history.ParticleHistory;
import org.spindrift.sim.scenario.SourceSetup;

/**
 * Periods and shear shapes of a run: writes {@code periods.csv} (one row per particle) and
 * {@code shear.csv} (one row per source and snapshot), and adds per-source medians, half 16-84 % ranges and
 * the metric's predictions to the summary. The {@link AnalysisResult} is handed to the plots
 * through {@link StageResults#analysis()}.
 */
public final class AnalysisStage implements RunStage {
    /** Lag profiles kept in the summary per source. */
    static final int PROFILES_IN_SUMMARY = 6;

    /** Row chunks of periods.csv (fixed, so that nothing depends on the thread count). */
    private static final int CSV_CHUNKS = 16;

    @Override public String name() {
        return "analysis";
    }

    @Override public void run(RunContext ctx) throws IOException {
        ParticleHistory h = ctx.history();
        int[] first = ctx.placed().firstIndex();
        AnalysisResult result = AnalysisResult.of(h, ctx.turningPoints(), first, ctx.threads());
        ParticlePeriods periods = result.periods();
        List<ShearShape> shapes = result.shapes();
        ctx.results().analysis(result);
        double spm = ctx.secondsPerM();
        ctx.archive().writeText(ArchiveLayout.PERIODS, periodsCsv(ctx.scenario(), h, periods, spm, ctx.threads()));
        ctx.archive().writeText(ArchiveLayout.SHEAR, shearCsv(ctx.scenario(), shapes, spm));
        summary(ctx, periods, shapes);
    }

    static String periodsCsv(Scenario sc, ParticleHistory h, ParticlePeriods p, double spm, int threads) {
        int n = h.particles();
        // rows formatted in fixed chunks on the run's threads, joined in order: the same text for any count
        int chunks = Math.max(1, Math.min(CSV_CHUNKS, n));
        String[] parts = new String[chunks];
        Chunked.forEach(chunks, threads, c -> {
            int from = Chunked.start(c, chunks, n);
            int to = Chunked.start(c + 1, chunks, n);
            StringBuilder b = new StringBuilder(160 * (to - from));
            for (int i = from; i < to; i++) {
                b.append(sc.sources().get(h.sourceIndex()[i]).name()).append(',').append(i).append(',')
                        .append(f(p.meanR(i))).append(',').append(f(p.periodPhi(i))).append(',').append(f(p.periodR(i)))
                        .append(',').append(f(p.periodTheta(i))).append(',').append(f(Math.toDegrees(p.advance(i))))
                        .append(',').append(f(p.periodPhi(i) * spm / 60)).append(',').append(f(p.periodR(i) * spm / 60))
                        .append(',').append(f(p.periodTheta(i) * spm / 60)).append('\n');
            }
            parts[c] = b.toString();
        });
        StringBuilder b = new StringBuilder(200);
        b.append(org.spindrift.shared.archive.ArchiveColumns.header(
                org.spindrift.shared.archive.ArchiveColumns.PERIODS)).append('\n');
        for (String part : parts) {
            b.append(part);
        }
        return b.toString();
    }

    static String shearCsv(Scenario sc, List<ShearShape> shapes, double spm) {
        StringBuilder b = new StringBuilder(200 * shapes.size() + 300);
        b.append(org.spindrift.shared.archive.ArchiveColumns.header(
                org.spindrift.shared.archive.ArchiveColumns.SHEAR)).append('\n');
        for (ShearShape s : shapes) {
            b.append(sc.sources().get(s.source()).name()).append(',').append(s.snapshot()).append(',')
                    .append(f(s.time())).append(',').append(f(s.time() * spm / 60)).append(',').append(s.alive())
                    .append(',').append(f(s.centreX())).append(',').append(f(s.centreY())).append(',').append(f(s.centreZ()))
                    .append(',').append(f(s.centreR())).append(',').append(f(s.major())).append(',')
                    .append(f(s.minor())).append(',').append(f(s.aspectRatio())).append(',')
                    .append(f(s.orientationDeg())).append(',').append(f(s.azimuthalExtentDeg())).append(',')
                    .append(f(s.lag().stationaryRadius())).append(',').append(f(s.lag().innerArm())).append(',')
                    .append(f(s.lag().outerArm())).append('\n');
        }
        return b.toString();
    }

    /** Empty for NaN or infinite (CSV readers then see a missing value). */
    static String f(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }

    /** @return the reference radius at which the metric's predictions are evaluated */
    static double referenceRadius(Source s) {
        CentreOrbit o = s.orbit();
        if (o instanceof CentreOrbit.Circular c) {
            return c.radiusM();
        }
        if (o instanceof CentreOrbit.Elements e) {
            return e.semiLatusRectumM();
        }
        return ((CentreOrbit.ZamoVelocity) o).radiusM();
    }

    private static void summary(RunContext ctx, ParticlePeriods p, List<ShearShape> shapes) {
        Scenario sc = ctx.scenario();
        ParticleHistory h = ctx.history();
        double spm = ctx.secondsPerM();
        ObjectNode sum = ctx.summary();
        sum.put("scenario", sc.name());
        sum.put("time_unit", "coordinate time, M (GM/c^3) and minutes; t = 0 at the start of the run");
        sum.put("M_seconds", spm);
        put(sum, "omega_max_radius_M", ctx.landmark(ArchiveLayout.LM_OMEGA_MAX_RADIUS));
        ArrayNode arr = sum.putArray("sources");
        int[] first = ctx.placed().firstIndex();
        int s = h.snapshots();
        for (int k = 0; k < sc.sources().size(); k++) {
            Source src = sc.sources().get(k);
            int from = first[k];
            int n = src.particles();
            ObjectNode o = arr.addObject();
            o.put("name", src.name());
            o.put("kind", src.kind().key());
            o.put("particles", n);
            int alive = 0;
            for (int i = from; i < from + n; i++) {
                alive += h.state(s - 1)[i] == 0 ? 1 : 0;
            }
            o.put("alive_at_end", alive);
            SourceSetup.Prediction pred = ctx.placed().centres()[k].prediction();
            o.put("reference_radius_M", referenceRadius(src));
            o.put("prediction_method", pred.method());
            ObjectNode per = o.putObject("periods");
            period(per, "azimuthal", slice(p.periodPhi(), from, n), pred.azimuthal(), spm);
            period(per, "radial", slice(p.periodR(), from, n), pred.radial(), spm);
            period(per, "vertical", slice(p.periodTheta(), from, n), pred.vertical(), spm);
            double[] adv = slice(p.advance(), from, n);
            for (int i = 0; i < adv.length; i++) {
                adv[i] = Math.toDegrees(adv[i]);
            }
            double[] ms = Stats.medianHalfRange(adv, adv.length);
            ObjectNode a = per.putObject("periastron_advance_deg");
            put(a, "median", ms[0]);
            put(a, "half_range_16_84", ms[1]);
            a.put("measured", (int) ms[2]);
            put(a, "predicted", Math.toDegrees(pred.advance()));
            ShearShape last = shapes.get(k * s + s - 1);
            ObjectNode sh = o.putObject("shape_at_end");
            put(sh, "time_M", last.time());
            put(sh, "major_M", last.major());
            put(sh, "minor_M", last.minor());
            put(sh, "aspect_ratio", last.aspectRatio());
            put(sh, "orientation_deg", last.orientationDeg());
            put(sh, "azimuthal_extent_deg", last.azimuthalExtentDeg());
            put(sh, "stationary_radius_M", last.lag().stationaryRadius());
            put(sh, "inner_arm_M", last.lag().innerArm());
            put(sh, "outer_arm_M", last.lag().outerArm());
            ArrayNode prof = o.putArray("lag_profiles");
            for (int q : profileSnapshots(s)) {
                LagProfile lp = shapes.get(k * s + q).lag();
                ObjectNode po = prof.addObject();
                po.put("snapshot", q);
                po.put("time_M", h.time(q));
                ArrayNode rs = po.putArray("r_M");
                ArrayNode ls = po.putArray("lag_rad");
                for (int b = 0; b < lp.r().length; b++) {
                    rs.add(lp.r()[b]);
                    ls.add(lp.lag()[b]);
                }
                put(po, "stationary_radius_M", lp.stationaryRadius());
            }
        }
    }

    /** @return up to {@link #PROFILES_IN_SUMMARY} snapshot indices spread over the run, the first excluded */
    static int[] profileSnapshots(int s) {
        int m = Math.min(PROFILES_IN_SUMMARY, s - 1);
        int[] out = new int[m];
        for (int j = 0; j < m; j++) {
            out[j] = (int) Math.round((double) (j + 1) * (s - 1) / m);
        }
        return out;
    }

    private static double[] slice(double[] a, int from, int n) {
        return java.util.Arrays.copyOfRange(a, from, from + n);
    }

    private static void period(ObjectNode per, String key, double[] v, double predicted, double spm) {
        double[] ms = Stats.medianHalfRange(v, v.length);
        ObjectNode o = per.putObject(key);
        put(o, "median_M", ms[0]);
        put(o, "half_range_16_84_M", ms[1]);
        put(o, "median_min", ms[0] * spm / 60);
        o.put("measured", (int) ms[2]);
        put(o, "predicted_M", predicted);
        put(o, "predicted_min", predicted * spm / 60);
    }

    static void put(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) {
            o.put(k, v);
        } else {
            o.putNull(k);
        }
    }
}
