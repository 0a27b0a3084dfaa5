package org.spindrift.sim.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.spindrift.shared.scenario.Scenario;
import org.spindrift.sim.light.FrameBudget;
import org.spindrift.sim.light.LightSettings;
import org.spindrift.sim.scenario.LoadedScenario;

/**
 * What a run may ask of the machine, checked before any work: memory for the particle history,
 * disk for the run folder, and imaging settings that would give an image cube beyond the budget
 * or empty or meaningless frames.
 */
public final class RunLimits {
    private RunLimits() {
    }

    /** Bytes of the particle history per particle and snapshot (see {@link org.spindrift.sim.history.ParticleHistory}), with the archive copy. */
    static final double HISTORY_BYTES = 61 + 88;

    /** Refuses a run whose particle history cannot fit in the Java heap (it would fail after the work). */
    static void checkMemory(LoadedScenario ls, long particles, int snapshots, double have) {
        double need = HISTORY_BYTES * particles * snapshots;
        if (need > 0.8 * have) {
            throw ls.error("run.snapshot_cadence", String.format(java.util.Locale.ROOT, "%d particles at %d snapshots"
                    + " need about %.3g GB of memory, more than the %.3g GB this Java process may use; use fewer"
                    + " particles, a longer snapshot_cadence, or more heap (SPINDRIFT_JAVA_OPTS=-Xmx...)", particles,
                    snapshots, need / 1e9, have / 1e9));
        }
    }

    /**
     * Estimated size of a run folder, bytes, by part.
     *
     * @param snapshots snapshots.h5 (kept particles x snapshots x 85 bytes, plus times and centres)
     * @param images images.fits (frames x pixels^2 x 4 bytes)
     * @param other CSV files (per particle, per source and snapshot, per frame; visibilities per
     *     frame and station pair), JSON files and plots
     */
    public record DiskEstimate(double snapshots, double images, double other) {
        /** @return the whole run folder, bytes */
        public double total() {
            return snapshots + images + other;
        }

        /** @return the scenario key that drives the largest part */
        public String key(Scenario sc) {
            if (snapshots >= images && snapshots >= other) {
                return sc.run().archiveSubsample() > 0 ? "run.archive_subsample" : "run.snapshot_cadence";
            }
            if (images >= other) {
                return sc.imaging().frameCadence() != null ? "imaging.frame_cadence" : "imaging.pixels";
            }
            return sc.interferometer() != null ? "interferometer" : "sources";
        }
    }

    /** Bytes per kept particle and snapshot in snapshots.h5: r, theta, phi, x, y, z, u[4] (float64), weight (float32), state. */
    static final int SNAPSHOT_BYTES = 6 * 8 + 4 * 8 + 4 + 1;

    /**
     * Room for plots, JSON files and file-system blocks, bytes: the plots of a one-particle run take
     * 0.7 MB together; the vector plots grow with the snapshots ({@link #PLOT_BYTES_PER_SNAPSHOT}).
     */
    static final double FIXED_BYTES = 1.5e6;

    /** Vector-plot bytes per source and snapshot (shape and lag curves). */
    static final double PLOT_BYTES_PER_SNAPSHOT = 1e3;

    /** @return the estimated size of the run folder of a prepared scenario */
    public static DiskEstimate diskEstimate(ScenarioRun.Prepared p) {
        Scenario sc = p.loaded().scenario();
        long particles = sc.totalParticles();
        int sub = sc.run().archiveSubsample();
        long kept = sub == 0 ? particles : Math.min(particles, sub);
        int s = p.times().length;
        int k = sc.sources().size();
        double snap = (double) SNAPSHOT_BYTES * kept * s + 8.0 * s + 24.0 * s * k + 4.0 * kept + 64e3;
        LightSettings light = LightSettings.of(sc);
        double frames = FrameBudget.frameEstimate(light, 0.0, p.durationM(), s);
        double images = frames * light.pixels() * (double) light.pixels() * 4 + 2880 * 2;
        // periods.csv ~200 B per particle, shear.csv ~300 B per source and snapshot, light CSVs ~400 B per frame
        double other = 200.0 * particles + (300.0 + PLOT_BYTES_PER_SNAPSHOT) * s * k + 400.0 * frames + FIXED_BYTES;
        if (sc.interferometer() != null) {
            int n = sc.interferometer().stations().size();
            // visibilities.csv and .uvfits (~400 B per frame and pair), closure files (~150 B per triangle, quadrangle)
            double pairs = n * (n - 1) / 2.0;
            double triangles = pairs * (n - 2) / 3.0;
            other += frames * (400.0 * pairs + 150.0 * triangles * (1 + Math.max(0, n - 3) / 2.0));
        }
        return new DiskEstimate(snap, images, other);
    }

    /**
     * Refuses a run whose folder would not fit in the free space where it is built (beside the
     * target folder; an old run there stays until the new one is complete, so it does not count).
     *
     * @param folder the run folder asked for
     */
    public static void checkDisk(ScenarioRun.Prepared p, Path folder) throws IOException {
        Path parent = folder.toAbsolutePath().normalize().getParent();
        while (parent != null && !java.nio.file.Files.exists(parent)) {
            parent = parent.getParent();
        }
        if (parent == null) {
            return; // the folder check reports it
        }
        checkDisk(p, parent, java.nio.file.Files.getFileStore(parent).getUsableSpace());
    }

    /** Refuses a run whose estimated folder is larger than free bytes at where. */
    public static void checkDisk(ScenarioRun.Prepared p, Path where, double free) {
        DiskEstimate e = diskEstimate(p);
        if (e.total() > free) {
            Scenario sc = p.loaded().scenario();
            throw p.loaded().error(e.key(sc), String.format(java.util.Locale.ROOT, "the run folder needs about %s on"
                    + " disk (snapshots.h5 %s, images.fits %s, other files %s), more than the %s free in %s; free some"
                    + " space, write elsewhere with -o, or keep fewer particles, snapshots or frames", size(e.total()),
                    size(e.snapshots()), size(e.images()), size(e.other()), size(free), where));
        }
    }

    private static String size(double bytes) {
        return bytes >= 1e9 ? String.format(java.util.Locale.ROOT, "%.3g GB", bytes / 1e9)
                : String.format(java.util.Locale.ROOT, "%.3g MB", bytes / 1e6);
    }

    /** The light stage's limits and the imaging settings that would give empty or meaningless output. */
    static void checkImaging(LoadedScenario ls, Scenario sc, double uasPerM, double[] times,
            double captureRadius, List<String> warnings) {
        LightSettings light = LightSettings.of(sc);
        double duration = times[times.length - 1];
        String budget = FrameBudget.problem(light, 0.0, duration, times.length);
        if (budget != null) {
            String key = sc.imaging().frameCadence() != null ? "imaging.frame_cadence" : "imaging.pixels";
            throw ls.error(key, budget);
        }
        if (!Double.isNaN(light.frameCadenceM()) && light.frameCadenceM() > duration) {
            throw ls.error("imaging.frame_cadence", "cadence " + sc.imaging().frameCadence() + " = "
                    + fmt(light.frameCadenceM()) + " M is longer than the run (" + fmt(duration)
                    + " M): at most one or two frames; use a frame_cadence shorter than run.duration");
        }
        // the FITS pixel scale in degrees must be an ordinary (normal, non-zero) number
        double pixelDeg = light.fieldOfViewM() / light.pixels() * uasPerM / 3.6e9;
        if (!(pixelDeg >= Double.MIN_NORMAL * 1e6) || !Double.isFinite(pixelDeg)) {
            throw ls.error("imaging.field_of_view_M", "a pixel of " + fmt(light.fieldOfViewM() / light.pixels())
                    + " M subtends " + pixelDeg + " degrees at this distance, too small for an image's coordinates");
        }
        if (light.fieldOfViewM() < MIN_FIELD_OF_VIEW_M) {
            throw ls.error("imaging.field_of_view_M", "value " + light.fieldOfViewM() + " M is smaller than "
                    + fmt(MIN_FIELD_OF_VIEW_M) + " M: the emission kernel alone is 0.1 M wide, so every frame would be"
                    + " empty or one blurred pixel; allowed [" + fmt(MIN_FIELD_OF_VIEW_M) + ", 1e5] M");
        }
        if (0.5 * light.fieldOfViewM() < captureRadius) {
            warnings.add(ls.error("imaging.field_of_view_M", "the field of view (" + fmt(light.fieldOfViewM())
                    + " M across) lies inside the capture radius (" + fmt(captureRadius) + " M): frames show only gas"
                    + " passing in front of the hole, often nothing").getMessage());
        }
    }

    /** Smallest field of view, M. */
    public static final double MIN_FIELD_OF_VIEW_M = 1.0;

    private static String fmt(double v) {
        return SnapshotGrid.fmt(v);
    }
}
