package org.spindrift.sim.sweep;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.spindrift.shared.UserInputException;
import org.spindrift.shared.archive.ArchiveLayout;
import org.spindrift.shared.archive.LightArchive;
import org.spindrift.shared.archive.RunArchive;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.history.Subsample;
import org.spindrift.sim.run.ScenarioRun;
import org.spindrift.sim.scenario.ConfigNode;
import org.spindrift.sim.scenario.ScenarioLoader;

/**
 * Scenario files as sweep tasks: checked with {@link ScenarioLoader} and
 * {@link ScenarioRun#prepare} (everything {@code check} does), run with {@link ScenarioRun#run}
 * (the run folder of {@code run}), summarised from {@code summary.json}, {@code centroid.csv}
 * (through {@link LightArchive}; its frame flux is the light curve's) and the manifest.
 */
public final class ScenarioTaskKind implements TaskKind {
    /** Heap of the JVM itself, the plots and the light stage's fixed buffers (our estimate). */
    static final long BASE_HEAP = 256L << 20;

    @Override public String name() {
        return "scenario";
    }

    @Override public Estimate check(Path label, ConfigNode tree) {
        ScenarioRun.Prepared p = ScenarioRun.prepare(ScenarioLoader.load(label, tree));
        return estimate(p);
    }

    /**
     * Memory and disk of a run from its sizes: the particle history (7 doubles, a float and a
     * byte per particle and snapshot), the archive writer's copy of the kept particles (about 110
     * bytes per kept particle and snapshot, see SnapshotWriter), the image cube (float frames,
     * twice with a beam) and the ray table (about 100 samples of 32 bytes per pixel); doubled
     * for the garbage collector's headroom. Our own estimate, checked against {@code bench run}.
     */
    static Estimate estimate(ScenarioRun.Prepared p) {
        Scenario sc = p.loaded().scenario();
        long n = p.placed().batch().size();
        long s = p.times().length;
        long kept = 0;
        for (int k : Subsample.keptPerSource(sc)) {
            kept += k;
        }
        long pix = (long) sc.imaging().pixels() * sc.imaging().pixels();
        double cadence = sc.imaging().frameCadence() == null ? p.times()[1] - p.times()[0]
                : sc.imaging().frameCadence().toM(p.secondsPerM());
        long frames = (long) Math.ceil(p.durationM() / cadence) + 2;
        boolean beam = sc.instrument() != null && sc.instrument().beamFwhmUas() > 0;
        long live = n * s * 61 + kept * s * 110 + frames * pix * 4 * (beam ? 2 : 1) + pix * 100 * 32;
        // at least 1.3 x (history + archive copy) = 1.3 x 149 bytes per particle and snapshot, so that
        // a run's own memory check (80 % of the heap) passes under the -Xmx the array job sets
        long heap = Math.max(BASE_HEAP + 2 * live, BASE_HEAP + (long) (1.3 * 149 * n * s));
        long disk = kept * s * 85 + s * sc.sources().size() * 24 + frames * pix * 4 + n * 120 + s * 400 + frames * 300
                + (3L << 20);
        return new Estimate(heap, disk);
    }

    @Override public void run(Path taskFile, Path runFolder, int threads) throws IOException {
        ScenarioRun.Prepared p = ScenarioRun.prepare(ScenarioLoader.load(taskFile));
        // the folder is the sweep's own: a damaged earlier run there is replaced (once the new one is complete)
        ScenarioRun.run(p, new ScenarioRun.Options(runFolder, threads, false, true));
    }

    /**
     * A finished run folder: quick = the manifest opens and lists only files that exist;
     * verified = the shared archive verifier (checksums, manifest ranges, snapshots.h5 origin,
     * complete light files).
     */
    @Override public boolean complete(Path runFolder, boolean verify) {
        if (!verify) {
            return TaskState.manifestComplete(runFolder, false);
        }
        try (RunArchive a = RunArchive.open(runFolder, true)) {
            return a != null;
        } catch (UserInputException | java.io.UncheckedIOException e) {
            return false;
        }
    }

    @Override public Map<String, Double> outputs(Path runFolder) throws IOException {
        ObjectMapper json = new ObjectMapper();
        JsonNode summary = json.readTree(runFolder.resolve(ArchiveLayout.SUMMARY).toFile());
        JsonNode manifest = json.readTree(runFolder.resolve(ArchiveLayout.MANIFEST).toFile());
        Map<String, Double> out = new LinkedHashMap<>();
        JsonNode sources = summary.path("sources");
        boolean prefix = sources.size() > 1;
        for (JsonNode s : sources) {
            String p = prefix ? s.path("name").asText() + "." : "";
            JsonNode per = s.path("periods");
            out.put(p + "period_phi_M", num(per.path("azimuthal").path("median_M")));
            out.put(p + "period_phi_min", num(per.path("azimuthal").path("median_min")));
            out.put(p + "period_r_M", num(per.path("radial").path("median_M")));
            out.put(p + "period_r_min", num(per.path("radial").path("median_min")));
            out.put(p + "period_theta_M", num(per.path("vertical").path("median_M")));
            out.put(p + "period_theta_min", num(per.path("vertical").path("median_min")));
            out.put(p + "advance_deg", num(per.path("periastron_advance_deg").path("median")));
            out.put(p + "shear_aspect_ratio", num(s.path("shape_at_end").path("aspect_ratio")));
            out.put(p + "azimuthal_extent_deg", num(s.path("shape_at_end").path("azimuthal_extent_deg")));
            out.put(p + "alive_fraction", s.path("particles").asDouble() > 0
                    ? s.path("alive_at_end").asDouble() / s.path("particles").asDouble() : Double.NaN);
        }
        LightArchive.Track track = Files.isRegularFile(runFolder.resolve(ArchiveLayout.CENTROID))
                ? LightArchive.readTrack(runFolder) : null;
        double[] extent = track == null ? new double[] {Double.NaN, Double.NaN} : centroidTrack(track);
        out.put("centroid_extent_uas", extent[0]);
        out.put("centroid_wander_uas", extent[1]);
        out.put("centroid_max_offset_uas", num(summary.path("light").path("max_centroid_offset_uas")));
        double peak = Double.NaN;
        double sum = 0;
        int m = 0;
        for (double f : track == null ? new double[0] : track.flux()) {
            if (Double.isFinite(f)) {
                peak = Double.isNaN(peak) ? f : Math.max(peak, f);
                sum += f;
                m++;
            }
        }
        out.put("flux_peak", peak);
        out.put("flux_mean", m > 0 ? sum / m : Double.NaN);
        out.put("flux_peak_over_mean", num(summary.path("light").path("peak_over_mean_flux")));
        out.put("hamiltonian_error_max", num(manifest.path("diagnostics").path("hamiltonian_error_max")));
        return out;
    }

    /**
     * Extent (largest distance between two centroid positions) and wander (flux-weighted rms
     * distance from the flux-weighted mean position) of the centroid track as observed, with the
     * steady source, over frames brighter than 1 % of the brightest (as the track plot shows).
     */
    static double[] centroidTrack(LightArchive.Track track) {
        double[] x = track.xSteady();
        double[] y = track.ySteady();
        double[] f = track.flux();
        double peak = 0;
        for (double v : f) {
            if (Double.isFinite(v)) {
                peak = Math.max(peak, v);
            }
        }
        List<Integer> keep = new ArrayList<>();
        for (int i = 0; i < f.length; i++) {
            if (Double.isFinite(f[i]) && f[i] > 0.01 * peak && Double.isFinite(x[i]) && Double.isFinite(y[i])) {
                keep.add(i);
            }
        }
        if (keep.isEmpty()) {
            return new double[] {Double.NaN, Double.NaN};
        }
        double extent = 0;
        double w = 0;
        double mx = 0;
        double my = 0;
        for (int a : keep) {
            for (int b : keep) {
                extent = Math.max(extent, Math.hypot(x[a] - x[b], y[a] - y[b]));
            }
            w += f[a];
            mx += f[a] * x[a];
            my += f[a] * y[a];
        }
        mx /= w;
        my /= w;
        double var = 0;
        for (int a : keep) {
            var += f[a] * ((x[a] - mx) * (x[a] - mx) + (y[a] - my) * (y[a] - my));
        }
        return new double[] {extent, Math.sqrt(var / w)};
    }

    private static double num(JsonNode n) {
        return n.isNumber() ? n.asDouble() : Double.NaN;
    }
}
